import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Secret, TOTP } from 'otpauth';
import { signedInClient, type ApiClient } from '../helpers/api-client';
import { cameraJpeg, fetchPhoto, METADATA_MARKERS } from '../helpers/images';
import { newKey } from '../helpers/inspections';
import { createProcedure, procedureBody, startChecklist, stepIdsByTitle, uploadStepPhoto } from '../helpers/procedures';
import { startServer, type RunningServer } from '../helpers/server';
import { SmtpFake } from '../helpers/smtp-fake';
import { joinByInvitation, makeTeamOfFour, type TeamOfFour } from '../helpers/team';

let server: RunningServer;
let smtp: SmtpFake;
let team: TeamOfFour;
let assemblyId: string;
let gearSetId: string;
beforeAll(async () => {
  smtp = await SmtpFake.create();
  await smtp.start();
  server = await startServer({ env: { SMTP_PORT: String(smtp.port) } });
  team = await makeTeamOfFour(server.baseUrl, smtp, 'Procedure Crew');
  assemblyId = (await team.chief.post('/api/assemblies', { serial: 'PR-1', name: 'Rear end' })).body.id;
  gearSetId = (await team.chief.post('/api/gear-sets', { serial: 'PR-GS1', ringTeeth: 41, pinionTeeth: 10 })).body.id;
}, 120_000);
afterAll(async () => {
  await server?.stop();
  await smtp?.stop();
});

/** The 10-bolt engine order (mixed-radix digit reversal, src/lib/analysis/tightening-sequence.ts). */
const TEN_BOLTS = [1, 6, 3, 8, 5, 10, 2, 7, 4, 9];

async function procedureCount(client: ApiClient): Promise<number> {
  return (await client.get('/api/procedures?archived=1&limit=100')).body.items.length;
}

function patchStep(client: ApiClient, checklistId: string, stepId: string, body: unknown, key = newKey()) {
  return client
    .request(`/api/checklists/${checklistId}/steps/${stepId}`, {
      method: 'PATCH',
      headers: { 'content-type': 'application/json', 'idempotency-key': key },
      body: JSON.stringify(body),
    })
    .then(async (response) => ({ status: response.status, body: await response.json() }));
}

describe('procedures', () => {
  it('answers 201 with the procedure, its version and an id for every section and step', async () => {
    const made = await team.chief.post('/api/procedures', procedureBody());
    expect(made.status).toBe(201);
    expect(made.body.version).toBe(1);
    expect(made.body.sections).toHaveLength(2);
    for (const section of made.body.sections) {
      expect(section.id).toMatch(/\S/);
      for (const step of section.steps) expect(step.id).toMatch(/\S/);
    }
    const ring = made.body.sections[1].steps[0];
    expect(ring.fasteners).toMatchObject({ count: 10, passesPercent: [30, 70, 100], sequence: true });
    expect((await team.viewer.get(`/api/procedures/${made.body.id}`)).body.name).toBe(
      'Rear-end teardown and inspection',
    );
  });

  it('lets crew chiefs and owners write, and everyone read', async () => {
    expect((await team.owner.post('/api/procedures', procedureBody('Owner’s'))).status).toBe(201);
    expect((await team.tech.post('/api/procedures', procedureBody('Tech’s'))).status).toBe(403);
    expect((await team.viewer.post('/api/procedures', procedureBody('Viewer’s'))).status).toBe(403);
    expect((await team.viewer.get('/api/procedures')).status).toBe(200);
  });

  it('makes a new version on PUT and keeps the old one readable with ?version=', async () => {
    const made = await createProcedure(team.chief);
    const ids = stepIdsByTitle(made);
    const checklistId = await startChecklist(team.tech, { procedureId: made.id, assemblyId });
    const changed = procedureBody('Rear-end teardown, revised', ids['Ring gear bolts']);
    const put = await team.chief.put(`/api/procedures/${made.id}`, changed);
    expect(put.status).toBe(200);
    expect(put.body.version).toBe(2);
    expect(stepIdsByTitle(put.body)['Ring gear bolts']).toBe(ids['Ring gear bolts']);
    expect((await team.tech.get(`/api/procedures/${made.id}?version=1`)).body.name).toBe(
      'Rear-end teardown and inspection',
    );
    expect((await team.tech.get(`/api/procedures/${made.id}`)).body.name).toBe('Rear-end teardown, revised');
    // The checklist keeps the version it followed.
    const checklist = (await team.tech.get(`/api/checklists/${checklistId}`)).body;
    expect(checklist.procedure).toMatchObject({ version: 1, name: 'Rear-end teardown and inspection' });
    expect(stepIdsByTitle(checklist)['Drain the oil']).toBe(ids['Drain the oil']);
  });

  it('duplicates and archives; an archived procedure starts no checklist', async () => {
    const made = await createProcedure(team.chief);
    const copy = await team.chief.post(`/api/procedures/${made.id}/duplicate`);
    expect(copy.status).toBe(201);
    expect(copy.body.name).toBe('Rear-end teardown and inspection (copy)');
    expect(copy.body.id).not.toBe(made.id);
    expect((await team.chief.post(`/api/procedures/${copy.body.id}/archive`, { archived: true })).body.archived).toBe(
      true,
    );
    const listed = (await team.tech.get('/api/procedures?limit=100')).body.items.map((p: { id: string }) => p.id);
    expect(listed).not.toContain(copy.body.id);
    const start = await team.tech.post('/api/checklists', { procedureId: copy.body.id, assemblyId });
    expect(start.status).toBe(409);
  });

  const BAD: [string, (body: any) => void, string][] = [
    ['a torque of 0', (b) => (b.sections[1].steps[0].fasteners.torque.value = 0), 'value'],
    ['a torque below 0', (b) => (b.sections[1].steps[0].fasteners.torque.value = -5), 'value'],
    // 1,476 lbf·ft is 2,001.2 N·m (NIST SP 811: 1 lbf·ft = 1.3558179483314004 N·m).
    [
      'a torque above 2,000 N·m given in lbf·ft',
      (b) => (b.sections[1].steps[0].fasteners.torque.value = 1476),
      'value',
    ],
    [
      'a torque above 2,000 N·m given in lbf·in',
      (b) => (b.sections[1].steps[0].fasteners.torque = { value: 17_702, unit: 'lbf-in' }),
      'value',
    ],
    ['passes not rising', (b) => (b.sections[1].steps[0].fasteners.passesPercent = [70, 30, 100]), 'passesPercent'],
    [
      'passes not ending at 100',
      (b) => (b.sections[1].steps[0].fasteners.passesPercent = [30, 70, 90]),
      'passesPercent',
    ],
    ['an unknown unit', (b) => (b.sections[1].steps[0].fasteners.torque.unit = 'kgf-m'), 'unit'],
    ['a torque without its source', (b) => delete b.sections[1].steps[0].fasteners.torqueSource, 'torqueSource'],
    ['a tightening order of 2 bolts', (b) => (b.sections[1].steps[0].fasteners.count = 2), 'count'],
    ['a tightening order of 37 bolts', (b) => (b.sections[1].steps[0].fasteners.count = 37), 'count'],
    ['no name', (b) => (b.name = ''), 'name'],
  ];
  for (const [what, spoil, field] of BAD) {
    it(`refuses ${what} with 400 naming ${field}, and writes nothing`, async () => {
      const before = await procedureCount(team.chief);
      const body = procedureBody('Refused');
      spoil(body);
      const answer = await team.chief.post('/api/procedures', body);
      expect(answer.status).toBe(400);
      expect(Object.keys(answer.body.error.fields).join(' ')).toContain(field);
      expect(answer.body.error.message).toContain(field);
      expect(await procedureCount(team.chief)).toBe(before);
    });
  }

  it('accepts one fastener without a tightening order (a pinion nut) and up to 36 bolts with one', async () => {
    const body = procedureBody('Limits');
    (body as any).sections[1].steps[0].fasteners.count = 36;
    expect((await team.chief.post('/api/procedures', body)).status).toBe(201);
  });

  it('draws the tightening diagram as SVG with each bolt’s place in its own <text>', async () => {
    const made = await createProcedure(team.chief);
    const ids = stepIdsByTitle(made);
    const response = await team.viewer.request(
      `/api/procedures/${made.id}/steps/${ids['Ring gear bolts']}/diagram.svg?unit=lbf-ft`,
    );
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toMatch(/^image\/svg\+xml/);
    const svg = await response.text();
    const places = [...svg.matchAll(/<text class="bolt-place" data-bolt="(\d+)"[^>]*>(\d+)<\/text>/g)].map((m) => [
      Number(m[1]),
      Number(m[2]),
    ]);
    expect(places).toHaveLength(10);
    const order = [...places].sort((a, b) => a[1]! - b[1]!).map((p) => p[0]);
    expect(order).toEqual(TEN_BOLTS);
    expect(svg).toContain('Pass 1: 30 % (16.5 lbf·ft)');
    const notes = [...svg.matchAll(/<text class="note">(.*?)<\/text>/g)].map((m) =>
      m[1]!.replace(/<tspan[^>]*>([^<]*)<\/tspan>/g, '$1 ').trim(),
    );
    expect(notes).toContain(
      'Follow the part maker’s figures, sequence and passes; Lashline never supplies a torque figure.',
    );
    expect(notes.some((note) => note.startsWith('Final check pass'))).toBe(true);
    expect(
      (await team.viewer.request(`/api/procedures/${made.id}/steps/${ids['Pinion nut']}/diagram.svg`)).status,
    ).toBe(404);
  });

  it('keeps step photos re-encoded, without the camera’s metadata', async () => {
    const made = await createProcedure(team.chief);
    const ids = stepIdsByTitle(made);
    const path = `/api/procedures/${made.id}/steps/${ids['Ring gear bolts']}/photos`;
    const uploaded = await uploadStepPhoto(team.chief, path, await cameraJpeg(), 'image/jpeg');
    expect(uploaded.status).toBe(201);
    const { response, bytes } = await fetchPhoto(team.viewer, uploaded.body.url);
    expect(response.headers.get('content-type')).toBe('image/jpeg');
    for (const marker of METADATA_MARKERS) expect(bytes.includes(Buffer.from(marker, 'latin1'))).toBe(false);
    expect((await uploadStepPhoto(team.chief, path, Buffer.from('not an image at all'))).status).toBe(415);
    expect((await uploadStepPhoto(team.tech, path, await cameraJpeg(), 'image/jpeg')).status).toBe(403);
    expect((await team.viewer.get(`/api/procedures/${made.id}`)).body.photos).toHaveLength(1);
  });
});

describe('checklists', () => {
  it('needs an assembly or a gear set, of this team; technicians start them, viewers cannot', async () => {
    const made = await createProcedure(team.chief);
    const none = await team.tech.post('/api/checklists', { procedureId: made.id });
    expect(none.status).toBe(400);
    expect(none.body.error.fields).toHaveProperty('assemblyId');
    expect((await team.viewer.post('/api/checklists', { procedureId: made.id, assemblyId })).status).toBe(403);
    const stranger = await signedInClient(server.baseUrl, { team: 'Other Crew' });
    const theirs = await createProcedure(stranger.client);
    expect((await team.tech.post('/api/checklists', { procedureId: theirs.id, assemblyId })).status).toBe(404);
    const mine = await startChecklist(team.tech, { procedureId: made.id, gearSetId });
    expect((await stranger.client.get(`/api/checklists/${mine}`)).status).toBe(404);
    expect((await stranger.client.get(`/api/procedures/${made.id}`)).status).toBe(404);
    expect(
      (await patchStep(stranger.client, mine, stepIdsByTitle(made)['Drain the oil']!, { status: 'done' })).status,
    ).toBe(404);
  });

  it('records steps once per Idempotency-Key, marks bolts out of order as a deviation, refuses bad input', async () => {
    const made = await createProcedure(team.chief);
    const ids = stepIdsByTitle(made);
    const other = stepIdsByTitle(await createProcedure(team.chief));
    const id = await startChecklist(team.tech, { procedureId: made.id, assemblyId, gearSetId });
    const key = newKey();
    const body = {
      status: 'done',
      torqueApplied: [
        { pass: 1, value: 16.5, unit: 'lbf-ft' },
        { pass: 2, value: 38.5, unit: 'lbf-ft' },
        { pass: 3, value: 55, unit: 'lbf-ft' },
      ],
      boltsInOrder: [1, 6, 3, 8, 5, 10, 2, 7, 9, 4],
    };
    const first = await patchStep(team.tech, id, ids['Ring gear bolts']!, body, key);
    expect(first.status).toBe(200);
    expect(first.body.step).toMatchObject({ status: 'done', orderDeviation: true, boltsInOrder: body.boltsInOrder });
    const again = await patchStep(team.tech, id, ids['Ring gear bolts']!, body, key);
    expect(again.body.replayed).toBe(true);
    const trail = (await team.chief.get(`/api/audit?recordType=checklist&recordId=${id}`)).body.items;
    expect(trail.filter((e: { action: string }) => e.action === 'step-change')).toHaveLength(1);
    const inOrder = await patchStep(team.tech, id, ids['Ring gear bolts']!, { ...body, boltsInOrder: TEN_BOLTS });
    expect(inOrder.body.step.orderDeviation).toBe(false);

    const refusals: [unknown, string, string?][] = [
      [{ ...body, boltsInOrder: [1, 2, 3] }, 'boltsInOrder'],
      [{ ...body, boltsInOrder: [1, 1, 3, 8, 5, 10, 2, 7, 4, 9] }, 'boltsInOrder'],
      [{ status: 'skipped' }, 'reason'],
      [{ status: 'done', torqueApplied: [{ pass: 4, value: 10, unit: 'lbf-ft' }] }, 'torqueApplied'],
      [{ status: 'done', torqueApplied: [{ pass: 1, value: 3000, unit: 'N-m' }] }, 'torqueApplied.0.value'],
      [{ status: 'done', torqueApplied: [{ pass: 1, value: 10, unit: 'ft-lb' }] }, 'torqueApplied.0.unit'],
      [{ status: 'done' }, 'stepId', other['Drain the oil']],
    ];
    for (const [refused, field, stepId] of refusals) {
      const answer = await patchStep(team.tech, id, stepId ?? ids['Ring gear bolts']!, refused);
      expect(answer.status, JSON.stringify(refused)).toBe(400);
      expect(Object.keys(answer.body.error.fields)).toContain(field);
    }
    const stored = (await team.tech.get(`/api/checklists/${id}`)).body.steps[ids['Ring gear bolts']!];
    expect(stored.boltsInOrder).toEqual(TEN_BOLTS);
  });

  it('merges two tablets: different steps both stay; on one step the later change wins and the audit keeps both', async () => {
    const made = await createProcedure(team.chief);
    const ids = stepIdsByTitle(made);
    const id = await startChecklist(team.tech, { procedureId: made.id, assemblyId });
    const tabletA = team.tech;
    const tabletB = team.chief;
    await patchStep(tabletA, id, ids['Drain the oil']!, { status: 'done', at: '2026-06-01T10:00:00Z' });
    await patchStep(tabletB, id, ids['Close up']!, { status: 'done', note: 'B', at: '2026-06-01T10:00:30Z' });
    // B's change was made later but arrives first; A's earlier change arrives after it and loses.
    await patchStep(tabletB, id, ids['Measure backlash']!, {
      status: 'done',
      value: 0.25,
      valueUnit: 'mm',
      at: '2026-06-01T10:05:00Z',
    });
    const late = await patchStep(tabletA, id, ids['Measure backlash']!, {
      status: 'done',
      value: 0.2,
      valueUnit: 'mm',
      at: '2026-06-01T10:04:00Z',
    });
    expect(late.body.applied).toBe(false);
    const checklist = (await team.tech.get(`/api/checklists/${id}`)).body;
    expect(checklist.steps[ids['Drain the oil']!].status).toBe('done');
    expect(checklist.steps[ids['Close up']!].note).toBe('B');
    expect(checklist.steps[ids['Measure backlash']!].value).toBe(0.25);
    const trail = (await team.chief.get(`/api/audit?recordType=checklist&recordId=${id}`)).body.items;
    const values = trail
      .filter((e: { after: { stepId?: string } }) => e.after?.stepId === ids['Measure backlash'])
      .map((e: { after: { value: number } }) => e.after.value)
      .sort();
    expect(values).toEqual([0.2, 0.25]);
  });

  it('completes only with every step done or skipped, then a crew chief signs off; after that only crew chiefs change it', async () => {
    const made = await createProcedure(team.chief);
    const ids = stepIdsByTitle(made);
    const id = await startChecklist(team.tech, { procedureId: made.id, assemblyId, gearSetId });
    await patchStep(team.tech, id, ids['Drain the oil']!, { status: 'done' });
    const early = await team.tech.post(`/api/checklists/${id}/complete`);
    expect(early.status).toBe(409);
    expect(early.body.error.message).toContain('Teardown › Check the turning torque');
    expect(early.body.error.message).toContain('Set-up › Close up');
    expect(early.body.error.message).not.toContain('Drain the oil');
    expect((await team.chief.post(`/api/checklists/${id}/sign-off`, {})).status).toBe(409);
    await patchStep(team.tech, id, ids['Check the turning torque']!, {
      status: 'done',
      value: 12,
      valueUnit: 'lbf-in',
    });
    await patchStep(team.tech, id, ids['Ring gear bolts']!, { status: 'done', boltsInOrder: TEN_BOLTS });
    await patchStep(team.tech, id, ids['Pinion nut']!, { status: 'skipped', reason: 'Pinion not disturbed' });
    await patchStep(team.tech, id, ids['Measure backlash']!, { status: 'done', value: 0.01, valueUnit: 'in' });
    await patchStep(team.tech, id, ids['Close up']!, { status: 'done', note: 'Closed' });
    const done = await team.tech.post(`/api/checklists/${id}/complete`);
    expect(done.status).toBe(200);
    expect(done.body.status).toBe('completed');
    expect((await team.tech.post(`/api/checklists/${id}/sign-off`, {})).status).toBe(403);
    const signed = await team.chief.post(`/api/checklists/${id}/sign-off`, { note: 'Good job' });
    expect(signed.status).toBe(200);
    expect(signed.body.signedOff.note).toBe('Good job');
    expect((await team.chief.post(`/api/checklists/${id}/sign-off`, {})).status).toBe(409);
    // Read-only now, except to crew chiefs and owners, with before and after in the audit trail.
    expect((await patchStep(team.tech, id, ids['Close up']!, { status: 'done', note: 'Changed' })).status).toBe(403);
    expect((await patchStep(team.chief, id, ids['Close up']!, { status: 'done', note: 'Corrected' })).status).toBe(200);
    const trail = (await team.owner.get(`/api/audit?recordType=checklist&recordId=${id}`)).body.items;
    const later = trail.find((e: { action: string }) => e.action === 'step-change-after-sign-off');
    expect(later.before.note).toBe('Closed');
    expect(later.after.note).toBe('Corrected');
    expect((await team.viewer.get(`/api/checklists/${id}`)).body.status).toBe('signed-off');
  });

  it('takes photos of a checklist step from technicians', async () => {
    const made = await createProcedure(team.chief);
    const id = await startChecklist(team.tech, { procedureId: made.id, assemblyId });
    const path = `/api/checklists/${id}/steps/${stepIdsByTitle(made)['Close up']}/photos`;
    const uploaded = await uploadStepPhoto(team.tech, path, await cameraJpeg(), 'image/jpeg');
    expect(uploaded.status).toBe(201);
    expect((await team.viewer.get(`/api/checklists/${id}`)).body.photos).toHaveLength(1);
    expect((await uploadStepPhoto(team.viewer, path, await cameraJpeg(), 'image/jpeg')).status).toBe(403);
  });
});

describe('sign-off in a team that requires a second factor', () => {
  /** The code an authenticator app would show now (RFC 6238, through otpauth). */
  const codeFor = (secret: string) =>
    new TOTP({ secret: Secret.fromBase32(secret), algorithm: 'SHA1', digits: 6, period: 30 }).generate();

  it('holds a crew chief without one back from signing off, as for decisions, until they turn it on', async () => {
    const owner = await signedInClient(server.baseUrl, { team: 'Strict Procedure Crew' });
    const chief = await joinByInvitation(server.baseUrl, smtp, owner.client, 'crew-chief');
    const tech = await joinByInvitation(server.baseUrl, smtp, owner.client, 'technician');
    const setId = (await owner.client.post('/api/gear-sets', { serial: 'SF-1', ringTeeth: 41, pinionTeeth: 10 })).body
      .id;
    const made = await createProcedure(owner.client);
    const id = await startChecklist(tech.client, { procedureId: made.id, gearSetId: setId });
    for (const stepId of Object.values(stepIdsByTitle(made)))
      expect((await patchStep(tech.client, id, stepId, { status: 'skipped', reason: 'Test run' })).status).toBe(200);
    expect((await tech.client.post(`/api/checklists/${id}/complete`)).status).toBe(200);

    const ownerSetup = (await owner.client.post('/api/account/second-factor')).body;
    await owner.client.post('/api/account/second-factor/confirm', { code: codeFor(ownerSetup.secret) });
    expect((await owner.client.put('/api/team/second-factor', { required: true })).status).toBe(200);
    const held = await chief.client.post(`/api/checklists/${id}/sign-off`, {});
    expect(held.status).toBe(403);
    expect(held.body.error.message).toContain('second factor');
    const setup = (await chief.client.post('/api/account/second-factor')).body;
    await chief.client.post('/api/account/second-factor/confirm', { code: codeFor(setup.secret) });
    const signed = await chief.client.post(`/api/checklists/${id}/sign-off`, {});
    expect(signed.status).toBe(200);
    expect(signed.body.status).toBe('signed-off');
  });
});
