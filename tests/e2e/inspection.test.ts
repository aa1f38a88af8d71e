import sharp from 'sharp';
import type { Browser, BrowserContext, Page } from 'playwright-core';
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

async function signIn(context: BrowserContext, email: string): Promise<Page> {
  const page = await context.newPage();
  await signInOnPage(page, server.baseUrl, email);
  return page;
}

/** A small real JPEG, as a phone would send (sharp, like the photo tests). */
function patternJpeg(): Promise<Buffer> {
  return sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 180, g: 150, b: 40 } } })
    .jpeg({ quality: 80 })
    .toBuffer();
}

const status = (page: Page) => page.getByTestId('save-status');

describe('the inspection sheet in a real browser', () => {
  it('is filled with the keyboard, survives going offline and a reload, submits once and shows on the gear set', async () => {
    const context = await browser.newContext({ viewport: { width: 1024, height: 768 } });
    const page = await signIn(context, 'tech@lashline.test');
    const sets = await page.evaluate(
      async () =>
        (await (await fetch('/api/gear-sets')).json()).items as { id: string; serial: string; status: string }[],
    );
    const set = sets.find((s) => s.status === 'in-service') ?? sets[0]!;

    // From the gear set's page, as a technician would start.
    await page.goto(`${server.baseUrl}/parts/${set.id}`);
    await page.getByTestId('new-inspection').click();
    await page.waitForURL(/\/inspections\/new\?gearSetId=.+&draft=[0-9a-f-]{36}$/);
    const sheet = page.getByTestId('inspection-sheet');
    await sheet.waitFor();
    // Runs prefilled from the run count, and the page cached for opening offline.
    await expect.poll(() => page.getByTestId('runs').inputValue()).toMatch(/^\d+$/);
    await expect.poll(() => sheet.getAttribute('data-offline-ready'), { timeout: 15_000 }).toBe('true');

    // Readings in thousandths (over the field's limit as inches, so read as thou), Enter to the next position;
    // from the last one on to the runout. The value as read shows under the field.
    await page.getByTestId('reading-1').focus();
    await page.keyboard.type('8');
    await page.keyboard.press('Enter');
    expect(await page.getByTestId('reading-1-note').textContent()).toBe('= 0.008 in');
    for (const value of ['7', '6', '7']) {
      await page.keyboard.type(value);
      await page.keyboard.press('Enter');
    }
    await expect
      .poll(() => page.evaluate(() => document.activeElement?.getAttribute('data-testid')))
      .toBe('runout-back-face');
    expect(await page.getByTestId('figure-mean').textContent()).toBe('0.007 in');
    expect(await page.getByTestId('figure-spread').textContent()).toBe('0.002 in');
    await page.keyboard.type('2');
    await page.keyboard.press('Enter');
    await page.keyboard.type('1');
    await page.keyboard.press('Enter');
    // Once the gear set, time and runs are in, the draft goes to Lashline by itself.
    await expect
      .poll(() => status(page).textContent(), { timeout: 15_000 })
      .toMatch(/Saved on this device · Saved to Lashline \d\d:\d\d/);
    const inspectionId = await sheet.getAttribute('data-server-id');
    expect(inspectionId).toMatch(/[0-9a-f-]{36}/);

    // A shim stack of two, by keyboard.
    await page.getByRole('button', { name: 'Add a shim' }).focus();
    await page.keyboard.press('Enter');
    await page.keyboard.type('0.030');
    await page.getByRole('button', { name: 'Add a shim' }).focus();
    await page.keyboard.press('Enter');
    await page.keyboard.type('0.005');
    expect(await page.getByTestId('shim-total').textContent()).toContain('0.035 in');
    await page.getByTestId('depth-change').focus();
    await page.keyboard.type('-0.002');
    await page.keyboard.press('Enter');
    await page.keyboard.type('+2');
    await page.keyboard.press('Enter');
    await page.keyboard.type('0.060');
    await page.keyboard.press('Enter');
    await page.keyboard.type('0.062');

    // The connection drops midway: everything keeps being saved on this device.
    await context.setOffline(true);
    await expect.poll(() => status(page).textContent()).toContain('Offline — saved on this device');
    await page.getByTestId('pinion-torque').focus();
    await page.keyboard.type('10');
    await page
      .getByRole('group', { name: 'Left hub: effort unchanged?' })
      .getByRole('radio', { name: 'Unchanged' })
      .focus();
    await page.keyboard.press('Space');
    // The first arrow places the pattern in the middle; each one after moves it 5 %.
    await page.getByTestId('pattern-drive').focus();
    for (const key of ['ArrowRight', 'ArrowRight', 'ArrowRight', 'ArrowUp']) await page.keyboard.press(key);
    expect(await page.getByTestId('pattern-drive-words').textContent()).toContain(
      '60 % from toe to heel, 55 % from flank to face',
    );
    await page.getByTestId('pattern-coast-along').focus();
    await page.keyboard.type('45');
    await page.keyboard.press('Enter');
    await page.keyboard.type('50');
    await page.getByTestId('finding-pitting').focus();
    await page.keyboard.press('ArrowDown');
    await page.getByTestId('notes').focus();
    await page.keyboard.type('Typed with no signal in the pits.');
    await expect.poll(() => status(page).textContent()).toContain('Offline — saved on this device');

    // A reload without a connection finds the sheet intact, from this device.
    await page.reload();
    await sheet.waitFor();
    await page.getByTestId('restored').waitFor();
    expect(await page.getByTestId('reading-3').inputValue()).toBe('6');
    expect(await page.getByTestId('shim-1').inputValue()).toBe('0.005');
    expect(await page.getByTestId('pinion-torque').inputValue()).toBe('10');
    expect(await page.getByTestId('notes').inputValue()).toBe('Typed with no signal in the pits.');
    expect(await page.getByTestId('finding-pitting').inputValue()).toBe('light');
    expect(await page.getByTestId('pattern-drive-words').textContent()).toContain('60 % from toe to heel');
    expect(await status(page).textContent()).toContain('Offline — saved on this device');

    // Back online: the waiting changes go to Lashline, then the submission, once.
    await context.setOffline(false);
    await expect.poll(() => status(page).textContent(), { timeout: 20_000 }).toMatch(/Saved to Lashline \d\d:\d\d$/);
    await page.getByTestId('submit').focus();
    await page.keyboard.press('Enter');
    await page.getByTestId('submitted').waitFor();
    expect(await sheet.getAttribute('data-status')).toBe('submitted');
    // The save bar says so where the button was, holds the focus, and offers the next step.
    const done = page.getByTestId('submitted-bar');
    await expect
      .poll(() => page.evaluate(() => document.activeElement?.getAttribute('data-testid')))
      .toBe('submitted-bar');
    expect(await done.textContent()).toContain('Submitted.');
    expect(await done.getByRole('link', { name: 'Open the inspection' }).getAttribute('href')).toMatch(
      /^\/inspections\/[0-9a-f-]{36}$/,
    );
    expect(await done.getByRole('link', { name: 'Record another' }).getAttribute('href')).toBe('/inspections/new');

    // What the server keeps is what was typed.
    const stored = await page.evaluate(
      async (id) => (await (await fetch(`/api/inspections/${id}`)).json()) as Record<string, any>,
      inspectionId,
    );
    expect(stored).toMatchObject({
      status: 'submitted',
      readings: [0.008, 0.007, 0.006, 0.007],
      runout: { backFace: 0.002, radial: 0.001 },
      pinion: { shims: [0.03, 0.005], depthChange: -0.002, marking: '+2' },
      notes: 'Typed with no signal in the pits.',
    });
    expect(stored.condition.teeth).toEqual([{ finding: 'pitting', severity: 'light' }]);
    expect(stored.preload).toMatchObject({ pinionTorque: 10, hubLeft: { unchanged: true } });
    // Submitting again with the same key answers the same inspection.
    const again = await page.evaluate(
      async (id) =>
        (await fetch(`/api/inspections/${id}/submit`, { method: 'POST', headers: { 'Idempotency-Key': 'e2e-repeat' } }))
          .status,
      inspectionId,
    );
    expect(again).toBe(200);

    // A photo of the drive side, with its upload progress, once the inspection is on the server. Enter on
    // "Add drive photos" opens the picker, as Space does.
    const chooser = page.waitForEvent('filechooser', { timeout: 10_000 });
    await page.getByTestId('photo-input-drive').focus();
    await page.keyboard.press('Enter');
    await (await chooser).setFiles({ name: 'drive.jpg', mimeType: 'image/jpeg', buffer: await patternJpeg() });
    await page.getByTestId('photos-drive').getByTestId('photo-thumbnail').waitFor({ timeout: 20_000 });

    // The gear set's page lists it, and the detail page reads back in the reader's unit.
    await page.goto(`${server.baseUrl}/parts/${set.id}`);
    const row = page
      .getByTestId('inspection-row')
      .filter({ has: page.locator(`a[href="/inspections/${inspectionId}"]`) });
    expect(await row.count()).toBe(1);
    expect(await row.textContent()).toMatch(/0\.007 in.*0\.002 in.*Submitted/);
    await row.getByRole('link').click();
    await page.waitForURL(`${server.baseUrl}/inspections/${inspectionId}`);
    expect(await page.getByTestId('inspection-status').textContent()).toContain('Submitted');
    // Spread 0.002 in sits on GM's printed 0.002 in (S: GM 1996): near the limit, never out of band against
    // 0.05 mm = 0.00197 in; the limit shown as printed and judged at the dial it was read on.
    const verdicts = await page.getByTestId('detail-verdicts').textContent();
    expect(verdicts).toContain('Near a limit — Spread');
    expect(verdicts).not.toContain('Out of band');
    expect(verdicts).toContain(
      'Upper limit 0.002 in, less than a graduation inside, judged at the 0.001 in graduation',
    );
    expect(await page.getByTestId('detail-photos-drive').locator('img').count()).toBe(1);
    // A technician cannot edit a submitted inspection.
    expect(await page.getByTestId('edit-link').count()).toBe(0);
    await context.close();
  });
});
