/**
 * Lighthouse (mobile settings) on two builds at once, run by run in turn, so both meet the same moment of a
 * noisy machine: a page change can be judged against the build before it rather than against a figure from
 * another hour. Prints each page's median performance and total blocking time per build, with every run.
 *
 *   git worktree add /tmp/before <commit> && ln -s "$PWD/node_modules" /tmp/before/ && (cd /tmp/before && npx astro build)
 *   npm run build && LASHLINE_COMPARE_DIST=/tmp/before/dist npx tsx bench/lighthouse-compare.ts
 */
import lighthouse from 'lighthouse';
import * as chromeLauncher from 'chrome-launcher';
import { ApiClient } from '../tests/helpers/api-client';
import { CHROMIUM_PATH } from '../tests/helpers/browser';
import { startServer } from '../tests/helpers/server';

const other = process.env.LASHLINE_COMPARE_DIST;
if (!other) throw new Error('Set LASHLINE_COMPARE_DIST to the other build’s dist folder.');
const RUNS = Number(process.env.LIGHTHOUSE_RUNS ?? 8);
const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!;

const servers = {
  this: await startServer({ demo: true }),
  other: await startServer({ demo: true, env: { LASHLINE_DIST: other } }),
};
const chrome = await chromeLauncher.launch({
  chromePath: CHROMIUM_PATH,
  chromeFlags: [
    '--headless=new',
    '--no-sandbox',
    '--disable-gpu',
    '--disable-quic',
    '--no-first-run',
    '--disable-background-networking',
    '--disable-component-update',
    '--disable-sync',
    '--disable-dev-shm-usage',
  ],
});
try {
  type Target = { baseUrl: string; cookie: string; paths: Record<string, string> };
  const targets = {} as Record<keyof typeof servers, Target>;
  for (const [build, server] of Object.entries(servers) as [keyof typeof servers, (typeof servers)['this']][]) {
    const viewer = new ApiClient(server.baseUrl);
    await viewer.signIn('viewer@lashline.test', 'lashline-demo');
    const sets = (await viewer.get('/api/gear-sets')).body.items as { id: string; serial: string }[];
    const set = sets.find((s) => s.serial === 'GS-4101')!;
    const inspections = (await viewer.get(`/api/inspections?gearSetId=${set.id}`)).body.items as { id: string }[];
    targets[build] = {
      baseUrl: server.baseUrl,
      cookie: viewer.cookieHeader(),
      paths: { board: '/', 'gear set': `/gear-sets/${set.id}`, inspection: `/inspections/${inspections.at(-1)!.id}` },
    };
  }
  const audit = (t: Target, path: string) =>
    lighthouse(`${t.baseUrl}${path}`, {
      port: chrome.port,
      output: 'json',
      logLevel: 'error',
      onlyCategories: ['performance'],
      extraHeaders: { Cookie: t.cookie },
    });
  await audit(targets.this, '/'); // warm-up, not counted
  const results: Record<string, { performance: number[]; tbt: number[] }> = {};
  for (let i = 0; i < RUNS; i += 1) {
    for (const page of Object.keys(targets.this.paths)) {
      // Alternate which build goes first, so neither always gets the warmer browser.
      for (const build of i % 2 ? (['other', 'this'] as const) : (['this', 'other'] as const)) {
        const lhr = (await audit(targets[build], targets[build].paths[page]!))!.lhr;
        if (lhr.runtimeError) continue;
        const r = (results[`${page}, ${build === 'this' ? 'this build' : 'other build'}`] ??= {
          performance: [],
          tbt: [],
        });
        r.performance.push(Math.round(lhr.categories.performance!.score! * 100));
        r.tbt.push(Math.round(lhr.audits['total-blocking-time']!.numericValue!));
      }
    }
  }
  for (const [key, r] of Object.entries(results).sort())
    console.log(
      `${key.padEnd(26)} performance ${median(r.performance)} [${r.performance.join(', ')}]  TBT ${median(r.tbt)} ms [${r.tbt.join(', ')}]`,
    );
} finally {
  chrome.kill();
  await servers.this.stop();
  await servers.other.stop();
}
