import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, TEST_PASSWORD, signedInClient, uniqueEmail } from '../helpers/api-client';
import { startServer, type RunningServer } from '../helpers/server';
import { SmtpFake } from '../helpers/smtp-fake';
import { joinByInvitation } from '../helpers/team';

let server: RunningServer;
let smtp: SmtpFake;
beforeAll(async () => {
  smtp = await SmtpFake.create();
  await smtp.start();
  server = await startServer({ env: { SMTP_PORT: String(smtp.port) } });
});
afterAll(async () => {
  await server?.stop();
  await smtp?.stop();
});

/** Invites `email` with `role` from the owner's client and returns the token from the caught mail. */
async function inviteAndCatchToken(owner: ApiClient, email: string, role: string): Promise<string> {
  const invited = await owner.post('/api/invitations', { email, role });
  expect(invited.status).toBe(201);
  const mail = await smtp.waitFor((m) => m.to.includes(email));
  const token = /token=([A-Za-z0-9_-]+)/.exec(mail.text)?.[1];
  if (!token) throw new Error(`no token in mail: ${mail.text}`);
  return token;
}

const joinAs = (owner: ApiClient, role: string) => joinByInvitation(server.baseUrl, smtp, owner, role);

describe('teams, roles and invitations', () => {
  it('makes the creator the owner and the team current', async () => {
    const { client } = await signedInClient(server.baseUrl);
    const team = await client.post('/api/teams', { name: 'Alkali Lakebed Crew' });
    expect(team.status).toBe(201);
    expect(team.body).toMatchObject({ name: 'Alkali Lakebed Crew', role: 'owner' });
    const account = await client.get('/api/account');
    expect(account.body.team).toMatchObject({ id: team.body.id, role: 'owner' });
    const teams = await client.get('/api/teams');
    expect(teams.body.items).toHaveLength(1);
    expect(teams.body.nextCursor).toBeNull();
  });

  it('lets a person belong to two teams and switch between them', async () => {
    const { client } = await signedInClient(server.baseUrl, { team: 'First Team' });
    const second = await client.post('/api/teams', { name: 'Second Team' });
    const first = (await client.get('/api/teams')).body.items.find((t: { name: string }) => t.name === 'First Team');
    expect((await client.get('/api/account')).body.team.id).toBe(second.body.id);
    expect((await client.put('/api/teams/current', { teamId: first.id })).status).toBe(200);
    expect((await client.get('/api/account')).body.team.id).toBe(first.id);
  });

  it('invites by e-mail over SMTP; the single-use link joins the team with the role', async () => {
    const owner = await signedInClient(server.baseUrl, { team: 'Invite Test Team' });
    const email = uniqueEmail('invitee');
    const token = await inviteAndCatchToken(owner.client, email, 'technician');
    const mail = smtp.received.find((m) => m.to.includes(email))!;
    expect(mail.subject).toContain('Invite Test Team');
    expect(mail.text).toContain(`${server.baseUrl}/invitations/accept?token=`);

    const invitee = await signedInClient(server.baseUrl, { email });
    const accepted = await invitee.client.post('/api/invitations/accept', { token });
    expect(accepted.body).toEqual({ teamId: owner.teamId, role: 'technician' });
    expect((await invitee.client.get('/api/account')).body.team.role).toBe('technician');

    const again = await invitee.client.post('/api/invitations/accept', { token });
    expect(again.status).toBe(410);
  });

  it('refuses an invitation accepted by another address', async () => {
    const owner = await signedInClient(server.baseUrl, { team: 'Address Check Team' });
    const token = await inviteAndCatchToken(owner.client, uniqueEmail('meant'), 'viewer');
    const stranger = await signedInClient(server.baseUrl);
    const refused = await stranger.client.post('/api/invitations/accept', { token });
    expect(refused.status).toBe(403);
    expect((await stranger.client.get('/api/account')).body.team).toBeNull();
  });

  it('stores only the hash of the token: a made-up token is unknown', async () => {
    const person = await signedInClient(server.baseUrl);
    const unknown = await person.client.post('/api/invitations/accept', { token: 'x'.repeat(43) });
    expect(unknown.status).toBe(404);
  });

  it('lets a crew chief invite but not grant owner, and not a technician invite at all', async () => {
    const owner = await signedInClient(server.baseUrl, { team: 'Grant Team' });
    const chief = await joinAs(owner.client, 'crew-chief');
    expect((await chief.client.post('/api/invitations', { email: uniqueEmail(), role: 'technician' })).status).toBe(
      201,
    );
    expect((await chief.client.post('/api/invitations', { email: uniqueEmail(), role: 'owner' })).status).toBe(403);
    const tech = await joinAs(owner.client, 'technician');
    expect((await tech.client.post('/api/invitations', { email: uniqueEmail(), role: 'viewer' })).status).toBe(403);
  });

  it('applies a role change on the very next request', async () => {
    const owner = await signedInClient(server.baseUrl, { team: 'Role Change Team' });
    const member = await joinAs(owner.client, 'crew-chief');
    expect((await member.client.get('/api/invitations')).status).toBe(200);
    const demoted = await owner.client.patch(`/api/members/${member.userId}`, { role: 'viewer' });
    expect(demoted.status).toBe(200);
    expect((await member.client.get('/api/invitations')).status).toBe(403);
    expect((await member.client.get('/api/account')).body.team.role).toBe('viewer');
  });

  it('cuts a removed member off at once', async () => {
    const owner = await signedInClient(server.baseUrl, { team: 'Removal Team' });
    const member = await joinAs(owner.client, 'technician');
    expect((await member.client.get('/api/members')).status).toBe(200);
    expect((await owner.client.delete(`/api/members/${member.userId}`)).status).toBe(204);
    const after = await member.client.get('/api/members');
    expect([401, 403]).toContain(after.status);
    const members = await owner.client.get('/api/members');
    expect(members.body.items.map((m: { userId: string }) => m.userId)).not.toContain(member.userId);
  });

  it('keeps at least one owner', async () => {
    const owner = await signedInClient(server.baseUrl, { team: 'Last Owner Team' });
    const refused = await owner.client.patch(`/api/members/${owner.userId}`, { role: 'viewer' });
    expect(refused.status).toBe(409);
  });

  it('lets only an owner change roles', async () => {
    const owner = await signedInClient(server.baseUrl, { team: 'Owner Only Team' });
    const chief = await joinAs(owner.client, 'crew-chief');
    const tech = await joinAs(owner.client, 'technician');
    expect((await chief.client.patch(`/api/members/${tech.userId}`, { role: 'crew-chief' })).status).toBe(403);
    expect((await chief.client.delete(`/api/members/${tech.userId}`)).status).toBe(403);
  });

  it("answers 404 for another team's records", async () => {
    const ours = await signedInClient(server.baseUrl, { team: 'Our Team' });
    const theirs = await signedInClient(server.baseUrl, { team: 'Their Team' });
    expect((await ours.client.get(`/api/teams/${theirs.teamId}`)).status).toBe(404);
    expect((await ours.client.put('/api/teams/current', { teamId: theirs.teamId })).status).toBe(404);
    expect((await ours.client.patch(`/api/members/${theirs.userId}`, { role: 'viewer' })).status).toBe(404);
    expect((await ours.client.delete(`/api/members/${theirs.userId}`)).status).toBe(404);
    expect((await theirs.client.get('/api/members')).body.items).toHaveLength(1);
  });

  it('signs in an invited person who made the account from the link', async () => {
    const owner = await signedInClient(server.baseUrl, { team: 'Link Team' });
    const email = uniqueEmail('fresh');
    const token = await inviteAndCatchToken(owner.client, email, 'viewer');
    const fresh = new ApiClient(server.baseUrl);
    expect((await fresh.post('/api/accounts', { email, password: TEST_PASSWORD, name: 'Fresh' })).status).toBe(201);
    await fresh.signIn(email, TEST_PASSWORD);
    expect((await fresh.post('/api/invitations/accept', { token })).status).toBe(200);
  });
});
