import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, signedInClient, TEST_PASSWORD } from '../helpers/api-client';
import { startServer, type RunningServer } from '../helpers/server';
import { SmtpFake } from '../helpers/smtp-fake';
import { joinByInvitation } from '../helpers/team';

/**
 * The fast lane (src/fast-lane.ts) answers the calculation routes beside Astro's pipeline. Every request
 * below goes to two real built servers, one as served (fast lane on) and one with LASHLINE_FAST_LANE=off
 * (every request through Astro), and the two answers must be the same: status, body and headers.
 * `Server-Timing: fast-lane` shows which path answered, so the test also knows the lane was used.
 */

interface Side {
  server: RunningServer;
  member: ApiClient;
  teamless: ApiClient;
  anonymous: ApiClient;
}

let smtp: SmtpFake;
let fast: Side;
let astro: Side;

async function startSide(env: Record<string, string>): Promise<Side> {
  const server = await startServer({ env: { SMTP_PORT: String(smtp.port), ...env } });
  const member = (await signedInClient(server.baseUrl, { team: 'Lane Team' })).client;
  const teamless = (await signedInClient(server.baseUrl)).client;
  return { server, member, teamless, anonymous: new ApiClient(server.baseUrl) };
}

beforeAll(async () => {
  smtp = await SmtpFake.create();
  await smtp.start();
  [fast, astro] = await Promise.all([startSide({}), startSide({ LASHLINE_FAST_LANE: 'off' })]);
}, 120_000);
afterAll(async () => {
  await Promise.all([fast?.server.stop(), astro?.server.stop()]);
  await smtp?.stop();
});

const BACKLASH = '/api/analysis/backlash';
const TREND = '/api/analysis/trend';
const SEQUENCE = '/api/analysis/tightening-sequence';
const EIGHT = [0.18, 0.17, 0.15, 0.14, 0.15, 0.16, 0.18, 0.19];
const JSON_TYPE = { 'content-type': 'application/json' };

// The headers an answer must carry the same on both paths (Date, Keep-Alive and the like aside).
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
  /** Whether the fast lane should take it (false: it hands the request to Astro). */
  lane: boolean;
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
    lane: true,
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
    lane: true,
  },
  {
    name: 'a query string on the POST',
    who: 'member',
    path: `${BACKLASH}?from=sheet`,
    init: () => json({ unit: 'mm', readings: EIGHT }),
    lane: true,
  },
  {
    name: 'a charset in the content type',
    who: 'member',
    path: BACKLASH,
    init: () =>
      post(JSON.stringify({ unit: 'mm', readings: EIGHT }), { 'content-type': 'application/json; charset=utf-8' }),
    lane: true,
  },
  {
    name: 'no Origin (a script)',
    who: 'member',
    path: BACKLASH,
    init: () => json({ unit: 'mm', readings: EIGHT }),
    noOrigin: true,
    lane: true,
  },
  {
    name: 'min above max',
    who: 'member',
    path: BACKLASH,
    init: () => json({ unit: 'mm', readings: EIGHT, profile: { min: 0.3, max: 0.1, maxSpread: 0.05 } }),
    lane: true,
  },
  {
    name: 'a reading as text',
    who: 'member',
    path: BACKLASH,
    init: () => json({ unit: 'mm', readings: [0.1, '0.2', 0.3] }),
    lane: true,
  },
  {
    name: 'two readings',
    who: 'member',
    path: BACKLASH,
    init: () => json({ unit: 'mm', readings: [0.1, 0.2] }),
    lane: true,
  },
  {
    name: 'a misspelt field',
    who: 'member',
    path: BACKLASH,
    init: () => json({ unit: 'mm', readings: EIGHT, pressureAngle: 20 }),
    lane: true,
  },
  {
    name: 'one tooth count only',
    who: 'member',
    path: BACKLASH,
    init: () => json({ unit: 'mm', readings: EIGHT, ringTeeth: 41 }),
    lane: true,
  },
  { name: 'malformed JSON', who: 'member', path: BACKLASH, init: () => post('{"unit": "mm",'), lane: true },
  {
    name: 'a bare NaN',
    who: 'member',
    path: BACKLASH,
    init: () => post('{"unit":"mm","readings":[0.15,NaN,0.17]}'),
    lane: true,
  },
  { name: 'an empty body', who: 'member', path: BACKLASH, init: () => post(''), lane: true },
  { name: 'exactly 64 KB', who: 'member', path: BACKLASH, init: () => post(padded(64 * 1024)), lane: true },
  { name: '64 KB and one byte', who: 'member', path: BACKLASH, init: () => post(padded(64 * 1024 + 1)), lane: true },
  {
    name: 'a streamed body over 64 KB',
    who: 'member',
    path: BACKLASH,
    init: () => post(streamedOverLimit()),
    lane: true,
  },
  {
    name: 'a signed-out caller',
    who: 'anonymous',
    path: BACKLASH,
    init: () => json({ unit: 'mm', readings: EIGHT }),
    lane: true,
  },
  {
    name: 'a person with no team',
    who: 'teamless',
    path: BACKLASH,
    init: () => json({ unit: 'mm', readings: EIGHT }),
    lane: true,
  },
  {
    name: 'a plain-text body',
    who: 'member',
    path: BACKLASH,
    init: () => post('readings=1', { 'content-type': 'text/plain' }),
    lane: false,
  },
  {
    name: 'a form body',
    who: 'member',
    path: BACKLASH,
    init: () => post('readings=1', { 'content-type': 'application/x-www-form-urlencoded' }),
    lane: false,
  },
  {
    name: 'a foreign Origin',
    who: 'member',
    path: BACKLASH,
    init: () =>
      post(JSON.stringify({ unit: 'mm', readings: EIGHT }), { ...JSON_TYPE, origin: 'http://elsewhere.test' }),
    lane: false,
  },
  { name: 'another method', who: 'member', path: BACKLASH, init: () => ({ method: 'GET' }), lane: false },
  {
    name: 'a trend',
    who: 'member',
    path: TREND,
    init: () =>
      json({ points: [0, 12, 25, 38].map((runs, i) => ({ runs, value: 0.22 + i * 0.008 })), limit: { max: 0.3 } }),
    lane: true,
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
    lane: true,
  },
  {
    name: 'a trend point with negative runs',
    who: 'member',
    path: TREND,
    init: () => json({ points: [{ runs: -1, value: 0.2 }] }),
    lane: true,
  },
  { name: 'ten bolts', who: 'member', path: `${SEQUENCE}?bolts=10`, init: () => ({}), lane: true },
  { name: 'bolts=2', who: 'member', path: `${SEQUENCE}?bolts=2`, init: () => ({}), lane: true },
  { name: 'no bolts', who: 'member', path: SEQUENCE, init: () => ({}), lane: true },
  { name: 'bolts signed out', who: 'anonymous', path: `${SEQUENCE}?bolts=8`, init: () => ({}), lane: true },
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
    lane: response.headers.get('server-timing'),
  };
}

describe('the fast lane for the calculation routes', () => {
  for (const c of CASES) {
    it(`answers ${c.name} exactly as Astro does${c.lane ? '' : ', by handing it to Astro'}`, async () => {
      const viaLane = await send(fast, c);
      const viaAstro = await send(astro, c);
      expect(viaLane.lane).toBe(c.lane ? 'fast-lane' : null);
      expect(viaAstro.lane).toBeNull();
      expect({ status: viaLane.status, body: viaLane.body, headers: viaLane.headers }).toEqual({
        status: viaAstro.status,
        body: viaAstro.body,
        headers: viaAstro.headers,
      });
      expect(viaLane.headers['content-security-policy']).toContain("frame-ancestors 'none'");
    });
  }

  it('keeps answering on the same connection after refusing a streamed body part-way', async () => {
    const refused = await send(fast, { ...CASES[0]!, path: BACKLASH }, post(streamedOverLimit()));
    expect(refused.status).toBe(413);
    expect(refused.headers.connection).toBe('close');
    expect((await fast.member.get(`${SEQUENCE}?bolts=4`)).status).toBe(200);
  });

  it('logs a refusal as a security event, as the Astro endpoints do', async () => {
    await fast.anonymous.post(TREND, { points: [{ runs: 1, value: 0.2 }] });
    // The server's output reaches this process through a pipe, possibly a moment after the answer did.
    const findLine = () =>
      fast.server
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
    const owner = await signedInClient(fast.server.baseUrl, { team: 'Cut-off Team' });
    const tech = await joinByInvitation(fast.server.baseUrl, smtp, owner.client, 'technician');
    const ask = (client: ApiClient) => client.post(BACKLASH, { unit: 'mm', readings: EIGHT });
    // Twice, so the person and role are in the session cache when the change comes.
    expect((await ask(tech.client)).status).toBe(200);
    expect((await ask(tech.client)).status).toBe(200);
    expect((await owner.client.delete(`/api/members/${tech.userId}`)).status).toBe(204);
    // Removal also ends the removed person's sessions (their session version moves on).
    expect((await ask(tech.client)).status).toBe(401);

    const secondDevice = new ApiClient(fast.server.baseUrl);
    await secondDevice.signIn(owner.email, TEST_PASSWORD);
    expect((await ask(secondDevice)).status).toBe(200);
    const changed = await owner.client.post('/api/account/password', {
      currentPassword: TEST_PASSWORD,
      newPassword: 'another long test passphrase',
    });
    expect(changed.status).toBe(200);
    const after = await ask(secondDevice);
    expect(after.status).toBe(401);
    expect(after.headers.get('server-timing')).toBe('fast-lane');
  });
});
