import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { TEST_PASSWORD, signedInClient, uniqueEmail } from '../helpers/api-client';
import { startServer, type RunningServer } from '../helpers/server';
import { postSignIn } from '../helpers/sign-in-requests';

/**
 * The review's finding 3: the sign-in limit walked around with a JSON body, a rotated
 * X-Forwarded-For, and (ours) a repeated e-mail field and a burst of parallel guesses. Every request
 * here comes from 127.0.0.1; the server behind "one proxy" (TRUST_PROXY=1) lets each test stand at
 * its own client address, so the per-address limit of one test does not spill into the next.
 */

const WRONG = 'not the password at all';
let direct: RunningServer;
let proxied: RunningServer;
beforeAll(async () => {
  [direct, proxied] = await Promise.all([startServer(), startServer({ env: { TRUST_PROXY: '1' } })]);
}, 60_000);
afterAll(async () => {
  await direct?.stop();
  await proxied?.stop();
});

let addressCounter = 0;
/** A client address of its own, as the trusted proxy in front would report it. */
const fromOwnAddress = () => ({ 'x-forwarded-for': `198.51.100.${(addressCounter += 1)}` });

describe('the sign-in limit, attacked', () => {
  it('(control) signs in with a JSON body, with a repeated e-mail field (Auth.js reads the last) and at the path with a trailing slash', async () => {
    const { email } = await signedInClient(proxied.baseUrl);
    const json = await postSignIn(proxied.baseUrl, {
      email,
      password: TEST_PASSWORD,
      as: 'json',
      headers: fromOwnAddress(),
    });
    expect(json.client.hasSessionCookie()).toBe(true);
    const repeated = await postSignIn(proxied.baseUrl, {
      email: [uniqueEmail('decoy'), email],
      password: TEST_PASSWORD,
      headers: fromOwnAddress(),
    });
    expect(repeated.client.hasSessionCookie()).toBe(true);
    const slash = await postSignIn(proxied.baseUrl, {
      email,
      password: TEST_PASSWORD,
      headers: fromOwnAddress(),
      path: '/api/auth/callback/credentials/',
    });
    expect(slash.client.hasSessionCookie()).toBe(true);
  });

  it('counts JSON bodies against the account: a locked account stays locked, whatever the body type', async () => {
    const { email } = await signedInClient(proxied.baseUrl);
    const headers = fromOwnAddress();
    for (let i = 0; i < 5; i += 1) {
      const { response } = await postSignIn(proxied.baseUrl, {
        email,
        password: WRONG,
        as: i % 2 ? 'json' : 'form',
        headers,
      });
      expect(response.status).toBe(302);
    }
    for (const as of ['json', 'form'] as const) {
      const { response, client } = await postSignIn(proxied.baseUrl, { email, password: TEST_PASSWORD, as, headers });
      expect(response.status).toBe(429);
      expect(Number(response.headers.get('retry-after'))).toBeGreaterThan(0);
      expect(client.hasSessionCookie()).toBe(false);
    }
  });

  it('counts a JSON body’s e-mail however it is written (case, spaces) as the account Auth.js checks', async () => {
    const { email } = await signedInClient(proxied.baseUrl);
    const headers = fromOwnAddress();
    for (let i = 0; i < 5; i += 1) {
      const spelled = i % 2 ? `  ${email.toUpperCase()} ` : email;
      await postSignIn(proxied.baseUrl, { email: spelled, password: WRONG, as: 'json', headers });
    }
    const { response } = await postSignIn(proxied.baseUrl, { email, password: TEST_PASSWORD, as: 'json', headers });
    expect(response.status).toBe(429);
  });

  it('counts a repeated e-mail field against the account Auth.js reads (the last one)', async () => {
    const { email } = await signedInClient(proxied.baseUrl);
    const headers = fromOwnAddress();
    for (let i = 0; i < 5; i += 1)
      await postSignIn(proxied.baseUrl, { email: [uniqueEmail('decoy'), email], password: WRONG, headers });
    const { response, client } = await postSignIn(proxied.baseUrl, {
      email: [uniqueEmail('decoy'), email],
      password: TEST_PASSWORD,
      headers,
    });
    expect(response.status).toBe(429);
    expect(client.hasSessionCookie()).toBe(false);
  });

  it('lets at most the allowed number of a burst of parallel guesses reach the password check', async () => {
    const { email } = await signedInClient(proxied.baseUrl);
    const headers = fromOwnAddress();
    const answers = await Promise.all(
      Array.from({ length: 15 }, () => postSignIn(proxied.baseUrl, { email, password: WRONG, headers })),
    );
    const checked = answers.filter((a) => a.response.status === 302).length;
    expect(checked).toBeLessThanOrEqual(5);
    expect(answers.filter((a) => a.response.status === 429).length).toBeGreaterThanOrEqual(10);
  });

  it('limits the same path with a trailing slash, which Auth.js also answers', async () => {
    const { email } = await signedInClient(proxied.baseUrl);
    const headers = fromOwnAddress();
    for (let i = 0; i < 5; i += 1)
      await postSignIn(proxied.baseUrl, { email, password: WRONG, headers, path: '/api/auth/callback/credentials/' });
    const { response } = await postSignIn(proxied.baseUrl, {
      email,
      password: TEST_PASSWORD,
      headers,
      path: '/api/auth/callback/credentials/',
    });
    expect(response.status).toBe(429);
  });

  it('behind a trusted proxy, limits the address the proxy saw, whatever the client wrote to its left', async () => {
    let status = 0;
    for (let i = 0; i < 25 && status !== 429; i += 1) {
      const { response } = await postSignIn(proxied.baseUrl, {
        email: uniqueEmail('spray'),
        password: WRONG,
        headers: { 'x-forwarded-for': `203.0.113.${i}, 192.0.2.77` },
      });
      status = response.status;
    }
    expect(status).toBe(429);
  });

  it('with no proxy trusted, ignores X-Forwarded-For: rotating it does not escape the address limit', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 22; i += 1) {
      const { response } = await postSignIn(direct.baseUrl, {
        email: uniqueEmail('rotate'),
        password: WRONG,
        headers: { 'x-forwarded-for': `203.0.113.${i + 1}` },
      });
      statuses.push(response.status);
    }
    // Twenty failures per address in 15 minutes; the 21st is refused.
    expect(statuses.slice(0, 20)).toEqual(statuses.slice(0, 20).map(() => 302));
    expect(statuses.slice(20)).toEqual([429, 429]);
  });
});
