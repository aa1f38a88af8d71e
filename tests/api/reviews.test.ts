import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient } from '../helpers/api-client';
import { draftBody, submitInspection } from '../helpers/inspections';
import { startServer, type RunningServer } from '../helpers/server';
import { SmtpFake } from '../helpers/smtp-fake';
import { makeTeamOfFour, type TeamOfFour } from '../helpers/team';
import { signedInClient } from '../helpers/api-client';

let server: RunningServer;
let smtp: SmtpFake;
let team: TeamOfFour;
let carId: string;
let assemblyId: string;
beforeAll(async () => {
  smtp = await SmtpFake.create();
  await smtp.start();
  server = await startServer({ env: { SMTP_PORT: String(smtp.port) } });
  team = await makeTeamOfFour(server.baseUrl, smtp, 'Review Crew');
  carId = (await team.chief.post('/api/cars', { name: 'Review car' })).body.id;
  assemblyId = (await team.chief.post('/api/assemblies', { serial: 'RV-1', name: 'Review rear end' })).body.id;
  await team.chief.post('/api/installations', { action: 'install', assemblyId, carId, at: '2026-01-01T00:00:00Z' });
});
afterAll(async () => {
  await server?.stop();
  await smtp?.stop();
});

let serial = 0;
async function spareSet(): Promise<string> {
  return (await team.chief.post('/api/gear-sets', { serial: `RV-S${++serial}`, ringTeeth: 41, pinionTeeth: 10 })).body
    .id;
}

describe('reviews and decisions', () => {
  it('opens a review with a snapshot, puts the set under review and tells the team', async () => {
    const setId = await spareSet();
    await submitInspection(
      team.tech,
      draftBody(setId, { unit: 'mm', resolution: '0.01mm', readings: [0.2, 0.18, 0.16, 0.18], runsAtInspection: 0 }),
    );
    const opened = await team.tech.post('/api/reviews', { gearSetId: setId });
    expect(opened.status).toBe(201);
    expect((await team.viewer.get(`/api/parts/${setId}`)).body.status).toBe('under-review');
    const review = (await team.chief.get(`/api/reviews/${opened.body.id}`)).body;
    expect(review.snapshot.analysis.inspectionCount).toBe(1);
    expect(review.snapshot.gearSet.id).toBe(setId);
    const mail = await smtp.waitFor(
      (m) => m.subject.includes('opened a review') && m.text.includes(`/reviews/${opened.body.id}`),
    );
    expect(mail.text).toContain('Stop these notices (no sign-in needed)');
    expect((await team.tech.post('/api/reviews', { gearSetId: setId })).status).toBe(409);
  });

  it('keeps the snapshot as it was after a new inspection', async () => {
    const setId = await spareSet();
    await submitInspection(team.tech, draftBody(setId, { runsAtInspection: 0 }));
    const { id } = (await team.tech.post('/api/reviews', { gearSetId: setId })).body;
    const before = (await team.chief.get(`/api/reviews/${id}`)).body.snapshot;
    await submitInspection(
      team.tech,
      draftBody(setId, {
        runsAtInspection: 5,
        inspectedAt: '2026-07-01T12:00:00Z',
        readings: [0.009, 0.009, 0.009, 0.009],
      }),
    );
    const after = (await team.chief.get(`/api/reviews/${id}`)).body.snapshot;
    expect(after).toEqual(before);
    expect((await team.chief.get(`/api/gear-sets/${setId}/analysis`)).body.inspectionCount).toBe(2);
  });

  it('lets a technician comment but not decide; a mention mails the member', async () => {
    const setId = await spareSet();
    const { id } = (await team.tech.post('/api/reviews', { gearSetId: setId })).body;
    const account = (await team.viewer.get('/api/account')).body;
    const handle = account.email.split('@')[0];
    const comment = await team.tech.post(`/api/reviews/${id}/comments`, {
      body: `Drive side looks heavy at the heel.\n@${handle} can you pull the photos?`,
    });
    expect(comment.status).toBe(201);
    const mail = await smtp.waitFor((m) => m.to.includes(account.email) && m.subject.includes('mentioned you'));
    expect(mail.text).toContain('> Drive side looks heavy at the heel.');
    expect((await team.viewer.post(`/api/reviews/${id}/comments`, { body: 'viewers read' })).status).toBe(403);
    const refused = await team.tech.post(`/api/reviews/${id}/decision`, { decision: 'retire', reason: 'Heat damage' });
    expect(refused.status).toBe(403);
    expect((await team.viewer.get(`/api/parts/${setId}`)).body.status).toBe('under-review');
  });

  it('keeps a set in service with a re-inspection after N runs, and reminds the team when the run log reaches it', async () => {
    const setId = await spareSet();
    await team.chief.post('/api/installations', {
      action: 'install',
      partId: setId,
      assemblyId,
      at: '2026-02-01T00:00:00Z',
    });
    const { id } = (await team.tech.post('/api/reviews', { gearSetId: setId })).body;
    const decided = await team.chief.post(`/api/reviews/${id}/decision`, {
      decision: 'keep',
      reason: 'Within the band',
      reinspectAfterRuns: 2,
    });
    expect(decided.status).toBe(200);
    expect(decided.body).toMatchObject({ status: 'decided', decision: 'keep', reinspectAtRuns: 2 });
    expect((await team.viewer.get(`/api/parts/${setId}`)).body.status).toBe('in-service');
    const decisionMail = await smtp.waitFor(
      (m) => m.subject.includes('Decision on gear set') && m.subject.includes('Keep in service'),
    );
    // The set's state in words, never the stored value.
    expect(decisionMail.text).toContain('The set is now: in service');
    expect(decisionMail.text).not.toMatch(/in-service/);
    await team.tech.post('/api/runs', { carId, at: '2026-02-02T10:00:00Z' });
    expect(smtp.received.filter((m) => m.subject.includes('Re-inspection due'))).toHaveLength(0);
    await team.tech.post('/api/runs', { carId, at: '2026-02-02T11:00:00Z' });
    const due = await smtp.waitFor((m) => m.subject.includes('Re-inspection due'));
    expect(due.text).toContain('Decision: Keep in service — re-inspect after 2 runs');
    await team.tech.post('/api/runs', { carId, at: '2026-02-02T12:00:00Z' });
    await new Promise((r) => setTimeout(r, 2500));
    const ownerEmail = (await team.owner.get('/api/account')).body.email;
    expect(
      smtp.received.filter((m) => m.subject.includes('Re-inspection due') && m.to.includes(ownerEmail)),
    ).toHaveLength(1);
    expect((await team.chief.post(`/api/reviews/${id}/decision`, { decision: 'retire', reason: 'Other' })).status).toBe(
      409,
    );
    await team.chief.post('/api/installations', { action: 'remove', partId: setId, at: '2026-02-03T00:00:00Z' });
  });

  it('retires a set: status retired, out of its assembly, history kept', async () => {
    const setId = await spareSet();
    await team.chief.post('/api/installations', {
      action: 'install',
      partId: setId,
      assemblyId,
      at: '2026-03-01T00:00:00Z',
    });
    const { id } = (await team.tech.post('/api/reviews', { gearSetId: setId })).body;
    const decided = await team.chief.post(`/api/reviews/${id}/decision`, {
      decision: 'retire',
      reason: 'Spalling or pitting on the teeth',
      notes: 'Three teeth at the heel.',
    });
    expect(decided.status).toBe(200);
    const set = (await team.viewer.get(`/api/parts/${setId}`)).body;
    expect(set.status).toBe('retired');
    expect(set.location).toBeNull();
    const history = (await team.viewer.get(`/api/installations?subjectId=${setId}`)).body.items;
    expect(history.map((e: { action: string }) => e.action)).toEqual(['remove', 'install']);
    const report = (await team.viewer.get('/api/reports/retirements?from=2020-01-01&to=2100-01-01')).body;
    const row = report.retired.find((r: { gearSetId: string }) => r.gearSetId === setId);
    expect(row).toMatchObject({ reason: 'Spalling or pitting on the teeth', early: true, lifeLimitRuns: 50 });
    const csv = await team.viewer.request('/api/reports/retirements?format=csv');
    expect(csv.headers.get('content-type')).toContain('text/csv');
    expect(await csv.text()).toMatch(
      /^gear_set,retired_at,runs_at_retirement,life_limit_runs,share_of_life,early,reason,notes\n/,
    );
  });

  it('re-shims: the set stays where it is and a re-inspection is set', async () => {
    const setId = await spareSet();
    const { id } = (await team.tech.post('/api/reviews', { gearSetId: setId })).body;
    const decided = await team.owner.post(`/api/reviews/${id}/decision`, {
      decision: 'reshim',
      reason: 'Spread over the limit',
      reinspectAfterRuns: 4,
    });
    expect(decided.status).toBe(200);
    expect((await team.viewer.get(`/api/parts/${setId}`)).body.status).toBe('spare');
  });

  it('refuses bad decisions by field name, and answers 404 for another team', async () => {
    const setId = await spareSet();
    const { id } = (await team.tech.post('/api/reviews', { gearSetId: setId })).body;
    for (const [body, field] of [
      [{ decision: 'scrap', reason: 'x' }, 'decision'],
      [{ decision: 'retire' }, 'reason'],
      [{ decision: 'keep', reason: 'ok' }, 'reinspectAfterRuns'],
      [{ decision: 'keep', reason: 'ok', reinspectAfterRuns: -1 }, 'reinspectAfterRuns'],
      [{ decision: 'keep', reason: 'ok', reinspectAfterRuns: 'soon' }, 'reinspectAfterRuns'],
    ] as const) {
      const answer = await team.chief.post(`/api/reviews/${id}/decision`, body);
      expect(answer.status, JSON.stringify(body)).toBe(400);
      expect(Object.keys(answer.body.error.fields)).toContain(field);
    }
    expect((await team.chief.post(`/api/reviews/${id}/comments`, { body: '' })).body.error.fields).toHaveProperty(
      'body',
    );
    expect((await team.viewer.get(`/api/parts/${setId}`)).body.status).toBe('under-review');
    const stranger = (await signedInClient(server.baseUrl, { team: 'Outsiders' })).client;
    expect((await stranger.get(`/api/reviews/${id}`)).status).toBe(404);
    expect((await stranger.post(`/api/reviews/${id}/comments`, { body: 'hello' })).status).toBe(404);
    expect((await stranger.post(`/api/reviews/${id}/decision`, { decision: 'retire', reason: 'x' })).status).toBe(404);
    expect((await stranger.post('/api/reviews', { gearSetId: setId })).status).toBe(404);
  });

  it('stops a kind of notice through the unsubscribe link, without signing in', async () => {
    const email = (await team.viewer.get('/api/account')).body.email;
    const setId = await spareSet();
    await team.tech.post('/api/reviews', { gearSetId: setId });
    const mail = await smtp.waitFor((m) => m.to.includes(email) && m.subject.includes(`RV-S${serial}`));
    const link = /Stop these notices \(no sign-in needed\): (\S+)/.exec(mail.text)![1]!;
    const anonymous = new ApiClient(server.baseUrl);
    const page = await anonymous.request(link.replace(server.baseUrl, ''));
    expect(page.status).toBe(200);
    const confirm = await anonymous.request(link.replace(server.baseUrl, ''), {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: '',
    });
    expect(await confirm.text()).toContain('Done: no more');
    expect((await team.viewer.get('/api/notifications/preferences')).body.muted).toEqual(['review-opened']);
    const next = await spareSet();
    await team.tech.post('/api/reviews', { gearSetId: next });
    await smtp.waitFor((m) => m.subject.includes(`RV-S${serial}`));
    await new Promise((r) => setTimeout(r, 1000));
    expect(smtp.received.filter((m) => m.to.includes(email) && m.subject.includes(`RV-S${serial}`))).toHaveLength(0);
    const forged = await anonymous.request(link.replace(server.baseUrl, '').slice(0, -3) + 'abc');
    expect(forged.status).toBe(400);
  });
});

describe('notices after runs and the outbox', () => {
  it('queues one life-reached notice when a run takes a set over its limit, not one per later run, and no near-limit notice beside it', async () => {
    const setId = (
      await team.chief.post('/api/gear-sets', { serial: 'RV-LIFE', ringTeeth: 41, pinionTeeth: 10, lifeLimitRuns: 2 })
    ).body.id;
    const car = (await team.chief.post('/api/cars', { name: 'Life car' })).body.id;
    const rear = (await team.chief.post('/api/assemblies', { serial: 'RV-LIFE-RE', name: 'Life rear end' })).body.id;
    await team.chief.post('/api/installations', {
      action: 'install',
      assemblyId: rear,
      carId: car,
      at: '2026-04-01T00:00:00Z',
    });
    await team.chief.post('/api/installations', {
      action: 'install',
      partId: setId,
      assemblyId: rear,
      at: '2026-04-01T00:00:00Z',
    });
    for (const hour of [10, 11, 12, 13])
      await team.tech.post('/api/runs', { carId: car, at: `2026-04-02T${hour}:00:00Z` });
    const ownerEmail = (await team.owner.get('/api/account')).body.email;
    await smtp.waitFor((m) => m.to.includes(ownerEmail) && m.subject.includes('RV-LIFE has reached its life limit'));
    await new Promise((r) => setTimeout(r, 2500));
    expect(
      smtp.received.filter(
        (m) => m.to.includes(ownerEmail) && m.subject.includes('RV-LIFE has reached its life limit'),
      ),
    ).toHaveLength(1);
    // It went past "near" and "reached" with the same run: only the notice that applies is sent.
    expect(
      smtp.received.filter((m) => m.to.includes(ownerEmail) && m.subject.includes('RV-LIFE is near its life limit')),
    ).toHaveLength(0);
  });

  it('tells the team a set is near its limit, then that it reached it, once each, as the runs come', async () => {
    const setId = (
      await team.chief.post('/api/gear-sets', { serial: 'RV-NEAR', ringTeeth: 41, pinionTeeth: 10, lifeLimitRuns: 10 })
    ).body.id;
    const car = (await team.chief.post('/api/cars', { name: 'Near car' })).body.id;
    await team.chief.post('/api/installations', {
      action: 'install',
      partId: setId,
      carId: car,
      at: '2026-04-01T00:00:00Z',
    });
    const ownerEmail = (await team.owner.get('/api/account')).body.email;
    const told = (words: string) =>
      smtp.received.filter((m) => m.to.includes(ownerEmail) && m.subject.includes(`RV-NEAR ${words}`));
    // With the default near share of a tenth (CP), 9 of 10 runs is near the limit.
    for (let run = 1; run <= 9; run += 1)
      await team.tech.post('/api/runs', { carId: car, at: `2026-04-02T10:${String(run).padStart(2, '0')}:00Z` });
    await smtp.waitFor((m) => m.to.includes(ownerEmail) && m.subject.includes('RV-NEAR is near its life limit'));
    expect(told('has reached its life limit')).toHaveLength(0);
    for (const minute of [30, 31]) await team.tech.post('/api/runs', { carId: car, at: `2026-04-02T10:${minute}:00Z` });
    await smtp.waitFor((m) => m.to.includes(ownerEmail) && m.subject.includes('RV-NEAR has reached its life limit'));
    await new Promise((r) => setTimeout(r, 2000));
    expect(told('is near its life limit')).toHaveLength(1);
    expect(told('has reached its life limit')).toHaveLength(1);
  });

  it('holds a message while the mail server is down and delivers it exactly once when it is back', async () => {
    await smtp.stop();
    const setId = await spareSet();
    await team.tech.post('/api/reviews', { gearSetId: setId });
    const subject = `RV-S${serial}`;
    await new Promise((r) => setTimeout(r, 3000));
    const outbox = (await team.owner.get('/api/outbox')).body.items.filter((m: { subject: string }) =>
      m.subject.includes(subject),
    );
    expect(outbox.length).toBeGreaterThan(0);
    expect(outbox.every((m: { status: string; attempts: number }) => m.status === 'queued' && m.attempts >= 1)).toBe(
      true,
    );
    await smtp.start();
    const ownerEmail = (await team.owner.get('/api/account')).body.email;
    await smtp.waitFor((m) => m.to.includes(ownerEmail) && m.subject.includes(subject), 30_000);
    await new Promise((r) => setTimeout(r, 3000));
    expect(smtp.received.filter((m) => m.to.includes(ownerEmail) && m.subject.includes(subject))).toHaveLength(1);
    const after = (await team.owner.get('/api/outbox')).body.items.filter((m: { subject: string }) =>
      m.subject.includes(subject),
    );
    expect(after.every((m: { status: string }) => m.status === 'sent')).toBe(true);
    expect((await team.chief.get('/api/outbox')).status).toBe(403);
  }, 60_000);
});

describe('records and exports', () => {
  it('shows the audit trail to crew chiefs and owners, filterable by record', async () => {
    const setId = await spareSet();
    await team.chief.patch(`/api/parts/${setId}`, { notes: 'audited change' });
    const trail = (await team.chief.get(`/api/audit?recordType=part&recordId=${setId}`)).body.items;
    expect(trail.map((e: { action: string }) => e.action)).toEqual(['update', 'create']);
    expect(trail[0].after.notes).toBe('audited change');
    expect((await team.tech.get('/api/audit')).status).toBe(403);
  });

  it('exports an inspection as CSV, one row per reading with units', async () => {
    const setId = await spareSet();
    const id = await submitInspection(
      team.tech,
      draftBody(setId, { readings: [0.008, 0.007, 0.006, 0.007, 0.008, 0.007] }),
    );
    const response = await team.viewer.request(`/api/exports/inspections/${id}.csv`);
    expect(response.headers.get('content-disposition')).toContain('attachment');
    const lines = (await response.text()).trim().split('\n');
    expect(lines[0]).toBe(
      'inspection_id,gear_set,inspected_at,runs_at_inspection,status,position,angle_deg,backlash,unit,backlash_mm,resolution',
    );
    expect(lines).toHaveLength(7);
    // 0.008 in = 0.2032 mm (NIST SP 811 (2008) App. B: 1 in = 25.4 mm).
    expect(lines[1]).toContain(',1,0,0.008,in,0.2032,0.001 in');
    expect(lines[2]).toContain(',2,60,');
  });

  it("exports a gear set's whole history as CSV", async () => {
    const setId = await spareSet();
    await team.chief.post('/api/installations', {
      action: 'install',
      partId: setId,
      assemblyId,
      at: '2026-05-01T00:00:00Z',
    });
    await submitInspection(team.tech, draftBody(setId, { inspectedAt: '2026-05-02T00:00:00Z' }));
    await team.chief.post('/api/installations', { action: 'remove', partId: setId, at: '2026-05-03T00:00:00Z' });
    const csv = await (await team.viewer.request(`/api/exports/gear-sets/${setId}.csv`)).text();
    const records = csv
      .trim()
      .split('\n')
      .slice(1)
      .map((line) => line.split(',')[1]);
    expect(records).toEqual(['installed', 'inspection', 'removed']);
  });
});

describe('the team archive', () => {
  it('round-trips into an empty database with every count equal', async () => {
    const response = await team.owner.request('/api/exports/team.json');
    expect(response.status).toBe(200);
    const archive = await response.json();
    expect((await team.chief.request('/api/exports/team.json')).status).toBe(403);
    const empty = await startServer();
    try {
      const importer = (await signedInClient(empty.baseUrl)).client;
      const imported = await importer.post('/api/imports/team', archive);
      expect(imported.status, JSON.stringify(imported.body)).toBe(201);
      const summary = async (client: ApiClient) => {
        const parts = (await client.get('/api/parts?limit=500')).body.items.map(
          (p: { id: string; serial: string; status: string; totalRuns: number; runsSinceInstall: number }) => [
            p.serial,
            p.status,
            p.totalRuns,
            p.runsSinceInstall,
          ],
        );
        let runs = 0;
        for (let cursor = ''; ;) {
          const page = (await client.get(`/api/runs?limit=500${cursor ? `&cursor=${cursor}` : ''}`)).body;
          runs += page.items.length;
          if (!page.nextCursor) break;
          cursor = page.nextCursor;
        }
        return {
          parts,
          runs,
          cars: (await client.get('/api/cars?limit=500')).body.items.length,
          assemblies: (await client.get('/api/assemblies?limit=500')).body.items.length,
          inspections: (await client.get('/api/inspections?limit=500')).body.items.length,
          reviews: (await client.get('/api/reviews?limit=500')).body.items.length,
          profiles: (await client.get('/api/tolerance-profiles')).body.items.length,
          installations: (await client.get('/api/installations?limit=500')).body.items.length,
        };
      };
      const original = await summary(team.owner);
      expect(original.runs).toBeGreaterThan(0);
      expect(original.inspections).toBeGreaterThan(0);
      expect(await summary(importer)).toEqual(original);
      // Every import gives its rows new ids, so the same archive again is a second team (the 409 it
      // used to answer, keyed on the archive's team id, told anyone whether such a team existed).
      expect((await importer.post('/api/imports/team', archive)).status).toBe(201);
    } finally {
      await empty.stop();
    }
  }, 60_000);

  it('refuses a file that is not an archive, naming the field', async () => {
    const answer = await team.owner.post('/api/imports/team', { format: 'spreadsheet' });
    expect(answer.status).toBe(400);
    expect(Object.keys(answer.body.error.fields)).toContain('format');
  });
});
