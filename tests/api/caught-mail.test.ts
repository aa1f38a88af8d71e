import { createClient } from '@libsql/client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, signedInClient, uniqueEmail } from '../helpers/api-client';
import { findFreePort, startServer, type RunningServer } from '../helpers/server';

/**
 * Issue #15, section 1, the attack as the review ran it: with no SMTP_HOST (the default) the local mail
 * catcher keeps Lashline's mail, and /dev/mail showed all of it to anyone — an owner invitation's link
 * included, which a stranger then accepted. A built server now answers 404 there unless
 * MAIL_CATCHER_PAGE=on, and then shows a signed-in owner only their own team's mail; mail of no team
 * (address verification, password resets) is never listed. The first test fails against the code
 * before this change (it answered 200 with the link).
 */

const DEMO_PASSWORD = 'lashline-demo';
let pageOff: RunningServer;
let pageOn: RunningServer;

async function catcherServer(env: Record<string, string> = {}): Promise<RunningServer> {
  return startServer({
    demo: true,
    env: { SMTP_HOST: '', MAIL_CATCHER: 'on', SMTP_PORT: String(await findFreePort()), ...env },
  });
}

async function demoClient(server: RunningServer, role: string): Promise<ApiClient> {
  const client = new ApiClient(server.baseUrl);
  await client.signIn(`${role}@lashline.test`, DEMO_PASSWORD);
  if (!client.hasSessionCookie()) throw new Error(`demo ${role} did not sign in`);
  return client;
}

/** Waits until the server's outbox has handed every message to its catcher. */
async function waitForOutboxToEmpty(server: RunningServer): Promise<void> {
  const database = createClient({ url: server.databaseUrl });
  try {
    for (let i = 0; i < 100; i += 1) {
      const row = (await database.execute("SELECT count(*) AS n FROM outbox WHERE status <> 'sent'")).rows[0];
      if (Number(row?.n) === 0) return;
      await new Promise((resolve) => setTimeout(resolve, 200));
    }
    throw new Error('the outbox did not empty');
  } finally {
    database.close();
  }
}

async function readPage(client: ApiClient, path = '/dev/mail'): Promise<{ status: number; text: string }> {
  const response = await client.request(path);
  return { status: response.status, text: await response.text() };
}

beforeAll(async () => {
  pageOff = await catcherServer();
  pageOn = await catcherServer({ MAIL_CATCHER_PAGE: 'on' });
}, 90_000);
afterAll(async () => {
  await pageOff?.stop();
  await pageOn?.stop();
});

describe('the caught-mail page of a built server', () => {
  it('answers 404 to everyone unless MAIL_CATCHER_PAGE=on, so an invitation link stays in the mail', async () => {
    const owner = await demoClient(pageOff, 'owner');
    const invited = uniqueEmail('would-be-owner');
    expect((await owner.post('/api/invitations', { email: invited, role: 'owner' })).status).toBe(201);
    await waitForOutboxToEmpty(pageOff);

    const stranger = await readPage(new ApiClient(pageOff.baseUrl));
    expect(stranger.status).toBe(404);
    expect(stranger.text).not.toContain('invitations/accept?token=');
    expect(stranger.text).not.toContain(invited);
    const ownPage = await readPage(owner);
    expect(ownPage.status).toBe(404);
    expect(ownPage.text).not.toContain('invitations/accept?token=');
  });

  it('with MAIL_CATCHER_PAGE=on shows an owner their own team’s mail and nothing else', async () => {
    const owner = await demoClient(pageOn, 'owner');
    const demoInvitee = uniqueEmail('demo-invitee');
    expect((await owner.post('/api/invitations', { email: demoInvitee, role: 'viewer' })).status).toBe(201);

    // Another team: its owner signs up (a verification mail), starts a team, invites someone and asks
    // for a password reset (a reset mail).
    const rival = await signedInClient(pageOn.baseUrl, { team: 'Rival Caught Crew' });
    const rivalInvitee = uniqueEmail('rival-invitee');
    expect((await rival.client.post('/api/invitations', { email: rivalInvitee, role: 'viewer' })).status).toBe(201);
    expect((await new ApiClient(pageOn.baseUrl).post('/api/password-resets', { email: rival.email })).status).toBe(202);
    await waitForOutboxToEmpty(pageOn);

    const demoPage = await readPage(owner);
    expect(demoPage.status).toBe(200);
    expect(demoPage.text).toContain(demoInvitee);
    expect(demoPage.text).not.toContain(rivalInvitee);
    expect(demoPage.text).not.toContain(rival.email);

    const rivalPage = await readPage(rival.client);
    expect(rivalPage.status).toBe(200);
    expect(rivalPage.text).toContain(rivalInvitee);
    expect(rivalPage.text).not.toContain(demoInvitee);
    // The rival owner's own verification and reset mail belong to no team: never listed.
    expect(rivalPage.text).not.toContain('Confirm your address');
    expect(rivalPage.text).not.toContain('Reset your Lashline password');
    expect(rivalPage.text).not.toContain('verify-email?token=');
    expect(rivalPage.text).not.toContain('reset-password?token=');
  });

  it('with MAIL_CATCHER_PAGE=on sends a stranger to sign in and refuses every role but owner', async () => {
    const signedOut = await new ApiClient(pageOn.baseUrl).request('/dev/mail');
    expect(signedOut.status).toBe(302);
    expect(signedOut.headers.get('location')).toMatch(/^\/sign-in\?next=%2Fdev%2Fmail/);
    for (const role of ['chief', 'tech', 'viewer']) {
      const page = await readPage(await demoClient(pageOn, role));
      expect(page.status, role).toBe(403);
      expect(page.text, role).not.toContain('invitations/accept?token=');
    }
  });
});
