/**
 * The screens at a season against the demo, side by side in one run, through the real built server:
 * each page's median latency measured at the client with 20 concurrent readers (signed in as the demo
 * crew chief) — the board, the gear set page (at the season, the set with 200 inspections), its latest
 * inspection, the parts page and a review of that set — on the demo, then on the demo plus a season
 * (seed/season.ts), with the ratio season/demo (target at most 2×) and the board's HTML size at the
 * season (target under 150 KB). One server at a time, so the two never share the CPU.
 *
 *   npm run build && npx tsx bench/season.ts [seconds per page] [readers]
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { ApiClient } from '../tests/helpers/api-client';
import { PROJECT_ROOT, startServer, type RunningServer } from '../tests/helpers/server';

const seconds = Number(process.argv[2] ?? 6);
const readers = Number(process.argv[3] ?? 20);
const WARM_UP_MS = 1500;
const PAGES = ['board', 'gear set', 'inspection', 'parts', 'review'] as const;
type Page = (typeof PAGES)[number];

interface Figures {
  median: Record<Page, number>;
  requests: Record<Page, number>;
  boardBytes: number;
  bytes: Record<Page, number>;
  inspections: number;
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

function seedSeason(databaseUrl: string): Promise<void> {
  return new Promise((resolveSeed, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', 'scripts/db-seed.ts', '--season'], {
      cwd: PROJECT_ROOT,
      env: { PATH: process.env.PATH, HOME: process.env.HOME, DATABASE_URL: databaseUrl },
      stdio: ['ignore', 'inherit', 'inherit'],
    });
    child.on('exit', (code) => (code === 0 ? resolveSeed() : reject(new Error(`seeding failed (${code})`))));
  });
}

/** The addresses of the five pages: the gear set with the most inspections, its latest one, a review. */
async function findPages(chief: ApiClient): Promise<{ paths: Record<Page, string>; inspections: number }> {
  const sets = (await chief.get<{ items: { id: string; serial: string }[] }>('/api/gear-sets?limit=500')).body.items;
  let best = { id: '', count: -1, latest: '' };
  for (const set of sets) {
    const items = (
      await chief.get<{ items: { id: string }[] }>(`/api/inspections?gearSetId=${set.id}&status=submitted&limit=500`)
    ).body.items;
    if (items.length > best.count) best = { id: set.id, count: items.length, latest: items.at(-1)?.id ?? '' };
  }
  const reviews = (await chief.get<{ items: { id: string }[] }>(`/api/reviews?gearSetId=${best.id}`)).body.items;
  const anyReview = (await chief.get<{ items: { id: string }[] }>('/api/reviews')).body.items;
  const review = reviews[0]?.id ?? anyReview[0]?.id;
  if (!best.latest || !review) throw new Error('no gear set with inspections, or no review');
  return {
    paths: {
      board: '/',
      'gear set': `/gear-sets/${best.id}`,
      inspection: `/inspections/${best.latest}`,
      parts: '/parts',
      review: `/reviews/${review}`,
    },
    inspections: best.count,
  };
}

/** `readers` loops asking one page for `seconds`, after a warm-up; the median of what the client saw. */
async function measure(server: RunningServer, chief: ApiClient, path: string): Promise<number[]> {
  const latencies: number[] = [];
  const cookie = chief.cookieHeader();
  let recording = false;
  let stop = false;
  const loop = async (): Promise<void> => {
    while (!stop) {
      const started = performance.now();
      const response = await fetch(`${server.baseUrl}${path}`, { headers: { cookie } });
      await response.arrayBuffer();
      if (response.status !== 200) throw new Error(`${path} answered ${response.status}`);
      if (recording) latencies.push(performance.now() - started);
    }
  };
  const loops = Array.from({ length: readers }, loop);
  await new Promise((r) => setTimeout(r, WARM_UP_MS));
  recording = true;
  await new Promise((r) => setTimeout(r, seconds * 1000));
  stop = true;
  await Promise.all(loops);
  return latencies;
}

async function run(server: RunningServer, label: string): Promise<Figures> {
  const chief = new ApiClient(server.baseUrl);
  await chief.signIn('chief@lashline.test', 'lashline-demo');
  const { paths, inspections } = await findPages(chief);
  const figures: Figures = {
    median: {} as Record<Page, number>,
    requests: {} as Record<Page, number>,
    boardBytes: 0,
    bytes: {} as Record<Page, number>,
    inspections,
  };
  const board = await fetch(`${server.baseUrl}/`, { headers: { cookie: chief.cookieHeader() } });
  figures.boardBytes = (await board.arrayBuffer()).byteLength;
  for (const page of PAGES) {
    const once = await fetch(`${server.baseUrl}${paths[page]}`, { headers: { cookie: chief.cookieHeader() } });
    figures.bytes[page] = (await once.arrayBuffer()).byteLength;
    const latencies = await measure(server, chief, paths[page]);
    figures.median[page] = median(latencies);
    figures.requests[page] = latencies.length;
    console.error(
      `${label}: ${page} ${paths[page]} median ${figures.median[page].toFixed(1)} ms (${latencies.length} requests)`,
    );
  }
  return figures;
}

const demoServer = await startServer({ demo: true });
let demo: Figures;
try {
  demo = await run(demoServer, 'demo');
} finally {
  await demoServer.stop();
}

const seasonDir = mkdtempSync(join(tmpdir(), 'lashline-season-'));
let season: Figures;
try {
  await seedSeason(`file:${join(seasonDir, 'lashline.db')}`);
  const seasonServer = await startServer({ dataDir: seasonDir });
  try {
    season = await run(seasonServer, 'season');
  } finally {
    await seasonServer.stop();
  }
} finally {
  rmSync(seasonDir, { recursive: true, force: true });
}

console.log(
  `\n${readers} concurrent readers, ${seconds} s per page after a ${WARM_UP_MS} ms warm-up; median latency at the client`,
);
console.log(
  `${'page'.padEnd(12)} ${'demo'.padStart(10)} ${'season'.padStart(10)} ${'ratio'.padStart(7)}  target ≤ 2×   HTML demo / season`,
);
for (const page of PAGES) {
  const ratio = season.median[page] / demo.median[page];
  console.log(
    `${page.padEnd(12)} ${`${demo.median[page].toFixed(1)} ms`.padStart(10)} ${`${season.median[page].toFixed(1)} ms`.padStart(10)} ${`${ratio.toFixed(2)}×`.padStart(7)}  ${(ratio <= 2 ? 'met' : 'MISSED').padEnd(12)}${(demo.bytes[page] / 1024).toFixed(1)} / ${(season.bytes[page] / 1024).toFixed(1)} KB`,
  );
}
console.log(`gear set page: ${demo.inspections} inspections on the demo, ${season.inspections} at the season`);
const kb = (bytes: number) => `${(bytes / 1024).toFixed(1)} KB`;
console.log(
  `board HTML: ${kb(demo.boardBytes)} on the demo, ${kb(season.boardBytes)} at the season (target < 150 KB: ${season.boardBytes < 150 * 1024 ? 'met' : 'MISSED'})`,
);
