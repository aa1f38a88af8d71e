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
});
