/**
 * Concurrent writes through the real built server: 50 clients (one shared signed-in session) logging
 * runs and creating inspection drafts with distinct Idempotency-Keys (every 10th resends an earlier
 * key) for 60 s on loopback. Prints req/s, p50 and p99 per route and the counts; then checks that
 * every acknowledged write is there, counted through the API, and that no 5xx or database error
 * reached a client. tests/api/load.test.ts is the short version.
 *
 *   npm run build && npx tsx bench/load-writes.ts [seconds] [clients]
 *   (another build: LASHLINE_DIST=/tmp/mine/dist, its parent folder holding a node_modules link)
 */
import { signedInClient } from '../tests/helpers/api-client';
import {
  describeLatencies,
  describeStatuses,
  listAllIds,
  runWriteLoad,
  DATABASE_ERROR_TEXT,
} from '../tests/helpers/load';
import { startServer } from '../tests/helpers/server';

const seconds = Number(process.argv[2] ?? 60);
const clients = Number(process.argv[3] ?? 50);
const server = await startServer();
let failed = false;
try {
  const { client } = await signedInClient(server.baseUrl, { team: 'Bench Crew' });
  const carId = (await client.post('/api/cars', { name: 'Bench car' })).body.id as string;
  const gearSetId = (await client.post('/api/gear-sets', { serial: 'BENCH-W1', ringTeeth: 41, pinionTeeth: 10 })).body
    .id as string;
  console.log(`writing for ${seconds} s from ${clients} clients on ${server.baseUrl} …`);
  const result = await runWriteLoad({
    clients: Array.from({ length: clients }, () => client),
    carId,
    gearSetId,
    durationMs: seconds * 1000,
    maxRequestsPerWorker: 100_000,
  });
  const all = [...result.latencies.runs, ...result.latencies.inspections];
  console.log(
    `${result.requests} answers in ${(result.elapsedMs / 1000).toFixed(1)} s: ${describeStatuses(result.statuses)}`,
  );
  console.log(describeLatencies('POST /api/runs', result.latencies.runs, result.elapsedMs));
  console.log(describeLatencies('POST /api/inspections', result.latencies.inspections, result.elapsedMs));
  console.log(describeLatencies('all writes', all, result.elapsedMs));
  const runs = await listAllIds(client, '/api/runs');
  const runSet = new Set(runs);
  const inspections = await listAllIds(client, '/api/inspections');
  const inspectionSet = new Set(inspections);
  const missingRuns = [...result.acknowledgedRuns].filter((id) => !runSet.has(id)).length;
  const missingInspections = [...result.acknowledgedInspections].filter((id) => !inspectionSet.has(id)).length;
  console.log(`runs: ${result.acknowledgedRuns.size} acknowledged, ${runs.length} listed, ${missingRuns} missing`);
  console.log(
    `inspections: ${result.acknowledgedInspections.size} acknowledged, ${inspections.length} listed, ${missingInspections} missing; ${result.repeats} repeated keys, ${result.badRepeats.length} answered wrongly`,
  );
  console.log(
    `5xx or database text: ${result.leaks.length}; no answer: ${result.networkErrors.length}; database errors in the server log: ${DATABASE_ERROR_TEXT.test(server.output()) ? 'yes' : 'none'}`,
  );
  for (const line of [...result.leaks, ...result.badRepeats, ...result.networkErrors].slice(0, 10))
    console.log(`  ${line}`);
  failed =
    result.leaks.length > 0 ||
    result.badRepeats.length > 0 ||
    result.networkErrors.length > 0 ||
    missingRuns + missingInspections > 0 ||
    runs.length !== result.acknowledgedRuns.size ||
    inspections.length !== result.acknowledgedInspections.size;
  console.log(failed ? 'RESULT: FAILED' : 'RESULT: every acknowledged write is present; no 5xx, no database error');
} finally {
  await server.stop();
}
process.exitCode = failed ? 1 : 0;
