import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInClient, type ApiClient } from '../helpers/api-client';
import { draftBody, submitInspection } from '../helpers/inspections';
import { startServer, type RunningServer } from '../helpers/server';

/**
 * Issue 15 §5: text a team member typed comes out of the CSV exports so that a spreadsheet cannot
 * read it as a formula (OWASP's CSV-injection guidance): a cell starting with = + - @ tab or CR gets a
 * leading '. The schemas trim text, so a leading tab or CR never reaches a cell at all; the test still
 * sends them and checks no cell starts with one.
 */
const LEADS = ['=', '+', '-', '@', '\t', '\r'] as const;
const DANGEROUS_START = /^[=+\-@\t\r]/;

let server: RunningServer;
let owner: ApiClient;
beforeAll(async () => {
  server = await startServer();
  owner = (await signedInClient(server.baseUrl, { team: 'Formula Crew' })).client;
});
afterAll(async () => {
  await server?.stop();
});

async function csvCells(path: string): Promise<string[][]> {
  const response = await owner.request(path);
  expect(response.status).toBe(200);
  expect(response.headers.get('content-type')).toContain('text/csv');
  return Papa.parse<string[]>(await response.text()).data;
}

/** The cell holding `marker`, which must read as text: `'` + what was typed (or, for tab/CR, typed less its blank). */
function expectNeutralised(cells: string[][], marker: string, typed: string, lead: string): void {
  const cell = cells.flat().find((value) => value.includes(marker));
  expect(cell, `a cell holding ${marker}`).toBeDefined();
  expect(cell).not.toMatch(DANGEROUS_START);
  if (lead === '\t' || lead === '\r') expect(cell).toBe(typed.trim());
  else expect(cell).toBe(`'${typed}`);
}

describe('CSV exports neutralise formulas', () => {
  it.each(LEADS)('gear-set history, inspection and retirements exports, leading %j', async (lead) => {
    const tag = `L${LEADS.indexOf(lead)}`;
    const serial = `${lead}GS-${tag}`;
    const set = await owner.post('/api/gear-sets', { serial, ringTeeth: 41, pinionTeeth: 10 });
    expect(set.status).toBe(201);
    const setId = set.body.id as string;
    const inspectionNotes = `${lead}SUM(1+1)*inspect-${tag}`;
    const inspectionId = await submitInspection(
      owner,
      draftBody(setId, { notes: inspectionNotes, runsAtInspection: 3 }),
    );
    const review = await owner.post('/api/reviews', { gearSetId: setId });
    expect(review.status).toBe(201);
    const reason = `${lead}cmd|' /C calc'!A0 reason-${tag}`;
    const decisionNotes = `${lead}SUM(A1:A9) notes-${tag}`;
    const decided = await owner.post(`/api/reviews/${review.body.id}/decision`, {
      decision: 'retire',
      reason,
      notes: decisionNotes,
    });
    expect(decided.status).toBe(200);

    const history = await csvCells(`/api/exports/gear-sets/${setId}.csv`);
    expectNeutralised(history, `reason-${tag}`, reason, lead);
    expectNeutralised(history, `notes-${tag}`, decisionNotes, lead);
    expectNeutralised(history, `inspect-${tag}`, inspectionNotes, lead);

    const inspection = await csvCells(`/api/exports/inspections/${inspectionId}.csv`);
    expectNeutralised(inspection, `GS-${tag}`, serial, lead);

    const retirements = await csvCells('/api/reports/retirements?format=csv');
    expectNeutralised(retirements, `reason-${tag}`, reason, lead);
    expectNeutralised(retirements, `notes-${tag}`, decisionNotes, lead);
    expectNeutralised(retirements, `GS-${tag}`, serial, lead);

    // No cell of any export starts like a formula.
    for (const cell of [...history, ...inspection, ...retirements].flat()) expect(cell).not.toMatch(DANGEROUS_START);
  });

  it('keeps numbers as numbers', async () => {
    const set = await owner.post('/api/gear-sets', { serial: 'GS-numbers', ringTeeth: 41, pinionTeeth: 10 });
    const inspectionId = await submitInspection(owner, draftBody(set.body.id, { runsAtInspection: 7 }));
    const [header, ...rows] = await csvCells(`/api/exports/inspections/${inspectionId}.csv`);
    const column = (name: string) => header!.indexOf(name);
    expect(rows[0]![column('runs_at_inspection')]).toBe('7');
    expect(rows[0]![column('backlash')]).toBe('0.008');
  });
});
