import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, TEST_PASSWORD, signedInClient, uniqueEmail } from '../helpers/api-client';
import { startServer, type RunningServer } from '../helpers/server';

let server: RunningServer;
beforeAll(async () => {
  server = await startServer();
});
afterAll(() => server?.stop());

describe('the sign-in rate limit', () => {
  it('answers 429 with Retry-After after five failures on one account, even with the right password', async () => {
    const { email } = await signedInClient(server.baseUrl);
    for (let i = 0; i < 5; i += 1) {
      const failed = await new ApiClient(server.baseUrl).signIn(email, 'wrong password here');
      expect(failed.status).toBe(302);
    }
    const limited = await new ApiClient(server.baseUrl).signIn(email, TEST_PASSWORD);
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
    const body = await limited.json();
    expect(body.error.message).toMatch(/Try again in/);
  });

  it('limits one client address across many accounts', async () => {
    let status = 0;
    for (let i = 0; i < 20 && status !== 429; i += 1) {
      status = (await new ApiClient(server.baseUrl).signIn(uniqueEmail('spray'), 'wrong password here')).status;
    }
    // Five failures were already counted against this address above; twenty in all trips the limit.
    expect(status).toBe(429);
  });
});
