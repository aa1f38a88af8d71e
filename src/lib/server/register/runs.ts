import { randomUUID } from 'node:crypto';
import { and, desc, eq } from 'drizzle-orm';
import type { z } from 'zod';
import { getDb, write } from '../../../db/client';
import { cars, runs, type Run } from '../../../db/schema';
import { checkRunRecords, parseRunCsv, type RowProblem } from '../../register/run-import';
import { mayDeleteRun } from '../../register/run-deletion';
import { checkRunTime, type RunInput, type runUpdateSchema } from '../../register/schemas';
import type { TeamAccess } from '../guard';
import { HttpError } from '../http';
import { recordAudit } from '../audit';
import { listCars } from './cars';

import type { RunView } from '../../register/views';
export type { RunView };

export function runToView(run: Run): RunView {
  const { id, carId, event, round, lane, notes, elapsedSeconds, speedMph, recordedBy } = run;
  // The idempotency key stays on the server.
  return {
    id,
    carId,
    at: run.at.toISOString(),
    event,
    round,
    lane,
    notes,
    elapsedSeconds,
    speedMph,
    recordedBy,
    createdAt: run.createdAt.toISOString(),
  };
}

async function requireCar(teamId: string, carId: string): Promise<void> {
  const db = await getDb();
  const car = await db
    .select({ id: cars.id })
    .from(cars)
    .where(and(eq(cars.id, carId), eq(cars.teamId, teamId)))
    .get();
  if (!car) throw new HttpError(404, 'carId: no such car in this team.', { carId: 'unknown car' });
}

function requireNotAhead(at: string, now: Date): void {
  const ahead = checkRunTime(at, now);
  if (ahead) throw new HttpError(400, `at: ${ahead}`, { at: ahead });
}

function runValues(input: RunInput) {
  return {
    carId: input.carId,
    at: new Date(input.at),
    event: input.event ?? null,
    round: input.round ?? null,
    lane: input.lane ?? null,
    notes: input.notes ?? null,
    elapsedSeconds: input.elapsedSeconds ?? null,
    speedMph: input.speedMph ?? null,
  };
}

/** Logs a run: every part in that car at that moment is charged with it (see run-counts.ts). */
export async function createRun(
  access: TeamAccess,
  input: RunInput,
  now = new Date(),
  idempotencyKey: string | null = null,
): Promise<RunView & { repeated?: true }> {
  requireNotAhead(input.at, now);
  await requireCar(access.team.id, input.carId);
  let repeated = false;
  const run = await write(async (tx) => {
    if (idempotencyKey) {
      const earlier = await tx
        .select()
        .from(runs)
        .where(and(eq(runs.teamId, access.team.id), eq(runs.idempotencyKey, idempotencyKey)))
        .get();
      if (earlier) {
        repeated = true;
        return earlier;
      }
    }
    const [row] = await tx
      .insert(runs)
      .values({
        ...runValues(input),
        id: randomUUID(),
        teamId: access.team.id,
        recordedBy: access.user.id,
        idempotencyKey,
      })
      .returning();
    if (!row) throw new Error('insert returned no row');
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'create',
      recordType: 'run',
      recordId: row.id,
      after: runToView(row),
    });
    return row;
  });
  return repeated ? { ...runToView(run), repeated: true } : runToView(run);
}

/** The team's runs, newest first, optionally for one car. */
export async function listRuns(
  teamId: string,
  options: { carId?: string; offset: number; limit: number },
): Promise<RunView[]> {
  const db = await getDb();
  const where = options.carId ? and(eq(runs.teamId, teamId), eq(runs.carId, options.carId)) : eq(runs.teamId, teamId);
  const rows = await db
    .select()
    .from(runs)
    .where(where)
    .orderBy(desc(runs.at), desc(runs.id))
    .limit(options.limit + 1)
    .offset(options.offset);
  return rows.map(runToView);
}

export async function getRun(teamId: string, runId: string): Promise<RunView> {
  const db = await getDb();
  const row = await db
    .select()
    .from(runs)
    .where(and(eq(runs.id, runId), eq(runs.teamId, teamId)))
    .get();
  if (!row) throw new HttpError(404, 'No such run in this team.');
  return runToView(row);
}

/** Edits a run (crew chief); every count it touched follows, since counts are derived. */
export async function updateRun(
  access: TeamAccess,
  runId: string,
  changes: z.infer<typeof runUpdateSchema>,
  now = new Date(),
): Promise<RunView> {
  // `{}` is a valid PATCH, and Drizzle refuses an UPDATE with nothing to SET: answer the run as it is.
  if (Object.values(changes).every((value) => value === undefined)) return getRun(access.team.id, runId);
  if (changes.at) requireNotAhead(changes.at, now);
  if (changes.carId) await requireCar(access.team.id, changes.carId);
  return write(async (tx) => {
    const before = await tx
      .select()
      .from(runs)
      .where(and(eq(runs.id, runId), eq(runs.teamId, access.team.id)))
      .get();
    if (!before) throw new HttpError(404, 'No such run in this team.');
    const { at, ...rest } = changes;
    const set = { ...rest, ...(at ? { at: new Date(at) } : {}) };
    const [after] = await tx.update(runs).set(set).where(eq(runs.id, runId)).returning();
    if (!after) throw new Error('update returned no row');
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'update',
      recordType: 'run',
      recordId: runId,
      before: runToView(before),
      after: runToView(after),
    });
    return runToView(after);
  });
}

/** Deletes a run: crew chiefs and owners any run, whoever logged it within 24 hours (see run-deletion.ts). */
export async function deleteRun(access: TeamAccess, runId: string, now = new Date()): Promise<void> {
  await write(async (tx) => {
    const before = await tx
      .select()
      .from(runs)
      .where(and(eq(runs.id, runId), eq(runs.teamId, access.team.id)))
      .get();
    if (!before) throw new HttpError(404, 'No such run in this team.');
    if (!mayDeleteRun(access.team.role, access.user.id, before, now))
      throw new HttpError(
        403,
        'You may delete a run you logged yourself within 24 hours of logging it; ask a crew chief to delete this one.',
      );
    await tx.delete(runs).where(eq(runs.id, runId));
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'delete',
      recordType: 'run',
      recordId: runId,
      before: runToView(before),
    });
  });
}

export interface ImportResult {
  imported: number;
  problems: RowProblem[];
  checked: number;
}

/**
 * Imports runs from CSV text or records: every row checked first; any problem writes nothing (422
 * with the rows and fields). `dryRun` only checks. One transaction for the whole file.
 */
export async function importRuns(
  access: TeamAccess,
  source: { csv: string } | { records: Record<string, string>[] },
  dryRun: boolean,
  now = new Date(),
): Promise<ImportResult> {
  const parsed = 'csv' in source ? parseRunCsv(source.csv) : { records: source.records, problems: [] };
  const check = checkRunRecords(parsed.records, await listCars(access.team.id), now);
  const problems = [...parsed.problems, ...check.problems];
  const checked = parsed.records.length;
  if (problems.length) {
    if (dryRun) return { imported: 0, problems, checked };
    throw new HttpError(
      422,
      `${problems.length} row${problems.length === 1 ? '' : 's'} need fixing (first: line ${problems[0]!.line}); nothing was imported.`,
      Object.fromEntries(
        problems.slice(0, 200).map((p) => [
          `line ${p.line}`,
          Object.entries(p.fields)
            .map(([f, m]) => `${f}: ${m}`)
            .join('; '),
        ]),
      ),
    );
  }
  if (dryRun) return { imported: 0, problems: [], checked };
  if (checked === 0) throw new HttpError(400, 'The file has no rows to import.');
  await write(async (tx) => {
    const values = check.valid.map(({ run }) => ({
      ...runValues(run),
      id: randomUUID(),
      teamId: access.team.id,
      recordedBy: access.user.id,
    }));
    for (let i = 0; i < values.length; i += 500) await tx.insert(runs).values(values.slice(i, i + 500));
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'import',
      recordType: 'run',
      recordId: `import:${values.length}`,
      after: { count: values.length, first: values[0]?.at, last: values.at(-1)?.at },
    });
  });
  return { imported: check.valid.length, problems: [], checked };
}
