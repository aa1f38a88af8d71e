import type { Browser, Page } from 'playwright-core';
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

/**
 * Links, buttons and fields in a page's main part shorter than 44 px (WCAG 2.5.5's target size, which the
 * crew's gloves need), leaving out links inside running text, which that criterion exempts.
 */
async function smallTargets(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const small: string[] = [];
    for (const element of Array.from(
      document.querySelectorAll<HTMLElement>('main a, main button, main input, main select'),
    )) {
      const box = element.getBoundingClientRect();
      if (box.width === 0 || box.height === 0) continue;
      if (element instanceof HTMLInputElement && ['hidden', 'checkbox', 'radio'].includes(element.type)) continue;
      const inText = element.tagName === 'A' && element.closest('p, li:not([data-testid])') && !element.closest('td');
      if (inText) continue;
      if (box.height < 43.5) {
        const name = element.getAttribute('aria-label') ?? element.getAttribute('data-testid') ?? element.textContent;
        small.push(
          `${element.tagName.toLowerCase()} "${(name ?? '').trim().slice(0, 40)}" ${Math.round(box.height)} px`,
        );
      }
    }
    return small;
  });
}

describe('tap targets on a tablet', () => {
  it('are at least 44 px tall on the board, parts, cars, a gear set, its inspection, the sheet and the reviews', async () => {
    const page = await browser.newPage({ viewport: { width: 800, height: 1280 } });
    await signInOnPage(page, server.baseUrl, 'chief@lashline.test');
    const sets = (await (await page.request.get(`${server.baseUrl}/api/gear-sets`)).json()).items as { id: string }[];
    const inspections = (await (await page.request.get(`${server.baseUrl}/api/inspections?limit=1`)).json()).items;
    const found: Record<string, string[]> = {};
    for (const path of [
      '/',
      '/parts',
      '/cars',
      `/gear-sets/${sets[0]!.id}`,
      `/parts/${sets[0]!.id}`,
      `/inspections/${inspections[0].id}`,
      '/inspections/new',
      '/reviews',
    ]) {
      await page.goto(`${server.baseUrl}${path}`);
      // Islands draw their controls once they run.
      await page.waitForLoadState('networkidle');
      const small = await smallTargets(page);
      if (small.length) found[path] = small;
    }
    expect(found).toEqual({});
    await page.close();
  });
});
