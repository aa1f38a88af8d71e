import { randomUUID } from 'node:crypto';
import type { Client } from '@libsql/client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInClient, type ApiClient } from '../helpers/api-client';
import { uploadPhoto } from '../helpers/images';
import { draftBody, submitInspection } from '../helpers/inspections';
import { smallPng } from '../helpers/records';
import { startServer, type RunningServer, openDatabase } from '../helpers/server';

/**
 * Issue 15 §2: every query that reaches a row through an id also filters by team. Rows of one team that
 * name another team's records — what the old team import let an archive write, and what may still be in
 * a database that took such an archive — are written straight into the database here, in the attacker's
 * team; the victim's answers must not change because of them.
 */

let server: RunningServer;
let database: Client;
let victim: ApiClient;
let attacker: ApiClient;
const a = {} as { team: string; car: string; gearSet: string; spare: string; inspection: string; review: string };
const b = {} as { team: string; user: string; car: string; part: string; inspection: string };

async function insert(table: string, row: Record<string, unknown>): Promise<void> {
  const columns = Object.keys(row);
  await database.execute({
    sql: `INSERT INTO ${table} (${columns.join(', ')}) VALUES (${columns.map(() => '?').join(', ')})`,
    args: Object.values(row) as (string | number | null)[],
  });
}

beforeAll(async () => {
  server = await startServer();
  database = await openDatabase(server.databaseUrl);
  const v = await signedInClient(server.baseUrl, { team: 'Filter Victims' });
  victim = v.client;
  a.team = v.teamId!;
  a.car = (await victim.post('/api/cars', { name: 'Victim secret car name' })).body.id;
  a.gearSet = (await victim.post('/api/gear-sets', { serial: 'FV-1', ringTeeth: 41, pinionTeeth: 10 })).body.id;
  a.spare = (await victim.post('/api/parts', { kind: 'spindle', serial: 'FV-SP' })).body.id;
  await victim.post('/api/installations', {
    action: 'install',
    partId: a.gearSet,
    carId: a.car,
    at: '2026-01-01T00:00:00Z',
  });
  await victim.post('/api/runs', { carId: a.car, at: '2026-01-02T00:00:00Z' });
  a.inspection = await submitInspection(victim, draftBody(a.gearSet, { runsAtInspection: 1 }));
  a.review = (await victim.post('/api/reviews', { gearSetId: a.gearSet })).body.id;
  await victim.post(`/api/reviews/${a.review}/decision`, { decision: 'keep', reason: 'Fine', reinspectAfterRuns: 9 });

  const m = await signedInClient(server.baseUrl, { team: 'Filter Attackers' });
  attacker = m.client;
  b.team = m.teamId!;
  b.user = m.userId;
  b.car = (await attacker.post('/api/cars', { name: 'Attacker car' })).body.id;
  b.part = (await attacker.post('/api/parts', { kind: 'spindle', serial: 'FA-SP' })).body.id;
  const bSet = (await attacker.post('/api/gear-sets', { serial: 'FA-1', ringTeeth: 41, pinionTeeth: 10 })).body.id;
  b.inspection = await submitInspection(attacker, draftBody(bSet, { runsAtInspection: 0 }));
  const photo = await uploadPhoto(attacker, b.inspection, await smallPng(), { type: 'image/png', filename: 'p.png' });
  const [keys] = (
    await database.execute({
      sql: 'SELECT storage_key, thumbnail_key FROM inspection_photos WHERE id = ?',
      args: [photo.body.id],
    })
  ).rows;

  // The forged rows, all in the attacker's team.
  const now = Date.now();
  await insert('runs', { id: randomUUID(), team_id: b.team, car_id: a.car, at: Date.parse('2026-01-03T00:00:00Z') });
  await insert('review_comments', {
    id: randomUUID(),
    team_id: b.team,
    review_id: a.review,
    author_id: b.user,
    body: 'Forged comment',
    mentions: '[]',
    created_at: now,
  });
  await insert('reviews', {
    id: randomUUID(),
    team_id: b.team,
    gear_set_id: a.gearSet,
    status: 'open',
    snapshot: '{}',
    opened_by: b.user,
    status_before: 'in-service',
  });
  for (const [subject, target, targetType, at] of [
    [a.spare, b.car, 'car', '2099-01-01T00:00:00Z'],
    [a.gearSet, b.car, 'car', '2026-01-05T00:00:00Z'],
    [b.part, a.car, 'car', '2026-01-05T00:00:00Z'],
  ] as const)
    await insert('installation_events', {
      id: randomUUID(),
      team_id: b.team,
      action: 'install',
      subject_type: 'part',
      subject_id: subject,
      target_type: targetType,
      target_id: target,
      at: Date.parse(at),
    });
  await insert('inspection_photos', {
    id: randomUUID(),
    team_id: b.team,
    inspection_id: a.inspection,
    side: 'drive',
    storage_key: keys!.storage_key,
    thumbnail_key: keys!.thumbnail_key,
    content_type: 'image/jpeg',
    width: 48,
    height: 32,
    bytes: 100,
  });
}, 60_000);
afterAll(async () => {
  database?.close();
  await server?.stop();
});

describe('rows of one team that name another team’s records', () => {
  it('charge no run to the other team’s parts (the runs join of the run counts)', async () => {
    expect((await victim.get(`/api/gear-sets/${a.gearSet}`)).body.totalRuns).toBe(1);
  });

  it('put no comment in the other team’s review', async () => {
    const review = (await victim.get(`/api/reviews/${a.review}`)).body;
    expect(review.comments.map((c: { body: string }) => c.body)).not.toContain('Forged comment');
  });

  it('keep no one from opening a review (the open-review check), and add no photo to its snapshot', async () => {
    const opened = await victim.post('/api/reviews', { gearSetId: a.gearSet });
    expect(opened.status, JSON.stringify(opened.body)).toBe(201);
    const review = (await victim.get(`/api/reviews/${opened.body.id}`)).body;
    expect(review.snapshot.photos).toEqual([]);
    await victim.post(`/api/reviews/${opened.body.id}/decision`, {
      decision: 'keep',
      reason: 'Fine',
      reinspectAfterRuns: 9,
    });
  });

  it('block no install (the last event and where a part is)', async () => {
    const install = await victim.post('/api/installations', {
      action: 'install',
      partId: a.spare,
      carId: a.car,
      at: '2026-02-01T00:00:00Z',
    });
    expect(install.status, JSON.stringify(install.body)).toBe(201);
    const spare = (await victim.get(`/api/parts/${a.spare}`)).body;
    expect(spare.location?.targetId).toBe(a.car);
  });

  it('leave the other team’s history as it was, and name none of its places', async () => {
    const csv = await (await victim.request(`/api/exports/gear-sets/${a.gearSet}.csv`)).text();
    expect(csv.split('\n').filter((line) => line.includes('installed'))).toHaveLength(1);
    const set = (await victim.get(`/api/gear-sets/${a.gearSet}`)).body;
    expect(set.location?.targetId).toBe(a.car);
    const part = (await attacker.get(`/api/parts/${b.part}`)).body;
    expect(JSON.stringify(part)).not.toContain('Victim secret car name');
  });
});
