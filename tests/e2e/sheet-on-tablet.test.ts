import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, signInOnPage } from '../helpers/browser';
import { startServer, type RunningServer } from '../helpers/server';

let server: RunningServer;
let browser: Browser;
beforeAll(async () => {
  server = await startServer({ demo: true });
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('the sheet on a tablet', () => {
  it('never covers the field that has the focus while tabbing through the whole sheet', async () => {
    const page = await browser.newPage({ viewport: { width: 800, height: 1280 } });
    await signInOnPage(page, server.baseUrl, 'tech@lashline.test');
    await page.goto(`${server.baseUrl}/inspections/new`);
    await page.getByTestId('inspection-sheet').waitFor();
    await page.getByTestId('reading-1').focus();

    const hidden: string[] = [];
    let visited = 0;
    for (let step = 0; step < 150; step += 1) {
      await page.keyboard.press('Tab');
      const where = await page.evaluate(() => {
        const focused = document.activeElement as HTMLElement | null;
        const sheet = document.querySelector('[data-testid="inspection-sheet"]');
        const bar = document.querySelector('[data-testid="save-status"]')?.parentElement;
        if (!focused || !sheet?.contains(focused) || !bar) return null;
        if (bar.contains(focused)) return { name: 'bar', covered: false, done: true };
        const box = focused.getBoundingClientRect();
        const barTop = bar.getBoundingClientRect().top;
        const name = focused.getAttribute('data-testid') ?? focused.getAttribute('aria-label') ?? focused.tagName;
        return { name, covered: box.bottom > barTop + 1, done: false };
      });
      if (!where) continue;
      if (where.done) break;
      visited += 1;
      if (where.covered) hidden.push(where.name);
    }
    expect(visited).toBeGreaterThan(20);
    expect(hidden).toEqual([]);
    await page.close();
  });

  it('takes the date and time in one field with a Now button: two Tab presses to the runs field, not seven', async () => {
    const page = await browser.newPage({ viewport: { width: 800, height: 1280 } });
    await signInOnPage(page, server.baseUrl, 'tech@lashline.test');
    await page.goto(`${server.baseUrl}/inspections/new`);
    const when = page.getByTestId('inspected-at');
    await when.waitFor();
    await when.fill('2026-05-03 7:05');
    await when.press('Tab');
    expect(await when.inputValue()).toBe('2026-05-03 07:05');
    expect(await page.getByTestId('inspected-at-read').textContent()).toMatch(/2026/);
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe('Now');
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => document.activeElement?.getAttribute('data-testid'))).toBe('runs');

    // Words that are no time are answered at the field; "now" is this minute.
    await when.fill('yesterday');
    await when.press('Tab');
    expect(await page.getByText(/Not a date and time/).count()).toBe(1);
    await page.getByRole('button', { name: 'Now', exact: true }).click();
    expect(await page.getByText(/Not a date and time/).count()).toBe(0);
    expect(await when.inputValue()).toMatch(/^\d{4}-\d\d-\d\d \d\d:\d\d$/);
    await page.close();
  });

  it('takes a digital indicator that types each reading and Enter: every position filled in order, no touch between', async () => {
    const page = await browser.newPage({ viewport: { width: 800, height: 1280 } });
    await signInOnPage(page, server.baseUrl, 'tech@lashline.test');
    await page.goto(`${server.baseUrl}/inspections/new`);
    await page.getByTestId('reading-1').waitFor();
    const count = await page
      .locator('[data-testid^="reading-"]')
      .evaluateAll((inputs) => inputs.filter((i) => /^reading-\d+$/.test(i.getAttribute('data-testid') ?? '')).length);
    expect(count).toBeGreaterThanOrEqual(4);
    const readings = Array.from({ length: count }, (_, i) => (0.0085 + i * 0.0005).toFixed(4));
    await page.getByTestId('reading-1').focus();
    // As a USB indicator sends it: the digits and Enter, as keystrokes, one reading after another.
    for (const reading of readings) {
      await page.keyboard.type(reading);
      await page.keyboard.press('Enter');
    }
    for (let i = 0; i < count; i += 1)
      expect(await page.getByTestId(`reading-${i + 1}`).inputValue(), `position ${i + 1}`).toBe(readings[i]);
    await page.close();
  });
});
