import { randomUUID } from 'node:crypto';
import { write, type Transaction } from '../src/db/client';
import { cars, inspections, installationEvents, parts, reviewComments, reviews, runs } from '../src/db/schema';
import { draftToData } from '../src/lib/inspections/record';
import { inspectionDraftSchema } from '../src/lib/inspections/schemas';
import {
  analyseFromRows,
  profileOfSet,
  readProfileBook,
  readSubmittedBySet,
} from '../src/lib/server/inspections/read-analyses';
import { readPartViews } from '../src/lib/server/register/part-views';
import type { SeededPeople } from './people';
import type { SeededRegister } from './register';
import { seededRandom } from './random';

/**
 * A season's worth more of the demo team, for measuring how the screens hold up as data grows: a third
 * car, 100 more gear sets over the three seasons before the demo's, 20 inspections each (one set with
 * 200), 5,000 runs and 200 decided reviews with their comments. Invented like the demo, from a fixed
 * seed, so two machines build the same season. Rows are written straight through the schema (entering
 * 2,200 inspections through the API would take minutes); the reviews' snapshots are made by the same
 * read functions the server uses.
 */
export const SEASON = { sets: 100, inspectionsPerSet: 20, bigSetInspections: 200, runs: 5000, reviews: 200 } as const;

/** The serial of the set with 200 inspections (the benchmark's gear set page). */
export const SEASON_BIG_SET = 'GS-5001';

const FIRST_DAY = Date.parse('2023-03-01T08:00:00Z');
// Before the demo's own season starts (2026-03-01), so the demo's stories read as they always did.
const LAST_DAY = Date.parse('2026-02-20T08:00:00Z');
const CHUNK = 100;

const UNIT_PAIRS = [
  { lengthUnit: 'mm', torqueUnit: 'N-m' },
  { lengthUnit: 'mm', torqueUnit: 'lbf-in' },
  { lengthUnit: 'in', torqueUnit: 'lbf-in' },
  { lengthUnit: 'in', torqueUnit: 'N-m' },
] as const;

async function insertInChunks<T>(rows: T[], insert: (tx: Transaction, chunk: T[]) => Promise<unknown>): Promise<void> {
  for (let i = 0; i < rows.length; i += CHUNK) {
    const chunk = rows.slice(i, i + CHUNK);
    await write((tx) => insert(tx, chunk));
  }
}

interface Stint {
  gearSetId: string;
  serial: string;
  carId: string;
  from: number;
  to: number | null;
  runTimes: number[];
}

/** Adds the season to a database that holds the demo (call it right after `seedDemo`'s steps). */
export async function seedSeason(people: SeededPeople, register: SeededRegister): Promise<void> {
  const { teamId } = people;
  const random = seededRandom(5001);
  const chiefId = people.userIds['crew-chief'];
  const techId = people.userIds.technician;
  const sandpiper = randomUUID();
  await write((tx) =>
    tx.insert(cars).values({ id: sandpiper, teamId, name: '31 Sandpiper', carClass: 'Altered', notes: 'Test car.' }),
  );
  const carIds = [register.carIds.ember, register.carIds.blackwater, sandpiper];

  // Sets take turns in the cars: set i goes into car i % 3, each car's sets one after another.
  const stints: Stint[] = [];
  const setRows: (typeof parts.$inferInsert)[] = [];
  const perCar = carIds.map((_, c) => Array.from({ length: SEASON.sets }, (_, i) => i).filter((i) => i % 3 === c));
  for (const [c, indices] of perCar.entries()) {
    const span = (LAST_DAY - FIRST_DAY) / indices.length;
    for (const [k, i] of indices.entries()) {
      const serial = `GS-${5001 + i}`;
      const id = randomUUID();
      const last = k === indices.length - 1;
      // The last set of the test car is still in it; every other set came out at the end of its stint.
      const stillIn = last && c === 2;
      const lifeLimitRuns = [50, 80, 120, null][i % 4] ?? null;
      const status = stillIn ? 'in-service' : i % 10 === 9 ? 'retired' : i % 20 === 4 ? 'scrapped' : 'spare';
      setRows.push({
        id,
        teamId,
        kind: 'gear-set',
        serial,
        status,
        lifeLimitRuns,
        ringTeeth: [40, 41, 43][i % 3],
        pinionTeeth: [9, 10, 10][i % 3],
        maker: 'Kestrel Gearworks',
        model: 'KG-95L',
        material: '9310 steel',
        notes: `Season set ${k + 1} of ${indices.length} for its car.`,
      });
      const from = FIRST_DAY + k * span;
      stints.push({
        gearSetId: id,
        serial,
        carId: carIds[c]!,
        from,
        to: stillIn ? null : from + span - 3_600_000,
        runTimes: [],
      });
    }
  }

  // 5,000 runs, spread over the stints of each car.
  const runRows: (typeof runs.$inferInsert)[] = [];
  for (let n = 0; n < SEASON.runs; n += 1) {
    const stint = stints[n % stints.length]!;
    const end = stint.to ?? LAST_DAY;
    const at = Math.floor(stint.from + 3_600_000 + random() * (end - stint.from - 7_200_000));
    stint.runTimes.push(at);
    runRows.push({
      id: randomUUID(),
      teamId,
      carId: stint.carId,
      at: new Date(at),
      event: `Season event ${1 + Math.floor((at - FIRST_DAY) / (14 * 86_400_000))}`,
      round: ['Q1', 'Q2', 'Q3', 'E1', 'E2'][n % 5],
      lane: random() < 0.5 ? 'left' : 'right',
      elapsedSeconds: Math.round((5.9 + random() * 0.5) * 1000) / 1000,
      speedMph: Math.round((220 + random() * 28) * 100) / 100,
      recordedBy: techId,
    });
  }
  for (const stint of stints) stint.runTimes.sort((a, b) => a - b);

  const eventRows: (typeof installationEvents.$inferInsert)[] = [];
  for (const stint of stints) {
    const base = { teamId, subjectType: 'part' as const, subjectId: stint.gearSetId, targetType: 'car' as const };
    eventRows.push({
      ...base,
      id: randomUUID(),
      action: 'install',
      targetId: stint.carId,
      at: new Date(stint.from),
      actorId: chiefId,
    });
    if (stint.to !== null)
      eventRows.push({
        ...base,
        id: randomUUID(),
        action: 'remove',
        targetId: stint.carId,
        at: new Date(stint.to),
        actorId: chiefId,
      });
  }

  await insertInChunks(setRows, (tx, chunk) => tx.insert(parts).values(chunk));
  await insertInChunks(runRows, (tx, chunk) => tx.insert(runs).values(chunk));
  await insertInChunks(eventRows, (tx, chunk) => tx.insert(installationEvents).values(chunk));

  const book = await readProfileBook(teamId);
  const profile = profileOfSet(book, null);
  const inspectionRows: (typeof inspections.$inferInsert)[] = [];
  for (const [i, stint] of stints.entries()) {
    const count = stint.serial === SEASON_BIG_SET ? SEASON.bigSetInspections : SEASON.inspectionsPerSet;
    const end = stint.to ?? LAST_DAY;
    // Each set tells its own story: where its lash starts, how fast it opens up, and how much it waves.
    const start = 0.0058 + random() * 0.0025;
    const drift = random() * 0.005;
    const wave = 0.0002 + random() * 0.0008;
    const positions = i % 2 ? 8 : 4;
    for (let n = 0; n < count; n += 1) {
      const at = Math.floor(stint.from + ((n + 0.5) / count) * (end - stint.from));
      const runsAt = stint.runTimes.filter((t) => t < at).length;
      const mean = start + (drift * n) / count;
      const readings = Array.from({ length: positions }, (_, k) => {
        const theta = (2 * Math.PI * k) / positions;
        return Number(
          (Math.round((mean + wave * Math.cos(theta - 0.7) + (random() - 0.5) * 0.0008) / 0.001) * 0.001).toFixed(4),
        );
      });
      const draft = inspectionDraftSchema.parse({
        gearSetId: stint.gearSetId,
        assemblyId: null,
        inspectedAt: new Date(at).toISOString(),
        runsAtInspection: runsAt,
        unit: 'in',
        resolution: '0.001in',
        torqueUnit: 'lbf-in',
        readings,
        runout: { backFace: Number((0.001 + random() * 0.002).toFixed(4)) },
        pinion: { shims: [0.03, 0.005], depthChange: n === 0 ? 0 : null, marking: '+1' },
        carrierShims: { left: 0.06, right: 0.055 },
        preload: {
          pinionTorque: n === 0 ? 26 : 10 + Math.round(random() * 2),
          bearings: n === 0 ? 'new' : 'used',
          hubLeft: { unchanged: true },
          hubRight: { unchanged: true },
        },
      });
      const technicianId = n % 2 ? techId : chiefId;
      inspectionRows.push({
        id: randomUUID(),
        teamId,
        gearSetId: stint.gearSetId,
        status: 'submitted',
        inspectedAt: new Date(at),
        runsAtInspection: runsAt,
        data: draftToData(draft),
        profileVersionId: profile.versionId,
        technicianId,
        createdBy: technicianId,
        submittedAt: new Date(at),
        submittedBy: technicianId,
        updatedAt: new Date(at),
      });
    }
  }
  await insertInChunks(inspectionRows, (tx, chunk) => tx.insert(inspections).values(chunk));
  await seedSeasonReviews(people, stints, random);
}

/** Two decided reviews of every season set, each with two comments, its snapshot made as the server makes one. */
async function seedSeasonReviews(people: SeededPeople, stints: Stint[], random: () => number): Promise<void> {
  const { teamId } = people;
  const ids = stints.map((s) => s.gearSetId);
  const [register, rowsBySet, book] = await Promise.all([
    readPartViews(teamId, { ids }),
    readSubmittedBySet(teamId, ids),
    readProfileBook(teamId),
  ]);
  const reviewRows: (typeof reviews.$inferInsert)[] = [];
  const commentRows: (typeof reviewComments.$inferInsert)[] = [];
  for (const set of register.parts) {
    const stint = stints.find((s) => s.gearSetId === set.id)!;
    const profile = profileOfSet(book, null);
    const analyses = Object.fromEntries(
      UNIT_PAIRS.map((units) => [
        `${units.lengthUnit}|${units.torqueUnit}`,
        analyseFromRows(set, rowsBySet.get(set.id) ?? [], book, profile, 25, units),
      ]),
    );
    const snapshot = { takenAt: new Date(stint.from).toISOString(), gearSet: set, analyses, photos: [] };
    for (let r = 0; r < SEASON.reviews / SEASON.sets; r += 1) {
      const id = randomUUID();
      const openedAt = stint.from + (r + 1) * 86_400_000 * 5;
      const decision = random() < 0.7 ? 'keep' : 'reshim';
      reviewRows.push({
        id,
        teamId,
        gearSetId: set.id,
        status: 'decided',
        snapshot,
        openedBy: people.userIds.technician,
        statusBefore: 'in-service',
        decision,
        reason: decision === 'keep' ? 'Within the profile' : 'Backlash opening up',
        notes: null,
        runsAtDecision: stint.runTimes.filter((t) => t < openedAt).length,
        decidedBy: people.userIds['crew-chief'],
        decidedAt: new Date(openedAt + 3_600_000),
        createdAt: new Date(openedAt),
      });
      commentRows.push(
        {
          id: randomUUID(),
          teamId,
          reviewId: id,
          authorId: people.userIds.technician,
          body: `Lash on ${set.serial} checked at the teardown.`,
          mentions: [],
          createdAt: new Date(openedAt + 60_000),
        },
        {
          id: randomUUID(),
          teamId,
          reviewId: id,
          authorId: people.userIds['crew-chief'],
          body: 'Seen. Deciding now.',
          mentions: [],
          createdAt: new Date(openedAt + 120_000),
        },
      );
    }
  }
  await insertInChunks(reviewRows, (tx, chunk) => tx.insert(reviews).values(chunk));
  await insertInChunks(commentRows, (tx, chunk) => tx.insert(reviewComments).values(chunk));
}
