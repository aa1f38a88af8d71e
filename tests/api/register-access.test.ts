import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ApiClient } from '../helpers/api-client';
import { signedInClient } from '../helpers/api-client';
import { startServer, type RunningServer, openDatabase } from '../helpers/server';
import { SmtpFake } from '../helpers/smtp-fake';
import { makeTeamOfFour, type TeamOfFour } from '../helpers/team';

let server: RunningServer;
let smtp: SmtpFake;
let team: TeamOfFour;
let other: { client: ApiClient; carId: string; partId: string; assemblyId: string; runId: string };
const ids: Record<string, string> = {};

beforeAll(async () => {
  smtp = await SmtpFake.create();
  await smtp.start();
  server = await startServer({ env: { SMTP_PORT: String(smtp.port) } });
  team = await makeTeamOfFour(server.baseUrl, smtp, 'Access Crew');
  ids.car = (await team.chief.post('/api/cars', { name: 'Access car' })).body.id;
  ids.assembly = (await team.chief.post('/api/assemblies', { serial: 'AC-1', name: 'Access rear end' })).body.id;
  ids.part = (await team.chief.post('/api/gear-sets', { serial: 'AC-G1', ringTeeth: 41, pinionTeeth: 10 })).body.id;
  ids.run = (await team.chief.post('/api/runs', { carId: ids.car, at: '2026-06-01T10:00:00Z' })).body.id;
  const stranger = await signedInClient(server.baseUrl, { team: 'Other Crew' });
  const carId = (await stranger.client.post('/api/cars', { name: 'Their car' })).body.id;
  other = {
    client: stranger.client,
    carId,
    partId: (await stranger.client.post('/api/parts', { kind: 'axle', serial: 'THEIR-1' })).body.id,
    assemblyId: (await stranger.client.post('/api/assemblies', { serial: 'THEIR-RE', name: 'Theirs' })).body.id,
    runId: (await stranger.client.post('/api/runs', { carId, at: '2026-06-01T10:00:00Z' })).body.id,
  };
});
afterAll(async () => {
  await server?.stop();
  await smtp?.stop();
});

type Role = 'owner' | 'chief' | 'tech' | 'viewer';
const clientOf = (role: Role) => team[role];
let serial = 0;
const fresh = () => `N-${++serial}`;

// Each row: a request and the status each role must get. Writes use fresh names so rows are independent.
const MATRIX: {
  name: string;
  method: string;
  path: () => string;
  body?: () => unknown;
  expect: Record<Role, number>;
}[] = [
  {
    name: 'list cars',
    method: 'GET',
    path: () => '/api/cars',
    expect: { owner: 200, chief: 200, tech: 200, viewer: 200 },
  },
  {
    name: 'add a car',
    method: 'POST',
    path: () => '/api/cars',
    body: () => ({ name: fresh() }),
    expect: { owner: 201, chief: 201, tech: 403, viewer: 403 },
  },
  {
    name: 'edit a car',
    method: 'PATCH',
    path: () => `/api/cars/${ids.car}`,
    body: () => ({ notes: fresh() }),
    expect: { owner: 200, chief: 200, tech: 403, viewer: 403 },
  },
  {
    name: 'list assemblies',
    method: 'GET',
    path: () => '/api/assemblies',
    expect: { owner: 200, chief: 200, tech: 200, viewer: 200 },
  },
  {
    name: 'add an assembly',
    method: 'POST',
    path: () => '/api/assemblies',
    body: () => ({ serial: fresh(), name: 'x' }),
    expect: { owner: 201, chief: 201, tech: 403, viewer: 403 },
  },
  {
    name: 'list parts',
    method: 'GET',
    path: () => '/api/parts',
    expect: { owner: 200, chief: 200, tech: 200, viewer: 200 },
  },
  {
    name: 'read a gear set',
    method: 'GET',
    path: () => `/api/gear-sets/${ids.part}`,
    expect: { owner: 200, chief: 200, tech: 200, viewer: 200 },
  },
  {
    name: 'add a part',
    method: 'POST',
    path: () => '/api/parts',
    body: () => ({ kind: 'bearing', serial: fresh() }),
    expect: { owner: 201, chief: 201, tech: 403, viewer: 403 },
  },
  {
    name: 'edit a part',
    method: 'PATCH',
    path: () => `/api/parts/${ids.part}`,
    body: () => ({ notes: fresh() }),
    expect: { owner: 200, chief: 200, tech: 403, viewer: 403 },
  },
  {
    name: 'log a run',
    method: 'POST',
    path: () => '/api/runs',
    body: () => ({ carId: ids.car, at: '2026-06-02T10:00:00Z' }),
    expect: { owner: 201, chief: 201, tech: 201, viewer: 403 },
  },
  {
    name: 'list runs',
    method: 'GET',
    path: () => '/api/runs',
    expect: { owner: 200, chief: 200, tech: 200, viewer: 200 },
  },
  {
    name: 'edit a run',
    method: 'PATCH',
    path: () => `/api/runs/${ids.run}`,
    body: () => ({ notes: fresh() }),
    expect: { owner: 200, chief: 200, tech: 403, viewer: 403 },
  },
  {
    name: 'list installations',
    method: 'GET',
    path: () => '/api/installations',
    expect: { owner: 200, chief: 200, tech: 200, viewer: 200 },
  },
  {
    name: 'import runs',
    method: 'POST',
    path: () => '/api/runs/import',
    body: () => ({ records: [{ car: 'Access car', at: '2026-06-03T10:00:00Z' }], dryRun: true }),
    expect: { owner: 200, chief: 200, tech: 200, viewer: 403 },
  },
  {
    name: 'read team settings',
    method: 'GET',
    path: () => '/api/team/settings',
    expect: { owner: 200, chief: 200, tech: 200, viewer: 200 },
  },
  {
    name: 'change team settings',
    method: 'PATCH',
    path: () => '/api/team/settings',
    body: () => ({ serviceIntervalRuns: 9 }),
    expect: { owner: 200, chief: 403, tech: 403, viewer: 403 },
  },
];

describe('the register routes by role', () => {
  for (const row of MATRIX) {
    for (const role of ['owner', 'chief', 'tech', 'viewer'] as const) {
      it(`${row.name}: ${role} gets ${row.expect[role]}`, async () => {
        const answer = await clientOf(role).json(row.method, row.path(), row.body?.());
        expect(answer.status, JSON.stringify(answer.body)).toBe(row.expect[role]);
      });
    }
  }

  it('lets a technician install and remove but not delete', async () => {
    const bearing = (await team.chief.post('/api/parts', { kind: 'bearing', serial: fresh() })).body.id;
    expect(
      (
        await team.tech.post('/api/installations', {
          action: 'install',
          partId: bearing,
          assemblyId: ids.assembly,
          at: '2026-06-01T09:00:00Z',
        })
      ).status,
    ).toBe(201);
    expect((await team.viewer.post('/api/installations', { action: 'remove', partId: bearing })).status).toBe(403);
    expect((await team.tech.post('/api/installations', { action: 'remove', partId: bearing })).status).toBe(201);
    expect((await team.tech.delete(`/api/parts/${bearing}`)).status).toBe(403);
    expect((await team.tech.delete(`/api/runs/${ids.run}`)).status).toBe(403);
  });
});

describe("another team's records", () => {
  const cases = () => [
    ['GET', `/api/cars/${other.carId}`],
    ['PATCH', `/api/cars/${other.carId}`],
    ['DELETE', `/api/cars/${other.carId}`],
    ['GET', `/api/parts/${other.partId}`],
    ['PATCH', `/api/parts/${other.partId}`],
    ['DELETE', `/api/parts/${other.partId}`],
    ['GET', `/api/assemblies/${other.assemblyId}`],
    ['DELETE', `/api/assemblies/${other.assemblyId}`],
    ['GET', `/api/runs/${other.runId}`],
    ['PATCH', `/api/runs/${other.runId}`],
    ['DELETE', `/api/runs/${other.runId}`],
    ['GET', `/api/gear-sets/${ids.part}x`],
  ];

  it('answer 404 to every method, and change nothing', async () => {
    for (const [method, path] of cases()) {
      const answer = await team.owner.json(method!, path!, method === 'PATCH' ? { notes: 'mine now' } : undefined);
      expect(answer.status, `${method} ${path}`).toBe(404);
    }
    expect((await other.client.get(`/api/runs/${other.runId}`)).body.notes).toBeNull();
  });

  it('cannot be used as the car of a run or the target of an install', async () => {
    const run = await team.tech.post('/api/runs', { carId: other.carId, at: '2026-06-01T10:00:00Z' });
    expect(run.status).toBe(404);
    expect(run.body.error.fields.carId).toBeDefined();
    const install = await team.tech.post('/api/installations', {
      action: 'install',
      partId: other.partId,
      assemblyId: ids.assembly,
    });
    expect(install.status).toBe(404);
    expect(install.body.error.fields.partId).toBeDefined();
  });
});

describe('bad input on the register routes', () => {
  const BAD: { path: string; method?: string; body: () => unknown; field: string; status?: number }[] = [
    { path: '/api/cars', body: () => ({ name: 12 }), field: 'name' },
    { path: '/api/cars', body: () => ({ name: '' }), field: 'name' },
    { path: '/api/assemblies', body: () => ({ serial: 'Z', name: ['x'] }), field: 'name' },
    { path: '/api/parts', body: () => ({ kind: 'gearbox', serial: 'Q' }), field: 'kind' },
    { path: '/api/parts', body: () => ({ kind: 'axle', serial: 'Q', lifeLimitRuns: -5 }), field: 'lifeLimitRuns' },
    { path: '/api/parts', body: () => ({ kind: 'axle', serial: 'Q', lifeLimitRuns: 'many' }), field: 'lifeLimitRuns' },
    { path: '/api/gear-sets', body: () => ({ serial: 'Q', ringTeeth: 41.5, pinionTeeth: 10 }), field: 'ringTeeth' },
    { path: '/api/gear-sets', body: () => ({ serial: 'Q', ringTeeth: 9, pinionTeeth: 10 }), field: 'ringTeeth' },
    { path: '/api/gear-sets', body: () => ({ serial: 'Q', ringTeeth: 41 }), field: 'pinionTeeth' },
    { path: '/api/runs', body: () => ({ carId: ids.car, at: 'yesterday' }), field: 'at' },
    {
      path: '/api/runs',
      body: () => ({ carId: ids.car, at: new Date(Date.now() + 3 * 86_400_000).toISOString() }),
      field: 'at',
    },
    {
      path: '/api/runs',
      body: () => ({ carId: ids.car, at: '2026-06-01T10:00:00Z', elapsedSeconds: -6.1 }),
      field: 'elapsedSeconds',
    },
    {
      path: '/api/runs',
      body: () => ({ carId: ids.car, at: '2026-06-01T10:00:00Z', speedMph: '250' }),
      field: 'speedMph',
    },
    {
      path: '/api/runs',
      body: () => ({ carId: 'no-such-car', at: '2026-06-01T10:00:00Z' }),
      field: 'carId',
      status: 404,
    },
    { path: '/api/runs', body: () => ({ at: '2026-06-01T10:00:00Z' }), field: 'carId' },
    {
      path: '/api/installations',
      body: () => ({ action: 'bolt-on', partId: ids.part, assemblyId: ids.assembly }),
      field: 'action',
    },
    {
      path: '/api/installations',
      body: () => ({ action: 'install', partId: 'nope', assemblyId: ids.assembly }),
      field: 'partId',
      status: 404,
    },
    { path: '/api/installations', body: () => ({ action: 'install', partId: ids.part }), field: 'assemblyId' },
    {
      path: '/api/installations',
      body: () => ({ action: 'install', partId: ids.part, assemblyId: 'nope' }),
      field: 'assemblyId',
      status: 404,
    },
    { path: `/api/runs/${'x'}`, method: 'PATCH', body: () => ({ elapsedSeconds: 'fast' }), field: 'elapsedSeconds' },
    { path: '/api/team/settings', method: 'PATCH', body: () => ({ nearShare: 2 }), field: 'nearShare' },
    { path: '/api/runs?limit=0', method: 'GET', body: () => undefined, field: 'limit' },
    { path: '/api/parts?kind=wheel', method: 'GET', body: () => undefined, field: 'kind' },
  ];

  async function rowCounts(): Promise<number[]> {
    const db = await openDatabase(server.databaseUrl);
    const counts: number[] = [];
    for (const table of ['cars', 'assemblies', 'parts', 'installation_events', 'runs'])
      counts.push(Number((await db.execute(`SELECT count(*) AS n FROM ${table}`)).rows[0]?.n));
    db.close();
    return counts;
  }

  for (const c of BAD) {
    it(`${c.method ?? 'POST'} ${c.path} refuses a bad ${c.field} by name and writes nothing`, async () => {
      const before = await rowCounts();
      const answer = await team.owner.json(c.method ?? 'POST', c.path, c.body());
      expect(answer.status, JSON.stringify(answer.body)).toBe(c.status ?? 400);
      expect(Object.keys(answer.body.error.fields ?? {})).toContain(c.field);
      expect(await rowCounts()).toEqual(before);
    });
  }
});
