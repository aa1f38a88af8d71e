import { createClient } from '@libsql/client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, signedInClient } from '../helpers/api-client';
import { startServer, type RunningServer } from '../helpers/server';

let server: RunningServer;
let owner: ApiClient;
beforeAll(async () => {
  server = await startServer();
  owner = (await signedInClient(server.baseUrl, { team: 'Bad Input Team' })).client;
});
afterAll(() => server?.stop());

const TABLES = ['users', 'teams', 'memberships', 'invitations', 'outbox'];

/** Row counts of the tables this issue writes, read straight from the server's SQLite file. */
async function rowCounts(): Promise<Record<string, number>> {
  const db = createClient({ url: server.databaseUrl });
  const counts: Record<string, number> = {};
  for (const table of TABLES)
    counts[table] = Number((await db.execute(`SELECT count(*) AS n FROM ${table}`)).rows[0]?.n);
  db.close();
  return counts;
}

interface Case {
  method: string;
  path: string;
  body: unknown;
  field?: string;
  raw?: string;
}

const CASES: Case[] = [
  {
    method: 'POST',
    path: '/api/accounts',
    body: { email: 'x@example.test', password: 12, name: 'X' },
    field: 'password',
  },
  { method: 'POST', path: '/api/accounts', body: { password: 'long enough password', name: 'X' }, field: 'email' },
  {
    method: 'POST',
    path: '/api/accounts',
    body: { email: 'x@example.test', password: 'long enough password' },
    field: 'name',
  },
  {
    method: 'POST',
    path: '/api/accounts',
    body: { email: 'nope', password: 'long enough password', name: 'X' },
    field: 'email',
  },
  { method: 'POST', path: '/api/accounts', body: [], field: '' },
  { method: 'POST', path: '/api/teams', body: { name: 7 }, field: 'name' },
  { method: 'POST', path: '/api/teams', body: {}, field: 'name' },
  { method: 'PUT', path: '/api/teams/current', body: { teamId: false }, field: 'teamId' },
  { method: 'POST', path: '/api/invitations', body: { email: 'a@example.test', role: 'admiral' }, field: 'role' },
  { method: 'POST', path: '/api/invitations', body: { role: 'viewer' }, field: 'email' },
  { method: 'POST', path: '/api/invitations/accept', body: { token: 5 }, field: 'token' },
  { method: 'PATCH', path: '/api/account', body: { lengthUnit: 'furlong' }, field: 'lengthUnit' },
  { method: 'PATCH', path: '/api/account', body: { name: '' }, field: 'name' },
  {
    method: 'POST',
    path: '/api/account/password',
    body: { currentPassword: 'x', newPassword: 'short' },
    field: 'newPassword',
  },
  { method: 'PATCH', path: '/api/members/someone', body: { role: 3 }, field: 'role' },
];

const ENDPOINTS = [...new Map(CASES.map((c) => [`${c.method} ${c.path}`, c])).values()];

describe('bad input on every endpoint of the foundation', () => {
  for (const c of CASES) {
    it(`${c.method} ${c.path} with ${JSON.stringify(c.body)} answers 400 naming "${c.field}" and writes nothing`, async () => {
      const before = await rowCounts();
      const answer = await owner.json(c.method, c.path, c.body);
      expect(answer.status).toBe(400);
      expect(answer.body.error.message).toBeTruthy();
      if (c.field) expect(Object.keys(answer.body.error.fields ?? {})).toContain(c.field);
      if (c.field) expect(answer.body.error.message).toContain(c.field);
      expect(await rowCounts()).toEqual(before);
    });
  }

  for (const c of ENDPOINTS) {
    it(`${c.method} ${c.path} answers 400 to malformed JSON`, async () => {
      const before = await rowCounts();
      const response = await owner.request(c.path, {
        method: c.method,
        headers: { 'content-type': 'application/json' },
        body: '{"name": "x",',
      });
      expect(response.status).toBe(400);
      expect((await response.json()).error.message).toMatch(/not valid JSON/);
      expect(await rowCounts()).toEqual(before);
    });

    it(`${c.method} ${c.path} answers 413 to a body over 1 MB`, async () => {
      const before = await rowCounts();
      const huge = JSON.stringify({ name: 'x'.repeat(1024 * 1024 + 10) });
      const response = await owner.request(c.path, {
        method: c.method,
        headers: { 'content-type': 'application/json' },
        body: huge,
      });
      expect(response.status).toBe(413);
      expect((await response.json()).error.message).toMatch(/1 MB/);
      expect(await rowCounts()).toEqual(before);
    });

    it(`${c.method} ${c.path} answers 415 to a body that is not JSON`, async () => {
      const response = await owner.request(c.path, {
        method: c.method,
        headers: { 'content-type': 'text/plain' },
        body: 'name=x',
      });
      expect(response.status).toBe(415);
    });
  }

  it('refuses a JSON request from a foreign Origin', async () => {
    const response = await owner.request('/api/teams', {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: 'http://elsewhere.test' },
      body: JSON.stringify({ name: 'Foreign' }),
    });
    expect(response.status).toBe(403);
  });

  it('answers 401 to a signed-out caller, never 500', async () => {
    const anonymous = new ApiClient(server.baseUrl);
    for (const path of ['/api/account', '/api/teams', '/api/members', '/api/invitations']) {
      expect((await anonymous.get(path)).status).toBe(401);
    }
  });
});
