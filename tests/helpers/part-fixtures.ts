import type { PartView } from '../../src/lib/server/register/parts';
import { listsToPlaceLookup } from '../../src/lib/register/place';

/** A part as listParts answers it, with runs left worked out from the limit and the total. */
export function makePart(fields: Partial<PartView> & Pick<PartView, 'id' | 'serial' | 'kind'>): PartView {
  const lifeLimitRuns = fields.lifeLimitRuns ?? null;
  const totalRuns = fields.totalRuns ?? 0;
  return {
    status: 'spare',
    lifeLimitRuns,
    runsSinceInstall: 0,
    totalRuns,
    runsLeft: lifeLimitRuns === null ? null : lifeLimitRuns - totalRuns,
    maker: null,
    model: null,
    material: null,
    notes: null,
    location: null,
    createdAt: '2026-03-01T08:00:00.000Z',
    ...fields,
  };
}

const inRe01 = {
  targetType: 'assembly' as const,
  targetId: 'a1',
  label: 'assembly RE-01 (Ember rear end)',
  since: '2026-05-12T08:00:00.000Z',
};

/** A fixed register in listParts order: runs left 6, −17, 50, 35, none, 29. */
export const PARTS: PartView[] = [
  makePart({
    id: 'p1',
    serial: 'GS-4101',
    kind: 'gear-set',
    status: 'in-service',
    lifeLimitRuns: 50,
    totalRuns: 44,
    runsSinceInstall: 44,
    location: inRe01,
  }),
  makePart({
    id: 'p2',
    serial: 'GS-4102',
    kind: 'gear-set',
    status: 'in-service',
    lifeLimitRuns: 50,
    totalRuns: 67,
    runsSinceInstall: 67,
  }),
  makePart({ id: 'p3', serial: 'GS-4104', kind: 'gear-set', status: 'spare', lifeLimitRuns: 50 }),
  makePart({
    id: 'p4',
    serial: 'SP-11',
    kind: 'spindle',
    status: 'in-service',
    lifeLimitRuns: 100,
    totalRuns: 65,
    runsSinceInstall: 65,
    location: inRe01,
  }),
  makePart({
    id: 'p5',
    serial: 'AX-11',
    kind: 'axle',
    status: 'in-service',
    totalRuns: 65,
    runsSinceInstall: 65,
    location: inRe01,
  }),
  makePart({ id: 'p6', serial: 'GS-4103', kind: 'gear-set', status: 'retired', lifeLimitRuns: 50, totalRuns: 21 }),
];

export const LOOKUP = listsToPlaceLookup(
  [{ id: 'a1', serial: 'RE-01', name: 'Ember rear end', carId: 'c1' }],
  [{ id: 'c1', name: '714 Ember' }],
);
