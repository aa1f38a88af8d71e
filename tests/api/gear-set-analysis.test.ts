import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInClient, type ApiClient } from '../helpers/api-client';
import { draftBody, submitInspection } from '../helpers/inspections';
import { startServer, type RunningServer } from '../helpers/server';

let server: RunningServer;
let chief: ApiClient;
beforeAll(async () => {
  server = await startServer();
  chief = (await signedInClient(server.baseUrl, { team: 'Trend Crew' })).client;
  await chief.patch('/api/account', { lengthUnit: 'mm' });
});
afterAll(() => server?.stop());

const newSet = async (serial: string) =>
  (await chief.post('/api/gear-sets', { serial, ringTeeth: 41, pinionTeeth: 10 })).body.id as string;
const mm = (readings: number[], runs: number, extra: Record<string, unknown> = {}) => ({
  unit: 'mm',
  resolution: '0.01mm',
  readings,
  runsAtInspection: runs,
  inspectedAt: new Date(Date.UTC(2026, 4, 1) + runs * 86_400_000).toISOString(),
  ...extra,
});

describe('GET /api/gear-sets/:id/analysis', () => {
  it('says why there is no projection yet, and keeps the recommendation to keep', async () => {
    const id = await newSet('TR-EMPTY');
    const empty = (await chief.get(`/api/gear-sets/${id}/analysis`)).body;
    expect(empty).toMatchObject({ inspectionCount: 0, latest: null, change: null, recommendation: null });
    const tightest = (body: {
      trends: { measure: string; projection: { reason: { code: string; message: string } } }[];
    }) => body.trends.find((t) => t.measure === 'backlash-min-point')!;
    expect(tightest(empty).projection.reason.code).toBe('too-few-points');
    await submitInspection(chief, draftBody(id, mm([0.18, 0.17, 0.16, 0.17], 5)));
    const one = (await chief.get(`/api/gear-sets/${id}/analysis`)).body;
    expect(tightest(one).projection.reason.message).toBe('Two more inspections give a projection.');
    expect(one.recommendation.action).toBe('keep');
  });

  it('projects where a set drifting loose meets the band, and re-shims when that is within the service interval', async () => {
    const id = await newSet('TR-LOOSE');
    // Mean backlash 0.15, 0.17, 0.19 mm at 0, 10, 20 runs: slope 0.002 mm/run meets 0.23 mm at 40 runs.
    await submitInspection(chief, draftBody(id, mm([0.16, 0.15, 0.14, 0.15], 0)));
    await submitInspection(chief, draftBody(id, mm([0.18, 0.17, 0.16, 0.17], 10)));
    await submitInspection(chief, draftBody(id, mm([0.2, 0.19, 0.18, 0.19], 20)));
    const analysis = (await chief.get(`/api/gear-sets/${id}/analysis`)).body;
    const mean = analysis.trends.find((t: { measure: string }) => t.measure === 'backlash-mean');
    expect(mean.fit.slope).toBeCloseTo(0.002, 12);
    expect(mean.fit.r2).toBeCloseTo(1, 12);
    // The band is for the points (S: GM 1996, "at the minimum point"): the mean is drawn, never projected; the
    // loosest point 0.16, 0.18, 0.20 mm meets 0.23 mm at run 35.
    expect(mean.projection.reason.code).toBe('mean-not-projected');
    const loosest = analysis.trends.find((t: { measure: string }) => t.measure === 'backlash-max-point');
    expect(loosest.projection.projectedRunsAtLimit).toBeCloseTo(35, 9);
    expect(loosest.projection.limit).toBe('max');
    // Each reading moved 0.02 mm: exactly 2 × the 0.01 mm resolution, which is not beyond it.
    const change = analysis.change.find((c: { measure: string }) => c.measure === 'mean');
    expect(change.delta).toBeCloseTo(0.02, 12);
    expect(change.flagged).toBe(false);
    expect(analysis.life).toMatchObject({ totalRuns: 0, lifeLimitRuns: 50 });
    // 15 runs to the limit: beyond the default service interval of 8 runs, so nothing to do yet …
    expect(analysis.recommendation.action).toBe('keep');
    // … but within a 25-run interval the set is re-shimmed before it gets there.
    expect((await chief.patch('/api/team/settings', { serviceIntervalRuns: 25 })).status).toBe(200);
    const later = (await chief.get(`/api/gear-sets/${id}/analysis`)).body;
    expect(later.recommendation.action).toBe('re-shim');
    expect(later.recommendation.reasons.map((r: { code: string }) => r.code)).toContain(
      'backlash-max-point-limit-before-next-service',
    );
    await chief.patch('/api/team/settings', { serviceIntervalRuns: 8 });
  });

  it('flags a change beyond twice the resolution and a spread out of band', async () => {
    const id = await newSet('TR-SPREAD');
    await submitInspection(chief, draftBody(id, mm([0.16, 0.15, 0.15, 0.16], 0)));
    await submitInspection(chief, draftBody(id, mm([0.22, 0.14, 0.13, 0.15], 8)));
    const analysis = (await chief.get(`/api/gear-sets/${id}/analysis`)).body;
    expect(analysis.change.find((c: { measure: string }) => c.measure === 'spread')).toMatchObject({ flagged: true });
    const spread = analysis.latest.summary.verdicts.find((v: { measure: string }) => v.measure === 'spread');
    // Variation between points within 0.05 mm (S: GM light-truck 1996 and GM medium-duty 2005 service manuals).
    expect(spread).toMatchObject({ verdict: 'out-of-band', limitValue: 0.05, unit: 'mm' });
    expect(spread.margin).toBeCloseTo(-0.04, 12);
    expect(analysis.recommendation.action).toBe('re-shim');
    expect(analysis.recommendation.reasons.map((r: { code: string }) => r.code)).toContain('spread-out-of-band');
  });

  it('judges a submitted inspection by the profile version it kept, after the profile changes', async () => {
    const id = await newSet('TR-VERSION');
    const inspectionId = await submitInspection(chief, draftBody(id, mm([0.25, 0.25, 0.25, 0.25], 0)));
    const before = (await chief.get(`/api/inspections/${inspectionId}`)).body.summary.verdicts.find(
      (v: { measure: string }) => v.measure === 'backlash-min-point',
    );
    expect(before.verdict).toBe('out-of-band');
    const profiles = (await chief.get('/api/tolerance-profiles')).body.items;
    const current = profiles[0];
    const changed = await chief.put(`/api/tolerance-profiles/${current.profileId}`, {
      values: { ...current.values, backlashMax: 0.3 },
    });
    expect(changed.status).toBe(200);
    expect(changed.body.version).toBe(current.version + 1);
    const after = (await chief.get(`/api/inspections/${inspectionId}`)).body.summary.verdicts.find(
      (v: { measure: string }) => v.measure === 'backlash-min-point',
    );
    expect(after.verdict).toBe('out-of-band');
    const fresh = await submitInspection(chief, draftBody(id, mm([0.25, 0.25, 0.25, 0.25], 3)));
    const judgedNew = (await chief.get(`/api/inspections/${fresh}`)).body.summary.verdicts.find(
      (v: { measure: string }) => v.measure === 'backlash-min-point',
    );
    expect(judgedNew.verdict).toBe('in-band');
  });

  it('gives the default profile with the source of every figure', async () => {
    const profile = (await chief.get('/api/tolerance-profiles')).body.items[0];
    expect(profile.sources.maxSpread.source).toContain('GM light-truck service manual, 8-5/8 in ring gear axle, 1996');
    expect(profile.sources.runoutMax.source).toBe('Ford light-truck service manual, 1997');
    expect(profile.sources.lifeLimitRuns.key).toBe('CP');
  });

  it('refuses a profile with min above max, naming the field', async () => {
    const current = (await chief.get('/api/tolerance-profiles')).body.items[0];
    const bad = await chief.post('/api/tolerance-profiles', {
      name: 'Bad',
      values: { ...current.values, backlashMin: 0.3, backlashMax: 0.2 },
    });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toContain('values.backlashMin');
  });
});
