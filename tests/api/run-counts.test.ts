import { createClient } from '@libsql/client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ApiClient } from '../helpers/api-client';
import { startServer, type RunningServer } from '../helpers/server';
import { SmtpFake } from '../helpers/smtp-fake';
import { makeTeamOfFour, type TeamOfFour } from '../helpers/team';

let server: RunningServer;
let smtp: SmtpFake;
let team: TeamOfFour;
beforeAll(async () => {
  smtp = await SmtpFake.create();
  await smtp.start();
  server = await startServer({ env: { SMTP_PORT: String(smtp.port) } });
  team = await makeTeamOfFour(server.baseUrl, smtp, 'Counting Crew');
});
afterAll(async () => {
  await server?.stop();
  await smtp?.stop();
});

async function created(client: ApiClient, path: string, body: unknown): Promise<string> {
  const answer = await client.post(path, body);
  if (answer.status !== 201) throw new Error(`${path}: ${answer.status} ${JSON.stringify(answer.body)}`);
  return answer.body.id;
}

async function counts(client: ApiClient, partId: string): Promise<[number, number]> {
  const part = (await client.get(`/api/parts/${partId}`)).body;
  return [part.totalRuns, part.runsSinceInstall];
}

const at = (hour: number) => new Date(Date.UTC(2026, 5, 1, hour)).toISOString();

describe('run counts derived from the installation history and the run log', () => {
  it('charges exactly the runs a part was there for, through moves, edits and deletes', async () => {
    const { chief, tech } = team;
    const carA = await created(chief, '/api/cars', { name: 'A-car' });
    const carB = await created(chief, '/api/cars', { name: 'B-car' });
    const x = await created(chief, '/api/assemblies', { serial: 'X-1', name: 'Assembly X' });
    const y = await created(chief, '/api/assemblies', { serial: 'Y-1', name: 'Assembly Y' });
    const gear = await created(chief, '/api/gear-sets', { serial: 'G-1', ringTeeth: 41, pinionTeeth: 10 });
    const spindle = await created(chief, '/api/parts', { kind: 'spindle', serial: 'S-1' });

    // A run before anything is installed is charged to nothing.
    await created(tech, '/api/runs', { carId: carA, at: at(9) });
    await created(tech, '/api/installations', { action: 'install', assemblyId: x, carId: carA, at: at(10) });
    await created(tech, '/api/installations', { action: 'install', partId: gear, assemblyId: x, at: at(10) });
    await created(tech, '/api/installations', { action: 'install', partId: spindle, assemblyId: x, at: at(10) });
    expect(await counts(tech, gear)).toEqual([0, 0]);

    const run1 = await created(tech, '/api/runs', { carId: carA, at: at(11) });
    await created(tech, '/api/runs', { carId: carA, at: at(12) });
    await created(tech, '/api/runs', { carId: carB, at: at(12) });
    expect(await counts(tech, gear)).toEqual([2, 2]);
    expect(await counts(tech, spindle)).toEqual([2, 2]);

    // Mid-season the set moves to assembly Y, which goes into car B.
    await created(tech, '/api/installations', { action: 'remove', partId: gear, at: at(13) });
    await created(tech, '/api/installations', { action: 'install', partId: gear, assemblyId: y, at: at(13) });
    await created(tech, '/api/installations', { action: 'install', assemblyId: y, carId: carB, at: at(13) });
    await created(tech, '/api/runs', { carId: carA, at: at(14) });
    const run5 = await created(tech, '/api/runs', { carId: carB, at: at(15) });
    expect(await counts(tech, gear)).toEqual([3, 1]);
    expect(await counts(tech, spindle)).toEqual([3, 3]);

    // A crew chief deletes one run and moves another to the other car: every count follows.
    expect((await chief.delete(`/api/runs/${run1}`)).status).toBe(204);
    expect(await counts(tech, gear)).toEqual([2, 1]);
    expect(await counts(tech, spindle)).toEqual([2, 2]);
    expect((await chief.patch(`/api/runs/${run5}`, { carId: carA })).status).toBe(200);
    expect(await counts(tech, gear)).toEqual([1, 0]);
    expect(await counts(tech, spindle)).toEqual([3, 3]);

    const audit = createClient({ url: server.databaseUrl });
    const rows = await audit.execute({
      sql: "SELECT action FROM audit_events WHERE record_type = 'run' AND record_id IN (?, ?) ORDER BY rowid",
      args: [run1, run5],
    });
    audit.close();
    expect(rows.rows.map((r) => r.action)).toEqual(['create', 'create', 'delete', 'update']);
  });

  it('keeps a part in one place: a second install answers 409 naming where it is', async () => {
    const { chief, tech } = team;
    const one = await created(chief, '/api/assemblies', { serial: 'P-1', name: 'Place one' });
    const two = await created(chief, '/api/assemblies', { serial: 'P-2', name: 'Place two' });
    const axle = await created(chief, '/api/parts', { kind: 'axle', serial: 'AX-9' });
    await created(tech, '/api/installations', { action: 'install', partId: axle, assemblyId: one, at: at(8) });
    const again = await tech.post('/api/installations', {
      action: 'install',
      partId: axle,
      assemblyId: two,
      at: at(9),
    });
    expect(again.status).toBe(409);
    expect(again.body.error.message).toContain('assembly P-1 (Place one)');
    expect((await tech.get(`/api/parts/${axle}`)).body.status).toBe('in-service');
  });

  it('holds one gear set per assembly and one assembly per car', async () => {
    const { chief, tech } = team;
    const car = await created(chief, '/api/cars', { name: 'Solo car' });
    const holder = await created(chief, '/api/assemblies', { serial: 'H-1', name: 'Holder' });
    const other = await created(chief, '/api/assemblies', { serial: 'H-2', name: 'Other' });
    const first = await created(chief, '/api/gear-sets', { serial: 'G-10', ringTeeth: 40, pinionTeeth: 9 });
    const second = await created(chief, '/api/gear-sets', { serial: 'G-11', ringTeeth: 40, pinionTeeth: 9 });
    await created(tech, '/api/installations', { action: 'install', partId: first, assemblyId: holder, at: at(1) });
    expect(
      (await tech.post('/api/installations', { action: 'install', partId: second, assemblyId: holder, at: at(2) }))
        .status,
    ).toBe(409);
    await created(tech, '/api/installations', { action: 'install', assemblyId: holder, carId: car, at: at(1) });
    expect(
      (await tech.post('/api/installations', { action: 'install', assemblyId: other, carId: car, at: at(2) })).status,
    ).toBe(409);
  });

  it('stores a run sent twice with the same Idempotency-Key once, and charges it once', async () => {
    const { chief, tech } = team;
    const car = await created(chief, '/api/cars', { name: 'Retry car' });
    const rear = await created(chief, '/api/assemblies', { serial: 'RT-1', name: 'Retry rear end' });
    const gear = await created(chief, '/api/gear-sets', { serial: 'G-RETRY', ringTeeth: 41, pinionTeeth: 10 });
    await created(tech, '/api/installations', { action: 'install', assemblyId: rear, carId: car, at: at(1) });
    await created(tech, '/api/installations', { action: 'install', partId: gear, assemblyId: rear, at: at(1) });
    const send = () =>
      tech.request('/api/runs', {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'idempotency-key': 'run-retry-1' },
        body: JSON.stringify({ carId: car, at: at(2) }),
      });
    const first = await send();
    const again = await send();
    expect(first.status).toBe(201);
    expect(again.status).toBe(200);
    expect((await again.json()).id).toBe((await first.json()).id);
    expect(await counts(tech, gear)).toEqual([1, 1]);
  });

  it('answers the ratio computed from the tooth counts', async () => {
    const id = await created(team.chief, '/api/gear-sets', { serial: 'G-RATIO', ringTeeth: 41, pinionTeeth: 10 });
    const gear = (await team.viewer.get(`/api/gear-sets/${id}`)).body;
    expect(gear).toMatchObject({
      kind: 'gear-set',
      ringTeeth: 41,
      pinionTeeth: 10,
      ratio: 4.1,
      ratioLabel: '4.10:1',
      lifeLimitRuns: 50,
    });
  });

  it('lists gear sets as parts filtered to the kind, paged with a cursor', async () => {
    const all = (await team.viewer.get('/api/gear-sets?limit=500')).body.items;
    expect(all.length).toBeGreaterThanOrEqual(4);
    expect(all.every((p: { kind: string }) => p.kind === 'gear-set')).toBe(true);
    const viaParts = (await team.viewer.get('/api/parts?kind=gear-set&limit=500')).body.items;
    expect(viaParts.map((p: { id: string }) => p.id)).toEqual(all.map((p: { id: string }) => p.id));
    const first = await team.viewer.get('/api/gear-sets?limit=2');
    expect(first.body.items).toHaveLength(2);
    const second = await team.viewer.get(`/api/gear-sets?limit=2&cursor=${first.body.nextCursor}`);
    expect(second.body.items[0].id).toBe(all[2].id);
  });
});
