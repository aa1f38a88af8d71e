import { describe, expect, it } from 'vitest';
import { RUN_CSV_COLUMNS, checkRunRecords, parseRunCsv, recordToRunBody } from '../../../src/lib/register/run-import';
import { makeRunCsv } from '../../helpers/run-csv';

// Invented demo cars and meets. The columns are the README's ("Run CSV columns"): car, at, event, round, lane,
// elapsed_seconds, speed_mph, notes; car and at required; at an ISO 8601 date-time with offset.
const CARS = [
  { id: 'car-ember', name: '714 Ember' },
  { id: 'car-black', name: '22 Blackwater' },
];
const NOW = new Date('2026-05-03T18:00:00Z');
const HEADER = 'car,at,event,round,lane,elapsed_seconds,speed_mph,notes';

/** Parses and checks CSV text the way the import endpoint does: parse problems first, then row problems. */
function importCsv(text: string, now = NOW) {
  const parsed = parseRunCsv(text);
  const check = checkRunRecords(parsed.records, CARS, now);
  return { parsed, check, problems: [...parsed.problems, ...check.problems] };
}

describe('RUN_CSV_COLUMNS', () => {
  it('names the columns the README documents, in its order', () => {
    expect([...RUN_CSV_COLUMNS]).toEqual([
      'car',
      'at',
      'event',
      'round',
      'lane',
      'elapsed_seconds',
      'speed_mph',
      'notes',
    ]);
  });
});

describe('parseRunCsv', () => {
  it('reads each row under the header into a record keyed by column', () => {
    const { records, problems } = parseRunCsv(
      `${HEADER}\n714 Ember,2026-05-03T14:20:00Z,Dry Lake Spring Meet,Q1,left,5.962,248.31,\n`,
    );
    expect(problems).toEqual([]);
    expect(records).toEqual([
      {
        car: '714 Ember',
        at: '2026-05-03T14:20:00Z',
        event: 'Dry Lake Spring Meet',
        round: 'Q1',
        lane: 'left',
        elapsed_seconds: '5.962',
        speed_mph: '248.31',
        notes: '',
      },
    ]);
  });

  it('reads header names whatever their case, spacing or a leading byte-order mark', () => {
    const { records, problems } = parseRunCsv('\uFEFF Car , AT ,Speed_MPH\n714 Ember,2026-05-03T14:20:00Z,248\n');
    expect(problems).toEqual([]);
    expect(records).toEqual([{ car: '714 Ember', at: '2026-05-03T14:20:00Z', speed_mph: '248' }]);
  });

  it('takes a file with only car and at, the two required columns', () => {
    const { records, problems } = parseRunCsv('car,at\n22 Blackwater,2026-05-03T14:28:00Z\n');
    expect(problems).toEqual([]);
    expect(records).toHaveLength(1);
  });

  it('keeps a quoted note with a comma and a line break in one cell', () => {
    const { records, problems } = parseRunCsv('car,at,notes\n714 Ember,2026-05-03T14:20:00Z,"shake, then\nlift"\n');
    expect(problems).toEqual([]);
    expect(records[0]?.notes).toBe('shake, then\nlift');
  });

  it('skips blank lines', () => {
    const { records } = parseRunCsv(
      'car,at\n\n714 Ember,2026-05-03T14:20:00Z\n   \n22 Blackwater,2026-05-03T14:28:00Z\n\n',
    );
    expect(records.map((r) => r.car)).toEqual(['714 Ember', '22 Blackwater']);
  });

  it('gives no records and no problems for a header with no rows', () => {
    expect(parseRunCsv(`${HEADER}\n`)).toEqual({ records: [], problems: [] });
  });

  it('refuses a header without the at column on line 1, naming it', () => {
    const { problems } = parseRunCsv('car,event\n714 Ember,Dry Lake Spring Meet\n');
    expect(problems).toEqual([{ line: 1, fields: { header: 'The header needs the column at.' } }]);
  });

  it('names both required columns when neither is there', () => {
    const { problems } = parseRunCsv('vehicle,when\n714 Ember,2026-05-03T14:20:00Z\n');
    expect(problems[0]).toEqual({ line: 1, fields: { header: 'The header needs the columns car, at.' } });
  });

  it('refuses an empty file by its header, first of its problems', () => {
    const { records, problems } = parseRunCsv('');
    expect(records).toEqual([]);
    expect(problems[0]).toEqual({ line: 1, fields: { header: 'The header needs the columns car, at.' } });
  });

  it('names the line of a row with more or fewer cells than the header (header is line 1)', () => {
    const { problems } = parseRunCsv(
      'car,at,notes\n714 Ember,2026-05-03T14:20:00Z,ok,extra\n22 Blackwater,2026-05-03T14:28:00Z\n714 Ember,2026-05-03T15:00:00Z,ok\n',
    );
    expect(problems.map((p) => p.line)).toEqual([2, 3]);
    expect(problems.every((p) => typeof p.fields.file === 'string' && p.fields.file.length > 0)).toBe(true);
  });

  it('reads a large file of the documented shape without a problem', () => {
    const { records, problems } = parseRunCsv(makeRunCsv(['714 Ember', '22 Blackwater'], 500));
    expect(problems).toEqual([]);
    expect(records).toHaveLength(500);
    expect(Object.keys(records[0]!)).toEqual([...RUN_CSV_COLUMNS]);
  });
});

describe('recordToRunBody', () => {
  const ids = new Map(CARS.map((c) => [c.name.toLowerCase(), c.id]));

  it('turns a record into the runs endpoint’s body, with the car looked up and numbers read', () => {
    expect(
      recordToRunBody(
        {
          car: ' 714 EMBER ',
          at: ' 2026-05-03T14:20:00Z ',
          event: 'Dry Lake Spring Meet',
          round: 'Q1',
          lane: 'left',
          elapsed_seconds: ' 5.962 ',
          speed_mph: '248.31',
          notes: 'clean pass',
        },
        ids,
      ),
    ).toEqual({
      carId: 'car-ember',
      at: '2026-05-03T14:20:00Z',
      event: 'Dry Lake Spring Meet',
      round: 'Q1',
      lane: 'left',
      notes: 'clean pass',
      elapsedSeconds: 5.962,
      speedMph: 248.31,
    });
  });

  it('gives null for missing columns and blank numbers, and an empty car id for an unknown car', () => {
    expect(recordToRunBody({ car: '99 Nobody', at: '2026-05-03T14:20:00Z', elapsed_seconds: '  ' }, ids)).toEqual({
      carId: '',
      at: '2026-05-03T14:20:00Z',
      event: null,
      round: null,
      lane: null,
      notes: null,
      elapsedSeconds: null,
      speedMph: null,
    });
  });

  it('leaves a number it cannot read as the text, for the schema to refuse by name', () => {
    const body = recordToRunBody({ car: '714 Ember', at: 'x', elapsed_seconds: '5,962', speed_mph: 'fast' }, ids);
    expect(body.elapsedSeconds).toBe('5,962');
    expect(body.speedMph).toBe('fast');
  });
});

describe('checkRunRecords', () => {
  it('accepts good rows with their line numbers, the header being line 1', () => {
    const { check, problems } = importCsv(
      `${HEADER}\n714 Ember,2026-05-03T14:20:00Z,Dry Lake Spring Meet,Q1,left,5.962,248.31,\n22 Blackwater,2026-05-03T14:28:00Z,Dry Lake Spring Meet,Q1,right,6.402,220.87,Slight shake\n`,
    );
    expect(problems).toEqual([]);
    expect(check.valid.map((v) => v.line)).toEqual([2, 3]);
    expect(check.valid[0]?.run).toEqual({
      carId: 'car-ember',
      at: '2026-05-03T14:20:00Z',
      event: 'Dry Lake Spring Meet',
      round: 'Q1',
      lane: 'left',
      notes: null,
      elapsedSeconds: 5.962,
      speedMph: 248.31,
    });
    expect(check.valid[1]?.run).toMatchObject({ carId: 'car-black', notes: 'Slight shake', elapsedSeconds: 6.402 });
  });

  it('checks nothing and finds nothing for no records', () => {
    expect(checkRunRecords([], CARS, NOW)).toEqual({ valid: [], problems: [] });
  });

  it('finds the car by name whatever its case and surrounding spaces, on either side', () => {
    const cars = [{ id: 'car-x', name: '  Night Owl ' }];
    const { valid, problems } = checkRunRecords([{ car: 'NIGHT OWL', at: '2026-05-03T14:20:00Z' }], cars, NOW);
    expect(problems).toEqual([]);
    expect(valid[0]?.run.carId).toBe('car-x');
  });

  it('refuses a car that is not one of the team’s by name, and a row with no car', () => {
    const { problems } = checkRunRecords(
      [
        { car: '99 Nobody', at: '2026-05-03T14:20:00Z' },
        { car: '   ', at: '2026-05-03T14:20:00Z' },
      ],
      CARS,
      NOW,
    );
    expect(problems).toEqual([
      { line: 2, fields: { car: 'No car called “99 Nobody” in this team.' } },
      { line: 3, fields: { car: 'Name the car.' } },
    ]);
  });

  it('refuses a time that is not an ISO date-time with an offset', () => {
    const { problems } = checkRunRecords(
      [
        { car: '714 Ember', at: '03/05/2026 14:20' },
        { car: '714 Ember', at: '2026-05-03T14:20:00' },
        { car: '714 Ember', at: '' },
      ],
      CARS,
      NOW,
    );
    expect(problems.map((p) => [p.line, Object.keys(p.fields)])).toEqual([
      [2, ['at']],
      [3, ['at']],
      [4, ['at']],
    ]);
    expect(problems[0]?.fields.at).toContain('ISO date-time');
  });

  it('accepts a run logged up to a day ahead and refuses one just past a day', () => {
    // 24 h exactly ahead of NOW is allowed (time zones, clocks); one minute more is a typing slip.
    const { valid, problems } = checkRunRecords(
      [
        { car: '714 Ember', at: '2026-05-04T18:00:00Z' },
        { car: '714 Ember', at: '2026-05-04T18:01:00Z' },
        { car: '714 Ember', at: '2026-05-04T19:00:00+01:00' }, // the same instant as the first, in another zone
      ],
      CARS,
      NOW,
    );
    expect(valid.map((v) => v.line)).toEqual([2, 4]);
    expect(problems).toEqual([
      { line: 3, fields: { at: 'The run is more than a day in the future; check the date.' } },
    ]);
  });

  it('refuses elapsed time and speed that are not numbers, not above 0, or past their maximum', () => {
    const { problems } = checkRunRecords(
      [
        { car: '714 Ember', at: '2026-05-03T14:20:00Z', elapsed_seconds: 'quick', speed_mph: '5,962' },
        { car: '714 Ember', at: '2026-05-03T14:20:00Z', elapsed_seconds: '0', speed_mph: '-1' },
        { car: '714 Ember', at: '2026-05-03T14:20:00Z', elapsed_seconds: '600.5', speed_mph: '401' },
        { car: '714 Ember', at: '2026-05-03T14:20:00Z', elapsed_seconds: 'Infinity' },
      ],
      CARS,
      NOW,
    );
    expect(problems).toEqual([
      { line: 2, fields: { elapsedSeconds: 'Elapsed time must be a number.', speedMph: 'Speed must be a number.' } },
      {
        line: 3,
        fields: { elapsedSeconds: 'Elapsed time must be more than 0.', speedMph: 'Speed must be more than 0.' },
      },
      { line: 4, fields: { elapsedSeconds: 'Elapsed time: at most 600.', speedMph: 'Speed: at most 400.' } },
      { line: 5, fields: { elapsedSeconds: 'Elapsed time must be a number.' } },
    ]);
  });

  it('accepts elapsed time and speed exactly at their maximum', () => {
    const { valid } = checkRunRecords(
      [{ car: '714 Ember', at: '2026-05-03T14:20:00Z', elapsed_seconds: '600', speed_mph: '400' }],
      CARS,
      NOW,
    );
    expect(valid[0]?.run).toMatchObject({ elapsedSeconds: 600, speedMph: 400 });
  });

  it('refuses text over its length by field', () => {
    const { problems } = checkRunRecords(
      [{ car: '714 Ember', at: '2026-05-03T14:20:00Z', lane: 'x'.repeat(21), round: 'r'.repeat(61) }],
      CARS,
      NOW,
    );
    expect(problems).toEqual([
      { line: 2, fields: { round: 'Round: at most 60 characters.', lane: 'Lane: at most 20 characters.' } },
    ]);
  });

  it('lists every field at fault in one row, the car among them', () => {
    const { problems } = checkRunRecords(
      [{ car: '99 Nobody', at: 'yesterday', elapsed_seconds: 'quick', speed_mph: '0' }],
      CARS,
      NOW,
    );
    expect(problems).toHaveLength(1);
    expect(Object.keys(problems[0]!.fields).sort()).toEqual(['at', 'car', 'elapsedSeconds', 'speedMph']);
    expect(problems[0]?.fields.car).toBe('No car called “99 Nobody” in this team.');
    expect(problems[0]?.fields).not.toHaveProperty('carId');
  });

  it('splits a mixed file into the good rows and the bad, each on its own line', () => {
    const { check } = importCsv(
      [
        HEADER,
        '714 Ember,2026-05-03T14:20:00Z,Dry Lake Spring Meet,Q1,left,5.962,248.31,',
        '99 Nobody,2026-05-03T14:24:00Z,Dry Lake Spring Meet,Q1,right,6.1,230,',
        '22 Blackwater,2026-05-03T14:28:00Z,Dry Lake Spring Meet,Q1,right,6.402,220.87,',
        '22 Blackwater,not a time,Dry Lake Spring Meet,Q2,left,6.377,222.14,',
      ].join('\n'),
    );
    expect(check.valid.map((v) => v.line)).toEqual([2, 4]);
    expect(check.problems.map((p) => [p.line, Object.keys(p.fields)])).toEqual([
      [3, ['car']],
      [5, ['at']],
    ]);
  });

  it('numbers lines from the first line it is given, for a file checked in chunks', () => {
    const { valid, problems } = checkRunRecords(
      [
        { car: '714 Ember', at: '2026-05-03T14:20:00Z' },
        { car: '99 Nobody', at: '2026-05-03T14:20:00Z' },
      ],
      CARS,
      NOW,
      1002,
    );
    expect(valid[0]?.line).toBe(1002);
    expect(problems[0]?.line).toBe(1003);
  });

  it('counts records, not blank lines: a bad row after a blank line is named by its row number', () => {
    // Line 1 header, line 2 a good row, a blank line, then the bad row: the second record, so line 3.
    const { problems } = importCsv('car,at\n714 Ember,2026-05-03T14:20:00Z\n\n714 Ember,not a time\n');
    expect(problems.map((p) => p.line)).toEqual([3]);
  });

  it('reports a date more than a day ahead even when the car is unknown', () => {
    const { problems } = checkRunRecords([{ car: '99 Nobody', at: '2026-06-03T14:20:00Z' }], CARS, NOW);
    expect(Object.keys(problems[0]!.fields).sort()).toEqual(['at', 'car']);
  });
});
