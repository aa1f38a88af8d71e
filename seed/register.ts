import { randomUUID } from 'node:crypto';
import type { Transaction } from '../src/db/client';
import { assemblies, cars, installationEvents, parts, runs } from '../src/db/schema';
import type { PartKind, PartStatus } from '../src/lib/register/kinds';
import { seededRandom } from './random';
import type { SeededPeople } from './people';

/**
 * The demo register: two cars, three rear-end assemblies, six gear sets across their lives and the
 * other parts, and a season of runs from March to November 2026. Invented throughout.
 */
export interface SeededRegister {
  carIds: Record<'ember' | 'blackwater', string>;
  assemblyIds: Record<'re01' | 're02' | 're03', string>;
  gearSetIds: Record<string, string>;
}

const day = (iso: string) => new Date(`${iso}T08:00:00Z`);

export async function seedRegister(tx: Transaction, people: SeededPeople): Promise<SeededRegister> {
  const { teamId } = people;
  const actorId = people.userIds['crew-chief'];
  const carIds = { ember: randomUUID(), blackwater: randomUUID() };
  await tx.insert(cars).values([
    { id: carIds.ember, teamId, name: '714 Ember', carClass: 'Doorslammer', notes: 'Primary car.' },
    {
      id: carIds.blackwater,
      teamId,
      name: '22 Blackwater',
      carClass: 'Altered',
      notes: 'Second car, shares spares with 714.',
    },
  ]);
  const assemblyIds = { re01: randomUUID(), re02: randomUUID(), re03: randomUUID() };
  await tx.insert(assemblies).values([
    {
      id: assemblyIds.re01,
      teamId,
      serial: 'RE-01',
      name: 'Ember rear end',
      housing: 'Fabricated housing, spool',
    },
    {
      id: assemblyIds.re02,
      teamId,
      serial: 'RE-02',
      name: 'Blackwater rear end',
      housing: 'Fabricated housing, spool',
    },
    {
      id: assemblyIds.re03,
      teamId,
      serial: 'RE-03',
      name: 'Spare rear end',
      housing: 'Fabricated housing, spool',
    },
  ]);

  const part = async (
    kind: PartKind,
    serial: string,
    status: PartStatus,
    extra: Partial<typeof parts.$inferInsert> = {},
  ) => {
    const id = randomUUID();
    const lifeLimitRuns = kind === 'gear-set' ? 50 : kind === 'spindle' ? 100 : null;
    await tx.insert(parts).values({ id, teamId, kind, serial, status, lifeLimitRuns, ...extra });
    return id;
  };
  const gear = (serial: string, status: PartStatus, ringTeeth: number, pinionTeeth: number, notes: string) =>
    part('gear-set', serial, status, {
      ringTeeth,
      pinionTeeth,
      maker: 'Kestrel Gearworks',
      model: 'KG-95L',
      material: '9310 steel',
      notes,
    });
  const gearSetIds: Record<string, string> = {
    'GS-4101': await gear('GS-4101', 'in-service', 40, 9, 'Went into RE-01 in May after GS-4103 came out.'),
    'GS-4102': await gear('GS-4102', 'in-service', 41, 10, 'Blackwater set all season.'),
    // Retired by the demo review in seed/reviews.ts.
    'GS-4103': await gear('GS-4103', 'spare', 40, 9, 'Retired early after spalling on the drive side.'),
    'GS-4104': await gear('GS-4104', 'spare', 41, 10, 'New, on the shelf.'),
    'GS-4105': await gear('GS-4105', 'spare', 43, 10, 'Short-track ratio, never run.'),
    'GS-4106': await gear('GS-4106', 'in-service', 41, 10, 'Lives in the spare rear end; ran one event in Blackwater.'),
  };
  const other = {
    sp11: await part('spindle', 'SP-11', 'in-service', { material: 'Aluminium' }),
    sp12: await part('spindle', 'SP-12', 'in-service', { material: 'Aluminium' }),
    ax11: await part('axle', 'AX-11', 'in-service', { material: '300M' }),
    ax12: await part('axle', 'AX-12', 'in-service', { material: '300M' }),
    br11: await part('bearing', 'BR-11', 'in-service', { notes: 'Pinion head bearing' }),
    sp21: await part('spindle', 'SP-21', 'in-service', { material: 'Aluminium' }),
    ax21: await part('axle', 'AX-21', 'in-service', { material: '300M' }),
    hb31: await part('hub', 'HB-31', 'spare'),
    sp31: await part('spindle', 'SP-31', 'spare', { material: 'Aluminium' }),
  };

  const event = async (
    action: 'install' | 'remove',
    subjectType: 'part' | 'assembly',
    subjectId: string,
    targetType: 'assembly' | 'car',
    targetId: string,
    at: Date,
  ) => {
    await tx
      .insert(installationEvents)
      .values({ id: randomUUID(), teamId, action, subjectType, subjectId, targetType, targetId, at, actorId });
  };
  const start = day('2026-03-01');
  await event('install', 'assembly', assemblyIds.re01, 'car', carIds.ember, start);
  await event('install', 'assembly', assemblyIds.re02, 'car', carIds.blackwater, start);
  await event('install', 'part', gearSetIds['GS-4103']!, 'assembly', assemblyIds.re01, start);
  await event('install', 'part', gearSetIds['GS-4102']!, 'assembly', assemblyIds.re02, start);
  await event('install', 'part', gearSetIds['GS-4106']!, 'assembly', assemblyIds.re03, start);
  for (const id of [other.sp11, other.sp12, other.ax11, other.ax12, other.br11])
    await event('install', 'part', id, 'assembly', assemblyIds.re01, start);
  for (const id of [other.sp21, other.ax21]) await event('install', 'part', id, 'assembly', assemblyIds.re02, start);
  // May: GS-4103 comes out of RE-01 early, GS-4101 goes in.
  await event('remove', 'part', gearSetIds['GS-4103']!, 'assembly', assemblyIds.re01, day('2026-05-11'));
  await event('install', 'part', gearSetIds['GS-4101']!, 'assembly', assemblyIds.re01, day('2026-05-12'));
  // July: the spare rear end (with GS-4106) runs one event in Blackwater, then RE-02 goes back in.
  await event('remove', 'assembly', assemblyIds.re02, 'car', carIds.blackwater, day('2026-07-13'));
  await event('install', 'assembly', assemblyIds.re03, 'car', carIds.blackwater, day('2026-07-14'));
  await event('remove', 'assembly', assemblyIds.re03, 'car', carIds.blackwater, day('2026-07-20'));
  await event('install', 'assembly', assemblyIds.re02, 'car', carIds.blackwater, day('2026-07-21'));

  await tx.insert(runs).values(makeSeason(teamId, carIds, people.userIds.technician));
  return { carIds, assemblyIds, gearSetIds };
}

const EVENTS = [
  ['2026-03-07', 'Salt Basin Spring Opener'],
  ['2026-03-21', 'Redline Flats Shootout'],
  ['2026-04-04', 'Copper Mesa Nationals'],
  ['2026-04-18', 'Salt Basin Test & Tune'],
  ['2026-05-02', 'Ironwood Raceway Classic'],
  ['2026-05-16', 'Copper Mesa Summer Open'],
  ['2026-05-30', 'Redline Flats Night Heat'],
  ['2026-06-13', 'Ironwood Raceway Midseason'],
  ['2026-06-27', 'Salt Basin Heat Wave'],
  ['2026-07-18', 'Copper Mesa Shootout'],
  ['2026-08-01', 'Redline Flats Grudge Night'],
  ['2026-08-15', 'Ironwood Raceway Fall Preview'],
  ['2026-08-29', 'Salt Basin Labour Weekend'],
  ['2026-09-12', 'Copper Mesa Nationals II'],
  ['2026-09-26', 'Redline Flats Finals'],
  ['2026-10-10', 'Ironwood Raceway Season Closer'],
  ['2026-10-24', 'Salt Basin Test & Tune II'],
] as const;
const ROUNDS = ['Q1', 'Q2', 'Q3', 'E1', 'E2', 'Semi', 'Final'];

/** About a season of passes for both cars: qualifying and elimination rounds at each event. */
function makeSeason(
  teamId: string,
  carIds: SeededRegister['carIds'],
  technicianId: string,
): (typeof runs.$inferInsert)[] {
  const random = seededRandom(2026);
  const rows: (typeof runs.$inferInsert)[] = [];
  for (const [date, name] of EVENTS) {
    for (const [car, baseEt, baseMph] of [
      [carIds.ember, 5.92, 247],
      [carIds.blackwater, 6.35, 221],
    ] as const) {
      const passes = 3 + Math.floor(random() * 3);
      for (let i = 0; i < passes; i += 1) {
        const at = new Date(
          `${date}T${String(11 + i * 2).padStart(2, '0')}:${String(Math.floor(random() * 50) + 5).padStart(2, '0')}:00Z`,
        );
        rows.push({
          id: randomUUID(),
          teamId,
          carId: car,
          at,
          event: name,
          round: ROUNDS[i] ?? `R${i + 1}`,
          lane: random() < 0.5 ? 'left' : 'right',
          elapsedSeconds: Math.round((baseEt + random() * 0.25) * 1000) / 1000,
          speedMph: Math.round((baseMph + random() * 6) * 100) / 100,
          recordedBy: technicianId,
        });
      }
    }
  }
  return rows;
}
