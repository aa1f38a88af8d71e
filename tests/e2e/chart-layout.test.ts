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

const WIDTHS = [390, 800, 1280] as const;

/** The description's width in characters of the body font, and whether it overlaps its chart. */
async function measureDescription(page: Page, chart: string, description: string) {
  return page.evaluate(
    ([chartSelector, descriptionSelector]) => {
      const svg = document.querySelector(chartSelector!)!.getBoundingClientRect();
      const text = document.querySelector(descriptionSelector!)!;
      const box = text.getBoundingClientRect();
      const probe = document.createElement('span');
      probe.textContent = '0'.repeat(30);
      probe.style.fontSize = getComputedStyle(text).fontSize;
      document.body.append(probe);
      const thirty = probe.getBoundingClientRect().width;
      probe.remove();
      const overlaps = box.left < svg.right && box.right > svg.left && box.top < svg.bottom && box.bottom > svg.top;
      return { characters: (box.width / thirty) * 30, overlaps };
    },
    [chart, description],
  );
}

/** Tables whose content is wider than their box and whose box does not scroll it. */
async function tablesCutOff(page: Page): Promise<string[]> {
  return page.evaluate(() =>
    Array.from(document.querySelectorAll('main table'))
      .filter((table) => {
        const box = table.getBoundingClientRect();
        if (box.width === 0) return false;
        let scroller: Element | null = table.parentElement;
        while (scroller && getComputedStyle(scroller).overflowX === 'visible') scroller = scroller.parentElement;
        const main = document.querySelector('main')!.getBoundingClientRect();
        const fitsPage = box.right <= Math.max(main.right, window.innerWidth) + 1;
        const scrolls =
          scroller !== null &&
          scroller !== document.body &&
          ['auto', 'scroll'].includes(getComputedStyle(scroller).overflowX);
        return !fitsPage && !scrolls;
      })
      .map((table) => table.getAttribute('data-testid') ?? table.querySelector('caption')?.textContent ?? 'a table'),
  );
}

describe('charts and tables laid out for every screen', () => {
  it('gives the polar chart a readable description beside or under it, on the inspection page and the sheet', async () => {
    const page = await browser.newPage();
    await signInOnPage(page, server.baseUrl, 'chief@lashline.test');
    const inspections = (await (await page.request.get(`${server.baseUrl}/api/inspections?limit=1`)).json()).items;
    const found: string[] = [];
    for (const width of WIDTHS) {
      await page.setViewportSize({ width, height: 1000 });
      await page.goto(`${server.baseUrl}/inspections/${inspections[0].id}`);
      await page.getByTestId('polar-svg').waitFor();
      const chart = await measureDescription(
        page,
        '[data-testid="polar-svg"]',
        '[data-testid="polar-chart"] figcaption',
      );
      if (chart.characters < 30 || chart.overlaps) found.push(`inspection at ${width}: ${JSON.stringify(chart)}`);

      await page.goto(`${server.baseUrl}/inspections/new`);
      await page.getByTestId('polar-preview').waitFor();
      const preview = await measureDescription(
        page,
        '[data-testid="polar-preview"]',
        'figure:has([data-testid="polar-preview"]) figcaption',
      );
      if (preview.characters < 30 || preview.overlaps) found.push(`sheet at ${width}: ${JSON.stringify(preview)}`);
    }
    expect(found).toEqual([]);
    await page.close();
  });

  it('fits every column of every table on the gear set and inspection pages, or scrolls it in its own box', async () => {
    const page = await browser.newPage();
    await signInOnPage(page, server.baseUrl, 'chief@lashline.test');
    const sets = (await (await page.request.get(`${server.baseUrl}/api/gear-sets`)).json()).items as { id: string }[];
    const inspections = (await (await page.request.get(`${server.baseUrl}/api/inspections?limit=1`)).json()).items;
    const found: string[] = [];
    for (const width of WIDTHS) {
      await page.setViewportSize({ width, height: 1000 });
      for (const path of [`/gear-sets/${sets[0]!.id}`, `/parts/${sets[0]!.id}`, `/inspections/${inspections[0].id}`]) {
        await page.goto(`${server.baseUrl}${path}`);
        await page.waitForLoadState('networkidle');
        for (const table of await tablesCutOff(page)) found.push(`${path} at ${width}: ${table}`);
      }
    }
    expect(found).toEqual([]);
    await page.close();
  });
});
