import { describe, expect, it } from 'vitest';
import {
  filterBoardRows,
  findProjectedRunsLeft,
  readBoardFilter,
  sortBoardRows,
  splitSpares,
  toBoardRow,
  type BoardAnalysis,
  type BoardGearSet,
} from '../../../src/lib/board/board';

const CAR = { id: 'car-1', name: '714 Ember' };
const carOf = (assemblyId: string) => (assemblyId === 'asm-1' ? CAR : null);
const carName = (carId: string) => (carId === CAR.id ? CAR.name : null);

function set(serial: string, extra: Partial<BoardGearSet> = {}): BoardGearSet {
  return {
    id: serial.toLowerCase(),
    serial,
    status: 'in-service',
    ratioLabel: '4.10:1',
    totalRuns: 20,
    runsSinceInstall: 20,
    lifeLimitRuns: 50,
    location: { targetType: 'assembly', targetId: 'asm-1', label: 'assembly RE-01 (Ember rear end)' },
    ...extra,
  };
}

function analysis(
  action: 'keep' | 'watch' | 're-shim' | 'retire' | null,
  extra: Partial<BoardAnalysis> = {},
): BoardAnalysis {
  return {
    inspectionCount: action ? 3 : 0,
    latest: action
      ? { inspectedAt: '2026-10-26T16:00:00.000Z', summary: { verdicts: [{ measure: 'spread', verdict: 'in-band' }] } }
      : null,
    trends: [],
    recommendation: action
      ? { action, reasons: [{ code: 'x', message: `${action} because`, severity: 'info', action }] }
      : null,
    ...extra,
  };
}

describe('board rows', () => {
  it('finds the car of the assembly a set is in', () => {
    const row = toBoardRow(set('GS-1'), analysis('keep'), carOf, carName);
    expect(row.car).toEqual(CAR);
    expect(row.placeText).toBe('assembly RE-01 (Ember rear end) in 714 Ember');
    expect(toBoardRow(set('GS-2', { location: null }), null, carOf, carName).placeText).toBe('on the shelf');
  });

  it('takes the worst verdict of the latest inspection and names its measure', () => {
    const row = toBoardRow(
      set('GS-1'),
      analysis('watch', {
        latest: {
          inspectedAt: '2026-10-26T16:00:00.000Z',
          summary: {
            verdicts: [
              { measure: 'spread', verdict: 'in-band' },
              { measure: 'backlash-max-point', verdict: 'near-limit' },
            ],
          },
        },
      }),
      carOf,
      carName,
    );
    expect(row.verdict).toBe('near-limit');
    expect(row.verdictMeasure).toBe('backlash-max-point');
  });

  it('projects runs left as the nearest of the life limit and a trend crossing', () => {
    expect(
      findProjectedRunsLeft(
        { totalRuns: 44, lifeLimitRuns: 50 },
        { trends: [{ measure: 'backlash-mean', projection: { runsToLimit: 9.5 } }] },
      ),
    ).toEqual({ runs: 6, what: 'life limit' });
    expect(
      findProjectedRunsLeft(
        { totalRuns: 10, lifeLimitRuns: 50 },
        { trends: [{ measure: 'backlash-mean', projection: { runsToLimit: 9.5 } }] },
      ),
    ).toEqual({ runs: 9, what: 'mean backlash' });
    expect(
      findProjectedRunsLeft(
        { totalRuns: 10, lifeLimitRuns: null },
        { trends: [{ measure: 'spread', projection: { runsToLimit: null, reason: { code: 'already-past-limit' } } }] },
      ),
    ).toEqual({ runs: 0, what: 'spread past its limit' });
    expect(
      findProjectedRunsLeft(
        { totalRuns: 10, lifeLimitRuns: null },
        { trends: [{ measure: 'spread', projection: { runsToLimit: 2e16 } }] },
      ),
    ).toBeNull();
  });

  it('says retire for a set past its life that was never inspected', () => {
    const row = toBoardRow(set('GS-9', { totalRuns: 60 }), analysis(null), carOf, carName);
    expect(row.action).toBe('retire');
    expect(row.topReason).toMatch(/60 runs reach the life limit of 50/);
  });

  // The order issue 14 defines: a set in a car that was never inspected runs blind, so it comes
  // straight after re-shim; one in no car never inspected comes last.
  it('sorts retire > re-shim > never inspected in a car > watch > keep > never inspected in no car, then fewest runs left', () => {
    const rows = [
      toBoardRow(set('GS-A'), analysis('keep'), carOf, carName),
      toBoardRow(set('GS-B'), analysis(null), carOf, carName),
      toBoardRow(set('GS-C', { totalRuns: 45 }), analysis('watch'), carOf, carName),
      toBoardRow(set('GS-D'), analysis('retire'), carOf, carName),
      toBoardRow(set('GS-E', { totalRuns: 30 }), analysis('watch'), carOf, carName),
      toBoardRow(set('GS-F'), analysis('re-shim'), carOf, carName),
      toBoardRow(set('GS-G', { location: null }), analysis(null), carOf, carName),
    ];
    expect(sortBoardRows(rows).map((r) => r.serial)).toEqual(['GS-D', 'GS-F', 'GS-B', 'GS-C', 'GS-E', 'GS-A', 'GS-G']);
  });
});

describe('board filters and spares', () => {
  const rows = [
    toBoardRow(set('GS-1'), analysis('keep'), carOf, carName),
    toBoardRow(set('GS-2', { status: 'spare', location: null, totalRuns: 0 }), analysis(null), carOf, carName),
    toBoardRow(set('GS-3', { status: 'retired' }), analysis('retire'), carOf, carName),
    toBoardRow(set('GS-4', { status: 'spare', location: null, totalRuns: 50 }), analysis(null), carOf, carName),
    toBoardRow(set('GS-5', { status: 'spare', location: null, totalRuns: 5 }), analysis('re-shim'), carOf, carName),
  ];

  it('leaves retired and scrapped sets off and filters by car and status', () => {
    expect(filterBoardRows(rows, { car: null, status: null }).map((r) => r.serial)).toEqual([
      'GS-1',
      'GS-2',
      'GS-4',
      'GS-5',
    ]);
    expect(filterBoardRows(rows, { car: 'car-1', status: null }).map((r) => r.serial)).toEqual(['GS-1']);
    expect(filterBoardRows(rows, { car: 'none', status: 'spare' }).map((r) => r.serial)).toEqual([
      'GS-2',
      'GS-4',
      'GS-5',
    ]);
  });

  it('reads the filter leniently', () => {
    expect(readBoardFilter(new URLSearchParams('car=car-1&status=spare'), ['car-1'])).toEqual({
      car: 'car-1',
      status: 'spare',
    });
    expect(readBoardFilter(new URLSearchParams('car=other&status=retired'), ['car-1'])).toEqual({
      car: null,
      status: null,
    });
  });

  it('lists as ready only spares within their life that no inspection holds back', () => {
    const { ready, notReady } = splitSpares(filterBoardRows(rows, { car: null, status: null }));
    expect(ready.map((r) => r.serial)).toEqual(['GS-2']);
    expect(notReady.map((n) => [n.row.serial, n.why])).toEqual([
      ['GS-4', 'at or past its life limit'],
      ['GS-5', 'its last inspection says re-shim'],
    ]);
  });
});
