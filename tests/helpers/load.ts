import { performance } from 'node:perf_hooks';
import type { ApiClient } from './api-client';
import { draftBody } from './inspections';

/**
 * Concurrent write traffic for the load test and bench/load-writes.ts: clients logging runs and
 * creating inspection drafts through the API on loopback, with what came back tallied so the
 * caller can check that every acknowledged write is there afterwards.
 */

/** Text that means a database error reached a client. */
export const DATABASE_ERROR_TEXT = /SQLITE|database is locked/i;

export interface WriteLoadOptions {
  /** One signed-in client per worker (the same one may be repeated: one shared session). */
  clients: ApiClient[];
  carId: string;
  gearSetId: string;
  durationMs: number;
  /** A bound on requests per worker, whatever the time. */
  maxRequestsPerWorker: number;
  /** Every n-th inspection resends an earlier Idempotency-Key, which must answer 200 with the same draft. */
  repeatEvery?: number;
}

export interface WriteLoadResult {
  requests: number;
  elapsedMs: number;
  statuses: Map<number, number>;
  /** Milliseconds per request, by kind. */
  latencies: { runs: number[]; inspections: number[] };
  acknowledgedRuns: Set<string>;
  acknowledgedInspections: Set<string>;
  repeats: number;
  /** Repeats that did not answer 200 with the draft of the first request. */
  badRepeats: string[];
  /** Bodies of 5xx answers, and answers that mention the database. */
  leaks: string[];
  /** Requests that got no answer at all (connection refused or reset). */
  networkErrors: string[];
}

let sequence = 0;

/** Runs the load and returns the tally; never throws for a bad answer (the caller asserts). */
export async function runWriteLoad(options: WriteLoadOptions): Promise<WriteLoadResult> {
  const result: WriteLoadResult = {
    requests: 0,
    elapsedMs: 0,
    statuses: new Map(),
    latencies: { runs: [], inspections: [] },
    acknowledgedRuns: new Set(),
    acknowledgedInspections: new Set(),
    repeats: 0,
    badRepeats: [],
    leaks: [],
    networkErrors: [],
  };
  const repeatEvery = options.repeatEvery ?? 10;
  const started = performance.now();
  const deadline = started + options.durationMs;
  const tag = `${Date.now().toString(36)}-${(sequence += 1)}`;

  let inspectionRequests = 0;
  const worker = async (client: ApiClient, index: number): Promise<void> => {
    const keys: { key: string; id: string }[] = [];
    for (let i = 0; i < options.maxRequestsPerWorker && performance.now() < deadline; i += 1) {
      const isRun = (i + index) % 2 === 0;
      if (!isRun) inspectionRequests += 1;
      const repeat =
        !isRun && keys.length > 0 && inspectionRequests % repeatEvery === 0 ? keys[i % keys.length] : undefined;
      const key = repeat?.key ?? `load-${tag}-${index}-${i}`;
      // Distinct times in the past (a run more than a day ahead is refused): a minute apart, 10,000 per worker.
      const at = new Date(Date.UTC(2024, 0, 1) + (index * 10_000 + i) * 60_000).toISOString();
      const t0 = performance.now();
      let status = 0;
      let text = '';
      try {
        const response = isRun
          ? await client.request('/api/runs', {
              method: 'POST',
              headers: { 'content-type': 'application/json' },
              body: JSON.stringify({ carId: options.carId, at, event: 'Load test', notes: `worker ${index} #${i}` }),
            })
          : await client.request('/api/inspections', {
              method: 'POST',
              headers: { 'content-type': 'application/json', 'idempotency-key': key },
              body: JSON.stringify(draftBody(options.gearSetId, { inspectedAt: at, runsAtInspection: i })),
            });
        status = response.status;
        text = await response.text();
      } catch (error) {
        result.networkErrors.push(
          `${isRun ? 'run' : 'inspection'}: ${(error as Error).message} ${String((error as Error).cause ?? '')}`,
        );
        continue;
      }
      const ms = performance.now() - t0;
      result.requests += 1;
      (isRun ? result.latencies.runs : result.latencies.inspections).push(ms);
      result.statuses.set(status, (result.statuses.get(status) ?? 0) + 1);
      if (status >= 500 || DATABASE_ERROR_TEXT.test(text)) result.leaks.push(`${status} ${text.slice(0, 300)}`);
      const id = status === 200 || status === 201 ? (JSON.parse(text) as { id: string }).id : undefined;
      if (repeat) {
        result.repeats += 1;
        if (status !== 200 || id !== repeat.id) result.badRepeats.push(`${status} ${id} for the draft ${repeat.id}`);
      } else if (status === 201 && id) {
        (isRun ? result.acknowledgedRuns : result.acknowledgedInspections).add(id);
        if (!isRun) keys.push({ key, id });
      }
    }
  };

  await Promise.all(options.clients.map((client, index) => worker(client, index)));
  result.elapsedMs = performance.now() - started;
  return result;
}

/** Every id of a paginated list endpoint (`{ items, nextCursor }`), following the cursors. */
export async function listAllIds(client: ApiClient, path: string, maxPages = 1000): Promise<string[]> {
  const ids: string[] = [];
  let cursor: string | null = null;
  for (let page = 0; page < maxPages; page += 1) {
    const separator = path.includes('?') ? '&' : '?';
    const answer: { status: number; body: { items: { id: string }[]; nextCursor: string | null } } = await client.get(
      `${path}${separator}limit=500${cursor ? `&cursor=${encodeURIComponent(cursor)}` : ''}`,
    );
    if (answer.status !== 200)
      throw new Error(`GET ${path}: ${answer.status} ${JSON.stringify(answer.body).slice(0, 300)}`);
    ids.push(...answer.body.items.map((item) => item.id));
    cursor = answer.body.nextCursor;
    if (!cursor) return ids;
  }
  throw new Error(`GET ${path}: more than ${maxPages} pages`);
}

/** The p-th percentile (0–100) of `values`, nearest rank. */
export function percentile(values: number[], p: number): number {
  if (values.length === 0) return Number.NaN;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))]!;
}

/** One line of figures: count, req/s, p50 and p99 in ms. */
export function describeLatencies(label: string, values: number[], elapsedMs: number): string {
  const rate = values.length / (elapsedMs / 1000);
  return `${label.padEnd(34)} ${String(values.length).padStart(7)} req  ${rate.toFixed(1).padStart(8)} req/s  p50 ${percentile(values, 50).toFixed(1).padStart(7)} ms  p99 ${percentile(values, 99).toFixed(1).padStart(7)} ms`;
}

/** The statuses as `201×812, 200×40`. */
export function describeStatuses(statuses: Map<number, number>): string {
  return [...statuses]
    .sort(([a], [b]) => a - b)
    .map(([status, count]) => `${status}×${count}`)
    .join(', ');
}
