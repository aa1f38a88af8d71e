import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, signedInClient, uniqueEmail } from '../helpers/api-client';
import { startServer, type RunningServer } from '../helpers/server';
import { SmtpFake, type ReceivedMail } from '../helpers/smtp-fake';
import { makeTeamOfFour, type TeamOfFour } from '../helpers/team';

let server: RunningServer;
let smtp: SmtpFake;
let team: TeamOfFour;
beforeAll(async () => {
  smtp = await SmtpFake.create();
  await smtp.start();
  server = await startServer({ env: { SMTP_PORT: String(smtp.port) } });
  team = await makeTeamOfFour(server.baseUrl, smtp, 'Tidy Invites');
});
afterAll(async () => {
  await server?.stop();
  await smtp?.stop();
});

const tokenIn = (mail: ReceivedMail) => /token=([A-Za-z0-9_-]+)/.exec(mail.text)?.[1] ?? '';

/** The `count`-th mail to `email` (1 for the first), once it has arrived. */
async function mailNumber(email: string, count: number): Promise<ReceivedMail> {
  await smtp.waitFor(() => smtp.received.filter((m) => m.to.includes(email)).length >= count);
  return smtp.received.filter((m) => m.to.includes(email))[count - 1]!;
}

async function openInvitationsTo(email: string) {
  const list = await team.owner.get<{ items: { id: string; email: string; role: string }[] }>('/api/invitations');
  return list.body.items.filter((i) => i.email === email);
}

describe('inviting the same person twice', () => {
  it('refuses someone already in the team, naming them, and sends nothing', async () => {
    const viewer = (await team.owner.get('/api/members')).body.items.find((m: any) => m.role === 'viewer');
    const mailsTo = () => smtp.received.filter((m) => m.to.includes(viewer.email) && /invited/.test(m.subject)).length;
    const before = mailsTo();
    const answer = await team.owner.post('/api/invitations', { email: viewer.email, role: 'technician' });
    expect(answer.status).toBe(409);
    expect(answer.body.error.fields.email).toMatch(/already a member/);
    expect(answer.body.error.message).toContain(viewer.name);
    await new Promise((r) => setTimeout(r, 1500));
    expect(mailsTo()).toBe(before);
  });

  it('sends an open invitation again instead of a second one: one pending row, and only the new link works', async () => {
    const email = uniqueEmail('twice');
    expect((await team.owner.post('/api/invitations', { email, role: 'viewer' })).status).toBe(201);
    const first = tokenIn(await mailNumber(email, 1));
    const again = await team.owner.post('/api/invitations', { email, role: 'technician' });
    expect(again.status).toBe(200);
    expect(again.body.resent).toBe(true);
    const second = tokenIn(await mailNumber(email, 2));
    expect(second).not.toBe(first);
    const open = await openInvitationsTo(email);
    expect(open).toHaveLength(1);
    expect(open[0]!.role).toBe('technician');

    const person = await signedInClient(server.baseUrl, { email });
    expect((await person.client.post('/api/invitations/accept', { token: first })).status).toBe(404);
    const accepted = await person.client.post('/api/invitations/accept', { token: second });
    expect(accepted.status).toBe(200);
    expect(accepted.body.role).toBe('technician');
  });
});

describe('pending invitations', () => {
  it('can be sent again with a new link, and the old link stops working', async () => {
    const email = uniqueEmail('resend');
    const made = await team.chief.post('/api/invitations', { email, role: 'technician' });
    const first = tokenIn(await mailNumber(email, 1));
    const resent = await team.chief.post(`/api/invitations/${made.body.id}/resend`);
    expect(resent.status).toBe(200);
    expect(resent.body.email).toBe(email);
    const second = tokenIn(await mailNumber(email, 2));
    const person = await signedInClient(server.baseUrl, { email });
    expect((await person.client.post('/api/invitations/accept', { token: first })).status).toBe(404);
    expect((await person.client.post('/api/invitations/accept', { token: second })).status).toBe(200);
  });

  it('can be cancelled: the link stops working and the pending list no longer shows it', async () => {
    const email = uniqueEmail('cancelled');
    const made = await team.owner.post('/api/invitations', { email, role: 'viewer' });
    const token = tokenIn(await mailNumber(email, 1));
    expect((await team.tech.delete(`/api/invitations/${made.body.id}`)).status).toBe(403);
    expect((await team.owner.delete(`/api/invitations/${made.body.id}`)).status).toBe(204);
    expect(await openInvitationsTo(email)).toEqual([]);
    const person = await signedInClient(server.baseUrl, { email });
    const refused = await person.client.post('/api/invitations/accept', { token });
    expect(refused.status).toBe(404);
    expect(refused.body.error.message).toMatch(/cancelled/);
    // Cancelling twice, or another team's invitation, is 404.
    expect((await team.owner.delete(`/api/invitations/${made.body.id}`)).status).toBe(404);
  });
});

describe('removing a member from the members page', () => {
  const form = (fields: Record<string, string>) => ({
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams(fields),
  });

  it('asks first, naming the person and what they lose, and removes only once confirmed', async () => {
    const techId = (await team.tech.get('/api/account')).body.id as string;
    const members = (await team.owner.get('/api/members')).body.items as { userId: string; name: string }[];
    const tech = members.find((m) => m.userId === techId)!;

    const asked = await team.owner.request('/team/members', form({ intent: 'remove', userId: tech.userId }));
    const page = await asked.text();
    expect(asked.status).toBe(200);
    expect(page).toContain(`Remove ${tech.name} from Tidy Invites?`);
    expect(page).toMatch(/will lose at once/);
    expect(page).toContain(`Yes, remove ${tech.name}`);
    expect((await team.tech.get('/api/members')).status).toBe(200);

    const removed = await team.owner.request(
      '/team/members',
      form({ intent: 'remove', confirm: 'yes', userId: tech.userId }),
    );
    expect(await removed.text()).toContain(`${tech.name} was removed from Tidy Invites.`);
    expect([401, 403]).toContain((await team.tech.get('/api/members')).status);
  });
});

describe('the invitation page', () => {
  it('names the team, the role and who invited; fills the address into sign-up; a used link says so with no Accept', async () => {
    const email = uniqueEmail('page');
    await team.owner.post('/api/invitations', { email, role: 'technician' });
    const token = tokenIn(await mailNumber(email, 1));
    const ownerName = (await team.owner.get('/api/account')).body.name as string;

    const stranger = new ApiClient(server.baseUrl);
    const page = await (await stranger.request(`/invitations/accept?token=${token}`)).text();
    expect(page).toContain(`${ownerName} invited ${email} to join Tidy Invites as technician.`);
    const signUp = /href="(\/sign-up\?[^"]+)"/.exec(page)?.[1]?.replace(/&amp;|&#38;/g, '&') ?? '';
    const signUpPage = await (await stranger.request(signUp)).text();
    expect(signUpPage).toContain(`value="${email}"`);

    const person = await signedInClient(server.baseUrl, { email });
    expect((await person.client.post('/api/invitations/accept', { token })).status).toBe(200);
    const used = await (await person.client.request(`/invitations/accept?token=${token}`)).text();
    expect(used).toContain('This invitation was already used');
    expect(used).not.toContain('Accept the invitation');
  });
});
