import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, signedInClient } from '../helpers/api-client';
import { startServer, type RunningServer } from '../helpers/server';

let server: RunningServer;
let member: ApiClient;
beforeAll(async () => {
  server = await startServer();
  member = (await signedInClient(server.baseUrl, { team: 'Analysis Team' })).client;
});
afterAll(() => server?.stop());

const DEG = Math.PI / 180;
const LIMIT = 64 * 1024;

/** Readings m + a·cos θ + b·sin θ at θk = 2πk/N, position 1 at 0°. */
function buildReadings(n: number, m: number, a: number, b: number): number[] {
  return Array.from(
    { length: n },
    (_, k) => m + a * Math.cos((2 * Math.PI * k) / n) + b * Math.sin((2 * Math.PI * k) / n),
  );
}

/** Agreement to `digits` significant digits of the certified value. */
function expectSignificant(actual: number, certified: number, digits: number): void {
  const tolerance = 0.5 * 10 ** (Math.floor(Math.log10(Math.abs(certified))) - digits + 1);
  expect(Math.abs(actual - certified)).toBeLessThanOrEqual(tolerance);
}

/** POSTs `raw` exactly as given (no JSON.stringify), so bodies JSON.stringify cannot make can be sent. */
async function postRaw(path: string, raw: string | ReadableStream<Uint8Array>, type = 'application/json') {
  const init: RequestInit & { duplex?: 'half' } = { method: 'POST', headers: { 'content-type': type }, body: raw };
  if (typeof raw !== 'string') init.duplex = 'half';
  const response = await member.request(path, init);
  return { status: response.status, body: await response.json(), headers: response.headers };
}

// m = 0.20 mm, a = 0.03, b = 0.04 → C = 0.05, φ = atan2(0.04, 0.03) = 53.13°.
const M = 0.2,
  A = 0.03,
  B = 0.04,
  C = 0.05;
const PHI_DEG = Math.atan2(B, A) / DEG;
const EIGHT = buildReadings(8, M, A, B);

describe('POST /api/analysis/backlash', () => {
  it('recovers the mean, amplitude and loosest angle of a constructed once-per-turn case', async () => {
    const { status, body } = await member.post('/api/analysis/backlash', { unit: 'mm', readings: EIGHT });
    expect(status).toBe(200);
    expect(Object.keys(body)).toEqual(['unit', 'count', 'mean', 'min', 'max', 'spread', 'sd', 'harmonic']);
    expect(body).toMatchObject({ unit: 'mm', count: 8 });
    // TRADE.md, least-squares once-per-turn fit (S: ISO 4291:1985 Annex F): m = ΣR/N, a, b, C = √(a² + b²), φ = atan2(b, a)
    expect(body.mean).toBeCloseTo(M, 14);
    expect(body.harmonic.a).toBeCloseTo(A, 14);
    expect(body.harmonic.b).toBeCloseTo(B, 14);
    expect(body.harmonic.amplitude).toBeCloseTo(C, 14);
    expect(body.harmonic.loosestAngleDeg).toBeCloseTo(PHI_DEG, 9);
    // TRADE.md (S: ISO 4291:1985 Annex F): the tightest is φ + 180°
    expect(body.harmonic.tightestAngleDeg).toBeCloseTo(PHI_DEG + 180, 9);
    expect(body.harmonic.residuals).toHaveLength(8);
    for (const residual of body.harmonic.residuals) expect(Math.abs(residual)).toBeLessThan(1e-15);
    expect(body.min).toBe(Math.min(...EIGHT));
    expect(body.max).toBe(Math.max(...EIGHT));
    expect(body.spread).toBeCloseTo(Math.max(...EIGHT) - Math.min(...EIGHT), 15);
    // D, from the fit above: a pure first harmonic has Σ(R − m)² = N·C²/2, so sd = C·√(N / (2(N − 1)))
    expect(body.sd).toBeCloseTo(C * Math.sqrt(8 / 14), 14);
  });

  it('estimates runout from 41:10 teeth with k ≈ 0.707', async () => {
    const { status, body } = await member.post('/api/analysis/backlash', {
      unit: 'mm',
      readings: EIGHT,
      ringTeeth: 41,
      pinionTeeth: 10,
    });
    expect(status).toBe(200);
    // TRADE.md, bevel/hypoid extension (D): k = 2·sin δ2·tan αn; 41:10 teeth, δ2 = 76.29°, αn = 20° give k ≈ 0.707
    expect(body.runoutEstimate.k).toBeCloseTo(0.707, 3);
    expect(body.runoutEstimate.deltaDeg).toBeCloseTo(76.29, 2);
    // TRADE.md (D): lash peak-to-peak 2C ≈ k·Ra, so Ra = 2C / k
    const k = 2 * Math.sin(Math.atan2(41, 10)) * Math.tan(20 * DEG);
    expect(body.runoutEstimate.tir).toBeCloseTo((2 * C) / k, 12);
    const steeper = await member.post('/api/analysis/backlash', {
      unit: 'mm',
      readings: EIGHT,
      ringTeeth: 41,
      pinionTeeth: 10,
      pressureAngleDeg: 25,
    });
    expect(steeper.body.runoutEstimate.k).toBeCloseTo(2 * Math.sin(Math.atan2(41, 10)) * Math.tan(25 * DEG), 12);
  });

  it("answers in the request's unit: the same readings in inches give the figures in inches", async () => {
    // NIST SP 811 (2008), Appendix B: 1 in = 25.4 mm exactly
    const inches = EIGHT.map((r) => r / 25.4);
    const { status, body } = await member.post('/api/analysis/backlash', {
      unit: 'in',
      readings: inches,
      ringTeeth: 41,
      pinionTeeth: 10,
    });
    const mm = await member.post('/api/analysis/backlash', {
      unit: 'mm',
      readings: EIGHT,
      ringTeeth: 41,
      pinionTeeth: 10,
    });
    expect(status).toBe(200);
    expect(body.unit).toBe('in');
    expect(body.mean).toBeCloseTo(M / 25.4, 15);
    expect(body.harmonic.amplitude).toBeCloseTo(C / 25.4, 15);
    expect(body.spread * 25.4).toBeCloseTo(mm.body.spread, 14);
    expect(body.runoutEstimate.tir * 25.4).toBeCloseTo(mm.body.runoutEstimate.tir, 14);
    expect(body.harmonic.loosestAngleDeg).toBeCloseTo(PHI_DEG, 9);
  });

  it('checks the plausible-reading cap in the request unit: 0.1 is fine in mm, too large in inches', async () => {
    expect((await member.post('/api/analysis/backlash', { unit: 'mm', readings: [0.1, 0.1, 0.1] })).status).toBe(200);
    const inches = await member.post('/api/analysis/backlash', { unit: 'in', readings: [0.1, 0.005, 0.005] });
    expect(inches.status).toBe(400);
    expect(Object.keys(inches.body.error.fields)).toEqual(['readings.0']);
  });

  it('adds verdicts when a profile is sent, judging the tightest point against the band', async () => {
    // Band 0.13–0.23 mm at the minimum point: TRADE.md (S: GM light-truck service manual, 8-5/8 in ring gear axle, 1996);
    // variation within 0.05 mm: TRADE.md (S: both GM manuals)
    const profile = { min: 0.13, max: 0.23, maxSpread: 0.05 };
    const { status, body } = await member.post('/api/analysis/backlash', { unit: 'mm', readings: EIGHT, profile });
    expect(status).toBe(200);
    expect(body.verdicts.map((v: { measure: string; verdict: string }) => [v.measure, v.verdict])).toEqual([
      ['backlash-min-point', 'in-band'],
      ['backlash-max-point', 'out-of-band'],
      ['spread', 'out-of-band'],
    ]);
    expect(body.verdicts[0]).toMatchObject({ value: Math.min(...EIGHT), limit: 'min', limitValue: 0.13 });
    expect(body.verdicts[1]).toMatchObject({ value: Math.max(...EIGHT), limit: 'max', limitValue: 0.23 });
    // Four points 90° apart: TRADE.md (S: Honda S2000 service manual, rear differential)
    const good = await member.post('/api/analysis/backlash', {
      unit: 'mm',
      readings: [0.19, 0.18, 0.17, 0.18],
      profile,
    });
    expect(good.body.verdicts.map((v: { verdict: string }) => v.verdict)).toEqual(['in-band', 'in-band', 'in-band']);
  });
});

// NIST StRD Norris, as TRADE.md lists it: y then x.
const NORRIS = `0.1 0.2; 338.8 337.4; 118.1 118.2; 888.0 884.6; 9.2 10.1; 228.1 226.5; 668.5 666.3; 998.5 996.3;
  449.1 448.6; 778.9 777.0; 559.2 558.2; 0.3 0.4; 0.1 0.6; 778.1 775.5; 668.8 666.9; 339.3 338.0;
  448.9 447.5; 10.8 11.6; 557.7 556.0; 228.3 228.1; 998.0 995.8; 888.8 887.6; 119.6 120.2; 0.3 0.3;
  0.6 0.3; 557.6 556.8; 339.3 339.1; 888.0 887.2; 998.5 999.0; 778.9 779.0; 10.2 11.1; 117.6 118.3;
  228.9 229.2; 668.4 669.1; 449.2 448.9; 0.2 0.5`
  .split(';')
  .map((pair) => pair.trim().split(/\s+/).map(Number) as [number, number]);

describe('POST /api/analysis/trend', () => {
  it('reproduces NIST StRD Norris to 9 significant digits', async () => {
    // runs must be whole numbers, so x is sent in tenths (runs = 10·x); the slope comes back divided by 10 exactly
    const points = NORRIS.map(([y, x]) => ({ runs: Math.round(x * 10), value: y }));
    expect(points).toHaveLength(36);
    const { status, body } = await member.post('/api/analysis/trend', { points });
    expect(status).toBe(200);
    // NIST StRD Norris, certified values
    expectSignificant(body.slope * 10, 1.00211681802045, 9);
    expectSignificant(body.intercept, -0.262323073774029, 9);
    expectSignificant(body.r2, 0.999993745883712, 9);
    expect(body.projectedRunsAtLimit).toBeNull();
    expect(body.reason.code).toBe('no-limit');
  });

  it('projects where a rising line meets the max', async () => {
    const points = [
      { runs: 0, value: 0.15 },
      { runs: 10, value: 0.16 },
      { runs: 20, value: 0.17 },
    ];
    const { status, body } = await member.post('/api/analysis/trend', { points, limit: { max: 0.23 } });
    expect(status).toBe(200);
    expect(body.slope).toBeCloseTo(0.001, 14);
    expect(body.r2).toBeCloseTo(1, 12);
    expect(body.projectedRunsAtLimit).toBeCloseTo(80, 9);
    expect(body).not.toHaveProperty('reason');
  });

  it('gives no projection for 2 points, and says why', async () => {
    const points = [
      { runs: 0, value: 0.15 },
      { runs: 10, value: 0.16 },
    ];
    const { status, body } = await member.post('/api/analysis/trend', { points, limit: { max: 0.23 } });
    expect(status).toBe(200);
    expect(body.slope).toBeCloseTo(0.001, 14);
    expect(body.projectedRunsAtLimit).toBeNull();
    expect(body.reason).toEqual({ code: 'too-few-points', message: 'One more inspection gives a projection.' });
  });
});

describe('GET /api/analysis/tightening-sequence', () => {
  // TRADE.md, legacy cross sequences (M, ASME PCC-1 2019)
  const LEGACY: Record<number, number[]> = {
    4: [1, 3, 2, 4],
    8: [1, 5, 3, 7, 2, 6, 4, 8],
    12: [1, 7, 4, 10, 2, 8, 5, 11, 3, 9, 6, 12],
    16: [1, 9, 5, 13, 3, 11, 7, 15, 2, 10, 6, 14, 4, 12, 8, 16],
  };
  for (const [bolts, sequence] of Object.entries(LEGACY)) {
    it(`gives the legacy cross order for ${bolts} bolts`, async () => {
      const { status, body } = await member.get(`/api/analysis/tightening-sequence?bolts=${bolts}`);
      expect(status).toBe(200);
      expect(body).toMatchObject({ bolts: Number(bolts), sequence });
      // Every answer that gives an order carries the caution that the part maker's figures govern.
      expect(body.caution).toMatch(/part maker’s figures, sequence and passes/);
    });
  }
});

interface BadCase {
  name: string;
  path: string;
  body: unknown;
  field: string;
}

const BACKLASH = '/api/analysis/backlash';
const TREND = '/api/analysis/trend';
const readingsWith = (third: unknown) => ({ unit: 'mm', readings: [0.15, 0.16, third, 0.17] });

const BAD: BadCase[] = [
  {
    name: 'a reading of null (what JSON.stringify makes of NaN)',
    path: BACKLASH,
    body: readingsWith(NaN),
    field: 'readings.2',
  },
  { name: 'a reading as a string', path: BACKLASH, body: readingsWith('0.16'), field: 'readings.2' },
  { name: 'the string "NaN"', path: BACKLASH, body: readingsWith('NaN'), field: 'readings.2' },
  { name: 'a negative reading', path: BACKLASH, body: readingsWith(-0.01), field: 'readings.2' },
  { name: 'two readings', path: BACKLASH, body: { unit: 'mm', readings: [0.15, 0.16] }, field: 'readings' },
  { name: '25 readings', path: BACKLASH, body: { unit: 'mm', readings: Array(25).fill(0.15) }, field: 'readings' },
  {
    name: 'readings that are not a list',
    path: BACKLASH,
    body: { unit: 'mm', readings: '0.15,0.16,0.17' },
    field: 'readings',
  },
  { name: 'an unknown unit', path: BACKLASH, body: { unit: 'thou', readings: [0.15, 0.16, 0.17] }, field: 'unit' },
  {
    name: 'profile min above max',
    path: BACKLASH,
    body: { unit: 'mm', readings: [0.15, 0.16, 0.17], profile: { min: 0.23, max: 0.13, maxSpread: 0.05 } },
    field: 'profile.min',
  },
  {
    name: 'a fractional ring tooth count',
    path: BACKLASH,
    body: { unit: 'mm', readings: [0.15, 0.16, 0.17], ringTeeth: 41.5, pinionTeeth: 10 },
    field: 'ringTeeth',
  },
  {
    name: 'a fractional pinion tooth count',
    path: BACKLASH,
    body: { unit: 'mm', readings: [0.15, 0.16, 0.17], ringTeeth: 41, pinionTeeth: 9.5 },
    field: 'pinionTeeth',
  },
  {
    name: 'one tooth count without the other',
    path: BACKLASH,
    body: { unit: 'mm', readings: [0.15, 0.16, 0.17], ringTeeth: 41 },
    field: 'pinionTeeth',
  },
  {
    name: 'a misspelt field',
    path: BACKLASH,
    body: { unit: 'mm', readings: [0.15, 0.16, 0.17], pressureAngle: 20 },
    field: 'pressureAngle',
  },
  {
    name: 'a fractional run count',
    path: TREND,
    body: { points: [{ runs: 1.5, value: 0.2 }] },
    field: 'points.0.runs',
  },
  { name: 'a negative run count', path: TREND, body: { points: [{ runs: -1, value: 0.2 }] }, field: 'points.0.runs' },
  { name: 'a value as a string', path: TREND, body: { points: [{ runs: 1, value: '0.2' }] }, field: 'points.0.value' },
  { name: 'no points', path: TREND, body: { points: [] }, field: 'points' },
  {
    name: 'limit min above max',
    path: TREND,
    body: { points: [{ runs: 1, value: 0.2 }], limit: { min: 0.3, max: 0.1 } },
    field: 'limit.min',
  },
];

// Bodies only a hand can write: JSON.parse turns 1e999 into Infinity, and a bare NaN is not JSON at all.
const RAW_BAD = [
  {
    name: 'a reading of 1e999 (Infinity)',
    path: BACKLASH,
    raw: '{"unit":"mm","readings":[0.15,0.16,1e999,0.17]}',
    field: 'readings.2',
  },
  {
    name: 'a value of -1e999 (−Infinity)',
    path: TREND,
    raw: '{"points":[{"runs":1,"value":-1e999}]}',
    field: 'points.0.value',
  },
  { name: 'a limit of 1e999', path: TREND, raw: '{"points":[{"runs":1,"value":0.2}],"limit":1e999}', field: 'limit' },
];

describe('bad input to the analysis endpoints', () => {
  for (const c of BAD) {
    it(`POST ${c.path} with ${c.name} answers 400 naming ${c.field}`, async () => {
      const { status, body } = await member.post(c.path, c.body);
      expect(status).toBe(400);
      expect(body.error.message).toContain(c.field);
      expect(Object.keys(body.error.fields)).toContain(c.field);
    });
  }

  for (const c of RAW_BAD) {
    it(`POST ${c.path} with ${c.name} answers 400 naming ${c.field}`, async () => {
      const { status, body } = await postRaw(c.path, c.raw);
      expect(status).toBe(400);
      expect(body.error.message).toContain(c.field);
      expect(Object.keys(body.error.fields)).toContain(c.field);
    });
  }

  for (const path of [BACKLASH, TREND]) {
    it(`POST ${path} answers 400 to malformed JSON, a bare NaN included`, async () => {
      for (const raw of ['{"unit": "mm",', '{"unit":"mm","readings":[0.15,NaN,0.17]}', '']) {
        const { status, body } = await postRaw(path, raw);
        expect(status).toBe(400);
        expect(body.error.message).toMatch(/not valid JSON/);
      }
    });

    it(`POST ${path} answers 415 to a body that is not JSON`, async () => {
      expect((await postRaw(path, 'readings=1', 'text/plain')).status).toBe(415);
    });

    it(`POST ${path} takes a body of exactly 64 KB and refuses one byte more with 413`, async () => {
      const valid =
        path === BACKLASH ? { unit: 'mm', readings: [0.15, 0.16, 0.17] } : { points: [{ runs: 1, value: 0.2 }] };
      const text = JSON.stringify(valid);
      const padded = (bytes: number) => text.slice(0, -1) + ' '.repeat(bytes - text.length) + '}';
      expect((await postRaw(path, padded(LIMIT))).status).toBe(200);
      const over = await postRaw(path, padded(LIMIT + 1));
      expect(over.status).toBe(413);
      expect(over.body.error.message).toMatch(/64 KB/);
    });
  }

  it('refuses a streamed body over 64 KB that declares no length', async () => {
    const encode = (text: string) => new TextEncoder().encode(text);
    const parts = [
      encode('{"unit":"mm","readings":[0.15,0.16,0.17]'),
      ...Array(5).fill(encode(' '.repeat(16 * 1024))),
      encode('}'),
    ];
    const stream = new ReadableStream<Uint8Array>({
      pull(controller) {
        const next = parts.shift();
        if (next) controller.enqueue(next);
        else controller.close();
      },
    });
    const { status, body, headers } = await postRaw(BACKLASH, stream);
    expect(status).toBe(413);
    expect(body.error.message).toMatch(/64 KB/);
    // The rest of the body is left unread, so the connection must not be reused: without this the next
    // request on it hung for 5 s and was reset.
    expect(headers.get('connection')).toBe('close');
    expect((await member.get('/api/analysis/tightening-sequence?bolts=4')).status).toBe(200);
  });

  for (const [query, message] of [
    ['bolts=2', /3 or more/],
    ['bolts=37', /36 or fewer/],
    ['bolts=abc', /must be a number/],
    ['bolts=8.5', /whole number/],
    ['', /must be a number/],
  ] as const) {
    it(`GET /api/analysis/tightening-sequence?${query} answers 400 naming bolts`, async () => {
      const { status, body } = await member.get(`/api/analysis/tightening-sequence?${query}`);
      expect(status).toBe(400);
      expect(body.error.message).toMatch(message);
      expect(body.error.message).toContain('bolts');
      expect(Object.keys(body.error.fields)).toEqual(['bolts']);
    });
  }

  it('answers 401 to a signed-out caller on all three', async () => {
    const anonymous = new ApiClient(server.baseUrl);
    expect((await anonymous.post(BACKLASH, { unit: 'mm', readings: EIGHT })).status).toBe(401);
    expect((await anonymous.post(TREND, { points: [{ runs: 1, value: 0.2 }] })).status).toBe(401);
    const sequence = await anonymous.get('/api/analysis/tightening-sequence?bolts=8');
    expect(sequence.status).toBe(401);
    expect(sequence.body.error.message).toBe('Sign in first.');
  });

  it('answers 403 to a signed-in person with no team yet', async () => {
    const { client } = await signedInClient(server.baseUrl);
    expect((await client.get('/api/analysis/tightening-sequence?bolts=8')).status).toBe(403);
    expect((await client.post(BACKLASH, { unit: 'mm', readings: EIGHT })).status).toBe(403);
  });
});
