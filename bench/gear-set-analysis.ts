/**
 * Latency of GET /api/gear-sets/:id/analysis for a set with 200 submitted inspections, through the
 * real built server. Target: under 20 ms at the median.
 *
 *   npm run build && npx tsx bench/gear-set-analysis.ts [inspections] [requests]
 */
import { signedInClient } from '../tests/helpers/api-client';
import { draftBody, submitInspection } from '../tests/helpers/inspections';
import { startServer } from '../tests/helpers/server';

const count = Number(process.argv[2] ?? 200);
const requests = Number(process.argv[3] ?? 300);
const server = await startServer();
try {
  const { client } = await signedInClient(server.baseUrl, { team: 'Bench Crew' });
  const gearSetId = (await client.post('/api/gear-sets', { serial: 'BENCH-1', ringTeeth: 41, pinionTeeth: 10 })).body
    .id as string;
  for (let i = 0; i < count; i += 1) {
    const drift = i * 0.00005;
    await submitInspection(
      client,
      draftBody(gearSetId, {
        runsAtInspection: i,
        inspectedAt: new Date(Date.UTC(2026, 0, 1) + i * 3_600_000).toISOString(),
        readings: [
          0.007 + drift,
          0.006 + drift,
          0.0055 + drift,
          0.0065 + drift,
          0.007 + drift,
          0.006 + drift,
          0.0055 + drift,
          0.0065 + drift,
        ],
        runout: { backFace: 0.001 },
        preload: { pinionTorque: 10, bearings: 'used' },
        patterns: { drive: { along: 0.5, up: 0.5 }, coast: { along: 0.45, up: 0.55 } },
      }),
    );
  }
  const check = await client.get(`/api/gear-sets/${gearSetId}/analysis`);
  if (check.status !== 200 || check.body.inspectionCount !== count) throw new Error(`analysis failed: ${check.status}`);
  for (let i = 0; i < 20; i += 1) await client.get(`/api/gear-sets/${gearSetId}/analysis`);
  const timings: number[] = [];
  for (let i = 0; i < requests; i += 1) {
    const started = performance.now();
    const response = await client.request(`/api/gear-sets/${gearSetId}/analysis`);
    await response.arrayBuffer();
    timings.push(performance.now() - started);
  }
  timings.sort((a, b) => a - b);
  const at = (q: number) => timings[Math.min(timings.length - 1, Math.floor(q * timings.length))]!;
  console.log(`GET /api/gear-sets/:id/analysis, ${count} inspections, ${requests} sequential requests`);
  console.log(
    `p50 ${at(0.5).toFixed(2)} ms  p90 ${at(0.9).toFixed(2)} ms  p99 ${at(0.99).toFixed(2)} ms  (answer ${(JSON.stringify(check.body).length / 1024).toFixed(0)} KB)`,
  );
  console.log(`target median < 20 ms: ${at(0.5) < 20 ? 'met' : 'MISSED'}`);
} finally {
  await server.stop();
}
