import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, TEST_PASSWORD, signedInClient, uniqueEmail } from '../helpers/api-client';
import { startServer, type RunningServer } from '../helpers/server';

let server: RunningServer;
beforeAll(async () => {
  server = await startServer();
});
afterAll(() => server?.stop());

describe('accounts and sessions', () => {
  it('answers health with the database reachable and the migrations counted', async () => {
    const health = await new ApiClient(server.baseUrl).get('/api/health');
    expect(health.status).toBe(200);
    expect(health.body.database).toBe('reachable');
    expect(health.body.migrationsApplied).toBeGreaterThanOrEqual(1);
  });

  it('signs up with 201 and never answers the password hash', async () => {
    const client = new ApiClient(server.baseUrl);
    const email = uniqueEmail();
    const made = await client.post('/api/accounts', { email, password: TEST_PASSWORD, name: 'Dana' });
    expect(made.status).toBe(201);
    expect(made.body).toMatchObject({ email, name: 'Dana' });
    expect(typeof made.body.id).toBe('string');
    expect(JSON.stringify(made.body)).not.toMatch(/hash|argon/i);
  });

  it('answers 409 for an e-mail that already has an account', async () => {
    const client = new ApiClient(server.baseUrl);
    const email = uniqueEmail();
    await client.post('/api/accounts', { email, password: TEST_PASSWORD, name: 'One' });
    const again = await client.post('/api/accounts', {
      email: email.toUpperCase(),
      password: TEST_PASSWORD,
      name: 'Two',
    });
    expect(again.status).toBe(409);
    expect(again.body.error.fields.email).toBeDefined();
  });

  it('signs in through /api/auth and shows the person in the session', async () => {
    const { client, email } = await signedInClient(server.baseUrl);
    const session = await client.get('/api/auth/session');
    expect(session.status).toBe(200);
    expect(session.body.user.email).toBe(email);
  });

  it('gives a wrong password and an unknown e-mail the same answer', async () => {
    const { email } = await signedInClient(server.baseUrl);
    const wrongPassword = await new ApiClient(server.baseUrl).signIn(email, 'not the right password');
    const unknownEmail = await new ApiClient(server.baseUrl).signIn(uniqueEmail('nobody'), 'not the right password');
    expect(wrongPassword.status).toBe(unknownEmail.status);
    expect(wrongPassword.headers.get('location')).toBe(unknownEmail.headers.get('location'));
    expect(wrongPassword.headers.get('location')).toContain('error=CredentialsSignin');
  });

  it('signs out: the session cookie is cleared and the API answers 401', async () => {
    const { client } = await signedInClient(server.baseUrl);
    expect((await client.get('/api/account')).status).toBe(200);
    await client.signOut();
    expect(client.hasSessionCookie()).toBe(false);
    expect((await client.get('/api/account')).status).toBe(401);
  });

  it('ends every other session when the password changes', async () => {
    const { client, email } = await signedInClient(server.baseUrl);
    const other = new ApiClient(server.baseUrl);
    await other.signIn(email, TEST_PASSWORD);
    expect((await other.get('/api/account')).status).toBe(200);
    const changed = await client.post('/api/account/password', {
      currentPassword: TEST_PASSWORD,
      newPassword: 'a brand new passphrase',
    });
    expect(changed.status).toBe(200);
    expect((await other.get('/api/account')).status).toBe(401);
    const fresh = new ApiClient(server.baseUrl);
    await fresh.signIn(email, 'a brand new passphrase');
    expect((await fresh.get('/api/account')).status).toBe(200);
  });

  it('keeps the chosen units on the account', async () => {
    const { client } = await signedInClient(server.baseUrl);
    const saved = await client.patch('/api/account', { lengthUnit: 'mm', torqueUnit: 'N-m' });
    expect(saved.status).toBe(200);
    const account = await client.get('/api/account');
    expect(account.body).toMatchObject({ lengthUnit: 'mm', torqueUnit: 'N-m' });
  });
});
