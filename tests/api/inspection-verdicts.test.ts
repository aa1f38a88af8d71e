import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { draftBody, newKey, submitInspection } from '../helpers/inspections';
import { startServer, type RunningServer } from '../helpers/server';
import { SmtpFake } from '../helpers/smtp-fake';
import { makeTeamOfFour, type TeamOfFour } from '../helpers/team';

// Issue 16 through the built server: verdicts on the limits as published, the API's resolution and date forms,
// and the per-set cut method and runout factor.

let server: RunningServer;
let smtp: SmtpFake;
let team: TeamOfFour;

beforeAll(async () => {
  smtp = await SmtpFake.create();
  await smtp.start();
  server = await startServer({ env: { SMTP_PORT: String(smtp.port) } });
  team = await makeTeamOfFour(server.baseUrl, smtp, 'Verdict Crew');
});
afterAll(async () => {
  await server?.stop();
  await smtp?.stop();
});

async function newGearSet(serial: string, extra: Record<string, unknown> = {}): Promise<string> {
  const made = await team.chief.post('/api/gear-sets', { serial, ringTeeth: 41, pinionTeeth: 10, ...extra });
  expect(made.status).toBe(201);
  return made.body.id as string;
}

function create(body: Record<string, unknown>) {
  return team.tech.request('/api/inspections', {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'idempotency-key': newKey() },
    body: JSON.stringify(body),
  });
}

describe('an inch inspection on the printed limits', () => {
  // A new spare set, the team's default profile, a 0.001 in indicator: 0.005 / 0.006 / 0.007 / 0.006 in, back-face
  // runout 0.003 in, used-bearing pinion torque 8 lbf·in — each on a printed limit: 0.005–0.009 in and 0.002 in
  // (S: GM 1996), 0.003 in (S: Ford 1997), 8–12 lbf·in (S: GM, 7-1/2 in axle).
  const inchSheet = (gearSetId: string) =>
    draftBody(gearSetId, {
      runsAtInspection: 0,
      readings: [0.005, 0.006, 0.007, 0.006],
      runout: { backFace: 0.003 },
      torqueUnit: 'lbf-in',
      preload: { pinionTorque: 8, bearings: 'used' },
    });

  it('is judged within and recommends keep or watch, never re-shim, for an inch and an mm reader', async () => {
    const gearSetId = await newGearSet('PUB-1');
    await submitInspection(team.tech, inchSheet(gearSetId));
    for (const lengthUnit of ['in', 'mm'] as const) {
      await team.viewer.patch('/api/account', { lengthUnit, torqueUnit: lengthUnit === 'in' ? 'lbf-in' : 'N-m' });
      const analysis = (await team.viewer.get(`/api/gear-sets/${gearSetId}/analysis`)).body;
      const verdicts = analysis.latest.summary.verdicts as { measure: string; verdict: string }[];
      expect(verdicts.filter((v) => v.verdict === 'out-of-band')).toEqual([]);
      expect(['keep', 'watch'], JSON.stringify(analysis.recommendation.reasons)).toContain(
        analysis.recommendation.action,
      );
      expect(analysis.recommendation.reasons.filter((r: { severity: string }) => r.severity === 'critical')).toEqual(
        [],
      );
    }
  });

  it('shows each limit as printed in the reader’s unit, with what it was judged at', async () => {
    const gearSetId = await newGearSet('PUB-2');
    const id = await submitInspection(team.tech, inchSheet(gearSetId));
    await team.viewer.patch('/api/account', { lengthUnit: 'in', torqueUnit: 'lbf-in' });
    const summary = (await team.viewer.get(`/api/inspections/${id}`)).body.summary;
    const tight = summary.verdicts.find((v: { measure: string }) => v.measure === 'backlash-min-point');
    expect(tight).toMatchObject({
      limitText: '0.005',
      limitValue: 0.005,
      judgedAt: 'judged at the 0.001 in graduation',
    });
    const torque = summary.verdicts.find((v: { measure: string }) => v.measure === 'pinion-preload-used');
    expect(torque).toMatchObject({ limitText: '8', verdict: 'near-limit', unit: 'lbf-in' });
    await team.viewer.patch('/api/account', { lengthUnit: 'mm', torqueUnit: 'N-m' });
    const metric = (await team.viewer.get(`/api/inspections/${id}`)).body.summary;
    // The mm reader sees GM's mm figure, 0.13 mm, and the verdict still judged at the inch dial it was read on.
    expect(metric.verdicts[0]).toMatchObject({ limitText: '0.13', judgedAt: 'judged at the 0.001 in graduation' });
    expect(metric.verdicts.find((v: { measure: string }) => v.measure === 'pinion-preload-used')).toMatchObject({
      limitText: '1.0',
    });
  });

  it('keeps the runout estimated from the lash among the saved verdicts', async () => {
    const gearSetId = await newGearSet('PUB-3');
    const id = await submitInspection(team.tech, inchSheet(gearSetId));
    const measures = (await team.tech.get(`/api/inspections/${id}`)).body.summary.verdicts.map(
      (v: { measure: string }) => v.measure,
    );
    expect(measures).toContain('runout');
    expect(measures).toContain('runout-measured');
  });
});

describe('the inspection API’s resolution and date forms', () => {
  it('takes a resolution as a number in the inspection’s unit', async () => {
    const gearSetId = await newGearSet('RES-1');
    const made = await create(draftBody(gearSetId, { unit: 'in', resolution: 0.0005 }));
    expect(made.status).toBe(201);
    expect((await made.json()).canonical.entry.resolution).toBe('0.0005in');
    const metric = await create(draftBody(gearSetId, { unit: 'mm', resolution: 0.002, readings: [0.2, 0.2, 0.2] }));
    expect((await metric.json()).canonical.entry.resolution).toBe('0.002mm');
  });

  it('refuses a number that is no graduation of the unit, naming the field once', async () => {
    const gearSetId = await newGearSet('RES-2');
    for (const resolution of [0.003, 0.01, '0.1in']) {
      const refused = await create(draftBody(gearSetId, { unit: 'in', resolution }));
      expect(refused.status).toBe(400);
      const { error } = await refused.json();
      expect(error.fields.resolution).toBeDefined();
      expect(error.message.startsWith('resolution: ')).toBe(true);
      expect(error.message.match(/resolution:/g)).toHaveLength(1);
    }
  });

  it('takes a plain date as that day at noon UTC, and refuses a day that does not exist', async () => {
    const gearSetId = await newGearSet('DAY-1');
    const made = await create(draftBody(gearSetId, { inspectedAt: '2026-05-03' }));
    expect(made.status).toBe(201);
    expect((await made.json()).inspectedAt).toBe('2026-05-03T12:00:00.000Z');
    const refused = await create(draftBody(gearSetId, { inspectedAt: '2026-02-30' }));
    expect(refused.status).toBe(400);
    const { error } = await refused.json();
    expect(error.fields.inspectedAt).toBeDefined();
    expect(error.message.match(/inspectedAt:/g)).toHaveLength(1);
  });

  it('words a length over its limit in the entry unit', async () => {
    const gearSetId = await newGearSet('LIM-1');
    const refused = await create(draftBody(gearSetId, { pinion: { shims: [25] } }));
    expect(refused.status).toBe(400);
    // 5 mm = 0.1969 in (NIST SP 811: 5 / 25.4); said in inches, no mm figure
    expect((await refused.json()).error.fields['pinion.shims.0']).toBe('Shim 1: at most 0.1969 in.');
  });
});

describe('per-set cut method and runout factor', () => {
  it('estimates runout with the set’s spiral angle or typed k, and says which k it used', async () => {
    const gearSetId = await newGearSet('K-1', { spiralAngleDeg: 45 });
    // C = 0.002 in; k = 2·sin(atan(41/10))·tan 20° / cos 45° = 1.0001445 worked by hand (TRADE.md, D):
    // TIR = 0.004 / 1.0001445 = 0.0039994 in.
    const id = await submitInspection(team.tech, draftBody(gearSetId, { readings: [0.008, 0.006, 0.004, 0.006] }));
    await team.tech.patch('/api/account', { lengthUnit: 'in' });
    const estimate = (await team.tech.get(`/api/inspections/${id}`)).body.summary.backlash.runoutEstimate;
    expect(estimate.kBasis).toBe('spiral-angle');
    expect(estimate.tir).toBeCloseTo(0.0039994, 6);
    const typed = await team.chief.patch(`/api/gear-sets/${gearSetId}`, { runoutK: 0.8 });
    expect(typed.status).toBe(200);
    expect(typed.body).toMatchObject({ runoutK: 0.8, spiralAngleDeg: null });
    const again = (await team.tech.get(`/api/inspections/${id}`)).body.summary.backlash.runoutEstimate;
    expect(again).toMatchObject({ kBasis: 'typed', kText: 'k = 0.800, typed in for this set' });
    expect(again.tir).toBeCloseTo(0.005, 9); // 0.004 / 0.8
  });

  it('gives a face-hobbed set no toe/heel depth advice, only the gear maker’s chart', async () => {
    const gearSetId = await newGearSet('CUT-1', { cutMethod: 'face-hobbed' });
    const id = await submitInspection(
      team.tech,
      draftBody(gearSetId, { patterns: { drive: { along: 0.9, up: 0.5 }, coast: { along: 0.9, up: 0.5 } } }),
    );
    const patterns = (await team.tech.get(`/api/inspections/${id}`)).body.summary.patterns;
    for (const pattern of patterns) {
      expect(pattern.corrections).toEqual([]);
      expect(pattern.guidance).toContain("gear maker's pattern chart");
    }
  });

  it('refuses a spiral angle and a typed k together, naming runoutK', async () => {
    const made = await team.chief.post('/api/gear-sets', {
      serial: 'K-2',
      ringTeeth: 41,
      pinionTeeth: 10,
      spiralAngleDeg: 35,
      runoutK: 0.7,
    });
    expect(made.status).toBe(400);
    expect(made.body.error.fields.runoutK).toBeDefined();
  });
});
