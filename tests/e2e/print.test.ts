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

/** What a page shows on paper: Chromium's print media, which is what its PDF is made from. */
async function printed(page: Page): Promise<{ text: string; printButton: boolean; pdfBytes: number }> {
  await page.emulateMedia({ media: 'print' });
  const text = await page.evaluate(() => document.body.innerText);
  const printButton = await page.getByRole('button', { name: 'Print' }).isVisible();
  const pdfBytes = (await page.pdf({ format: 'A4' })).length;
  await page.emulateMedia({ media: 'screen' });
  return { text, printButton, pdfBytes };
}

describe('printed records', () => {
  it('carry the team, where the set is, the cautions, the governing line and lines to sign, on the inspection, the review and the gear set', async () => {
    const page = await browser.newPage({ viewport: { width: 1024, height: 900 } });
    await signInOnPage(page, server.baseUrl, 'chief@lashline.test');
    const inspections = (await (await page.request.get(`${server.baseUrl}/api/inspections?limit=1`)).json()).items;
    const reviews = (await (await page.request.get(`${server.baseUrl}/api/reviews`)).json()).items;
    const pages = [
      `/inspections/${inspections[0].id}`,
      `/reviews/${reviews[0].id}`,
      `/gear-sets/${inspections[0].gearSetId}`,
    ];
    for (const path of pages) {
      await page.goto(`${server.baseUrl}${path}`);
      // On screen: a Print button, and none of the paper-only lines.
      expect(await page.getByRole('button', { name: 'Print' }).isVisible(), path).toBe(true);
      expect(await page.getByTestId('signature-lines').isVisible(), path).toBe(false);
      const paper = await printed(page);
      expect(paper.printButton, path).toBe(false);
      expect(paper.pdfBytes, path).toBeGreaterThan(10_000);
      expect(paper.text, path).toContain('Cinder Flats Racing');
      expect(paper.text, path).toContain('Support the car on rated stands');
      expect(paper.text, path).toContain('wear protective gloves (P280)');
      expect(paper.text, path).toContain('local codes govern the work');
      expect(paper.text, path).toMatch(/Recorded by _+ Date/);
      expect(paper.text, path).toMatch(/Checked by _+ Date/);
    }
    await page.close();
  });
});
