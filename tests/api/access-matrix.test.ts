import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, signedInClient } from '../helpers/api-client';
import { uploadPhoto } from '../helpers/images';
import { createInspection, draftBody, newKey } from '../helpers/inspections';
import { procedureBody } from '../helpers/procedures';
import { freshSerial, makeTeamRecords, recordsToParams, smallPng, type TeamRecords } from '../helpers/records';
import { fillPattern, listApiEndpoints } from '../helpers/routes';
import { findFreePort, startServer, type RunningServer } from '../helpers/server';
import { SmtpFake } from '../helpers/smtp-fake';
import { joinByInvitation, makeTeamOfFour, type TeamOfFour } from '../helpers/team';

/**
 * Every API route × every caller (signed out, owner, crew chief, technician, viewer) × the caller's
 * own team and another team's ids, against ONE table below. The rows are checked against the route
 * files themselves: a new route or method without a row fails the first test.
 *
 * Expectations follow src/lib/roles.ts and each route's own rule: 401 signed out, 403 for a role
 * without the permission, 404 for another team's record (whether it exists or not), and for an
 * allowed caller OK — any answer but 401, 403, 404 or 5xx (a minimal body may well get a 400).
 */

const OK = 'ok' as const;
type Expect = number | typeof OK;
/** Signed out, owner, crew chief, technician, viewer. */
type Cells = readonly [Expect, Expect, Expect, Expect, Expect];
const CALLERS = ['signed out', 'owner', 'crew chief', 'technician', 'viewer'] as const;

interface Rule {
  /** In the caller's own team. */
  own: Cells;
  /** With another team's ids in the path (and body); null when the route names no record of a team. */
  other: Cells | null;
  /** A body (JSON) built from the scope's ids; POST/PUT/PATCH without one send `{}`. */
  body?: (ids: TeamRecords) => unknown;
  headers?: () => Record<string, string>;
  query?: string;
  /** For a request that uses its record up (a delete): a fresh one for each caller who may succeed. */
  fresh?: (ids: TeamRecords) => Promise<Partial<Record<'id' | 'photoId' | 'userId', string>>>;
  /** Ends the caller's session: these rows run after all the others. */
  endsSession?: true;
}

const ANYONE: Cells = [OK, OK, OK, OK, OK];
const SIGNED_IN: Cells = [401, OK, OK, OK, OK];
const MEMBER = SIGNED_IN;
const RECORDERS: Cells = [401, OK, OK, OK, 403];
const MANAGERS: Cells = [401, OK, OK, 403, 403];
const OWNER_ONLY: Cells = [401, OK, 403, 403, 403];
const NOT_FOUND: Cells = [401, 404, 404, 404, 404];
/** Another team's record for a route that checks the permission first, then looks the record up. */
const NOT_FOUND_FOR = (own: Cells): Cells =>
  own.map((cell, i) => (i === 0 ? 401 : cell === 403 ? 403 : 404)) as unknown as Cells;

let freshRun = 0;
const runAt = () => new Date(Date.UTC(2026, 0, 1) + (freshRun += 1) * 60_000).toISOString();

// ───────────────────────────── the table ─────────────────────────────
const MATRIX: Record<string, Rule> = {
  'GET /api/account': { own: SIGNED_IN, other: null },
  'PATCH /api/account': { own: SIGNED_IN, other: null },
  'POST /api/account/password': { own: SIGNED_IN, other: null },
  'POST /api/account/second-factor': { own: [401, OK, OK, 403, 403], other: null },
  'POST /api/account/second-factor/confirm': { own: [401, OK, OK, 403, 403], other: null },
  'POST /api/account/second-factor/disable': { own: SIGNED_IN, other: null },
  'POST /api/account/second-factor/recovery-codes': { own: SIGNED_IN, other: null },
  'POST /api/account/sessions/revoke': { own: SIGNED_IN, other: null, endsSession: true },
  'POST /api/accounts': { own: ANYONE, other: null },
  'POST /api/analysis/backlash': { own: MEMBER, other: null },
  'GET /api/analysis/tightening-sequence': { own: MEMBER, other: null, query: '?bolts=10' },
  'POST /api/analysis/trend': { own: MEMBER, other: null },
  'GET /api/assemblies': { own: MEMBER, other: null },
  'POST /api/assemblies': { own: MANAGERS, other: null },
  'GET /api/assemblies/[id]': { own: MEMBER, other: NOT_FOUND },
  'PATCH /api/assemblies/[id]': { own: MANAGERS, other: NOT_FOUND_FOR(MANAGERS), body: () => ({ notes: 'matrix' }) },
  'DELETE /api/assemblies/[id]': {
    own: MANAGERS,
    other: NOT_FOUND_FOR(MANAGERS),
    fresh: () => freshRecord('/api/assemblies', { serial: freshSerial('AS'), name: 'Spare' }),
  },
  'GET /api/audit': { own: MANAGERS, other: null },
  'GET /api/cars': { own: MEMBER, other: null },
  // Address verification and password resets work without a session: the mailed link is the proof.
  'POST /api/email-verifications': { own: ANYONE, other: null },
  'POST /api/email-verifications/confirm': { own: ANYONE, other: null },
  'POST /api/cars': { own: MANAGERS, other: null },
  'GET /api/cars/[id]': { own: MEMBER, other: NOT_FOUND },
  'PATCH /api/cars/[id]': { own: MANAGERS, other: NOT_FOUND_FOR(MANAGERS), body: () => ({ notes: 'matrix' }) },
  'DELETE /api/cars/[id]': {
    own: MANAGERS,
    other: NOT_FOUND_FOR(MANAGERS),
    fresh: () => freshRecord('/api/cars', { name: freshSerial('Car') }),
  },
  'GET /api/checklists': { own: MEMBER, other: null },
  'POST /api/checklists': {
    own: RECORDERS,
    other: NOT_FOUND_FOR(RECORDERS),
    body: (ids) => ({ procedureId: ids.procedureId, gearSetId: ids.gearSetId }),
  },
  'GET /api/checklists/[id]': { own: MEMBER, other: NOT_FOUND },
  // The matrix's checklist stays open: the 10-bolt step is ticked again and again, never completed.
  'PATCH /api/checklists/[id]/steps/[stepId]': {
    own: RECORDERS,
    other: NOT_FOUND_FOR(RECORDERS),
    body: () => ({ status: 'done', boltsInOrder: [1, 6, 3, 8, 5, 10, 2, 7, 4, 9] }),
    headers: () => ({ 'idempotency-key': newKey() }),
  },
  'POST /api/checklists/[id]/steps/[stepId]/photos': { own: RECORDERS, other: NOT_FOUND_FOR(RECORDERS) },
  // Open steps answer 409, which counts as allowed here; procedures.test.ts completes one for real.
  'POST /api/checklists/[id]/complete': { own: RECORDERS, other: NOT_FOUND_FOR(RECORDERS) },
  'POST /api/checklists/[id]/sign-off': { own: MANAGERS, other: NOT_FOUND_FOR(MANAGERS) },
  'GET /api/exports/gear-sets/[id].csv': { own: MEMBER, other: NOT_FOUND },
  'GET /api/exports/inspections/[id].csv': { own: MEMBER, other: NOT_FOUND },
  'GET /api/exports/team.json': { own: OWNER_ONLY, other: null },
  'GET /api/gear-sets': { own: MEMBER, other: null },
  'POST /api/gear-sets': { own: MANAGERS, other: null },
  'GET /api/gear-sets/[id]': { own: MEMBER, other: NOT_FOUND },
  'PATCH /api/gear-sets/[id]': { own: MANAGERS, other: NOT_FOUND_FOR(MANAGERS), body: () => ({ notes: 'matrix' }) },
  'DELETE /api/gear-sets/[id]': {
    own: MANAGERS,
    other: NOT_FOUND_FOR(MANAGERS),
    fresh: () => freshRecord('/api/gear-sets', { serial: freshSerial('GS'), ringTeeth: 41, pinionTeeth: 10 }),
  },
  'GET /api/gear-sets/[id]/analysis': { own: MEMBER, other: NOT_FOUND },
  'GET /api/gear-sets/[id]/run-count': { own: MEMBER, other: NOT_FOUND },
  'GET /api/health': { own: [200, 200, 200, 200, 200], other: null },
  // An archive's rows may refer only to rows of the same archive: one naming the scope's car (the
  // caller's own team's or another's) is refused, 422 naming the field, whoever sends it.
  'POST /api/imports/team': {
    own: [401, 422, 422, 422, 422],
    other: [401, 422, 422, 422, 422],
    body: (ids) => ({
      format: 'lashline-team-archive',
      version: 1,
      team: { name: 'Matrix import' },
      people: [],
      runs: [{ id: 'run-1', carId: ids.carId, at: '2026-06-01T10:00:00Z' }],
    }),
  },
  'GET /api/inspections': { own: MEMBER, other: null },
  'POST /api/inspections': { own: RECORDERS, other: NOT_FOUND_FOR(RECORDERS), body: (ids) => draftBody(ids.gearSetId) },
  'GET /api/inspections/[id]': { own: MEMBER, other: NOT_FOUND },
  // A technician changes their own draft; the draft here is the technician's.
  'PATCH /api/inspections/[id]': { own: RECORDERS, other: NOT_FOUND_FOR(RECORDERS) },
  'DELETE /api/inspections/[id]': {
    own: RECORDERS,
    other: NOT_FOUND_FOR(RECORDERS),
    fresh: async () => ({ id: await createInspection(team.tech, own.gearSetId) }),
  },
  'GET /api/inspections/[id]/photos': { own: MEMBER, other: NOT_FOUND },
  // The inspection is looked up before the role is weighed: another team's is 404 for everyone.
  'POST /api/inspections/[id]/photos': { own: RECORDERS, other: NOT_FOUND },
  'DELETE /api/inspections/[id]/photos/[photoId]': {
    own: RECORDERS,
    other: NOT_FOUND,
    fresh: async () => ({ photoId: await freshPhoto() }),
  },
  'POST /api/inspections/[id]/submit': {
    own: RECORDERS,
    other: NOT_FOUND_FOR(RECORDERS),
    headers: () => ({ 'idempotency-key': newKey() }),
  },
  'GET /api/installations': { own: MEMBER, other: null },
  'POST /api/installations': {
    own: RECORDERS,
    other: NOT_FOUND_FOR(RECORDERS),
    body: (ids) => ({ action: 'install', partId: ids.partId, assemblyId: ids.assemblyId, at: '2026-06-01T09:00:00Z' }),
  },
  'GET /api/invitations': { own: MANAGERS, other: null },
  'POST /api/invitations': { own: MANAGERS, other: null },
  'POST /api/invitations/accept': { own: SIGNED_IN, other: null },
  'DELETE /api/invitations/[id]': {
    own: MANAGERS,
    other: NOT_FOUND_FOR(MANAGERS),
    fresh: () =>
      freshRecord('/api/invitations', {
        email: freshSerial('cancel').toLowerCase() + '@lashline.test',
        role: 'viewer',
      }),
  },
  'POST /api/invitations/[id]/resend': { own: MANAGERS, other: NOT_FOUND_FOR(MANAGERS) },
  'GET /api/members': { own: MEMBER, other: null },
  'PATCH /api/members/[userId]': {
    own: OWNER_ONLY,
    other: NOT_FOUND_FOR(OWNER_ONLY),
    body: () => ({ role: 'viewer' }),
  },
  'DELETE /api/members/[userId]': {
    own: OWNER_ONLY,
    other: NOT_FOUND_FOR(OWNER_ONLY),
    fresh: async () => ({ userId: (await joinByInvitation(server.baseUrl, smtp, team.owner, 'viewer')).userId }),
  },
  'GET /api/notifications/preferences': { own: MEMBER, other: null },
  'PUT /api/notifications/preferences': { own: MEMBER, other: null },
  'GET /api/outbox': { own: OWNER_ONLY, other: null },
  'GET /api/parts': { own: MEMBER, other: null },
  'POST /api/parts': { own: MANAGERS, other: null },
  'GET /api/parts/[id]': { own: MEMBER, other: NOT_FOUND },
  'PATCH /api/parts/[id]': { own: MANAGERS, other: NOT_FOUND_FOR(MANAGERS), body: () => ({ notes: 'matrix' }) },
  'DELETE /api/parts/[id]': {
    own: MANAGERS,
    other: NOT_FOUND_FOR(MANAGERS),
    fresh: () => freshRecord('/api/parts', { kind: 'bearing', serial: freshSerial('BR') }),
  },
  'POST /api/password-resets': { own: ANYONE, other: null },
  'POST /api/password-resets/confirm': { own: ANYONE, other: null },
  'GET /api/photos/[id]': { own: MEMBER, other: NOT_FOUND },
  'GET /api/photos/[id]/thumbnail': { own: MEMBER, other: NOT_FOUND },
  'GET /api/procedures': { own: MEMBER, other: null },
  'POST /api/procedures': { own: MANAGERS, other: null, body: () => procedureBody('Matrix procedure') },
  'GET /api/procedures/[id]': { own: MEMBER, other: NOT_FOUND },
  'PUT /api/procedures/[id]': {
    own: MANAGERS,
    other: NOT_FOUND_FOR(MANAGERS),
    body: (ids) => procedureBody('Matrix procedure', ids.procedureStepId),
  },
  'POST /api/procedures/[id]/archive': {
    own: MANAGERS,
    other: NOT_FOUND_FOR(MANAGERS),
    body: () => ({ archived: false }),
  },
  'POST /api/procedures/[id]/duplicate': { own: MANAGERS, other: NOT_FOUND_FOR(MANAGERS) },
  'POST /api/procedures/[id]/steps/[stepId]/photos': { own: MANAGERS, other: NOT_FOUND_FOR(MANAGERS) },
  'GET /api/procedures/[id]/steps/[stepId]/diagram.svg': { own: MEMBER, other: NOT_FOUND },
  'GET /api/reports/retirements': { own: MEMBER, other: null },
  'GET /api/reviews': { own: MEMBER, other: null },
  'POST /api/reviews': {
    own: RECORDERS,
    other: NOT_FOUND_FOR(RECORDERS),
    body: (ids) => ({ gearSetId: ids.gearSetId }),
  },
  'GET /api/reviews/[id]': { own: MEMBER, other: NOT_FOUND },
  'POST /api/reviews/[id]/comments': {
    own: RECORDERS,
    other: NOT_FOUND_FOR(RECORDERS),
    body: () => ({ body: 'From the access matrix.' }),
  },
  'POST /api/reviews/[id]/decision': {
    own: MANAGERS,
    other: NOT_FOUND_FOR(MANAGERS),
    body: () => ({ decision: 'keep', reason: 'Pattern is fine', reinspectAfterRuns: 20 }),
  },
  'POST /api/reviews/[id]/correction': {
    own: MANAGERS,
    other: NOT_FOUND_FOR(MANAGERS),
    body: () => ({ decision: 'keep', reason: 'Corrected', reinspectAfterRuns: 20 }),
  },
  'GET /api/runs': { own: MEMBER, other: null },
  'POST /api/runs': {
    own: RECORDERS,
    other: NOT_FOUND_FOR(RECORDERS),
    body: (ids) => ({ carId: ids.carId, at: runAt() }),
  },
  'GET /api/runs/[id]': { own: MEMBER, other: NOT_FOUND },
  'PATCH /api/runs/[id]': { own: MANAGERS, other: NOT_FOUND_FOR(MANAGERS), body: () => ({ notes: 'matrix' }) },
  // A technician may delete a run they logged themselves within a day; the fresh run here is the owner's.
  'DELETE /api/runs/[id]': {
    own: MANAGERS,
    other: NOT_FOUND_FOR(RECORDERS),
    fresh: async () => freshRecord('/api/runs', { carId: own.carId, at: runAt() }),
  },
  'POST /api/runs/import': { own: RECORDERS, other: null },
  'GET /api/step-photos/[id]': { own: MEMBER, other: NOT_FOUND },
  'GET /api/step-photos/[id]/thumbnail': { own: MEMBER, other: NOT_FOUND },
  'GET /api/team/second-factor': { own: MEMBER, other: null },
  'PUT /api/team/second-factor': { own: OWNER_ONLY, other: null },
  'GET /api/team/settings': { own: MEMBER, other: null },
  'PATCH /api/team/settings': { own: OWNER_ONLY, other: null },
  'GET /api/teams': { own: SIGNED_IN, other: null },
  'POST /api/teams': { own: SIGNED_IN, other: null },
  // Any signed-in person may ask for a team by id; only their own teams answer.
  'GET /api/teams/[id]': { own: SIGNED_IN, other: NOT_FOUND },
  'GET /api/teams/current': { own: SIGNED_IN, other: null },
  'PUT /api/teams/current': { own: SIGNED_IN, other: NOT_FOUND, body: (ids) => ({ teamId: ids.teamId }) },
  'GET /api/tolerance-profiles': { own: MEMBER, other: null },
  'POST /api/tolerance-profiles': { own: MANAGERS, other: null },
  'GET /api/tolerance-profiles/[id]': { own: MEMBER, other: NOT_FOUND },
  'PUT /api/tolerance-profiles/[id]': {
    own: MANAGERS,
    other: NOT_FOUND_FOR(MANAGERS),
    body: () => ({ values: profileValues }),
  },
  'GET /api/tolerance-profiles/for-gear-set/[id]': { own: MEMBER, other: NOT_FOUND },
};
// ─────────────────────────────────────────────────────────────────────

let server: RunningServer;
let smtp: SmtpFake;
let team: TeamOfFour;
let own: TeamRecords;
let other: TeamRecords;
let profileValues: unknown;
let signedOut: ApiClient;

async function freshRecord(path: string, body: unknown): Promise<{ id: string }> {
  const made = await team.owner.post(path, body);
  if (made.status !== 201) throw new Error(`fresh ${path}: ${made.status} ${JSON.stringify(made.body)}`);
  return { id: made.body.id as string };
}

async function freshPhoto(): Promise<string> {
  const made = await uploadPhoto(team.tech, own.inspectionId, await smallPng(), {
    type: 'image/png',
    filename: 'p.png',
  });
  if (made.status !== 201) throw new Error(`fresh photo: ${made.status}`);
  return made.body.id as string;
}

beforeAll(async () => {
  smtp = await SmtpFake.create();
  await smtp.start();
  server = await startServer({ env: { SMTP_PORT: String(smtp.port) } });
  team = await makeTeamOfFour(server.baseUrl, smtp, 'Matrix Crew');
  const viewerId = (await team.viewer.get('/api/account')).body.id as string;
  own = await makeTeamRecords(team.chief, team.tech, { teamId: team.teamId, memberId: viewerId });
  const stranger = await signedInClient(server.baseUrl, { team: 'Matrix Rivals' });
  other = await makeTeamRecords(stranger.client, stranger.client, {
    teamId: stranger.teamId!,
    memberId: stranger.userId,
  });
  profileValues = (await team.chief.get('/api/tolerance-profiles')).body.items[0].values;
  signedOut = new ApiClient(server.baseUrl);
}, 120_000);
afterAll(async () => {
  await server?.stop();
  await smtp?.stop();
});

const callerClient = (index: number): ApiClient => [signedOut, team.owner, team.chief, team.tech, team.viewer][index]!;
const succeeds = (cell: Expect) => cell === OK || (typeof cell === 'number' && cell < 400);

function matches(cell: Expect, status: number): boolean {
  if (cell === OK) return status < 500 && ![401, 403, 404].includes(status);
  return status === cell;
}

async function ask(
  key: string,
  rule: Rule,
  scope: 'own' | 'other',
  caller: number,
  cell: Expect,
): Promise<{ status: number; text: string }> {
  const [method, pattern] = key.split(' ') as [string, string];
  const ids = scope === 'own' ? own : other;
  let params = recordsToParams(ids, pattern);
  if (rule.fresh && scope === 'own' && succeeds(cell)) params = { ...params, ...(await rule.fresh(ids)) };
  const path = fillPattern(pattern, params) + (rule.query ?? '');
  const hasBody = !['GET', 'DELETE'].includes(method);
  const response = await callerClient(caller).request(path, {
    method,
    headers: { ...(hasBody ? { 'content-type': 'application/json' } : {}), ...rule.headers?.() },
    body: hasBody ? JSON.stringify(rule.body ? rule.body(ids) : {}) : undefined,
  });
  return { status: response.status, text: (await response.text()).slice(0, 200) };
}

describe('the access matrix', () => {
  it('has exactly one row for every method of every route file under src/pages/api', () => {
    const endpoints = listApiEndpoints();
    expect(endpoints.length).toBeGreaterThan(50);
    expect(
      endpoints.filter((key) => !(key in MATRIX)),
      'routes without a row: add one to MATRIX',
    ).toEqual([]);
    expect(
      Object.keys(MATRIX).filter((key) => !endpoints.includes(key)),
      'rows without a route',
    ).toEqual([]);
  });

  const ordered = Object.entries(MATRIX).sort(([, a], [, b]) => Number(!!a.endsSession) - Number(!!b.endsSession));
  for (const [key, rule] of ordered) {
    it(`${key}: ${rule.own.join(' ')}${rule.other ? ` | other team ${rule.other.join(' ')}` : ''}`, async () => {
      const wrong: string[] = [];
      // Another team's ids first, so a row that wrongly succeeds there cannot spoil the own-team cells.
      for (const scope of rule.other ? (['other', 'own'] as const) : (['own'] as const)) {
        const cells = scope === 'own' ? rule.own : rule.other!;
        for (let caller = 0; caller < CALLERS.length; caller += 1) {
          const answer = await ask(key, rule, scope, caller, cells[caller]!);
          if (!matches(cells[caller]!, answer.status))
            wrong.push(
              `${scope} team, ${CALLERS[caller]}: expected ${cells[caller]}, got ${answer.status} ${answer.text}`,
            );
        }
      }
      expect(wrong).toEqual([]);
    });
  }
});

/**
 * The caught-mail page, the one page that hands out what the mail carries (invitation links): on the
 * matrix's server (a real SMTP server, no catcher) it does not exist; on a built server that catches its
 * own mail it answers only with MAIL_CATCHER_PAGE=on, and then only to owners (signed out → sign-in).
 */
describe('the access matrix of the caught-mail page', () => {
  let catcher: RunningServer | undefined;
  beforeAll(async () => {
    catcher = await startServer({
      demo: true,
      env: { SMTP_HOST: '', MAIL_CATCHER: 'on', MAIL_CATCHER_PAGE: 'on', SMTP_PORT: String(await findFreePort()) },
    });
  }, 60_000);
  afterAll(async () => {
    await catcher?.stop();
  });

  it('GET /dev/mail without a catcher: 404 404 404 404 404', async () => {
    const statuses = [];
    for (let caller = 0; caller < CALLERS.length; caller += 1)
      statuses.push((await callerClient(caller).request('/dev/mail')).status);
    expect(statuses).toEqual([404, 404, 404, 404, 404]);
  });

  it('GET /dev/mail with the catcher and MAIL_CATCHER_PAGE=on: 302 200 403 403 403', async () => {
    const statuses = [];
    for (const role of [null, 'owner', 'chief', 'tech', 'viewer']) {
      const client = new ApiClient(catcher!.baseUrl);
      if (role) await client.signIn(`${role}@lashline.test`, 'lashline-demo');
      statuses.push((await client.request('/dev/mail')).status);
    }
    expect(statuses).toEqual([302, 200, 403, 403, 403]);
  });
});
