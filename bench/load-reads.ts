/**
 * A mixed read workload against the demo data through the real built server: the board page (/),
 * GET /api/gear-sets/:id/analysis (rotating over the demo's gear sets), GET /api/parts and
 * GET /api/runs, from 50 connections for 20 s, signed in as the demo viewer. Prints req/s, p50 and
 * p99 per route and the statuses.
 *
 *   npm run build && npx tsx bench/load-reads.ts [seconds] [connections]
 *   (another build: LASHLINE_DIST=/tmp/mine/dist, its parent folder holding a node_modules link)
 */
import { performance } from 'node:perf_hooks';
import { ApiClient } from '../tests/helpers/api-client';
import { describeLatencies, describeStatuses } from '../tests/helpers/load';
import { startServer } from '../tests/helpers/server';

const seconds = Number(process.argv[2] ?? 20);
const connections = Number(process.argv[3] ?? 50);
const WARM_UP_MS = 2000;

const server = await startServer({ demo: true });
try {
  const viewer = new ApiClient(server.baseUrl);
  await viewer.signIn('viewer@lashline.test', 'lashline-demo');
  if (!viewer.hasSessionCookie()) throw new Error('could not sign in as the demo viewer');
  const gearSets = (await viewer.get<{ items: { id: string }[] }>('/api/gear-sets?limit=500')).body.items.map(
    (item) => item.id,
  );
  if (gearSets.length === 0) throw new Error('the demo has no gear sets');
  const routes: { label: string; path: (i: number) => string }[] = [
    { label: 'GET / (board page)', path: () => '/' },
    {
      label: 'GET /api/gear-sets/:id/analysis',
      path: (i) => `/api/gear-sets/${gearSets[i % gearSets.length]}/analysis`,
    },
    { label: 'GET /api/parts', path: () => '/api/parts' },
    { label: 'GET /api/runs', path: () => '/api/runs' },
  ];
  const latencies = routes.map(() => [] as number[]);
  const statuses = new Map<number, number>();
  let failures = 0;

  const run = async (durationMs: number, record: boolean): Promise<number> => {
    const started = performance.now();
    const deadline = started + durationMs;
    await Promise.all(
      Array.from({ length: connections }, async (_, worker) => {
        for (let i = worker; performance.now() < deadline && i < worker + 1_000_000; i += 1) {
          const route = i % routes.length;
          const t0 = performance.now();
          try {
            const response = await viewer.request(routes[route]!.path(i));
            await response.arrayBuffer();
            if (!record) continue;
            latencies[route]!.push(performance.now() - t0);
            statuses.set(response.status, (statuses.get(response.status) ?? 0) + 1);
          } catch {
            if (record) failures += 1;
          }
        }
      }),
    );
    return performance.now() - started;
  };

  console.log(
    `${connections} connections, ${seconds} s after a ${WARM_UP_MS / 1000} s warm-up, demo data (${gearSets.length} gear sets), signed in as the viewer, on ${server.baseUrl}`,
  );
  await run(WARM_UP_MS, false);
  const elapsed = await run(seconds * 1000, true);
  routes.forEach((route, i) => console.log(describeLatencies(route.label, latencies[i]!, elapsed)));
  console.log(describeLatencies('all', latencies.flat(), elapsed));
  console.log(`statuses: ${describeStatuses(statuses)}; no answer: ${failures}`);
} finally {
  await server.stop();
}
