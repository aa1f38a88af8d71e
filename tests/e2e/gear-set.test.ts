import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient } from '../helpers/api-client';
import { launchBrowser, signInOnPage } from '../helpers/browser';
import { PROJECT_ROOT, startServer, type RunningServer } from '../helpers/server';

let server: RunningServer;
let browser: Browser;
let api: ApiClient;
let gearSetId: string;
let submitted: { id: string; runsAtInspection: number }[];
const problems: string[] = [];

beforeAll(async () => {
  server = await startServer({ demo: true });
  browser = await launchBrowser();
  api = new ApiClient(server.baseUrl);
  await api.signIn('chief@lashline.test', 'lashline-demo');
  const sets = await api.get<{ items: { id: string; serial: string }[] }>('/api/gear-sets');
  gearSetId = sets.body.items.find((s) => s.serial === 'GS-4101')!.id;
  const inspections = await api.get<{ items: { id: string; runsAtInspection: number }[] }>(
    `/api/inspections?gearSetId=${gearSetId}&status=submitted`,
  );
  submitted = inspections.body.items;
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

async function signIn(): Promise<Page> {
  const page = await browser.newPage({ viewport: { width: 1024, height: 768 } });
  page.on('console', (message) => {
    if (message.type() === 'error') problems.push(message.text());
  });
  page.on('pageerror', (error) => problems.push(error.message));
  await signInOnPage(page, server.baseUrl, 'chief@lashline.test');
  return page;
}

/** "+0.001 in" → 0.001, "−0.002 in" → −0.002. */
function deltaTextToNumber(text: string): number {
  const match = /([+−-]?)(\d+(?:\.\d+)?)/.exec(text.replace(/\s+/g, ' '));
  if (!match) return Number.NaN;
  return (match[1] === '−' || match[1] === '-' ? -1 : 1) * Number(match[2]);
}

describe('a gear set’s life in a real browser', () => {
  it('shows every submitted inspection as a point, and a point opens its inspection', async () => {
    const page = await signIn();
    await page.getByRole('link', { name: 'GS-4101' }).first().click();
    await page.waitForURL(`${server.baseUrl}/gear-sets/${gearSetId}`);
    const chart = page.getByTestId('chart-backlash-mean');
    await chart.waitFor();
    const points = chart.getByTestId('chart-point');
    await expect.poll(() => points.count()).toBe(submitted.length);
    expect(submitted.length).toBeGreaterThanOrEqual(3);
    // The projection is labelled with the run count where it meets the limit.
    expect(await page.getByTestId('message-backlash-mean').textContent()).toMatch(/at about run \d+/);
    // The same figures are in the table behind "The numbers", one row per inspection.
    expect(await page.getByTestId('table-backlash-mean').locator('tbody tr').count()).toBe(submitted.length);
    expect(await page.getByTestId('history-row').count()).toBe(submitted.length);

    mkdirSync(join(PROJECT_ROOT, 'docs', 'screenshots'), { recursive: true });
    await page.setViewportSize({ width: 1024, height: 1180 });
    await page.evaluate(() => window.scrollTo(0, 0));
    await page.screenshot({ path: join(PROJECT_ROOT, 'docs', 'screenshots', 'gear-set.png') });

    // The latest inspection is the right-most point.
    const latest = [...submitted].sort((a, b) => a.runsAtInspection - b.runsAtInspection).at(-1)!;
    const last = chart.locator(`[data-testid="chart-point"][data-runs="${latest.runsAtInspection}"]`);
    expect(await last.getAttribute('href')).toBe(`/inspections/${latest.id}`);
    await last.click();
    await page.waitForURL(`${server.baseUrl}/inspections/${latest.id}`);
    expect(await page.getByRole('heading', { level: 1 }).textContent()).toContain('GS-4101');
    expect(problems.filter((p) => /Content Security Policy|Refused/i.test(p))).toEqual([]);
    await page.close();
  });

  it('compares the latest with the one before, showing the API’s deltas and flags', async () => {
    const analysis = await api.get<{ change: { measure: string; delta: number | null; flagged: boolean }[] }>(
      `/api/gear-sets/${gearSetId}/analysis`,
    );
    expect(analysis.status).toBe(200);
    const page = await signIn();
    await page.goto(`${server.baseUrl}/gear-sets/${gearSetId}`);
    await page.getByTestId('compare-link').click();
    await page.waitForURL(new RegExp(`/gear-sets/${gearSetId}/compare$`));
    await page.getByTestId('polar-chart').first().waitFor();
    expect(await page.getByTestId('polar-curve').count()).toBeGreaterThanOrEqual(1);
    for (const change of analysis.body.change) {
      const row = page.locator(`[data-testid="change-table"] tr[data-measure="${change.measure}"]`);
      expect(await row.count(), change.measure).toBe(1);
      expect(await row.getAttribute('data-flagged'), change.measure).toBe(String(change.flagged));
      const shown = deltaTextToNumber((await row.getByTestId('change-delta').textContent()) ?? '');
      // Shown with the digits the 0.001 in indicator resolves: within half a graduation of the API's delta.
      expect(Math.abs(shown - (change.delta ?? Number.NaN)), change.measure).toBeLessThanOrEqual(0.0005 + 1e-9);
    }
    expect(problems.filter((p) => /Content Security Policy|Refused/i.test(p))).toEqual([]);
    await page.close();
  });

  it('shows the board most urgent first, with ready spares', async () => {
    const page = await signIn();
    const actions = await page
      .getByTestId('board-row')
      .evaluateAll((rows) => rows.map((r) => r.getAttribute('data-action')));
    const rank: Record<string, number> = { retire: 4, 're-shim': 3, watch: 2, keep: 1, none: 0 };
    expect(actions.length).toBeGreaterThan(0);
    expect([...actions].sort((a, b) => rank[b!]! - rank[a!]!)).toEqual(actions);
    expect(await page.getByTestId('spare').count()).toBeGreaterThan(0);
    expect(await page.locator('script[src]').count()).toBe(0);
    await page.close();
  });

  it('filters the board by status and by car with one tap each, keeping the other choice', async () => {
    const page = await signIn();
    const filter = page.getByRole('navigation', { name: 'Filter the board' });
    const current = () => filter.locator('[aria-current="true"]').allTextContents();
    expect(await current()).toEqual(['All cars', 'Any in use']);
    const allRows = await page.getByTestId('board-row').count();

    await filter.getByRole('link', { name: 'Spare', exact: true }).click();
    await page.waitForURL(`${server.baseUrl}/?status=spare`);
    expect(await current()).toEqual(['All cars', 'Spare']);
    const spareRows = await page.getByTestId('board-row').count();
    expect(spareRows).toBeGreaterThan(0);
    expect(spareRows).toBeLessThan(allRows);
    expect(await page.getByTestId('board-summary').textContent()).toContain(
      `${spareRows} set${spareRows === 1 ? '' : 's'} shown`,
    );

    // A car keeps the status already chosen; the demo's spares sit on the shelf, in no car.
    await filter.getByRole('link', { name: 'Not in a car' }).click();
    await page.waitForURL(`${server.baseUrl}/?car=none&status=spare`);
    expect(await current()).toEqual(['Not in a car', 'Spare']);
    expect(await page.getByTestId('board-row').count()).toBe(spareRows);

    // The current choice carries a tick as well as its fill, so it does not rest on colour.
    const tick = await filter
      .locator('[aria-current="true"]')
      .first()
      .evaluate((a) => getComputedStyle(a, '::before').borderRightWidth);
    expect(tick).toBe('3px');

    await filter.getByRole('link', { name: 'Any in use' }).click();
    await page.waitForURL(`${server.baseUrl}/?car=none`);
    await filter.getByRole('link', { name: 'All cars' }).click();
    await page.waitForURL(`${server.baseUrl}/`);
    expect(await page.getByTestId('board-row').count()).toBe(allRows);
    await page.close();
  });
});
