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
  team = await makeTeamOfFour(server.baseUrl, smtp, 'Mentioning Crew');
});
afterAll(async () => {
  await server?.stop();
  await smtp?.stop();
});

describe('a mention in a review comment', () => {
  it('says under the comment who was told, and which @name matched nobody', async () => {
    const setId = (await team.chief.post('/api/gear-sets', { serial: 'MN-1', ringTeeth: 41, pinionTeeth: 10 })).body.id;
    const reviewId = (await team.tech.post('/api/reviews', { gearSetId: setId })).body.id;
    const viewer = (await team.viewer.get('/api/account')).body;
    const handle = viewer.email.split('@')[0];
    const posted = await team.tech.post(`/api/reviews/${reviewId}/comments`, {
      body: `@${handle} and @nobodyhere, see the coast side.`,
    });
    expect(posted.status).toBe(201);
    const html = await (await team.chief.request(`/reviews/${reviewId}`)).text();
    const note = /data-testid="mention-note"[^>]*>([^<]*)</.exec(html)?.[1] ?? '';
    expect(note).toContain(`Told: ${viewer.name}.`);
    expect(note).toContain('@nobodyhere matched nobody in the team');
  });
});

describe('the Team data page for each role', () => {
  it('tells a viewer once what they can do there, and offers the owner the export', async () => {
    const viewerPage = await (await team.viewer.request('/team/data')).text();
    expect(viewerPage.match(/data-testid="data-role-note"/g)).toHaveLength(1);
    expect(viewerPage).toContain('Exporting the whole team is for its owner');
    expect(viewerPage).not.toContain('Download the team archive');
    expect(viewerPage).not.toMatch(/Not for your role/);
    expect(viewerPage).toContain('id="archive"');

    const ownerPage = await (await team.owner.request('/team/data')).text();
    expect(ownerPage).toContain('Download the team archive');
    expect(ownerPage).not.toContain('data-role-note');
  });
});
