import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInClient, type ApiClient } from '../helpers/api-client';
import { draftBody, newKey, submitInspection } from '../helpers/inspections';
import { startServer, type RunningServer, openDatabase } from '../helpers/server';
import { SmtpFake } from '../helpers/smtp-fake';
import { makeTeamOfFour, type TeamOfFour } from '../helpers/team';

let server: RunningServer;
let smtp: SmtpFake;
let team: TeamOfFour;
let gearSetId: string;
let other: { client: ApiClient; gearSetId: string; inspectionId: string };

beforeAll(async () => {
  smtp = await SmtpFake.create();
  await smtp.start();
  server = await startServer({ env: { SMTP_PORT: String(smtp.port) } });
  team = await makeTeamOfFour(server.baseUrl, smtp, 'Sheet Crew');
  gearSetId = (await team.chief.post('/api/gear-sets', { serial: 'SH-1', ringTeeth: 41, pinionTeeth: 10 })).body.id;
  const stranger = (await signedInClient(server.baseUrl, { team: 'Strangers' })).client;
  const theirSet = (await stranger.post('/api/gear-sets', { serial: 'ST-1', ringTeeth: 40, pinionTeeth: 9 })).body.id;
  other = {
    client: stranger,
    gearSetId: theirSet,
    inspectionId: await submitInspection(stranger, draftBody(theirSet)),
  };
});
afterAll(async () => {
  await server?.stop();
  await smtp?.stop();
});

function post(client: ApiClient, path: string, body: unknown, key: string | null = newKey()) {
  const headers: Record<string, string> = { 'content-type': 'application/json' };
  if (key) headers['idempotency-key'] = key;
  return client.request(path, { method: 'POST', headers, body: JSON.stringify(body) });
}

async function countInspections(): Promise<number> {
  const db = await openDatabase(server.databaseUrl);
  const n = Number((await db.execute('SELECT count(*) AS n FROM inspections')).rows[0]?.n);
  db.close();
  return n;
}

describe('the inspection sheet API', () => {
  it('creates a draft stored in mm with the entry unit and resolution beside it', async () => {
    const response = await post(
      team.tech,
      '/api/inspections',
      draftBody(gearSetId, { readings: [0.01, 0.008, null, 0.009], runout: { backFace: 0.002 } }),
    );
    expect(response.status).toBe(201);
    const view = await response.json();
    expect(view.status).toBe('draft');
    // 1 in = 25.4 mm exactly (NIST SP 811 (2008) App. B).
    expect(view.canonical.backlashMm[0]).toBeCloseTo(0.254, 12);
    expect(view.canonical.backlashMm[2]).toBeNull();
    expect(view.canonical.runoutMm.backFace).toBeCloseTo(0.0508, 12);
    expect(view.canonical.entry).toEqual({ unit: 'in', resolution: '0.001in', torqueUnit: 'lbf-in' });
    expect(view.readings).toEqual([0.01, 0.008, null, 0.009]);
    expect(view.summary.complete).toBe(false);
  });

  it('answers the same draft to a repeated create with the same Idempotency-Key', async () => {
    const key = newKey();
    const before = await countInspections();
    const first = await post(team.tech, '/api/inspections', draftBody(gearSetId), key);
    const again = await post(team.tech, '/api/inspections', draftBody(gearSetId), key);
    expect(first.status).toBe(201);
    expect(again.status).toBe(200);
    expect((await again.json()).id).toBe((await first.json()).id);
    expect(await countInspections()).toBe(before + 1);
  });

  it('merges an update, refuses a submit with a position not read, then submits once', async () => {
    const draft = await (
      await post(team.tech, '/api/inspections', draftBody(gearSetId, { readings: [0.008, null, 0.006, 0.007] }))
    ).json();
    const early = await team.tech.request(`/api/inspections/${draft.id}/submit`, {
      method: 'POST',
      headers: { 'idempotency-key': newKey() },
    });
    expect(early.status).toBe(422);
    expect((await early.json()).error.fields).toHaveProperty('readings.1');
    const patched = await team.tech.patch(`/api/inspections/${draft.id}`, {
      readings: [0.008, 0.009, 0.006, 0.007],
      notes: 'Clean teardown.',
    });
    expect(patched.status).toBe(200);
    expect(patched.body.revision).toBe(2);
    expect(patched.body.summary.backlash.mean).toBeCloseTo(0.0075, 12);
    const key = newKey();
    const submitted = await team.tech.request(`/api/inspections/${draft.id}/submit`, {
      method: 'POST',
      headers: { 'idempotency-key': key },
    });
    const repeat = await team.tech.request(`/api/inspections/${draft.id}/submit`, {
      method: 'POST',
      headers: { 'idempotency-key': key },
    });
    expect(submitted.status).toBe(200);
    expect(repeat.status).toBe(200);
    const [a, b] = [await submitted.json(), await repeat.json()];
    expect(a.id).toBe(draft.id);
    expect(b.id).toBe(draft.id);
    expect(b.status).toBe('submitted');
    expect(b.submittedAt).toBe(a.submittedAt);
  });

  it('needs the Idempotency-Key header on submit', async () => {
    const draft = await (await post(team.tech, '/api/inspections', draftBody(gearSetId))).json();
    const response = await team.tech.request(`/api/inspections/${draft.id}/submit`, { method: 'POST' });
    expect(response.status).toBe(400);
    expect((await response.json()).error.message).toContain('Idempotency-Key');
  });

  it('keeps a submitted inspection read-only except to a crew chief, auditing before and after', async () => {
    const id = await submitInspection(team.tech, draftBody(gearSetId, { notes: 'first words' }));
    expect((await team.tech.patch(`/api/inspections/${id}`, { notes: 'changed by tech' })).status).toBe(403);
    const byChief = await team.chief.patch(`/api/inspections/${id}`, { notes: 'corrected by chief' });
    expect(byChief.status).toBe(200);
    const db = await openDatabase(server.databaseUrl);
    const rows = await db.execute({
      sql: "SELECT before, after FROM audit_events WHERE record_type = 'inspection' AND record_id = ? AND action = 'update'",
      args: [id],
    });
    db.close();
    expect(rows.rows).toHaveLength(1);
    expect(JSON.parse(String(rows.rows[0]!.before)).notes).toBe('first words');
    expect(JSON.parse(String(rows.rows[0]!.after)).notes).toBe('corrected by chief');
  });

  it('lets a technician change only their own draft, and a viewer nothing', async () => {
    const chiefDraft = await (await post(team.chief, '/api/inspections', draftBody(gearSetId))).json();
    expect((await team.tech.patch(`/api/inspections/${chiefDraft.id}`, { notes: 'mine?' })).status).toBe(403);
    expect((await post(team.viewer, '/api/inspections', draftBody(gearSetId))).status).toBe(403);
    expect((await team.viewer.get(`/api/inspections/${chiefDraft.id}`)).status).toBe(200);
    expect((await team.viewer.patch(`/api/inspections/${chiefDraft.id}`, { notes: 'x' })).status).toBe(403);
  });

  it("answers 404 for another team's gear set and inspection", async () => {
    const onTheirs = await post(team.tech, '/api/inspections', draftBody(other.gearSetId));
    expect(onTheirs.status).toBe(404);
    expect((await onTheirs.json()).error.fields.gearSetId).toBeDefined();
    for (const [method, path] of [
      ['GET', `/api/inspections/${other.inspectionId}`],
      ['PATCH', `/api/inspections/${other.inspectionId}`],
      ['DELETE', `/api/inspections/${other.inspectionId}`],
      ['GET', `/api/gear-sets/${other.gearSetId}/analysis`],
    ]) {
      expect(
        (await team.owner.json(method!, path!, method === 'PATCH' ? { notes: 'x' } : undefined)).status,
        `${method} ${path}`,
      ).toBe(404);
    }
    const submit = await team.owner.request(`/api/inspections/${other.inspectionId}/submit`, {
      method: 'POST',
      headers: { 'idempotency-key': newKey() },
    });
    expect(submit.status).toBe(404);
  });

  it('shows each reader the summary in their own unit', async () => {
    const id = await submitInspection(
      team.tech,
      draftBody(gearSetId, { unit: 'mm', resolution: '0.01mm', readings: [0.2, 0.18, 0.16, 0.18] }),
    );
    await team.viewer.patch('/api/account', { lengthUnit: 'in' });
    const asInch = (await team.viewer.get(`/api/inspections/${id}`)).body;
    expect(asInch.readings).toEqual([0.2, 0.18, 0.16, 0.18]);
    expect(asInch.summary.unit).toBe('in');
    expect(asInch.summary.backlash.mean).toBeCloseTo(0.18 / 25.4, 12);
    await team.viewer.patch('/api/account', { lengthUnit: 'mm' });
    expect((await team.viewer.get(`/api/inspections/${id}`)).body.summary.backlash.mean).toBeCloseTo(0.18, 12);
  });
});

describe('bad input on the inspection sheet', () => {
  const BAD: [string, Record<string, unknown>, string][] = [
    ['a reading over 2.5 mm', { unit: 'mm', resolution: '0.01mm', readings: [0.2, 2.6, 0.2, 0.2] }, 'readings.1'],
    ['a reading over 2.5 mm typed in inches', { readings: [0.008, 0.1, 0.008, 0.008] }, 'readings.1'],
    ['a negative reading', { readings: [0.008, -0.001, 0.008, 0.008] }, 'readings.1'],
    ['a reading that is text', { readings: [0.008, 'ten', 0.008, 0.008] }, 'readings.1'],
    ['two readings', { readings: [0.008, 0.007] }, 'readings'],
    ['an unknown unit', { unit: 'cubit' }, 'unit'],
    ['an unknown resolution', { resolution: '0.1in' }, 'resolution'],
    [
      'a preload over 20 N·m',
      { torqueUnit: 'N-m', preload: { pinionTorque: 25, bearings: 'new' } },
      'preload.pinionTorque',
    ],
    [
      'a shim over 5 mm',
      { unit: 'mm', resolution: '0.01mm', readings: [0.2, 0.2, 0.2, 0.2], pinion: { shims: [1, 6] } },
      'pinion.shims.1',
    ],
    ['runs over 100,000', { runsAtInspection: 100_001 }, 'runsAtInspection'],
    ['runs as text', { runsAtInspection: '10' }, 'runsAtInspection'],
    ['a date that is not one', { inspectedAt: 'last tuesday' }, 'inspectedAt'],
    ['a pattern off the tooth', { patterns: { drive: { along: 1.5, up: 0.5 } } }, 'patterns.drive.along'],
    ['an unknown field', { colour: 'blue' }, 'colour'],
  ];
  for (const [what, overrides, field] of BAD) {
    it(`refuses ${what}, naming ${field}, and stores nothing`, async () => {
      const before = await countInspections();
      const response = await post(team.tech, '/api/inspections', draftBody(gearSetId, overrides));
      expect(response.status).toBe(400);
      const body = await response.json();
      expect(Object.keys(body.error.fields)).toContain(field);
      expect(body.error.message).toContain(field);
      expect(await countInspections()).toBe(before);
    });
  }

  it('refuses an unknown gear set with 404 naming gearSetId', async () => {
    const response = await post(team.tech, '/api/inspections', draftBody('no-such-set'));
    expect(response.status).toBe(404);
    expect((await response.json()).error.fields.gearSetId).toBeDefined();
  });
});
