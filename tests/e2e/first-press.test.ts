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

describe('a press made while a page is still waking', () => {
  it('opens the add-part form from a press on "Add a part" made before its island hydrated', async () => {
    const page = await browser.newPage({ viewport: { width: 800, height: 1280 } });
    await signInOnPage(page, server.baseUrl, 'chief@lashline.test');
    // Hold the island's code back, as a slow connection would, until the press has been made.
    let release = () => {};
    const held = new Promise<void>((resolve) => (release = resolve));
    await page.route(/\/_astro\/PartActions[^/]*\.js$/, async (route) => {
      await held;
      await route.continue();
    });
    await page.goto(`${server.baseUrl}/parts`, { waitUntil: 'load' });
    const button = page.getByRole('button', { name: 'Add a part' });
    expect(await page.locator('astro-island[ssr]').count()).toBeGreaterThan(0);
    await button.click();
    expect(await button.getAttribute('data-pressed')).toBe('true');

    release();
    await page.getByRole('heading', { name: 'Add a part' }).waitFor({ timeout: 20_000 });
    await page.close();
  });

  it('says so after a few seconds when the inspection sheet cannot open, and offers a reload that opens it', async () => {
    const page = await browser.newPage({ viewport: { width: 800, height: 1280 } });
    await signInOnPage(page, server.baseUrl, 'tech@lashline.test');
    const sheetCode = /\/_astro\/InspectionSheet[^/]*\.js$/;
    await page.route(sheetCode, (route) => route.abort('internetdisconnected'));
    await page.goto(`${server.baseUrl}/inspections/new`);
    const late = page.getByTestId('sheet-not-opening');
    expect(await page.getByText('Opening the inspection sheet…').isVisible()).toBe(true);
    expect(await late.isVisible()).toBe(false);
    await late.waitFor({ state: 'visible', timeout: 15_000 });
    expect(await late.textContent()).toMatch(/What you typed on this device is kept/);

    await page.unroute(sheetCode);
    await late.getByRole('link', { name: 'Reload the sheet' }).click();
    await page.getByTestId('inspection-sheet').waitFor({ timeout: 20_000 });
    await page.close();
  });
});
