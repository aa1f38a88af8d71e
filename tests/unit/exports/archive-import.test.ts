import { describe, expect, it } from 'vitest';
import {
  ARCHIVE_TABLES,
  planArchiveImport,
  type ArchiveTable,
  type Row,
} from '../../../src/lib/exports/archive-import';
import { remapJson, withoutStorageKeys } from '../../../src/lib/exports/archive-json';
import { choosePhotosWithin } from '../../../src/lib/exports/archive-photos';

function archive(rows: Partial<Record<ArchiveTable, Row[]>>): Record<ArchiveTable, Row[]> {
  return {
    ...(Object.fromEntries(ARCHIVE_TABLES.map((t) => [t, [] as Row[]])) as Record<ArchiveTable, Row[]>),
    ...rows,
  };
}

function context() {
  let n = 0;
  return {
    teamId: 'team-new',
    people: new Map([['p1', 'user-1']]),
    newId: () => `new-${(n += 1)}`,
    now: new Date('2026-06-01T00:00:00Z'),
  };
}

const car = { id: 'c1', name: 'Dragster' };
const set = { id: 'g1', kind: 'gear-set', serial: 'G-1', status: 'spare', ringTeeth: 41, pinionTeeth: 10 };
const event = (id: string, seq: unknown, at: string) => ({
  id,
  seq,
  action: 'install',
  subjectType: 'part',
  subjectId: 'g1',
  targetType: 'car',
  targetId: 'c1',
  at,
});

describe('planArchiveImport', () => {
  it('gives every row a new id and the new team, and maps references inside the archive', () => {
    const planned = planArchiveImport(
      archive({
        cars: [car],
        parts: [set],
        runs: [{ id: 'r1', carId: 'c1', at: '2026-05-01T10:00:00Z', recordedBy: 'p1' }],
      }),
      context(),
    );
    if (!planned.ok) throw new Error(JSON.stringify(planned.problems));
    const [newCar] = planned.plan.rows.cars;
    const [run] = planned.plan.rows.runs;
    expect(newCar).toMatchObject({ teamId: 'team-new', name: 'Dragster' });
    expect(newCar!.id).not.toBe('c1');
    expect(run).toMatchObject({ carId: newCar!.id, teamId: 'team-new', recordedBy: 'user-1' });
  });

  it('reports a reference outside the archive by table, row and field', () => {
    const planned = planArchiveImport(
      archive({ cars: [car], runs: [{ id: 'r1', carId: 'someone-elses-car', at: '2026-05-01T10:00:00Z' }] }),
      context(),
    );
    expect(planned.ok).toBe(false);
    if (planned.ok) return;
    expect(planned.problems).toContainEqual(expect.objectContaining({ table: 'runs', row: 0, field: 'carId' }));
  });

  it('keeps the order of the events without keeping their sequence numbers', () => {
    const planned = planArchiveImport(
      archive({
        cars: [car],
        parts: [set],
        installationEvents: [event('e2', 9e18, '2026-02-01T00:00:00Z'), event('e1', 3, '2026-01-01T00:00:00Z')],
      }),
      context(),
    );
    if (!planned.ok) throw new Error(JSON.stringify(planned.problems));
    const events = planned.plan.rows.installationEvents;
    expect(events.map((e) => (e.at as Date).toISOString().slice(0, 7))).toEqual(['2026-01', '2026-02']);
    expect(events.every((e) => !('seq' in e))).toBe(true);
  });

  it('refuses an event more than a day ahead', () => {
    const planned = planArchiveImport(
      archive({ cars: [car], parts: [set], installationEvents: [event('e1', 1, '2099-01-01T00:00:00Z')] }),
      context(),
    );
    expect(planned.ok).toBe(false);
    if (!planned.ok) expect(planned.problems[0]).toMatchObject({ table: 'installationEvents', field: 'at' });
  });

  it('drops unknown columns', () => {
    const planned = planArchiveImport(archive({ cars: [{ ...car, teamId: 'other', storageKey: 'x.jpg' }] }), context());
    if (!planned.ok) throw new Error(JSON.stringify(planned.problems));
    expect(Object.keys(planned.plan.rows.cars[0]!).sort()).toEqual(
      ['carClass', 'createdAt', 'id', 'name', 'notes', 'teamId'].sort(),
    );
  });
});

describe('archive JSON', () => {
  it('takes storage keys out at any depth, and keeps times as ISO text', () => {
    expect(
      withoutStorageKeys({ row: { id: 'p', storageKey: 'a.jpg', thumbnailKey: 'b.jpg', at: new Date(0) } }),
    ).toEqual({ row: { id: 'p', at: '1970-01-01T00:00:00.000Z' } });
  });

  it('maps ids and photo addresses, and empties the address of a photo not imported', () => {
    const ids = new Map([
      ['set-old', 'set-new'],
      ['ph-old', 'ph-new'],
    ]);
    expect(
      remapJson({ gearSet: { id: 'set-old' }, photos: ['/api/photos/ph-old/thumbnail', '/api/photos/gone'] }, ids),
    ).toEqual({ gearSet: { id: 'set-new' }, photos: ['/api/photos/ph-new/thumbnail', ''] });
  });
});

describe('choosePhotosWithin', () => {
  it('takes photos oldest first while the archive stays within its limit, leaving out those that would pass it', () => {
    // base64 of 300 bytes is 400 characters, +12 for the field: 412; of 600 bytes 812; of 100 bytes 148.
    expect(choosePhotosWithin(1000, [300, 600, 100], 1600)).toEqual([true, false, true]);
    expect(choosePhotosWithin(1000, [300], 1411)).toEqual([false]);
    expect(choosePhotosWithin(1000, [300], 1412)).toEqual([true]);
  });
});
