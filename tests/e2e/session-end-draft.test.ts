import { createClient } from '@libsql/client';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, signInOnPage } from '../helpers/browser';
import { startServer, type RunningServer } from '../helpers/server';

/**
 * An ended session (here the idle timeout, SESSION_IDLE_HOURS) never costs a device its unsent
 * inspection sheet: the sheet keeps the change, and sends it after the next sign-in.
 */

let server: RunningServer;
let browser: Browser;
beforeAll(async () => {
  server = await startServer({ demo: true });
  browser = await launchBrowser();
}, 60_000);
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

const TECH = 'tech@lashline.test';
const status = (page: Page) => page.getByTestId('save-status');

/** Ages every session of the person past the 12-hour idle timeout, as a night in the paddock would. */
async function idleOutSessions(email: string): Promise<void> {
  const db = createClient({ url: server.databaseUrl });
  try {
    const ended = await db.execute({
      sql: 'UPDATE sessions SET last_seen_at = ? WHERE user_id = (SELECT id FROM users WHERE email = ?)',
      args: [Date.now() - 13 * 3_600_000, email],
    });
    expect(ended.rowsAffected).toBeGreaterThan(0);
  } finally {
    db.close();
  }
}

describe('an inspection sheet when the session ends', () => {
  it('keeps the change made after the session ended and sends it after the next sign-in', async () => {
    const context = await browser.newContext({ viewport: { width: 1024, height: 768 } });
    const page = await context.newPage();
    await signInOnPage(page, server.baseUrl, TECH);
    const sets = await page.evaluate(
      async () => (await (await fetch('/api/gear-sets')).json()).items as { id: string; status: string }[],
    );
    const set = sets.find((s) => s.status === 'in-service') ?? sets[0]!;
    await page.goto(`${server.baseUrl}/parts/${set.id}`);
    await page.getByTestId('new-inspection').click();
    await page.waitForURL(/\/inspections\/new\?gearSetId=.+&draft=[0-9a-f-]{36}$/);
    const sheetUrl = page.url();
    const sheet = page.getByTestId('inspection-sheet');
    await sheet.waitFor();
    await expect.poll(() => page.getByTestId('runs').inputValue()).toMatch(/^\d+$/);
    await page.getByTestId('reading-1').focus();
    for (const value of ['8', '7', '6', '7', '2', '1']) {
      await page.keyboard.type(value);
      await page.keyboard.press('Enter');
    }
    await expect
      .poll(() => status(page).textContent(), { timeout: 15_000 })
      .toMatch(/Saved on this device · Saved to Lashline \d\d:\d\d/);
    const inspectionId = await sheet.getAttribute('data-server-id');
    expect(inspectionId).toMatch(/[0-9a-f-]{36}/);

    // The session ends (idle too long); the technician keeps writing.
    await idleOutSessions(TECH);
    await page.getByTestId('notes').focus();
    await page.keyboard.type('Written after the session ended.');
    await expect
      .poll(() => status(page).textContent(), { timeout: 15_000 })
      .toContain('Lashline did not take the last change');
    expect(await page.evaluate(() => fetch('/api/account').then((r) => r.status))).toBe(401);

    // Opening the sheet again asks for a sign-in, and brings the person back to the same sheet.
    await page.reload();
    await page.waitForURL(/\/sign-in\?next=/);
    await page.getByLabel('E-mail').fill(TECH);
    await page.getByLabel('Password').fill('lashline-demo');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(sheetUrl);
    await sheet.waitFor();
    expect(await page.getByTestId('notes').inputValue()).toBe('Written after the session ended.');
    await expect
      .poll(() => status(page).textContent(), { timeout: 15_000 })
      .toMatch(/Saved on this device · Saved to Lashline \d\d:\d\d/);
    const saved = await page.evaluate(
      async (id) => (await (await fetch(`/api/inspections/${id}`)).json()) as { notes?: string; data?: unknown },
      inspectionId,
    );
    expect(JSON.stringify(saved)).toContain('Written after the session ended.');
    await context.close();
  }, 90_000);
});
