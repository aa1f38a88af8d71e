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

describe('on a phone', () => {
  it('keeps the header to one row, with the links behind a Menu that works without script', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 }, javaScriptEnabled: false });
    const page = await context.newPage();
    await signInOnPage(page, server.baseUrl, 'chief@lashline.test');
    for (const path of ['/', '/parts', '/runs']) {
      await page.goto(`${server.baseUrl}${path}`);
      const header = await page.locator('header').boundingBox();
      // One row of 44 px targets and the header's padding and rule; it took 255 px when the links wrapped.
      expect(header!.height, path).toBeLessThanOrEqual(80);
    }
    const runs = page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Runs' });
    expect(await runs.isVisible()).toBe(false);
    await page.getByText('Menu', { exact: true }).click();
    await runs.click();
    await page.waitForURL(`${server.baseUrl}/runs`);
    expect(await page.getByRole('heading', { level: 1 }).textContent()).toBe('Runs');
    await context.close();
  });
});
