/**
 * Lighthouse (mobile settings) on the board, a gear set page and an inspection page of the demo,
 * through Debian's Chromium, signed in as the viewer. Targets: performance ≥ 95, accessibility 100.
 *
 *   npm run build && npx tsx bench/lighthouse.ts
 */
import lighthouse from 'lighthouse';
import * as chromeLauncher from 'chrome-launcher';
import { ApiClient } from '../tests/helpers/api-client';
import { CHROMIUM_PATH } from '../tests/helpers/browser';
import { startServer } from '../tests/helpers/server';

const server = await startServer({ demo: true });
const chrome = await chromeLauncher.launch({
  chromePath: CHROMIUM_PATH,
  chromeFlags: ['--headless=new', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--disable-dev-shm-usage'],
});
try {
  const viewer = new ApiClient(server.baseUrl);
  await viewer.signIn('viewer@lashline.test', 'lashline-demo');
  const sets = (await viewer.get('/api/gear-sets')).body.items as { id: string; serial: string }[];
  const set = sets.find((s) => s.serial === 'GS-4101')!;
  const inspections = (await viewer.get(`/api/inspections?gearSetId=${set.id}`)).body.items as { id: string }[];
  const pages: [string, string][] = [
    ['board', '/'],
    ['gear set GS-4101', `/gear-sets/${set.id}`],
    ['inspection', `/inspections/${inspections.at(-1)!.id}`],
  ];
  let allMet = true;
  for (const [name, path] of pages) {
    const result = await lighthouse(`${server.baseUrl}${path}`, {
      port: chrome.port,
      output: 'json',
      logLevel: 'error',
      onlyCategories: ['performance', 'accessibility'],
      extraHeaders: { Cookie: viewer.cookieHeader() },
    });
    const categories = result!.lhr.categories;
    const performance = Math.round((categories.performance?.score ?? 0) * 100);
    const accessibility = Math.round((categories.accessibility?.score ?? 0) * 100);
    const met = performance >= 95 && accessibility === 100;
    allMet &&= met;
    const failing = Object.values(result!.lhr.audits).filter((a) => a.score !== null && a.score < 1 && a.scoreDisplayMode === 'binary').map((a) => a.id);
    console.log(`${name.padEnd(18)} performance ${performance}  accessibility ${accessibility}  ${met ? 'met' : 'MISSED'}${failing.length ? `  (failing: ${failing.join(', ')})` : ''}`);
  }
  console.log(`targets (performance ≥ 95, accessibility 100): ${allMet ? 'met' : 'MISSED'}`);
} finally {
  await chrome.kill();
  await server.stop();
}
