import sharp from 'sharp';
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

/** A phone-sized photo (4032 × 3024) of several megabytes: coarse noise scaled up, as a sharp JPEG. */
async function phonePhoto(): Promise<Buffer> {
  const width = 504;
  const height = 378;
  const noise = Buffer.alloc(width * height * 3);
  let seed = 7;
  for (let i = 0; i < noise.length; i += 1) {
    seed = (seed * 1103515245 + 12345) % 2147483648;
    noise[i] = seed % 256;
  }
  return sharp(noise, { raw: { width, height, channels: 3 } })
    .resize(4032, 3024, { kernel: 'cubic' })
    .jpeg({ quality: 95 })
    .toBuffer();
}

describe('pattern photos on a weak connection', () => {
  it('keeps a photo taken offline on the device through a reload, then sends it once, made smaller', async () => {
    const photo = await phonePhoto();
    expect(photo.length).toBeGreaterThan(2_000_000);
    const context = await browser.newContext({ viewport: { width: 800, height: 1280 } });
    const page = await context.newPage();
    await signInOnPage(page, server.baseUrl, 'tech@lashline.test');
    const sets = await page.evaluate(
      async () => (await (await fetch('/api/gear-sets')).json()).items as { id: string; status: string }[],
    );
    const set = sets.find((s) => s.status === 'in-service') ?? sets[0]!;
    await page.goto(`${server.baseUrl}/parts/${set.id}`);
    await page.getByTestId('new-inspection').click();
    const sheet = page.getByTestId('inspection-sheet');
    await sheet.waitFor();
    await expect.poll(() => sheet.getAttribute('data-offline-ready'), { timeout: 15_000 }).toBe('true');
    await expect.poll(() => page.getByTestId('runs').inputValue()).toMatch(/^\d+$/);

    const uploads: number[] = [];
    page.on('request', (request) => {
      if (request.method() === 'POST' && /\/api\/inspections\/[^/]+\/photos$/.test(request.url()))
        uploads.push(request.postDataBuffer()?.length ?? 0);
    });

    await context.setOffline(true);
    await page
      .getByTestId('photo-input-drive')
      .setInputFiles({ name: 'drive.jpg', mimeType: 'image/jpeg', buffer: photo });
    await page.getByTestId('photos-drive').getByTestId('photo-waiting').waitFor({ timeout: 20_000 });

    // A reload with no connection: the photo is still on the device, waiting.
    await page.reload();
    await sheet.waitFor();
    await page.getByTestId('photos-drive').getByTestId('photo-waiting').waitFor({ timeout: 20_000 });
    expect(uploads).toEqual([]);

    await context.setOffline(false);
    await page.getByTestId('photos-drive').getByTestId('photo-thumbnail').waitFor({ timeout: 30_000 });
    expect(await page.getByTestId('photo-waiting').count()).toBe(0);
    const inspectionId = await sheet.getAttribute('data-server-id');
    await page.waitForTimeout(2_000);
    const stored = await page.evaluate(
      async (id) => (await (await fetch(`/api/inspections/${id}/photos`)).json()).items as { side: string }[],
      inspectionId,
    );
    expect(stored.map((p) => p.side)).toEqual(['drive']);
    // Sent once, and as a reduced JPEG: under 1 MB from a photo of several.
    expect(uploads).toHaveLength(1);
    expect(uploads[0]!).toBeLessThan(1_000_000);
    await context.close();
  });
});
