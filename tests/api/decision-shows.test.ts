import { afterAll, beforeAll, describe, expect, it } from 'vitest';
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
  team = await makeTeamOfFour(server.baseUrl, smtp, 'Deciding Crew');
});
afterAll(async () => {
  await server?.stop();
  await smtp?.stop();
});

/** The text of the page's latest-decision line, or null when the page shows none. */
async function decisionLine(path: string): Promise<string | null> {
  const html = await (await team.viewer.request(path)).text();
  const match = /<p[^>]*data-testid="latest-decision"[^>]*>([\s\S]*?)<\/p>/.exec(html);
  return match
    ? match[1]!
        .replace(/<[^>]+>/g, '')
        .replace(/\s+/g, ' ')
        .trim()
    : null;
}

describe('the latest decision where the set is shown', () => {
  it('shows what was decided, by whom and when, and the re-inspection point counting down to "due now"', async () => {
    const { chief, tech } = team;
    const carId = (await chief.post('/api/cars', { name: 'Decision car' })).body.id;
    const assemblyId = (await chief.post('/api/assemblies', { serial: 'DC-1', name: 'Decision rear end' })).body.id;
    await chief.post('/api/installations', { action: 'install', assemblyId, carId, at: '2026-03-01T08:00:00Z' });
    const setId = (await chief.post('/api/gear-sets', { serial: 'DS-1', ringTeeth: 41, pinionTeeth: 10 })).body.id;
    await chief.post('/api/installations', {
      action: 'install',
      partId: setId,
      assemblyId,
      at: '2026-03-01T09:00:00Z',
    });
    for (let i = 0; i < 43; i += 1)
      await tech.post('/api/runs', { carId, at: new Date(Date.UTC(2026, 2, 2, 10, i)).toISOString() });

    const pages = ['/', `/gear-sets/${setId}`, `/parts/${setId}`];
    for (const path of pages) expect(await decisionLine(path), path).toBeNull();

    const review = (await tech.post('/api/reviews', { gearSetId: setId })).body.id;
    const chiefName = (await chief.get('/api/account')).body.name as string;
    const decided = await chief.post(`/api/reviews/${review}/decision`, {
      decision: 'reshim',
      reason: 'Pattern toward the heel',
      reinspectAfterRuns: 6,
    });
    expect(decided.status).toBe(200);
    for (const path of pages) {
      const line = await decisionLine(path);
      expect(line, path).toContain('Decision: Re-shim and re-inspect');
      expect(line, path).toContain(`(${chiefName}, 20`);
      expect(line, path).toContain('re-inspect due in 6 runs (at 49)');
    }
    // The set's own pages give the reason too.
    expect(await decisionLine(`/gear-sets/${setId}`)).toContain('Pattern toward the heel');

    for (let i = 0; i < 6; i += 1)
      await tech.post('/api/runs', { carId, at: new Date(Date.UTC(2026, 2, 3, 10, i)).toISOString() });
    for (const path of pages) expect(await decisionLine(path), path).toContain('re-inspection due now (at 49)');
  });

  it('lets a crew chief correct the latest decision: the new one supersedes it, both stay, the set follows', async () => {
    const { chief, tech } = team;
    const setId = (await chief.post('/api/gear-sets', { serial: 'DS-2', ringTeeth: 41, pinionTeeth: 10 })).body.id;
    const first = (await tech.post('/api/reviews', { gearSetId: setId })).body.id;
    await chief.post(`/api/reviews/${first}/decision`, { decision: 'retire', reason: 'Heat damage' });
    expect((await chief.get(`/api/parts/${setId}`)).body.status).toBe('retired');

    // Not for a technician; and a decision must be chosen, naming the field, with nothing written.
    expect((await tech.post(`/api/reviews/${first}/correction`, { decision: 'keep', reason: 'x' })).status).toBe(403);
    const bad = await chief.post(`/api/reviews/${first}/correction`, { reason: 'No choice' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('decision');
    expect((await chief.get(`/api/reviews?gearSetId=${setId}`)).body.items).toHaveLength(1);

    const corrected = await chief.post(`/api/reviews/${first}/correction`, {
      decision: 'keep',
      reason: 'The discolouring was the paint, not heat',
      reinspectAfterRuns: 10,
    });
    expect(corrected.status).toBe(201);
    expect(corrected.body).toMatchObject({ status: 'decided', decision: 'keep' });
    expect(corrected.body.notes).toMatch(/Supersedes the decision of 20\d\d-\d\d-\d\d \(Retire\)/);
    // A retired set comes back only this way: on the shelf again, since it left its assembly when retired.
    expect((await chief.get(`/api/parts/${setId}`)).body.status).toBe('spare');
    const history = (await chief.get(`/api/reviews?gearSetId=${setId}`)).body.items as { decision: string }[];
    expect(history.map((r) => r.decision).sort()).toEqual(['keep', 'retire']);
    expect(await decisionLine(`/gear-sets/${setId}`)).toContain('Decision: Keep in service');

    // Only the latest decision can be corrected.
    const again = await chief.post(`/api/reviews/${first}/correction`, { decision: 'retire', reason: 'x' });
    expect(again.status).toBe(409);

    // The review page's form does the same, and lands on the new decision.
    const form = await chief.request(`/reviews/${corrected.body.id}`, {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({
        intent: 'correct',
        decision: 'reshim',
        reason: 'Lash wider',
        reinspectAfterRuns: '4',
      }),
    });
    expect(form.status).toBe(303);
    const landed = form.headers.get('location') ?? '';
    expect(landed).toMatch(/^\/reviews\/[\w-]+$/);
    expect(landed).not.toBe(`/reviews/${corrected.body.id}`);
    expect(await decisionLine(`/parts/${setId}`)).toContain('Decision: Re-shim and re-inspect');
  });
});
