import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInClient, type ApiClient } from '../helpers/api-client';
import { makeRunCsv } from '../helpers/run-csv';
import { startServer, type RunningServer } from '../helpers/server';

let server: RunningServer;
let chief: ApiClient;
let carId: string;
let gearId: string;
beforeAll(async () => {
  server = await startServer();
  chief = (await signedInClient(server.baseUrl, { team: 'Import Crew' })).client;
  carId = (await chief.post('/api/cars', { name: 'Nine Volt' })).body.id;
  await chief.post('/api/cars', { name: 'Second Wind' });
  const assembly = (await chief.post('/api/assemblies', { serial: 'IM-1', name: 'Import rear end' })).body.id;
  gearId = (await chief.post('/api/gear-sets', { serial: 'IM-G', ringTeeth: 40, pinionTeeth: 9 })).body.id;
  await chief.post('/api/installations', {
    action: 'install',
    assemblyId: assembly,
    carId,
    at: '2026-01-01T00:00:00Z',
  });
  await chief.post('/api/installations', {
    action: 'install',
    partId: gearId,
    assemblyId: assembly,
    at: '2026-01-01T00:00:00Z',
  });
});
afterAll(() => server?.stop());

async function countRuns(): Promise<number> {
  let total = 0;
  let cursor: string | null = '';
  while (cursor !== null) {
    const page: { body: { items: unknown[]; nextCursor: string | null } } = await chief.get(
      `/api/runs?limit=500${cursor ? `&cursor=${cursor}` : ''}`,
    );
    total += page.body.items.length;
    cursor = page.body.nextCursor;
  }
  return total;
}

function postCsv(csv: string, dryRun = false) {
  return chief.request(`/api/runs/import${dryRun ? '?dryRun=1' : ''}`, {
    method: 'POST',
    headers: { 'content-type': 'text/csv' },
    body: csv,
  });
}

describe('importing runs from CSV', () => {
  it('imports a good file in one go and charges the installed parts', async () => {
    const response = await postCsv(makeRunCsv(['Nine Volt', 'Second Wind'], 10));
    expect(response.status).toBe(201);
    expect(await response.json()).toMatchObject({ imported: 10, problems: [] });
    expect(await countRuns()).toBe(10);
    // Five of the ten rows are for Nine Volt, whose assembly holds the gear set.
    expect((await chief.get(`/api/parts/${gearId}`)).body.totalRuns).toBe(5);
  });

  it('writes nothing from a file with bad rows, naming each row and field', async () => {
    const before = await countRuns();
    const csv = [
      'car,at,event,elapsed_seconds,speed_mph',
      'Nine Volt,2026-05-01T10:00:00Z,Meet,6.01,230',
      'Nine Volt,not a date,Meet,6.01,230',
      'Nine Volt,2026-05-01T11:00:00Z,Meet,-3,230',
      'Nine Volt,2026-05-01T12:00:00Z,Meet,6.02,fast',
    ].join('\n');
    const response = await postCsv(csv);
    expect(response.status).toBe(422);
    const body = await response.json();
    expect(body.error.message).toContain('3 rows need fixing');
    expect(body.error.fields['line 3']).toContain('at:');
    expect(body.error.fields['line 4']).toContain('elapsedSeconds:');
    expect(body.error.fields['line 5']).toContain('speedMph:');
    expect(await countRuns()).toBe(before);
  });

  it("refuses a row naming another team's car, and writes nothing", async () => {
    const stranger = (await signedInClient(server.baseUrl, { team: 'Other Importers' })).client;
    await stranger.post('/api/cars', { name: 'Their Rocket' });
    const before = await countRuns();
    const response = await postCsv('car,at\nNine Volt,2026-05-02T10:00:00Z\nTheir Rocket,2026-05-02T11:00:00Z\n');
    expect(response.status).toBe(422);
    expect((await response.json()).error.fields['line 3']).toContain('No car called “Their Rocket” in this team');
    expect(await countRuns()).toBe(before);
  });

  it('previews without writing (dry run) and lists the problems', async () => {
    const before = await countRuns();
    const response = await postCsv('car,at\nNine Volt,2026-05-03T10:00:00Z\nGhost,2026-05-03T11:00:00Z\n', true);
    expect(response.status).toBe(200);
    const body = await response.json();
    expect(body).toMatchObject({ imported: 0, checked: 2 });
    expect(body.problems).toEqual([{ line: 3, fields: { car: 'No car called “Ghost” in this team.' } }]);
    expect(await countRuns()).toBe(before);
  });

  it('imports the rows left after the user leaves out the bad ones (JSON records)', async () => {
    const before = await countRuns();
    const kept = [{ car: 'Nine Volt', at: '2026-05-04T10:00:00Z', event: 'Kept', round: 'Q1', lane: 'left' }];
    const answer = await chief.post('/api/runs/import', { records: kept });
    expect(answer.status).toBe(201);
    expect(await countRuns()).toBe(before + 1);
  });

  it('needs the car and at columns', async () => {
    const response = await postCsv('vehicle,when\nNine Volt,2026-05-05T10:00:00Z\n');
    expect(response.status).toBe(422);
    expect((await response.json()).error.fields['line 1']).toContain('car, at');
  });

  it('imports a file of 5,000 rows', async () => {
    const before = await countRuns();
    const response = await postCsv(makeRunCsv(['Nine Volt', 'Second Wind'], 5000, Date.UTC(2026, 6, 1)));
    expect(response.status).toBe(201);
    expect((await response.json()).imported).toBe(5000);
    expect(await countRuns()).toBe(before + 5000);
  });
});
