import { readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, signedInClient, uniqueEmail, TEST_PASSWORD } from '../helpers/api-client';
import { makeTeamRecords, recordsToParams, type TeamRecords } from '../helpers/records';
import { fillPattern, listOtherEndpoints, listPageRoutes, patternParams } from '../helpers/routes';
import { SERVER_ENTRY, startServer, type RunningServer } from '../helpers/server';

/**
 * The security headers on every page (every .astro file under src/pages, with real ids, signed in
 * and signed out), on the other endpoints outside /api, and on a sample of API answers of every
 * kind: success, 204, a download, an image, a redirect, 400, 401, 403 (ours and Astro's origin
 * check), 404, 413 (declared and streamed), 415 and 429.
 */

let server: RunningServer;
let owner: ApiClient;
let lonely: ApiClient;
let anonymous: ApiClient;
let records: TeamRecords;

beforeAll(async () => {
  server = await startServer();
  const made = await signedInClient(server.baseUrl, { team: 'Header Crew' });
  owner = made.client;
  records = await makeTeamRecords(owner, owner, { teamId: made.teamId!, memberId: made.userId });
  // Signed in but in no team: every team route answers 403.
  lonely = (await signedInClient(server.baseUrl)).client;
  anonymous = new ApiClient(server.baseUrl);
}, 90_000);
afterAll(() => server?.stop());

const SAFE_SOURCE =
  /^('self'|'none'|'unsafe-inline'|'strict-dynamic'|'(sha256|sha384|sha512)-[A-Za-z0-9+/=]+'|'nonce-[A-Za-z0-9+/=_-]+'|data:|blob:)$/;
const SAFE_REFERRER_POLICIES = ['no-referrer', 'same-origin', 'strict-origin', 'strict-origin-when-cross-origin'];

/** What is wrong with a response's security headers; empty when nothing is. */
function headerProblems(headers: Headers): string[] {
  const problems: string[] = [];
  const csp = headers.get('content-security-policy');
  if (!csp) problems.push('no Content-Security-Policy');
  else {
    const directives = csp
      .split(';')
      .map((d) => d.trim())
      .filter(Boolean);
    if (!directives.some((d) => d === "frame-ancestors 'none'"))
      problems.push(`CSP without frame-ancestors 'none': ${csp.slice(0, 200)}`);
    for (const directive of directives) {
      const [name, ...sources] = directive.split(/\s+/);
      // upgrade-insecure-requests and the like name no source at all.
      const foreign = sources.filter((source) => !SAFE_SOURCE.test(source));
      if (foreign.length) problems.push(`CSP ${name} allows ${foreign.join(' ')}`);
    }
  }
  if (headers.get('x-content-type-options') !== 'nosniff')
    problems.push(`X-Content-Type-Options: ${headers.get('x-content-type-options')}`);
  if (!SAFE_REFERRER_POLICIES.includes(headers.get('referrer-policy') ?? ''))
    problems.push(`Referrer-Policy: ${headers.get('referrer-policy')}`);
  if (headers.get('x-frame-options') !== 'DENY') problems.push(`X-Frame-Options: ${headers.get('x-frame-options')}`);
  return problems;
}

async function check(
  client: ApiClient,
  path: string,
  init: RequestInit = {},
): Promise<{ status: number; problems: string[] }> {
  const response = await client.request(path, init);
  await response.arrayBuffer().catch(() => undefined);
  return { status: response.status, problems: headerProblems(response.headers) };
}

/** A path for a route pattern with the team's ids, and a made-up id for a kind the records do not have. */
function pathFor(pattern: string): string {
  const params = recordsToParams(records, pattern);
  for (const name of patternParams(pattern)) params[name] ??= 'no-such-record';
  return fillPattern(pattern, params);
}

describe('security headers', () => {
  it('are on every page, signed in and signed out', async () => {
    const pages = listPageRoutes();
    expect(pages.length).toBeGreaterThan(10);
    const wrong: string[] = [];
    for (const page of pages) {
      for (const [who, client] of [
        ['signed in', owner],
        ['signed out', anonymous],
      ] as const) {
        const path = pathFor(page.pattern);
        const { status, problems } = await check(client, path);
        if (problems.length) wrong.push(`${who} GET ${path} (${status}): ${problems.join('; ')}`);
      }
    }
    expect(wrong).toEqual([]);
  });

  it('are on the endpoints outside /api', async () => {
    const wrong: string[] = [];
    for (const endpoint of listOtherEndpoints()) {
      for (const method of endpoint.methods) {
        const path = pathFor(endpoint.pattern);
        const init: RequestInit =
          method === 'GET'
            ? {}
            : {
                method,
                headers: { 'content-type': 'application/x-www-form-urlencoded' },
                body: `teamId=${records.teamId}`,
              };
        const { status, problems } = await check(owner, path, init);
        if (problems.length) wrong.push(`${method} ${path} (${status}): ${problems.join('; ')}`);
      }
    }
    expect(wrong).toEqual([]);
  });

  const json = (method: string, body: unknown, extra: Record<string, string> = {}): RequestInit => ({
    method,
    headers: { 'content-type': 'application/json', ...extra },
    body: JSON.stringify(body),
  });

  const SAMPLES: { name: string; status: number; send: () => Promise<{ status: number; problems: string[] }> }[] = [
    { name: 'a list', status: 200, send: () => check(owner, '/api/runs') },
    {
      name: 'a creation',
      status: 201,
      send: () => check(owner, '/api/cars', json('POST', { name: `Header car ${Date.now()}` })),
    },
    {
      name: 'a deletion',
      status: 204,
      send: async () =>
        check(
          owner,
          `/api/runs/${(await owner.post('/api/runs', { carId: records.carId, at: '2026-06-01T11:00:00Z' })).body.id}`,
          { method: 'DELETE' },
        ),
    },
    {
      name: 'a CSV download',
      status: 200,
      send: () => check(owner, `/api/exports/gear-sets/${records.gearSetId}.csv`),
    },
    { name: 'a photo', status: 200, send: () => check(owner, `/api/photos/${records.photoId}`) },
    {
      name: 'a built script (static file)',
      status: 200,
      send: () =>
        check(
          anonymous,
          `/_astro/${readdirSync(join(dirname(dirname(SERVER_ENTRY)), 'client', '_astro')).find((name) => name.endsWith('.js'))}`,
        ),
    },
    { name: 'the health check', status: 200, send: () => check(anonymous, '/api/health') },
    { name: 'the Auth.js CSRF token', status: 200, send: () => check(anonymous, '/api/auth/csrf') },
    { name: 'a bad field', status: 400, send: () => check(owner, '/api/cars', json('POST', {})) },
    {
      name: 'malformed JSON',
      status: 400,
      send: () =>
        check(owner, '/api/cars', { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{' }),
    },
    { name: 'signed out', status: 401, send: () => check(anonymous, '/api/runs') },
    { name: 'no team', status: 403, send: () => check(lonely, '/api/runs') },
    {
      name: 'a foreign Origin on JSON',
      status: 403,
      send: () => check(owner, '/api/cars', json('POST', { name: 'x' }, { origin: 'http://evil.example' })),
    },
    { name: "another team's record", status: 404, send: () => check(owner, '/api/cars/no-such-car') },
    { name: 'an unknown API path', status: 404, send: () => check(owner, '/api/no-such-thing') },
    { name: 'an unknown page', status: 404, send: () => check(owner, '/no-such-page') },
    // Astro answers a method a route does not export with 404.
    { name: 'a method the route does not have', status: 404, send: () => check(owner, '/api/health', json('PUT', {})) },
    {
      name: 'a declared body over 1 MB',
      status: 413,
      send: () => check(owner, '/api/cars', json('POST', { name: 'x'.repeat(1_100_000) })),
    },
    {
      name: 'a streamed body over 1 MB',
      status: 413,
      send: () => {
        const chunk = new TextEncoder().encode(`"${'x'.repeat(64 * 1024)}`);
        let sent = 0;
        const body = new ReadableStream<Uint8Array>({
          pull(controller) {
            if ((sent += 1) > 20) controller.close();
            else controller.enqueue(chunk);
          },
        });
        return check(owner, '/api/cars', {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body,
          duplex: 'half',
        } as RequestInit);
      },
    },
    {
      name: 'a body that is not JSON',
      status: 415,
      send: () =>
        check(owner, '/api/cars', { method: 'POST', headers: { 'content-type': 'text/plain' }, body: 'name=x' }),
    },
    {
      name: 'too many failed sign-ins',
      status: 429,
      send: async () => {
        const email = uniqueEmail('limited');
        const someone = new ApiClient(server.baseUrl);
        for (let i = 0; i < 5; i += 1) await someone.signIn(email, `${TEST_PASSWORD} but wrong`);
        const csrf = (await someone.get<{ csrfToken: string }>('/api/auth/csrf')).body.csrfToken;
        return check(someone, '/api/auth/callback/credentials', {
          method: 'POST',
          headers: { 'content-type': 'application/x-www-form-urlencoded' },
          body: new URLSearchParams({ email, password: 'wrong again', csrfToken: csrf }),
        });
      },
    },
    {
      name: 'a sign-in redirect',
      status: 302,
      send: async () => {
        const someone = new ApiClient(server.baseUrl);
        const response = await someone.signIn(uniqueEmail('nobody'), 'not a password of anyone');
        return { status: response.status, problems: headerProblems(response.headers) };
      },
    },
  ];

  for (const sample of SAMPLES) {
    it(`are on ${sample.name} (${sample.status})`, async () => {
      const { status, problems } = await sample.send();
      expect(status).toBe(sample.status);
      expect(problems).toEqual([]);
    });
  }

  // Astro refuses a cross-site form POST with its own 403 before any middleware runs; the headers
  // come from the serving wrapper (scripts/serve.mjs), which sets them on every response.
  it("are on Astro's own origin-check 403 for a cross-site form POST (set by scripts/serve.mjs)", async () => {
    const { status, problems } = await check(owner, '/teams/switch', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded', origin: 'http://evil.example' },
      body: `teamId=${records.teamId}`,
    });
    expect(status).toBe(403);
    expect(problems).toEqual([]);
  });
});
