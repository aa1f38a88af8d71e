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

/** Console errors of every page this file opens: a CSP refusal shows up here. */
const consoleErrors: string[] = [];

async function signInAs(email: string): Promise<Page> {
  const page = await browser.newPage({ viewport: { width: 1024, height: 768 } });
  page.on('console', (message) => {
    if (message.type() === 'error') consoleErrors.push(`${page.url()}: ${message.text()}`);
  });
  page.on('pageerror', (error) => consoleErrors.push(`${page.url()}: ${error.message}`));
  await signInOnPage(page, server.baseUrl, email);
  return page;
}

/** Opens a page and waits until its island has hydrated (Astro drops `ssr` from the element then). */
async function open(page: Page, path: string): Promise<void> {
  await page.goto(`${server.baseUrl}${path}`);
  await page.waitForSelector('astro-island:not([ssr])', { state: 'attached' });
}

/**
 * Opens the parts page, which the server renders whole: only roles that may add parts get an island
 * (the add form), so this waits for the table instead.
 */
async function openParts(page: Page, query = ''): Promise<void> {
  await page.goto(`${server.baseUrl}/parts${query}`);
  await page.getByRole('region', { name: 'Parts', exact: true }).waitFor();
}

/** The serials of the rows shown, in order, and one column's cells as text. */
async function readColumn(page: Page, column: string): Promise<{ serial: string; text: string }[]> {
  return page.getByTestId('part-row').evaluateAll(
    (rows, id) =>
      rows.map((row) => ({
        serial: (row as HTMLElement).dataset.serial ?? '',
        text: row.querySelector(`td[data-column="${id}"]`)?.textContent?.trim() ?? '',
      })),
    column,
  );
}

/** The search part of the page's URL as an object. */
const queryOf = (page: Page) => Object.fromEntries(new URL(page.url()).searchParams);

type Counts = Map<string, { sinceInstall: number; total: number }>;

/** The run counts of every part the cars page lists under one car or one shelf assembly. */
async function readCounts(page: Page, regionName: string): Promise<Counts> {
  const rows = page.getByRole('region', { name: regionName, exact: true }).getByTestId('installed-part');
  const counts: Counts = new Map();
  for (let i = 0; i < (await rows.count()); i += 1) {
    const row = rows.nth(i);
    counts.set((await row.getAttribute('data-serial'))!, {
      sinceInstall: Number(await row.getByTestId('since-install').textContent()),
      total: Number(await row.getByTestId('total-runs').textContent()),
    });
  }
  return counts;
}

/** Total runs of each part as the parts table shows them. */
async function readPartsTable(page: Page): Promise<Map<string, number>> {
  await openParts(page);
  const totals = new Map<string, number>();
  const rows = page.getByTestId('part-row');
  for (let i = 0; i < (await rows.count()); i += 1) {
    const row = rows.nth(i);
    totals.set(
      (await row.getAttribute('data-serial'))!,
      Number(await row.locator('td[data-column="totalRuns"]').textContent()),
    );
  }
  return totals;
}

describe('the parts register and the run log in a real browser', () => {
  it('charges one logged run to every part in the car, and to nothing else', async () => {
    const page = await signInAs('tech@lashline.test');
    await open(page, '/cars');
    const ember = await readCounts(page, '714 Ember');
    const blackwater = await readCounts(page, '22 Blackwater');
    const shelf = await readCounts(page, 'RE-03 Spare rear end');
    // The demo's RE-01 sits in 714 Ember with its gear set, spindles, axles and bearing.
    expect([...ember.keys()].sort()).toEqual(['AX-11', 'AX-12', 'BR-11', 'GS-4101', 'SP-11', 'SP-12']);
    expect(blackwater.size).toBeGreaterThan(0);
    expect(shelf.size).toBeGreaterThan(0);
    const tableBefore = await readPartsTable(page);

    await open(page, '/runs');
    // A tap on the car's big button (its label; the radio inside is visually hidden).
    await page.locator('label.choice').filter({ hasText: '714 Ember' }).click();
    expect(await page.getByRole('radio', { name: /714 Ember/ }).isChecked()).toBe(true);
    await page.getByRole('button', { name: 'Log run for 714 Ember' }).click();
    await page.getByText(/Run logged for 714 Ember/).waitFor();
    expect(await page.getByTestId('run-row').first().textContent()).toContain('714 Ember');

    await open(page, '/cars');
    const emberAfter = await readCounts(page, '714 Ember');
    for (const [serial, before] of ember) {
      expect(emberAfter.get(serial), serial).toEqual({
        sinceInstall: before.sinceInstall + 1,
        total: before.total + 1,
      });
    }
    expect(await readCounts(page, '22 Blackwater')).toEqual(blackwater);
    expect(await readCounts(page, 'RE-03 Spare rear end')).toEqual(shelf);

    const tableAfter = await readPartsTable(page);
    for (const [serial, total] of tableBefore)
      expect(tableAfter.get(serial), serial).toBe(ember.has(serial) ? total + 1 : total);
    await page.close();
  });

  it('takes a part out and fits it, and shows where a part already is when another screen was behind', async () => {
    const page = await signInAs('tech@lashline.test');
    const stale = await signInAs('tech@lashline.test');
    await open(page, '/cars');
    await open(stale, '/cars');
    const shelf = page.getByRole('region', { name: 'RE-03 Spare rear end', exact: true });

    await shelf.getByRole('button', { name: 'Take GS-4106 out of RE-03' }).click();
    await shelf.getByRole('button', { name: 'Yes, take it out' }).click();
    await shelf.getByText('GS-4106 is out of RE-03.').waitFor();
    expect(await shelf.getByTestId('installed-part').count()).toBe(0);

    await shelf.getByLabel('Fit a part into RE-03').selectOption({ label: 'HB-31 — Hub, 0 runs' });
    await shelf.getByRole('button', { name: 'Fit part' }).click();
    await shelf.getByText('HB-31 is in RE-03.').waitFor();
    expect(await shelf.getByTestId('installed-part').getAttribute('data-serial')).toBe('HB-31');

    // The second screen still lists HB-31 as loose; the server answers 409 and the screen says where it is.
    const ember = stale.getByRole('region', { name: '714 Ember', exact: true });
    await ember.getByLabel('Fit a part into RE-01').selectOption({ label: 'HB-31 — Hub, 0 runs' });
    await ember.getByRole('button', { name: 'Fit part' }).click();
    expect(await ember.getByRole('alert').textContent()).toMatch(
      /^It is already installed in assembly RE-03 \(Spare rear end\) since .*; remove it first\.$/,
    );
    await page.close();
    await stale.close();
  });

  it('imports the sample file after checking it on the page', async () => {
    const page = await signInAs('tech@lashline.test');
    await open(page, '/runs');
    await page.getByRole('button', { name: 'Import a CSV file' }).click();
    const sample = await page.request.get(`${server.baseUrl}/samples/runs-sample.csv`);
    expect(sample.status()).toBe(200);
    expect(await page.getByRole('link', { name: 'Download a sample file' }).getAttribute('href')).toBe(
      '/samples/runs-sample.csv',
    );
    await page
      .getByLabel('Choose a CSV file')
      .setInputFiles({ name: 'runs-sample.csv', mimeType: 'text/csv', buffer: await sample.body() });
    expect(await page.getByTestId('import-summary').textContent()).toBe(
      'runs-sample.csv: 10 rows read — 10 ready, 0 with problems.',
    );
    await page.getByRole('button', { name: 'Import 10 runs' }).click();
    await page.getByText('Imported 10 runs.', { exact: false }).waitFor();
    await page.getByText('Cinder Flats Test Day').first().waitFor();
    await page.close();
  });

  it('shows a viewer the register without any control to log, install or edit', async () => {
    const page = await signInAs('viewer@lashline.test');
    await openParts(page);
    expect(await page.getByTestId('part-row').count()).toBeGreaterThan(10);
    expect(await page.getByRole('button', { name: 'Add a part' }).count()).toBe(0);
    expect(await page.locator('astro-island').count()).toBe(0);

    await open(page, '/cars');
    expect(await page.getByTestId('car-card').count()).toBe(2);
    expect(await page.getByTestId('installed-part').count()).toBeGreaterThan(5);
    for (const name of [/Take .* out/, /^Fit/, 'Add the car', 'Add the assembly']) {
      expect(await page.getByRole('button', { name }).count(), String(name)).toBe(0);
    }
    expect(await page.getByRole('combobox').count()).toBe(0);

    await open(page, '/runs');
    expect(await page.getByTestId('run-row').count()).toBe(50);
    expect(await page.getByRole('heading', { name: 'Log a run' }).count()).toBe(0);
    expect(await page.getByRole('radio').count()).toBe(0);
    for (const name of [/^Log run/, 'Import a CSV file', /^Edit/, /^Delete/]) {
      expect(await page.getByRole('button', { name }).count(), String(name)).toBe(0);
    }
    await page.getByRole('button', { name: 'Show older runs' }).click();
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="run-row"]').length === 100);
    await page.close();
  });

  it('gives a crew chief the edit and delete of a run, each delete asked twice', async () => {
    const page = await signInAs('chief@lashline.test');
    await open(page, '/runs');
    expect(await page.getByRole('button', { name: /^Edit the run/ }).count()).toBe(50);
    const firstRun = page.getByTestId('run-row').first();
    await firstRun.getByRole('button', { name: /^Delete the run/ }).click();
    expect(await firstRun.getByText(/Delete this run\?/).count()).toBe(1);
    await firstRun.getByRole('button', { name: 'Keep it' }).click();
    expect(await page.getByTestId('run-row').count()).toBe(50);

    await firstRun.getByRole('button', { name: /^Edit the run/ }).click();
    await firstRun.getByLabel(/ET, seconds/).fill('6.012');
    await firstRun.getByRole('button', { name: 'Save changes' }).click();
    await firstRun.getByText('6.012 s').waitFor();
    await open(page, '/runs');
    expect(await page.getByTestId('run-row').first().textContent()).toContain('6.012 s');
    await page.close();
  });

  it('sorts the parts by a header link and filters them by kind through the form', async () => {
    const page = await signInAs('tech@lashline.test');
    await openParts(page);
    expect(await page.locator('astro-island').count()).toBe(0);
    const header = page.locator('th[data-column="totalRuns"]');
    const totals = async () => (await readColumn(page, 'totalRuns')).map((cell) => Number(cell.text));
    const unsorted = await totals();
    const ascending = [...unsorted].sort((a, b) => a - b);
    expect(unsorted).not.toEqual(ascending);

    await header.getByRole('link', { name: /Total runs/ }).click();
    await page.waitForURL(/sort=totalRuns/);
    expect(queryOf(page)).toEqual({ sort: 'totalRuns', dir: 'asc' });
    expect(await header.getAttribute('aria-sort')).toBe('ascending');
    expect(await header.locator('[data-sort-mark]').getAttribute('data-sort-mark')).toBe('asc');
    expect(await totals()).toEqual(ascending);

    await header.getByRole('link', { name: /Total runs/ }).click();
    await page.waitForURL(/dir=desc/);
    expect(await header.getAttribute('aria-sort')).toBe('descending');
    expect(await header.locator('[data-sort-mark]').getAttribute('data-sort-mark')).toBe('desc');
    expect(await totals()).toEqual([...ascending].reverse());

    // A changed list submits the form at once; the sort rides along in hidden fields.
    const everything = await page.getByTestId('part-row').count();
    await page.getByLabel('Kind').selectOption('gear-set');
    await page.waitForURL(/kind=gear-set/);
    expect(queryOf(page)).toMatchObject({ kind: 'gear-set', sort: 'totalRuns', dir: 'desc' });
    const kinds = await readColumn(page, 'kind');
    expect(kinds.length).toBeGreaterThan(1);
    expect(kinds.length).toBeLessThan(everything);
    expect(new Set(kinds.map((cell) => cell.text))).toEqual(new Set(['Gear set']));
    expect(kinds.every((cell) => cell.serial.startsWith('GS-'))).toBe(true);
    const gearTotals = await totals();
    expect(gearTotals).toEqual([...gearTotals].sort((a, b) => b - a));
    expect(await page.getByTestId('parts-summary').textContent()).toBe(
      `Parts 1–${kinds.length} of ${kinds.length} (filtered from ${everything}).`,
    );

    // The third press of a header takes the sort off and keeps the filter.
    await header.getByRole('link', { name: /Total runs/ }).click();
    await page.waitForURL((url) => !url.searchParams.has('sort'));
    expect(queryOf(page)).toEqual({ kind: 'gear-set' });
    expect(await header.getAttribute('aria-sort')).toBe('none');
    expect(await header.locator('[data-sort-mark]').getAttribute('data-sort-mark')).toBe('none');
    await page.getByRole('link', { name: 'Clear filters' }).click();
    await page.waitForURL(`${server.baseUrl}/parts`);
    expect(await page.getByTestId('part-row').count()).toBe(everything);
    await page.close();
  });

  it('filters, sorts and pages the parts with JavaScript turned off', async () => {
    const context = await browser.newContext({ javaScriptEnabled: false, viewport: { width: 1024, height: 768 } });
    const page = await context.newPage();
    await signInOnPage(page, server.baseUrl, 'tech@lashline.test');
    await openParts(page, '?size=nonsense&page=99&sort=colour');
    // A bad query falls back to the defaults, and a page past the end shows the last one.
    expect(await page.getByTestId('parts-page').textContent()).toBe('Page 1 of 1');
    const everything = await page.getByTestId('part-row').count();
    expect(everything).toBeGreaterThan(10);

    await page.getByLabel('Status').selectOption('spare');
    await page.getByLabel('Serial contains').fill('gs-');
    await page.getByRole('button', { name: 'Apply' }).click();
    await page.waitForURL(/status=spare/);
    const statuses = await readColumn(page, 'status');
    expect(statuses.length).toBeGreaterThan(0);
    expect(new Set(statuses.map((cell) => cell.text))).toEqual(new Set(['Spare']));
    expect(statuses.every((cell) => cell.serial.startsWith('GS-'))).toBe(true);

    await page.locator('th[data-column="serial"]').getByRole('link').click();
    await page.waitForURL(/sort=serial/);
    await page.locator('th[data-column="serial"]').getByRole('link').click();
    await page.waitForURL(/dir=desc/);
    const serials = (await readColumn(page, 'serial')).map((cell) => cell.serial);
    expect(serials).toEqual([...serials].sort().reverse());
    expect(queryOf(page)).toMatchObject({ status: 'spare', serial: 'gs-', sort: 'serial', dir: 'desc' });
    // One page only: there is no link to a next or previous page.
    expect(await page.getByRole('link', { name: /page$/ }).count()).toBe(0);
    await context.close();
  });

  it('lets a crew chief add a part, then names it above the table that now lists it', async () => {
    const page = await signInAs('chief@lashline.test');
    await openParts(page, '?kind=axle&sort=serial&dir=desc');
    await page.waitForSelector('astro-island:not([ssr])', { state: 'attached' });
    await page.getByRole('button', { name: 'Add a part' }).click();
    await page.getByLabel('Serial', { exact: true }).fill('GS-4199');
    await page.getByLabel('Ring gear teeth').fill('41');
    await page.getByLabel('Pinion teeth').fill('10');
    await page.getByRole('button', { name: 'Add the part' }).click();
    await page.waitForURL(/added=/);
    // The filters and sort are dropped, so the new part is in the table.
    expect(Object.keys(queryOf(page))).toEqual(['added']);
    expect((await page.getByTestId('part-added').textContent())?.trim()).toBe(
      'Added gear set GS-4199. It is on the shelf as a spare.',
    );
    const row = page.locator('[data-testid="part-row"][data-serial="GS-4199"]');
    expect((await row.locator('td[data-column="status"]').textContent())?.trim()).toBe('Spare');
    expect((await row.locator('td[data-column="where"]').textContent())?.trim()).toBe('Not installed');
    expect(await page.getByTestId('part-added').getByRole('link', { name: 'GS-4199' }).getAttribute('href')).toBe(
      `/parts/${queryOf(page).added}`,
    );

    // An id that is not one of this team's parts says nothing.
    await openParts(page, '?added=not-a-part');
    expect(await page.getByTestId('part-added').count()).toBe(0);
    await page.close();
  });

  it('answers an unknown part with 404 and a page that says so', async () => {
    const page = await signInAs('viewer@lashline.test');
    const response = await page.goto(`${server.baseUrl}/parts/not-a-part`);
    expect(response?.status()).toBe(404);
    expect(await page.getByRole('heading', { name: 'No such part' }).count()).toBe(1);
    await page.close();
  });

  it('loaded every page without a script error or a refused inline style', () => {
    // The 404 page and the 409 of the stale screen are asked for; Chromium logs their statuses.
    const expected = /Failed to load resource: the server responded with a status of (404|409)/;
    expect(consoleErrors.filter((line) => !expected.test(line))).toEqual([]);
  });
});
