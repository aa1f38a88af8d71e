import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInClient, type ApiClient } from '../helpers/api-client';
import { describeLatencies, describeStatuses, listAllIds, runWriteLoad, DATABASE_ERROR_TEXT } from '../helpers/load';
import { startServer, type RunningServer } from '../helpers/server';

/**
 * 50 concurrent clients writing through the API for a few seconds (bench/load-writes.ts is the
 * 60 s version with figures): no 5xx, no database error text reaching a client, and every write
 * the server acknowledged with 201 is there afterwards, counted through the API.
 */

const CLIENTS = 50;
const WRITE_MS = 6_000;

let server: RunningServer;
let writer: ApiClient;
let carId: string;
let gearSetId: string;

beforeAll(async () => {
  server = await startServer();
  const owner = await signedInClient(server.baseUrl, { team: 'Load Crew' });
  carId = (await owner.client.post('/api/cars', { name: 'Load car' })).body.id;
  gearSetId = (await owner.client.post('/api/gear-sets', { serial: 'LOAD-1', ringTeeth: 41, pinionTeeth: 10 })).body.id;
  // The shared session of the writers is the owner's: the traffic is what matters here, not the role.
  writer = owner.client;
});
afterAll(() => server?.stop());

describe('50 concurrent writers', () => {
  it(
    'get no 5xx and no database error, and every acknowledged write is there afterwards',
    { timeout: 60_000 },
    async () => {
      const result = await runWriteLoad({
        clients: Array.from({ length: CLIENTS }, () => writer),
        carId,
        gearSetId,
        durationMs: WRITE_MS,
        maxRequestsPerWorker: 400,
      });
      console.log(
        [
          `load: ${result.requests} requests in ${(result.elapsedMs / 1000).toFixed(1)} s from ${CLIENTS} clients (${describeStatuses(result.statuses)})`,
          describeLatencies('POST /api/runs', result.latencies.runs, result.elapsedMs),
          describeLatencies('POST /api/inspections', result.latencies.inspections, result.elapsedMs),
        ].join('\n'),
      );
      expect(result.networkErrors).toEqual([]);
      expect(result.leaks).toEqual([]);
      expect(result.badRepeats).toEqual([]);
      expect([...result.statuses.keys()].every((status) => status === 200 || status === 201)).toBe(true);
      expect(result.acknowledgedRuns.size).toBeGreaterThanOrEqual(CLIENTS / 2);
      expect(result.acknowledgedInspections.size).toBeGreaterThanOrEqual(CLIENTS / 2);
      expect(result.repeats).toBeGreaterThan(0);

      const runs = await listAllIds(writer, '/api/runs');
      const inspections = await listAllIds(writer, '/api/inspections');
      expect(new Set(runs).size).toBe(runs.length);
      expect(runs.length).toBe(result.acknowledgedRuns.size);
      expect(runs.filter((id) => !result.acknowledgedRuns.has(id))).toEqual([]);
      expect(new Set(inspections).size).toBe(inspections.length);
      expect(inspections.length).toBe(result.acknowledgedInspections.size);
      expect(inspections.filter((id) => !result.acknowledgedInspections.has(id))).toEqual([]);
      expect(server.output()).not.toMatch(DATABASE_ERROR_TEXT);
    },
  );
});
