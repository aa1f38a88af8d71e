import { Secret, TOTP } from 'otpauth';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, TEST_PASSWORD, signedInClient } from '../helpers/api-client';
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

/** The code an authenticator app would show now (RFC 6238, through otpauth). */
const codeFor = (secret: string, offset = 0) =>
  new TOTP({ secret: Secret.fromBase32(secret), algorithm: 'SHA1', digits: 6, period: 30 }).generate({
    timestamp: Date.now() + offset,
  });

async function signInWithCode(email: string, code: string | null): Promise<ApiClient> {
  const client = new ApiClient(server.baseUrl);
  const csrf = await client.get('/api/auth/csrf');
  await client.request('/api/auth/callback/credentials', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({
      email,
      password: TEST_PASSWORD,
      csrfToken: csrf.body.csrfToken,
      ...(code === null ? {} : { code }),
    }),
  });
  return client;
}

describe('the second factor', () => {
  it('is turned on with a code from the app and then asked for at every sign-in', async () => {
    const { client, email } = await signedInClient(server.baseUrl, { team: 'Two Factor Crew' });
    const setup = await client.post('/api/account/second-factor');
    expect(setup.status).toBe(201);
    expect(setup.body.uri).toMatch(/^otpauth:\/\/totp\/Lashline:/);
    expect((await client.post('/api/account/second-factor/confirm', { code: '000000' })).status).toBe(400);
    const confirmed = await client.post('/api/account/second-factor/confirm', { code: codeFor(setup.body.secret) });
    expect(confirmed.status).toBe(200);
    expect(confirmed.body.recoveryCodes).toHaveLength(10);
    expect((await client.get('/api/account')).body.secondFactor).toBe(true);

    expect((await signInWithCode(email, null)).hasSessionCookie()).toBe(false);
    expect((await signInWithCode(email, '123456')).hasSessionCookie()).toBe(false);
    // The confirming code's 30-second step is used up; the app's next code (one step ahead is accepted) signs in.
    expect((await signInWithCode(email, codeFor(setup.body.secret))).hasSessionCookie()).toBe(false);
    expect((await signInWithCode(email, codeFor(setup.body.secret, 30_000))).hasSessionCookie()).toBe(true);

    // A recovery code works once.
    const recovery = confirmed.body.recoveryCodes[0];
    expect((await signInWithCode(email, recovery)).hasSessionCookie()).toBe(true);
    expect((await signInWithCode(email, recovery)).hasSessionCookie()).toBe(false);
  });

  it('is for owners and crew chiefs only, and a missing code is answered as a wrong password is', async () => {
    const owner = await signedInClient(server.baseUrl, { team: 'Roles Crew' });
    const tech = await joinByInvitation(server.baseUrl, smtp, owner.client, 'technician');
    expect((await tech.client.post('/api/account/second-factor')).status).toBe(403);
    const setup = (await owner.client.post('/api/account/second-factor')).body;
    await owner.client.post('/api/account/second-factor/confirm', { code: codeFor(setup.secret) });
    const answerFor = async (password: string) => {
      const client = new ApiClient(server.baseUrl);
      const csrf = await client.get('/api/auth/csrf');
      const answer = await client.request('/api/auth/callback/credentials', {
        method: 'POST',
        headers: { 'content-type': 'application/x-www-form-urlencoded' },
        body: new URLSearchParams({ email: owner.email, password, csrfToken: csrf.body.csrfToken }),
      });
      return { status: answer.status, location: answer.headers.get('location') };
    };
    // Telling "code needed" from "wrong password" would confirm the password to whoever guessed it.
    expect(await answerFor(TEST_PASSWORD)).toEqual(await answerFor('not the password at all'));
  });

  it('can be turned off with the password and a code, ending the sessions', async () => {
    const { client, email } = await signedInClient(server.baseUrl, { team: 'Off Crew' });
    const setup = (await client.post('/api/account/second-factor')).body;
    await client.post('/api/account/second-factor/confirm', { code: codeFor(setup.secret) });
    expect(
      (
        await client.post('/api/account/second-factor/disable', {
          password: 'wrong password!',
          code: codeFor(setup.secret),
        })
      ).status,
    ).toBe(400);
    expect(
      (
        await client.post('/api/account/second-factor/disable', {
          password: TEST_PASSWORD,
          // The step of the confirming code is used up: the next one.
          code: codeFor(setup.secret, 30_000),
        })
      ).status,
    ).toBe(200);
    expect((await client.get('/api/account')).status).toBe(401);
    expect((await signInWithCode(email, null)).hasSessionCookie()).toBe(true);
  });
});

describe('recovery codes', () => {
  it('are counted, and made anew with the password and a code; the old ones stop working', async () => {
    const { client, email } = await signedInClient(server.baseUrl, { team: 'Recovery Crew' });
    const setup = (await client.post('/api/account/second-factor')).body;
    const first = (await client.post('/api/account/second-factor/confirm', { code: codeFor(setup.secret) })).body
      .recoveryCodes as string[];
    expect((await client.get('/api/account')).body.recoveryCodesLeft).toBe(10);
    expect((await signInWithCode(email, first[0]!)).hasSessionCookie()).toBe(true);
    expect((await client.get('/api/account')).body.recoveryCodesLeft).toBe(9);

    const wrong = await client.post('/api/account/second-factor/recovery-codes', {
      password: 'not the password at all',
      code: first[1],
    });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toHaveProperty('password');
    // A recovery code, written with its dashes, proves the second factor here too (and is spent).
    const remade = await client.post('/api/account/second-factor/recovery-codes', {
      password: TEST_PASSWORD,
      code: first[1],
    });
    expect(remade.status).toBe(200);
    expect(remade.body.recoveryCodes).toHaveLength(10);
    expect((await client.get('/api/account')).body.recoveryCodesLeft).toBe(10);
    expect((await signInWithCode(email, first[2]!)).hasSessionCookie()).toBe(false);
    expect((await signInWithCode(email, remade.body.recoveryCodes[0])).hasSessionCookie()).toBe(true);
  });

  it('are not offered to a person without a second factor', async () => {
    const { client } = await signedInClient(server.baseUrl);
    expect((await client.get('/api/account')).body.recoveryCodesLeft).toBeNull();
    const refused = await client.post('/api/account/second-factor/recovery-codes', {
      password: TEST_PASSWORD,
      code: '123456',
    });
    expect(refused.status).toBe(409);
  });
});

describe('a team that requires a second factor', () => {
  it('holds back its crew chiefs without one, until they turn it on; technicians are not asked', async () => {
    const owner = await signedInClient(server.baseUrl, { team: 'Strict Crew' });
    const chief = await joinByInvitation(server.baseUrl, smtp, owner.client, 'crew-chief');
    const tech = await joinByInvitation(server.baseUrl, smtp, owner.client, 'technician');
    expect((await owner.client.put('/api/team/second-factor', { required: true })).status).toBe(409);
    const ownerSetup = (await owner.client.post('/api/account/second-factor')).body;
    await owner.client.post('/api/account/second-factor/confirm', { code: codeFor(ownerSetup.secret) });
    expect((await owner.client.put('/api/team/second-factor', { required: true })).status).toBe(200);
    expect((await owner.client.get('/api/parts')).status).toBe(200);
    expect((await tech.client.get('/api/parts')).status).toBe(200);
    const held = await chief.client.get('/api/parts');
    expect(held.status).toBe(403);
    expect(held.body.error.message).toContain('second factor');
    const setup = (await chief.client.post('/api/account/second-factor')).body;
    await chief.client.post('/api/account/second-factor/confirm', { code: codeFor(setup.secret) });
    expect((await chief.client.get('/api/parts')).status).toBe(200);
  });
});

describe('sessions end when they should', () => {
  it('signs out everywhere: every session of the person ends', async () => {
    const { client, email } = await signedInClient(server.baseUrl, { team: 'Everywhere Crew' });
    const other = await signInWithCode(email, null);
    expect((await other.get('/api/account')).status).toBe(200);
    expect((await client.post('/api/account/sessions/revoke')).status).toBe(200);
    expect((await other.get('/api/account')).status).toBe(401);
    expect((await client.get('/api/account')).status).toBe(401);
  });

  it('ends a removed member’s sessions', async () => {
    const owner = await signedInClient(server.baseUrl, { team: 'Removal Crew' });
    const member = await joinByInvitation(server.baseUrl, smtp, owner.client, 'viewer');
    expect((await member.client.get('/api/account')).status).toBe(200);
    await owner.client.delete(`/api/members/${member.userId}`);
    expect((await member.client.get('/api/account')).status).toBe(401);
  });

  it('logs sign-ins, failed sign-ins and denied requests with who, what and when, and no secret', async () => {
    const { client, email } = await signedInClient(server.baseUrl, { team: 'Log Crew' });
    await signInWithCode(email, null);
    const failed = new ApiClient(server.baseUrl);
    await failed.signIn(email, 'not the password at all');
    await client.post('/api/account/second-factor/confirm', { code: '111111' });
    await new ApiClient(server.baseUrl).get('/api/members');
    await new Promise((r) => setTimeout(r, 200));
    const lines = server
      .output()
      .split('\n')
      .filter((line) => line.startsWith('[lashline:security]'))
      .map((line) => JSON.parse(line.slice('[lashline:security] '.length)));
    const mine = lines.filter((l) => l.email === email);
    expect(mine.some((l) => l.event === 'sign-in' && l.userId)).toBe(true);
    expect(mine.some((l) => l.event === 'sign-in-failed')).toBe(true);
    expect(lines.some((l) => l.event === 'denied' && l.status === 401 && l.path === '/api/members')).toBe(true);
    for (const l of lines) expect(l.at).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z$/);
    const raw = server.output();
    expect(raw).not.toContain(TEST_PASSWORD);
    expect(raw).not.toContain('not the password at all');
    expect(raw).not.toMatch(/authjs\.session-token=/);
  });
});
