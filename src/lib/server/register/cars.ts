import { randomUUID } from 'node:crypto';
import { and, asc, eq, sql } from 'drizzle-orm';
import type { z } from 'zod';
import { getDb, write } from '../../../db/client';
import { cars, installationEvents, runs, type Car } from '../../../db/schema';
import type { carCreateSchema, carUpdateSchema } from '../../register/schemas';
import type { TeamAccess } from '../guard';
import { HttpError } from '../http';
import { recordAudit } from '../audit';

import type { CarView } from '../../register/views';
export type { CarView };

/** The team's cars with their run totals. */
export async function listCars(teamId: string): Promise<CarView[]> {
  const db = await getDb();
  const rows = await db
    .select({
      car: cars,
      totalRuns: sql<number>`(SELECT count(*) FROM runs r WHERE r.car_id = "cars"."id")`,
      lastRunAt: sql<number | null>`(SELECT max(r.at) FROM runs r WHERE r.car_id = "cars"."id")`,
    })
    .from(cars)
    .where(eq(cars.teamId, teamId))
    .orderBy(asc(cars.name), asc(cars.id));
  return rows.map(({ car, totalRuns, lastRunAt }) =>
    toView(car, Number(totalRuns), lastRunAt === null ? null : new Date(Number(lastRunAt)).toISOString()),
  );
}

function toView(car: Car, totalRuns = 0, lastRunAt: string | null = null): CarView {
  return {
    id: car.id,
    name: car.name,
    carClass: car.carClass,
    notes: car.notes,
    totalRuns,
    lastRunAt,
    createdAt: car.createdAt.toISOString(),
  };
}

export async function getCar(teamId: string, carId: string): Promise<CarView> {
  const found = (await listCars(teamId)).find((c) => c.id === carId);
  if (!found) throw new HttpError(404, 'No such car in this team.');
  return found;
}

async function refuseDuplicateName(teamId: string, name: string, exceptId?: string): Promise<void> {
  const db = await getDb();
  const clash = await db
    .select({ id: cars.id })
    .from(cars)
    .where(and(eq(cars.teamId, teamId), eq(cars.name, name)))
    .get();
  if (clash && clash.id !== exceptId)
    throw new HttpError(409, `name: the team already has a car called ${name}.`, { name: 'already used' });
}

export async function createCar(access: TeamAccess, input: z.infer<typeof carCreateSchema>): Promise<CarView> {
  await refuseDuplicateName(access.team.id, input.name);
  const car = await write(async (tx) => {
    const [row] = await tx
      .insert(cars)
      .values({ ...input, id: randomUUID(), teamId: access.team.id })
      .returning();
    if (!row) throw new Error('insert returned no row');
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'create',
      recordType: 'car',
      recordId: row.id,
      after: row,
    });
    return row;
  });
  return toView(car);
}

export async function updateCar(
  access: TeamAccess,
  carId: string,
  changes: z.infer<typeof carUpdateSchema>,
): Promise<CarView> {
  // `{}` is a valid PATCH, and Drizzle refuses an UPDATE with nothing to SET: answer the car as it is.
  if (Object.values(changes).every((value) => value === undefined)) return getCar(access.team.id, carId);
  if (changes.name) await refuseDuplicateName(access.team.id, changes.name, carId);
  await write(async (tx) => {
    const before = await tx
      .select()
      .from(cars)
      .where(and(eq(cars.id, carId), eq(cars.teamId, access.team.id)))
      .get();
    if (!before) throw new HttpError(404, 'No such car in this team.');
    const [after] = await tx.update(cars).set(changes).where(eq(cars.id, carId)).returning();
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'update',
      recordType: 'car',
      recordId: carId,
      before,
      after,
    });
  });
  return getCar(access.team.id, carId);
}

/** Deletes a car with no runs and no installation history (409 otherwise: its history counts). */
export async function deleteCar(access: TeamAccess, carId: string): Promise<void> {
  await write(async (tx) => {
    const before = await tx
      .select()
      .from(cars)
      .where(and(eq(cars.id, carId), eq(cars.teamId, access.team.id)))
      .get();
    if (!before) throw new HttpError(404, 'No such car in this team.');
    const used =
      (await tx
        .select({ id: runs.id })
        .from(runs)
        .where(and(eq(runs.teamId, access.team.id), eq(runs.carId, carId)))
        .limit(1)
        .get()) ??
      (await tx
        .select({ id: installationEvents.id })
        .from(installationEvents)
        .where(
          and(
            eq(installationEvents.teamId, access.team.id),
            eq(installationEvents.targetType, 'car'),
            eq(installationEvents.targetId, carId),
          ),
        )
        .limit(1)
        .get());
    if (used)
      throw new HttpError(
        409,
        'This car has runs or an installation history, which the parts’ counts depend on; it cannot be deleted.',
      );
    await tx.delete(cars).where(eq(cars.id, carId));
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'delete',
      recordType: 'car',
      recordId: carId,
      before,
    });
  });
}
