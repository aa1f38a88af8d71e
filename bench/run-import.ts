/**
 * How long a 5,000-row CSV import of runs takes through the real built server, end to end
 * (upload, parse, check every row, one transaction). Target: under 2 s on the 2-core machine.
 *
 *   npm run build && npx tsx bench/run-import.ts [rows] [repeats]
 */
import { signedInClient } from '../tests/helpers/api-client';
import { makeRunCsv } from '../tests/helpers/run-csv';
import { startServer } from '../tests/helpers/server';

const rows = Number(process.argv[2] ?? 5000);
const repeats = Number(process.argv[3] ?? 5);
const server = await startServer();
try {
  const { client } = await signedInClient(server.baseUrl, { team: 'Bench Crew' });
  await client.post('/api/cars', { name: 'Bench A' });
  await client.post('/api/cars', { name: 'Bench B' });
  const timings: number[] = [];
  for (let i = 0; i < repeats; i += 1) {
    const csv = makeRunCsv(['Bench A', 'Bench B'], rows, Date.UTC(2026, 0, 1) + i * rows * 60_000);
    const started = performance.now();
    const response = await client.request('/api/runs/import', {
      method: 'POST',
      headers: { 'content-type': 'text/csv' },
      body: csv,
    });
    const body = (await response.json()) as { imported?: number };
    const ms = performance.now() - started;
    if (response.status !== 201 || body.imported !== rows)
      throw new Error(`import failed: ${response.status} ${JSON.stringify(body).slice(0, 300)}`);
    timings.push(ms);
    console.log(`run ${i + 1}: ${rows} rows (${(csv.length / 1024).toFixed(0)} KB) imported in ${ms.toFixed(0)} ms`);
  }
  const sorted = [...timings].sort((a, b) => a - b);
  const median = sorted[Math.floor(sorted.length / 2)]!;
  console.log(
    `median ${median.toFixed(0)} ms, best ${sorted[0]!.toFixed(0)} ms, worst ${sorted.at(-1)!.toFixed(0)} ms for ${rows} rows; target < 2000 ms: ${median < 2000 ? 'met' : 'MISSED'}`,
  );
} finally {
  await server.stop();
}
