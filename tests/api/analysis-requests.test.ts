import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, signedInClient, TEST_PASSWORD } from '../helpers/api-client';
import { startServer, type RunningServer } from '../helpers/server';
import { SmtpFake } from '../helpers/smtp-fake';
import { joinByInvitation } from '../helpers/team';

/**
 * The calculation routes, asked the ordinary and the unusual way a script or a page might ask them:
 * each answer's status, the field a 400 names, and the security headers every answer carries.
 */

interface Side {
  server: RunningServer;
  member: ApiClient;
  teamless: ApiClient;
  anonymous: ApiClient;
}

let smtp: SmtpFake;
let side: Side;

beforeAll(async () => {
  smtp = await SmtpFake.create();
  await smtp.start();
  const server = await startServer({ env: { SMTP_PORT: String(smtp.port) } });
  const member = (await signedInClient(server.baseUrl, { team: 'Calculation Team' })).client;
  const teamless = (await signedInClient(server.baseUrl)).client;
  side = { server, member, teamless, anonymous: new ApiClient(server.baseUrl) };
}, 120_000);
afterAll(async () => {
  await side?.server.stop();
  await smtp?.stop();
});

const BACKLASH = '/api/analysis/backlash';
const TREND = '/api/analysis/trend';
const SEQUENCE = '/api/analysis/tightening-sequence';
const EIGHT = [0.18, 0.17, 0.15, 0.14, 0.15, 0.16, 0.18, 0.19];
const JSON_TYPE = { 'content-type': 'application/json' };

// The headers read from each answer.
const COMPARED_HEADERS = [
  'content-type',
  'cache-control',
  'connection',
  'content-security-policy',
  'x-content-type-options',
  'referrer-policy',
  'x-frame-options',
  'cross-origin-opener-policy',
  'cross-origin-resource-policy',
  'permissions-policy',
  'retry-after',
];

interface Case {
  name: string;
  who: keyof Omit<Side, 'server'>;
  path: string;
  /** A fresh request each call: a streamed body can be sent once. */
  init: () => RequestInit & { duplex?: 'half' };
  /** No Origin header, as a script sends (the client adds one to every POST otherwise). */
  noOrigin?: boolean;
  /** The status it must answer. */
  status: number;
  /** For a 400: the field the answer names. */
  field?: string;
}

type Init = ReturnType<Case['init']>;

const post = (body: string | ReadableStream<Uint8Array>, headers: Record<string, string> = JSON_TYPE): Init => ({
  method: 'POST',
  headers,
  body,
  ...(typeof body === 'string' ? {} : { duplex: 'half' as const }),
});
const json = (value: unknown) => post(JSON.stringify(value));

/** A body over 64 KB sent in chunks with no declared length. */
function streamedOverLimit(): ReadableStream<Uint8Array> {
  const parts = [
    new TextEncoder().encode('{"unit":"mm","readings":[0.15,0.16,0.17]'),
    ...Array(5).fill(new Uint8Array(16 * 1024).fill(32)),
  ];
  return new ReadableStream({
    pull(controller) {
      const next = parts.shift();
      if (next) controller.enqueue(next);
      else controller.close();
    },
  });
}

const padded = (bytes: number) => {
  const text = JSON.stringify({ unit: 'mm', readings: [0.15, 0.16, 0.17] });
  return text.slice(0, -1) + ' '.repeat(bytes - text.length) + '}';
};

const CASES: Case[] = [
  {
    name: 'eight readings',
    who: 'member',
    path: BACKLASH,
    init: () => json({ unit: 'mm', readings: EIGHT }),
    status: 200,
  },
  {
    name: 'readings with a band and tooth counts',
    who: 'member',
    path: BACKLASH,
    init: () =>
      json({
        unit: 'in',
        readings: [0.0095, 0.0091, 0.0086, 0.0083, 0.0085, 0.0089],
        profile: { min: 0.008, max: 0.012, maxSpread: 0.002 },
        ringTeeth: 37,
        pinionTeeth: 9,
      }),
    status: 200,
  },
  {
    name: 'a query string on the POST',
    who: 'member',
    path: `${BACKLASH}?from=sheet`,
    init: () => json({ unit: 'mm', readings: EIGHT }),
    status: 200,
  },
  {
    name: 'a charset in the content type',
    who: 'member',
    path: BACKLASH,
    init: () =>
      post(JSON.stringify({ unit: 'mm', readings: EIGHT }), { 'content-type': 'application/json; charset=utf-8' }),
    status: 200,
  },
  {
    name: 'no Origin (a script)',
    who: 'member',
    path: BACKLASH,
    init: () => json({ unit: 'mm', readings: EIGHT }),
    noOrigin: true,
    status: 200,
  },
  {
    name: 'min above max',
    who: 'member',
    path: BACKLASH,
    init: () => json({ unit: 'mm', readings: EIGHT, profile: { min: 0.3, max: 0.1, maxSpread: 0.05 } }),
    status: 400,
    field: 'profile.min',
  },
  {
    name: 'a reading as text',
    who: 'member',
    path: BACKLASH,
    init: () => json({ unit: 'mm', readings: [0.1, '0.2', 0.3] }),
    status: 400,
    field: 'readings.1',
  },
  {
    name: 'two readings',
    who: 'member',
    path: BACKLASH,
    init: () => json({ unit: 'mm', readings: [0.1, 0.2] }),
    status: 400,
    field: 'readings',
  },
  {
    name: 'a misspelt field',
    who: 'member',
    path: BACKLASH,
    init: () => json({ unit: 'mm', readings: EIGHT, pressureAngle: 20 }),
    status: 400,
    field: 'pressureAngle',
  },
  {
    name: 'one tooth count only',
    who: 'member',
    path: BACKLASH,
    init: () => json({ unit: 'mm', readings: EIGHT, ringTeeth: 41 }),
    status: 400,
    field: 'pinionTeeth',
  },
  { name: 'malformed JSON', who: 'member', path: BACKLASH, init: () => post('{"unit": "mm",'), status: 400 },
  {
    name: 'a bare NaN',
    who: 'member',
    path: BACKLASH,
    init: () => post('{"unit":"mm","readings":[0.15,NaN,0.17]}'),
    status: 400,
  },
  { name: 'an empty body', who: 'member', path: BACKLASH, init: () => post(''), status: 400 },
  { name: 'exactly 64 KB', who: 'member', path: BACKLASH, init: () => post(padded(64 * 1024)), status: 200 },
  { name: '64 KB and one byte', who: 'member', path: BACKLASH, init: () => post(padded(64 * 1024 + 1)), status: 413 },
  {
    name: 'a streamed body over 64 KB',
    who: 'member',
    path: BACKLASH,
    init: () => post(streamedOverLimit()),
    status: 413,
  },
  {
    name: 'a signed-out caller',
    who: 'anonymous',
    path: BACKLASH,
    init: () => json({ unit: 'mm', readings: EIGHT }),
    status: 401,
  },
  {
    name: 'a person with no team',
    who: 'teamless',
    path: BACKLASH,
    init: () => json({ unit: 'mm', readings: EIGHT }),
    status: 403,
  },
  {
    name: 'a plain-text body',
    who: 'member',
    path: BACKLASH,
    init: () => post('readings=1', { 'content-type': 'text/plain' }),
    status: 415,
  },
  {
    name: 'a form body',
    who: 'member',
    path: BACKLASH,
    init: () => post('readings=1', { 'content-type': 'application/x-www-form-urlencoded' }),
    status: 415,
  },
  {
    name: 'a foreign Origin',
    who: 'member',
    path: BACKLASH,
    init: () =>
      post(JSON.stringify({ unit: 'mm', readings: EIGHT }), { ...JSON_TYPE, origin: 'http://elsewhere.test' }),
    status: 403,
  },
  { name: 'another method', who: 'member', path: BACKLASH, init: () => ({ method: 'GET' }), status: 404 },
  {
    name: 'a trend',
    who: 'member',
    path: TREND,
    init: () =>
      json({ points: [0, 12, 25, 38].map((runs, i) => ({ runs, value: 0.22 + i * 0.008 })), limit: { max: 0.3 } }),
    status: 200,
  },
  {
    name: 'a trend of two points',
    who: 'member',
    path: TREND,
    init: () =>
      json({
        points: [
          { runs: 0, value: 0.2 },
          { runs: 10, value: 0.21 },
        ],
        limit: 0.3,
      }),
    status: 200,
  },
  {
    name: 'a trend point with negative runs',
    who: 'member',
    path: TREND,
    init: () => json({ points: [{ runs: -1, value: 0.2 }] }),
    status: 400,
    field: 'points.0.runs',
  },
  { name: 'ten bolts', who: 'member', path: `${SEQUENCE}?bolts=10`, init: () => ({}), status: 200 },
  { name: 'bolts=2', who: 'member', path: `${SEQUENCE}?bolts=2`, init: () => ({}), status: 400, field: 'bolts' },
  { name: 'no bolts', who: 'member', path: SEQUENCE, init: () => ({}), status: 400, field: 'bolts' },
  { name: 'bolts signed out', who: 'anonymous', path: `${SEQUENCE}?bolts=8`, init: () => ({}), status: 401 },
];

async function send(side: Side, c: Case, init: Init = c.init()) {
  const client = side[c.who];
  const response = c.noOrigin
    ? await fetch(`${side.server.baseUrl}${c.path}`, {
        ...init,
        headers: { ...(init.headers as Record<string, string>), cookie: client.cookieHeader() },
      })
    : await client.request(c.path, init);
  const text = await response.text();
  let body: unknown = text;
  try {
    body = JSON.parse(text);
  } catch {
    // not JSON: compare the text
  }
  return {
    status: response.status,
    body,
    headers: Object.fromEntries(COMPARED_HEADERS.map((name) => [name, response.headers.get(name)])),
  };
}

describe('the calculation routes, asked every way', () => {
  for (const c of CASES) {
    it(`answer ${c.name} with ${c.status}${c.field ? ` naming ${c.field}` : ''}`, async () => {
      const answer = await send(side, c);
      expect(answer.status).toBe(c.status);
      if (c.field) expect(Object.keys((answer.body as { error: { fields: object } }).error.fields)).toContain(c.field);
      // Every refusal of ours says what to fix; a 404 for a method the route has not is Astro's plain page.
      if (c.status >= 400 && c.status !== 404)
        expect((answer.body as { error: { message: string } }).error.message).toMatch(/\w/);
      expect(answer.headers['content-security-policy']).toContain("frame-ancestors 'none'");
      expect(answer.headers['x-content-type-options']).toBe('nosniff');
    });
  }

  it('keeps answering on the same connection after refusing a streamed body part-way', async () => {
    const refused = await send(side, { ...CASES[0]!, path: BACKLASH }, post(streamedOverLimit()));
    expect(refused.status).toBe(413);
    expect(refused.headers.connection).toBe('close');
    expect((await side.member.get(`${SEQUENCE}?bolts=4`)).status).toBe(200);
  });

  it('logs a refusal as a security event', async () => {
    await side.anonymous.post(TREND, { points: [{ runs: 1, value: 0.2 }] });
    // The server's output reaches this process through a pipe, possibly a moment after the answer did.
    const findLine = () =>
      side.server
        .output()
        .split('\n')
        .find((l) => l.includes('"event":"denied"') && l.includes(TREND));
    await expect.poll(findLine, { timeout: 2000 }).toBeDefined();
    const line = findLine();
    expect(JSON.parse(line!.replace('[lashline:security] ', ''))).toMatchObject({
      status: 401,
      method: 'POST',
      path: TREND,
      userId: null,
    });
  });

  it('cuts off a removed member, and a session ended by a password change, on the very next request', async () => {
    const owner = await signedInClient(side.server.baseUrl, { team: 'Cut-off Team' });
    const tech = await joinByInvitation(side.server.baseUrl, smtp, owner.client, 'technician');
    const ask = (client: ApiClient) => client.post(BACKLASH, { unit: 'mm', readings: EIGHT });
    // Twice, so the person and role are in the session cache when the change comes.
    expect((await ask(tech.client)).status).toBe(200);
    expect((await ask(tech.client)).status).toBe(200);
    expect((await owner.client.delete(`/api/members/${tech.userId}`)).status).toBe(204);
    // Removal also ends the removed person's sessions (their session version moves on).
    expect((await ask(tech.client)).status).toBe(401);

    const secondDevice = new ApiClient(side.server.baseUrl);
    await secondDevice.signIn(owner.email, TEST_PASSWORD);
    expect((await ask(secondDevice)).status).toBe(200);
    const changed = await owner.client.post('/api/account/password', {
      currentPassword: TEST_PASSWORD,
      newPassword: 'another long test passphrase',
    });
    expect(changed.status).toBe(200);
    const after = await ask(secondDevice);
    expect(after.status).toBe(401);
  });
});
