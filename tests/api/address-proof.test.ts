import type { Client } from '@libsql/client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, TEST_PASSWORD, signedInClient, uniqueEmail } from '../helpers/api-client';
import { draftBody, submitInspection } from '../helpers/inspections';
import { startServer, type RunningServer, openDatabase } from '../helpers/server';
import { SmtpFake, type ReceivedMail } from '../helpers/smtp-fake';
import { joinByInvitation, verifyAddressByMail } from '../helpers/team';

/**
 * Issue #15, section 1: addresses are proved before they count, and a forgotten password has a way back.
 * The attacks the review reproduced (an imported account taken over by whoever signs up first with its
 * address; notices mailed to an address nobody proved; no way back from a lost password) each have a
 * test here that fails against the code before this change.
 */

let server: RunningServer;
let smtp: SmtpFake;
let database: Client;
beforeAll(async () => {
  smtp = await SmtpFake.create();
  await smtp.start();
  server = await startServer({ env: { SMTP_PORT: String(smtp.port) } });
  database = await openDatabase(server.databaseUrl);
}, 60_000);
afterAll(async () => {
  database?.close();
  await server?.stop();
  await smtp?.stop();
});

const tokenIn = (mail: ReceivedMail, page: string) =>
  new RegExp(`${page}\\?token=([A-Za-z0-9_-]+)`).exec(mail.text)?.[1] ?? '';
const mailTo = (email: string, subject: string) =>
  smtp.waitFor((m) => m.to.includes(email) && m.subject.includes(subject));
const mailsTo = (email: string, subject: string) =>
  smtp.received.filter((m) => m.to.includes(email) && m.subject.includes(subject));

/** Every reset request this file sends from 127.0.0.1, so the per-client limit can be checked at the end. */
let resetRequests = 0;
async function askReset(email: string) {
  resetRequests += 1;
  return new ApiClient(server.baseUrl).post('/api/password-resets', { email });
}

async function verifiedAt(email: string): Promise<unknown> {
  const row = (await database.execute({ sql: 'SELECT email_verified_at FROM users WHERE email = ?', args: [email] }))
    .rows[0];
  return row?.email_verified_at ?? null;
}

async function expireTokensOf(email: string): Promise<void> {
  await database.execute({
    sql: 'UPDATE email_tokens SET expires_at = ? WHERE user_id = (SELECT id FROM users WHERE email = ?)',
    args: [Date.now() - 1000, email],
  });
}

describe('address verification', () => {
  it('mails a single-use link at sign-up, keeps only its hash, and proves the address once', async () => {
    const { email, client } = await signedInClient(server.baseUrl);
    expect(await verifiedAt(email)).toBeNull();
    const accountPage = async () => (await client.request('/account')).text();
    expect(await accountPage()).toContain('data-testid="unconfirmed-address"');
    const mail = await mailTo(email, 'Confirm your address');
    const token = tokenIn(mail, 'verify-email');
    expect(token.length).toBeGreaterThanOrEqual(40);
    const stored = (await database.execute('SELECT token_hash FROM email_tokens')).rows.map((r) => r.token_hash);
    expect(stored).not.toContain(token);
    expect(stored).toHaveLength(new Set(stored).size);

    const anyone = new ApiClient(server.baseUrl);
    const confirmed = await anyone.post('/api/email-verifications/confirm', { token });
    expect(confirmed.status).toBe(200);
    expect(confirmed.body).toEqual({ email });
    expect(await verifiedAt(email)).not.toBeNull();
    expect(await accountPage()).not.toContain('unconfirmed-address');
    const again = await anyone.post('/api/email-verifications/confirm', { token });
    expect(again.status).toBe(410);
    expect(again.body.error.fields).toEqual({ token: 'already used' });
    const madeUp = await anyone.post('/api/email-verifications/confirm', { token: 'x'.repeat(43) });
    expect(madeUp.status).toBe(404);
    expect((await anyone.post('/api/email-verifications/confirm', {})).body.error.fields.token).toBeTruthy();
  });

  it('refuses a verification link after 24 hours, and sends a new one on request', async () => {
    const { email } = await signedInClient(server.baseUrl);
    const first = tokenIn(await mailTo(email, 'Confirm your address'), 'verify-email');
    await expireTokensOf(email);
    const late = await new ApiClient(server.baseUrl).post('/api/email-verifications/confirm', { token: first });
    expect(late.status).toBe(410);
    expect(late.body.error.fields).toEqual({ token: 'expired' });

    const asked = await new ApiClient(server.baseUrl).post('/api/email-verifications', { email });
    expect(asked.status).toBe(202);
    const unknown = await new ApiClient(server.baseUrl).post('/api/email-verifications', {
      email: uniqueEmail('nobody'),
    });
    expect(unknown.status).toBe(202);
    expect(unknown.body).toEqual(asked.body);
    await smtp.waitFor((m) => m.to.includes(email) && tokenIn(m, 'verify-email') !== first);
    const second = mailsTo(email, 'Confirm your address').map((m) => tokenIn(m, 'verify-email'))[1]!;
    expect(
      (await new ApiClient(server.baseUrl).post('/api/email-verifications/confirm', { token: second })).status,
    ).toBe(200);
  });

  it('mails no notice to an address nobody proved, and does once it is proved', async () => {
    // The owner signs up and starts a team but has not followed the link; the chief joins by invitation.
    const owner = await signedInClient(server.baseUrl, { team: 'Unproved Owner Crew' });
    const chief = await joinByInvitation(server.baseUrl, smtp, owner.client, 'crew-chief');
    const openReview = async (serial: string) => {
      const set = await chief.client.post('/api/gear-sets', { serial, ringTeeth: 41, pinionTeeth: 10 });
      await submitInspection(chief.client, draftBody(set.body.id, { runsAtInspection: 0 }));
      const opened = await chief.client.post('/api/reviews', { gearSetId: set.body.id });
      expect(opened.status).toBe(201);
    };
    await openReview('UP-1');
    // The outbox worker polls every 2 s: wait long enough for a notice to have gone, then look.
    await new Promise((resolve) => setTimeout(resolve, 5000));
    expect(smtp.received.filter((m) => m.to.includes(owner.email) && m.subject.includes('opened a review'))).toEqual(
      [],
    );

    await verifyAddressByMail(server.baseUrl, smtp, owner.email);
    await openReview('UP-2');
    const notice = await smtp.waitFor((m) => m.to.includes(owner.email) && m.subject.includes('opened a review'));
    expect(notice.text).toContain('UP-2');
  });

  it('counts an address as proved when its person accepts the invitation mailed to it', async () => {
    const owner = await signedInClient(server.baseUrl, { team: 'Invited Proof Crew' });
    const viewer = await joinByInvitation(server.baseUrl, smtp, owner.client, 'viewer');
    expect(await verifiedAt(viewer.email)).not.toBeNull();
  });
});

describe('an account a team import made', () => {
  it('is not claimed by whoever signs up first with its address; its owner claims it through the mail', async () => {
    const owner = await signedInClient(server.baseUrl, { team: 'Archive Crew' });
    const member = await joinByInvitation(server.baseUrl, smtp, owner.client, 'technician');
    const archive = await (await owner.client.request('/api/exports/team.json')).json();
    const empty = await startServer({ env: { SMTP_PORT: String(smtp.port) } });
    try {
      const importer = (await signedInClient(empty.baseUrl)).client;
      expect((await importer.post('/api/imports/team', archive)).status).toBe(201);

      // Someone who does not read the member's mail signs up with the member's address.
      const before = smtp.received.length;
      const attacker = new ApiClient(empty.baseUrl);
      const signUp = await attacker.post('/api/accounts', {
        email: member.email,
        password: 'the attacker chose this one',
        name: 'Not The Member',
      });
      expect(signUp.status).toBe(202);
      await attacker.signIn(member.email, 'the attacker chose this one');
      expect(attacker.hasSessionCookie()).toBe(false);

      // The member's own mail holds the link that sets the password.
      const mail = await smtp.waitFor(
        (m) => smtp.received.indexOf(m) >= before && m.to.includes(member.email) && m.subject.includes('Choose'),
      );
      const token = tokenIn(mail, 'reset-password');
      const set = await new ApiClient(empty.baseUrl).post('/api/password-resets/confirm', {
        token,
        newPassword: 'the member chose this one',
      });
      expect(set.status).toBe(200);
      const claimed = new ApiClient(empty.baseUrl);
      await claimed.signIn(member.email, 'the member chose this one');
      expect(claimed.hasSessionCookie()).toBe(true);
      expect((await claimed.get('/api/account')).body.email).toBe(member.email);
    } finally {
      await empty.stop();
    }
  }, 90_000);
});

describe('a forgotten password', () => {
  it('answers the same for an address with an account and one without, and mails only the first', async () => {
    const { email } = await signedInClient(server.baseUrl);
    const nobody = uniqueEmail('nobody');
    const known = await askReset(email);
    const unknown = await askReset(nobody);
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(unknown.body).toEqual(known.body);
    await mailTo(email, 'Reset your Lashline password');
    await new Promise((resolve) => setTimeout(resolve, 2500));
    expect(smtp.received.filter((m) => m.to.includes(nobody))).toEqual([]);
  });

  it('sets a new password once, ends every session of the person, and records it in the audit trail', async () => {
    const person = await signedInClient(server.baseUrl);
    const laptop = person.client;
    const phone = new ApiClient(server.baseUrl);
    await phone.signIn(person.email, TEST_PASSWORD);
    expect((await phone.get('/api/account')).status).toBe(200);

    expect((await askReset(person.email)).status).toBe(202);
    expect((await askReset(person.email)).status).toBe(202);
    await smtp.waitFor((m) => m.to.includes(person.email) && mailsTo(person.email, 'Reset').length >= 2);
    const [older, newer] = mailsTo(person.email, 'Reset your Lashline password').map((m) =>
      tokenIn(m, 'reset-password'),
    );
    expect(older).not.toBe(newer);

    const weak = await new ApiClient(server.baseUrl).post('/api/password-resets/confirm', {
      token: newer,
      newPassword: 'short',
    });
    expect(weak.status).toBe(400);
    expect(weak.body.error.fields.newPassword).toBeTruthy();

    const reset = await new ApiClient(server.baseUrl).post('/api/password-resets/confirm', {
      token: newer,
      newPassword: 'a brand new passphrase',
    });
    expect(reset.status).toBe(200);
    expect((await laptop.get('/api/account')).status).toBe(401);
    expect((await phone.get('/api/account')).status).toBe(401);

    const again = await new ApiClient(server.baseUrl).post('/api/password-resets/confirm', {
      token: newer,
      newPassword: 'yet another passphrase',
    });
    expect(again.status).toBe(410);
    // The older link died with the reset.
    const stale = await new ApiClient(server.baseUrl).post('/api/password-resets/confirm', {
      token: older,
      newPassword: 'yet another passphrase',
    });
    expect(stale.status).toBe(410);

    const oldPassword = new ApiClient(server.baseUrl);
    await oldPassword.signIn(person.email, TEST_PASSWORD);
    expect(oldPassword.hasSessionCookie()).toBe(false);
    const newPassword = new ApiClient(server.baseUrl);
    await newPassword.signIn(person.email, 'a brand new passphrase');
    expect(newPassword.hasSessionCookie()).toBe(true);

    const audit = await database.execute({
      sql: "SELECT actor_id FROM audit_events WHERE action = 'reset-password' AND record_type = 'account' AND record_id = ?",
      args: [person.userId],
    });
    expect(audit.rows.map((r) => r.actor_id)).toEqual([person.userId]);
    expect(await verifiedAt(person.email)).not.toBeNull();
  });

  it('refuses a reset link after an hour', async () => {
    const { email } = await signedInClient(server.baseUrl);
    expect((await askReset(email)).status).toBe(202);
    const token = tokenIn(await mailTo(email, 'Reset your Lashline password'), 'reset-password');
    await expireTokensOf(email);
    const late = await new ApiClient(server.baseUrl).post('/api/password-resets/confirm', {
      token,
      newPassword: 'too late for this one',
    });
    expect(late.status).toBe(410);
    expect(late.body.error.fields).toEqual({ token: 'expired' });
  });

  it('limits requests per address (3 an hour) with Retry-After, the same for an unknown address', async () => {
    for (const email of [uniqueEmail('limited'), (await signedInClient(server.baseUrl)).email]) {
      for (let i = 0; i < 3; i += 1) expect((await askReset(email)).status).toBe(202);
      const limited = await askReset(email);
      resetRequests -= 1; // refused: not counted
      expect(limited.status).toBe(429);
      expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(3000);
    }
  });

  it('limits requests per client (20 an hour), whatever addresses they name', async () => {
    while (resetRequests < 20) expect((await askReset(uniqueEmail('spray'))).status).toBe(202);
    const limited = await askReset(uniqueEmail('spray'));
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
  });
});
