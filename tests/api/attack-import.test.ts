import { createClient, type Client } from '@libsql/client';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInClient, type ApiClient } from '../helpers/api-client';
import { hostileValue } from '../helpers/hostile';
import { uploadPhoto } from '../helpers/images';
import { draftBody, submitInspection } from '../helpers/inspections';
import { smallPng } from '../helpers/records';
import { startServer, type RunningServer } from '../helpers/server';

/**
 * Issue 15 §2: a team import used to store an archive's rows as they stood — ids, `seq`, foreign keys,
 * storage keys — so an archive could reach into another team. Each attack below is one the review
 * showed; the victim team is a real one made through the API, the attacker imports through the API.
 */

let server: RunningServer;
let database: Client;
let victim: ApiClient;
let attacker: ApiClient;
let attackerEmail: string;
const ids = {} as {
  car: string;
  gearSet: string;
  spare: string;
  review: string;
  inspection: string;
  photo: string;
  inspectionData: unknown;
};

beforeAll(async () => {
  server = await startServer();
  database = createClient({ url: server.databaseUrl });
  victim = (await signedInClient(server.baseUrl, { team: 'Victim Crew' })).client;
  const made = await signedInClient(server.baseUrl, { team: 'Attacker Crew' });
  attacker = made.client;
  attackerEmail = made.email;
  ids.car = (await victim.post('/api/cars', { name: 'Victim car' })).body.id;
  ids.gearSet = (await victim.post('/api/gear-sets', { serial: 'V-GS-1', ringTeeth: 41, pinionTeeth: 10 })).body.id;
  ids.spare = (await victim.post('/api/parts', { kind: 'spindle', serial: 'V-SP-1' })).body.id;
  const installed = await victim.post('/api/installations', {
    action: 'install',
    partId: ids.gearSet,
    carId: ids.car,
    at: '2026-01-01T00:00:00Z',
  });
  expect(installed.status).toBe(201);
  for (let day = 2; day <= 4; day += 1)
    expect((await victim.post('/api/runs', { carId: ids.car, at: `2026-01-0${day}T12:00:00Z` })).status).toBe(201);
  ids.inspection = await submitInspection(victim, draftBody(ids.gearSet, { runsAtInspection: 3 }));
  const photo = await uploadPhoto(victim, ids.inspection, await smallPng(), { type: 'image/png', filename: 'p.png' });
  expect(photo.status).toBe(201);
  ids.photo = photo.body.id;
  ids.review = (await victim.post('/api/reviews', { gearSetId: ids.gearSet })).body.id;
  expect(
    (
      await victim.post(`/api/reviews/${ids.review}/decision`, {
        decision: 'keep',
        reason: 'Pattern is fine',
        reinspectAfterRuns: 10,
      })
    ).status,
  ).toBe(200);
  const inspection = (
    await database.execute({ sql: 'SELECT data FROM inspections WHERE id = ?', args: [ids.inspection] })
  ).rows[0]!;
  ids.inspectionData = JSON.parse(String(inspection.data));
}, 60_000);
afterAll(async () => {
  database?.close();
  await server?.stop();
});

let round = 0;
/**
 * A small valid archive of the attacker's own: a car, a gear set, an inspection. Its local ids
 * (car-1, set-1 …) get a suffix of their own each time, so no archive collides with an earlier one
 * in a Lashline that keeps archive ids as they stand.
 */
function ownArchive(extra: Record<string, unknown[]> = {}): Record<string, unknown> {
  round += 1;
  const archive = {
    format: 'lashline-team-archive',
    version: 1,
    team: { id: 'team-1', name: 'Imported Crew' },
    settings: null,
    people: [{ id: 'person-1', email: attackerEmail, name: 'Attacker', role: 'owner' }],
    formerPeople: [],
    cars: [{ id: 'car-1', name: 'Own car' }],
    assemblies: [],
    parts: [{ id: 'set-1', kind: 'gear-set', serial: 'A-GS-1', status: 'spare', ringTeeth: 41, pinionTeeth: 10 }],
    installationEvents: [],
    runs: [],
    toleranceProfileVersions: [],
    inspections: [
      {
        id: 'insp-1',
        gearSetId: 'set-1',
        status: 'draft',
        inspectedAt: '2026-02-01T00:00:00Z',
        runsAtInspection: 0,
        data: ids.inspectionData,
        createdBy: 'person-1',
        updatedAt: '2026-02-01T00:00:00Z',
      },
    ],
    inspectionPhotos: [],
    reviews: [],
    reviewComments: [],
    auditEvents: [],
    ...extra,
  };
  return JSON.parse(
    JSON.stringify(archive).replace(/"((?:team|car|set|insp|person|ev|run|c|rv|ph)-\d)"/g, `"$1-r${round}"`),
  ) as Record<string, unknown>;
}

async function victimRuns(): Promise<number> {
  return (await victim.get(`/api/gear-sets/${ids.gearSet}`)).body.totalRuns as number;
}

async function attackerTeams(): Promise<number> {
  return ((await attacker.get('/api/teams')).body.items as unknown[]).length;
}

async function expectRefused(archive: Record<string, unknown>, field: string): Promise<void> {
  const teamsBefore = await attackerTeams();
  const answer = await attacker.post('/api/imports/team', archive);
  expect(answer.status, JSON.stringify(answer.body)).toBe(422);
  expect(Object.keys(answer.body.error.fields)).toContain(field);
  expect(answer.body.error.message).toContain('nothing was imported');
  expect(await attackerTeams()).toBe(teamsBefore);
}

describe('a team import', () => {
  it('gives events new sequence numbers: a seq at the integer maximum breaks no one’s installs', async () => {
    const archive = ownArchive({
      installationEvents: [
        {
          id: 'ev-1',
          // As text, SQLite stores it as the integer maximum exactly.
          seq: '9223372036854775807',
          action: 'install',
          subjectType: 'part',
          subjectId: 'set-1',
          targetType: 'car',
          targetId: 'car-1',
          at: '2026-01-01T00:00:00Z',
        },
      ],
    });
    const imported = await attacker.post('/api/imports/team', archive);
    expect(imported.status, JSON.stringify(imported.body)).toBe(201);
    const install = await victim.post('/api/installations', {
      action: 'install',
      partId: ids.spare,
      carId: ids.car,
      at: '2026-03-01T00:00:00Z',
    });
    expect(install.status, JSON.stringify(install.body)).toBe(201);
    expect(
      (await victim.post('/api/installations', { action: 'remove', partId: ids.spare, at: '2026-03-02T00:00:00Z' }))
        .status,
    ).toBe(201);
    const [row] = (await database.execute('SELECT CAST(MAX(seq) AS TEXT) AS seq FROM installation_events')).rows;
    expect(Number(row!.seq)).toBeLessThan(1_000_000);
  });

  it('refuses runs naming another team’s car, and that team’s counts stay', async () => {
    const before = await victimRuns();
    expect(before).toBe(3);
    await expectRefused(
      ownArchive({ runs: [{ id: 'run-1', carId: ids.car, at: '2026-01-03T08:00:00Z', recordedBy: 'person-1' }] }),
      'runs.0.carId',
    );
    expect(await victimRuns()).toBe(before);
  });

  it('refuses a comment on another team’s review, written under its owner’s name', async () => {
    const victimEmail = (await victim.get('/api/account')).body.email;
    const before = (await victim.get(`/api/reviews/${ids.review}`)).body.comments.length;
    await expectRefused(
      ownArchive({
        formerPeople: [{ id: 'person-2', email: victimEmail, name: 'Victim owner' }],
        reviewComments: [{ id: 'c-1', reviewId: ids.review, authorId: 'person-2', body: 'Approve it.', mentions: [] }],
      }),
      'reviewComments.0.reviewId',
    );
    expect((await victim.get(`/api/reviews/${ids.review}`)).body.comments.length).toBe(before);
  });

  it('refuses an open review of another team’s gear set, so that team can still open one', async () => {
    await expectRefused(
      ownArchive({
        reviews: [
          {
            id: 'rv-1',
            gearSetId: ids.gearSet,
            status: 'open',
            snapshot: {},
            openedBy: 'person-1',
            statusBefore: 'in-service',
          },
        ],
      }),
      'reviews.0.gearSetId',
    );
    const opened = await victim.post('/api/reviews', { gearSetId: ids.gearSet });
    expect(opened.status, JSON.stringify(opened.body)).toBe(201);
    await victim.post(`/api/reviews/${opened.body.id}/decision`, {
      decision: 'keep',
      reason: 'Fine',
      reinspectAfterRuns: 5,
    });
  });

  it('refuses an install event of another team’s part, and an event dated 2099 of its own', async () => {
    await expectRefused(
      ownArchive({
        installationEvents: [
          {
            id: 'ev-2',
            action: 'install',
            subjectType: 'part',
            subjectId: ids.spare,
            targetType: 'car',
            targetId: 'car-1',
            at: '2026-04-01T00:00:00Z',
          },
        ],
      }),
      'installationEvents.0.subjectId',
    );
    await expectRefused(
      ownArchive({
        installationEvents: [
          {
            id: 'ev-3',
            action: 'install',
            subjectType: 'part',
            subjectId: 'set-1',
            targetType: 'car',
            targetId: 'car-1',
            at: '2099-01-01T00:00:00Z',
          },
        ],
      }),
      'installationEvents.0.at',
    );
    const install = await victim.post('/api/installations', {
      action: 'install',
      partId: ids.spare,
      carId: ids.car,
      at: '2026-05-01T00:00:00Z',
    });
    expect(install.status, JSON.stringify(install.body)).toBe(201);
    await victim.post('/api/installations', { action: 'remove', partId: ids.spare, at: '2026-05-02T00:00:00Z' });
  });

  it('never takes a storage key: a photo row naming another team’s image brings no photo', async () => {
    const [stored] = (
      await database.execute({
        sql: 'SELECT storage_key, thumbnail_key FROM inspection_photos WHERE id = ?',
        args: [ids.photo],
      })
    ).rows;
    const imported = await attacker.post(
      '/api/imports/team',
      ownArchive({
        inspectionPhotos: [
          {
            id: 'ph-1',
            inspectionId: 'insp-1',
            side: 'drive',
            storageKey: stored!.storage_key,
            thumbnailKey: stored!.thumbnail_key,
            contentType: 'image/jpeg',
            width: 48,
            height: 32,
            bytes: 1000,
          },
        ],
      }),
    );
    expect(imported.status, JSON.stringify(imported.body)).toBe(201);
    expect(imported.body.photosWithoutBytes).toBe(1);
    expect(imported.body.counts.inspectionPhotos).toBe(0);
    const users = (
      await database.execute({
        sql: 'SELECT count(*) AS n FROM inspection_photos WHERE storage_key = ?',
        args: [String(stored!.storage_key)],
      })
    ).rows;
    expect(Number(users[0]!.n)).toBe(1);
    expect((await victim.request(`/api/photos/${ids.photo}`)).status).toBe(200);
  });

  it('takes only the columns it knows, and checks each row with the API’s schema', async () => {
    const imported = await attacker.post(
      '/api/imports/team',
      ownArchive({ cars: [{ id: 'car-1', name: 'Own car', teamId: 'someone-else', createdBy: 'x', extra: 1 }] }),
    );
    expect(imported.status, JSON.stringify(imported.body)).toBe(201);
    const [car] = (
      await database.execute({ sql: 'SELECT id, team_id FROM cars WHERE team_id = ?', args: [imported.body.teamId] })
    ).rows;
    expect(car!.id).not.toBe('car-1');
    await expectRefused(
      ownArchive({ runs: [{ id: 'run-2', carId: 'car-1', at: '2026-01-03T08:00:00Z', speedMph: -5 }] }),
      'runs.0.speedMph',
    );
    await expectRefused(
      ownArchive({
        cars: [
          { id: 'car-1', name: 'Twin' },
          { id: 'car-2', name: 'Twin' },
        ],
      }),
      'cars.1.name',
    );
    await expectRefused(ownArchive({ parts: [{ id: 'set-1', kind: 'gear-set', serial: 'A' }] }), 'parts.0.ringTeeth');
  });

  it('keeps storage keys out of the audit trail and the export, and carries photos as bytes', async () => {
    const audit = await victim.request('/api/audit?limit=200');
    expect(audit.status).toBe(200);
    const trail = await audit.text();
    expect(trail).toContain('inspection-photo');
    expect(trail).not.toMatch(/storageKey|thumbnailKey/);
    const [stored] = (
      await database.execute({ sql: 'SELECT storage_key FROM inspection_photos WHERE id = ?', args: [ids.photo] })
    ).rows;
    const exported = await victim.request('/api/exports/team.json');
    const text = await exported.text();
    expect(text).not.toContain(String(stored!.storage_key));
    expect(text).not.toMatch(/storageKey|thumbnailKey/);
    const archive = JSON.parse(text);
    expect(archive.inspectionPhotos[0].image).toMatch(/^[A-Za-z0-9+/]+=*$/);
    expect(archive.photosLeftOut.count).toBe(0);

    // Read back by someone else: new ids everywhere, the photo served from its own stored copy.
    const importer = (await signedInClient(server.baseUrl)).client;
    const imported = await importer.post('/api/imports/team', archive);
    expect(imported.status, JSON.stringify(imported.body)).toBe(201);
    expect(imported.body.counts.inspectionPhotos).toBe(1);
    expect(imported.body.teamId).not.toBe(archive.team.id);
    const sets = (await importer.get('/api/gear-sets')).body.items as { id: string; totalRuns: number }[];
    expect(sets.map((s) => s.id)).not.toContain(ids.gearSet);
    expect(sets[0]!.totalRuns).toBe(3);
    const inspections = (await importer.get('/api/inspections')).body.items as { id: string }[];
    const photos = (await importer.get(`/api/inspections/${inspections[0]!.id}/photos`)).body.items as {
      id: string;
      url: string;
    }[];
    expect(photos).toHaveLength(1);
    expect(photos[0]!.id).not.toBe(ids.photo);
    const served = await importer.request(photos[0]!.url);
    expect(served.status).toBe(200);
    expect(served.headers.get('content-type')).toBe('image/jpeg');
    // A review's snapshot names the imported photo, by its new address.
    const reviews = (await importer.get('/api/reviews')).body.items as { id: string }[];
    const snapshots = await Promise.all(reviews.map(async (r) => (await importer.get(`/api/reviews/${r.id}`)).body));
    const shown = snapshots.flatMap((r: { snapshot: { photos: { id: string; url: string }[] } }) => r.snapshot.photos);
    expect(shown).toContainEqual(expect.objectContaining({ id: photos[0]!.id, url: `/api/photos/${photos[0]!.id}` }));
    expect(JSON.stringify(snapshots)).not.toContain(ids.photo);
    // The same archive again is another new team, not a clash.
    expect((await importer.post('/api/imports/team', archive)).status).toBe(201);
  }, 30_000);
});

describe('the Team data form', () => {
  async function postArchive(archive: unknown): Promise<{ status: number; text: string }> {
    const form = new FormData();
    form.set('archive', new Blob([JSON.stringify(archive)], { type: 'application/json' }), 'archive.json');
    const response = await attacker.request('/team/data', { method: 'POST', body: form });
    return { status: response.status, text: await response.text() };
  }

  it('imports through the same checks as the API', async () => {
    const refused = await postArchive(
      ownArchive({ runs: [{ id: 'run-1', carId: ids.car, at: '2026-01-03T08:00:00Z' }] }),
    );
    expect(refused.status).toBe(400);
    expect(refused.text).toContain('runs[0].carId');
    expect(refused.text).toContain('nothing was imported');
    const imported = await postArchive(ownArchive());
    expect(imported.status).toBe(200);
    expect(imported.text).toContain('Imported: 1 parts');
  });
});

describe('every field of every row of an archive, fuzzed', () => {
  it('never answers 5xx, and a refusal writes nothing', async () => {
    const archive = JSON.parse(await (await victim.request('/api/exports/team.json')).text());
    const cells: [string, number, string][] = [];
    for (const [table, rows] of Object.entries(archive))
      if (Array.isArray(rows))
        rows.forEach((row, index) => {
          if (row && typeof row === 'object') for (const field of Object.keys(row)) cells.push([table, index, field]);
        });
    expect(cells.length).toBeGreaterThan(50);
    const count = async () =>
      Number(
        (await database.execute('SELECT (SELECT count(*) FROM teams) + (SELECT count(*) FROM users) AS n')).rows[0]!.n,
      );
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...cells), hostileValue, async ([table, index, field], value) => {
        const copy = structuredClone(archive);
        copy[table][index][field] = value;
        const before = await count();
        const answer = await attacker.post('/api/imports/team', copy);
        expect(answer.status, `${table}[${index}].${field} = ${JSON.stringify(value)?.slice(0, 80)}`).toBeLessThan(500);
        if (answer.status >= 400) expect(await count()).toBe(before);
      }),
      { numRuns: 40, seed: 20_261_205 },
    );
  }, 120_000);
});
