import { createHash } from 'node:crypto';
import { createClient } from '@libsql/client';
import { Secret, TOTP } from 'otpauth';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type ApiClient, TEST_PASSWORD, signedInClient } from '../helpers/api-client';
import { startServer, type RunningServer } from '../helpers/server';
import { postSignIn, prepareSignIn } from '../helpers/sign-in-requests';

/**
 * The review's finding 7 (and the code-guessing half of 3): a TOTP code taken twice, 40-bit recovery
 * codes stored as unsalted SHA-256 and spent in a separate write, a sign-in answer that tells a right
 * password from a wrong one, and no limit on codes or re-entered passwords. The server stands behind
 * "one proxy" (TRUST_PROXY=1) so a test can send each guess from an address of its own, as a spread
 * attacker would.
 */

let server: RunningServer;
beforeAll(async () => {
  server = await startServer({ env: { TRUST_PROXY: '1' } });
}, 60_000);
afterAll(() => server?.stop());

let addressCounter = 0;
const newAddress = () => ({ 'x-forwarded-for': `198.51.100.${(addressCounter += 1) % 250}` });

/** The code an authenticator app shows `offsetMs` from now (RFC 6238 through otpauth). */
const codeFor = (secret: string, offsetMs = 0) =>
  new TOTP({ secret: Secret.fromBase32(secret), algorithm: 'SHA1', digits: 6, period: 30 }).generate({
    timestamp: Date.now() + offsetMs,
  });

/** An owner with the second factor on (confirmed with the current code, whose step is then used). */
async function ownerWithSecondFactor(): Promise<{
  client: ApiClient;
  email: string;
  userId: string;
  secret: string;
  recoveryCodes: string[];
}> {
  const owner = await signedInClient(server.baseUrl, { team: 'Second Factor Crew' });
  const setup = (await owner.client.post('/api/account/second-factor')).body;
  const confirmed = await owner.client.post('/api/account/second-factor/confirm', { code: codeFor(setup.secret) });
  expect(confirmed.status).toBe(200);
  return { ...owner, secret: setup.secret, recoveryCodes: confirmed.body.recoveryCodes };
}

async function signInWith(email: string, password: string, code?: string) {
  const { response, client } = await postSignIn(server.baseUrl, { email, password, code, headers: newAddress() });
  return { status: response.status, location: response.headers.get('location'), signedIn: client.hasSessionCookie() };
}

describe('the second factor, attacked', () => {
  it('accepts each time step’s code once: a code seen over a shoulder cannot sign in again', async () => {
    const { email, secret } = await ownerWithSecondFactor();
    const next = codeFor(secret, 30_000);
    expect((await signInWith(email, TEST_PASSWORD, next)).signedIn).toBe(true);
    expect((await signInWith(email, TEST_PASSWORD, next)).signedIn).toBe(false);
  });

  it('makes recovery codes of at least 80 bits and keeps no plain SHA-256 of them', async () => {
    const { userId, recoveryCodes } = await ownerWithSecondFactor();
    expect(recoveryCodes).toHaveLength(10);
    for (const code of recoveryCodes) expect(code.replace(/-/g, '')).toMatch(/^[0-9a-f]{20}$/); // 20 hex digits = 80 bits
    const db = createClient({ url: server.databaseUrl });
    try {
      const rows = (await db.execute({ sql: 'SELECT code_hash FROM recovery_codes WHERE user_id = ?', args: [userId] }))
        .rows;
      expect(rows).toHaveLength(10);
      const stored = new Set(rows.map((row) => String(row.code_hash)));
      for (const code of recoveryCodes) {
        const plain = code.replace(/-/g, '');
        expect(stored.has(plain)).toBe(false);
        expect(stored.has(createHash('sha256').update(plain).digest('hex'))).toBe(false);
      }
    } finally {
      db.close();
    }
  });

  it('spends a recovery code once, even when it is sent ten times at the same moment', async () => {
    const { email, recoveryCodes } = await ownerWithSecondFactor();
    // Every request holds its CSRF token first, so the ten leave together.
    const sends = await Promise.all(
      Array.from({ length: 10 }, () =>
        prepareSignIn(server.baseUrl, {
          email,
          password: TEST_PASSWORD,
          code: recoveryCodes[0],
          headers: newAddress(),
        }),
      ),
    );
    const answers = (await Promise.all(sends.map((send) => send()))).map(({ client }) => ({
      signedIn: client.hasSessionCookie(),
    }));
    expect(answers.filter((a) => a.signedIn)).toHaveLength(1);
  });

  it('answers a right password without a code, or with a wrong one, exactly as a wrong password', async () => {
    const { email } = await ownerWithSecondFactor();
    const wrongPassword = await signInWith(email, 'not the password at all');
    const noCode = await signInWith(email, TEST_PASSWORD);
    const wrongCode = await signInWith(email, TEST_PASSWORD, '000000');
    expect(wrongPassword.signedIn).toBe(false);
    expect(noCode).toEqual(wrongPassword);
    expect(wrongCode).toEqual(wrongPassword);
  });

  it('limits code guesses per account, from any number of addresses and in JSON bodies', async () => {
    const { email, secret } = await ownerWithSecondFactor();
    for (let i = 0; i < 5; i += 1) {
      const { response } = await postSignIn(server.baseUrl, {
        email,
        password: TEST_PASSWORD,
        code: String(100000 + i),
        as: 'json',
        headers: newAddress(),
      });
      expect(response.status).toBe(302);
    }
    const { response, client } = await postSignIn(server.baseUrl, {
      email,
      password: TEST_PASSWORD,
      code: codeFor(secret, 30_000),
      as: 'json',
      headers: newAddress(),
    });
    expect(response.status).toBe(429);
    expect(Number(response.headers.get('retry-after'))).toBeGreaterThan(0);
    expect(client.hasSessionCookie()).toBe(false);
  });

  it('limits re-entered passwords when turning the second factor off', async () => {
    const { client, secret } = await ownerWithSecondFactor();
    for (let i = 0; i < 5; i += 1) {
      const wrong = await client.post('/api/account/second-factor/disable', {
        password: `wrong guess ${i}!`,
        code: '000000',
      });
      expect(wrong.status).toBe(400);
    }
    const limited = await client.post('/api/account/second-factor/disable', {
      password: TEST_PASSWORD,
      code: codeFor(secret, 30_000),
    });
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
    expect((await client.get('/api/account')).body.secondFactor).toBe(true);
  });

  it('limits wrong codes when turning the second factor off', async () => {
    const { client, secret } = await ownerWithSecondFactor();
    for (let i = 0; i < 5; i += 1) {
      const wrong = await client.post('/api/account/second-factor/disable', {
        password: TEST_PASSWORD,
        code: String(200000 + i),
      });
      expect(wrong.status).toBe(400);
    }
    const limited = await client.post('/api/account/second-factor/disable', {
      password: TEST_PASSWORD,
      code: codeFor(secret, 30_000),
    });
    expect(limited.status).toBe(429);
  });

  it('limits wrong codes while confirming a new second factor', async () => {
    const owner = await signedInClient(server.baseUrl, { team: 'Confirm Crew' });
    const setup = (await owner.client.post('/api/account/second-factor')).body;
    for (let i = 0; i < 5; i += 1)
      expect((await owner.client.post('/api/account/second-factor/confirm', { code: String(300000 + i) })).status).toBe(
        400,
      );
    const limited = await owner.client.post('/api/account/second-factor/confirm', { code: codeFor(setup.secret) });
    expect(limited.status).toBe(429);
    expect((await owner.client.get('/api/account')).body.secondFactor).toBe(false);
  });

  it('limits re-entered passwords when changing the password', async () => {
    const { client } = await signedInClient(server.baseUrl);
    for (let i = 0; i < 5; i += 1) {
      const wrong = await client.post('/api/account/password', {
        currentPassword: `wrong guess ${i}!`,
        newPassword: 'another long enough passphrase',
      });
      expect(wrong.status).toBe(400);
    }
    const limited = await client.post('/api/account/password', {
      currentPassword: TEST_PASSWORD,
      newPassword: 'another long enough passphrase',
    });
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
    expect((await client.get('/api/account')).status).toBe(200);
  });
});
