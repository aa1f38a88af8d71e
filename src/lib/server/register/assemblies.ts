import { randomUUID } from 'node:crypto';
import { and, asc, eq, or } from 'drizzle-orm';
import type { z } from 'zod';
import { getDb, write } from '../../../db/client';
import { assemblies, installationEvents, type Assembly } from '../../../db/schema';
import type { assemblyCreateSchema, assemblyUpdateSchema } from '../../register/schemas';
import type { TeamAccess } from '../guard';
import { HttpError } from '../http';
import { recordAudit } from '../audit';
import { listCurrentInstalls } from './locations';

import type { AssemblyView } from '../../register/views';
export type { AssemblyView };

/** The team's rear-end assemblies, each with the car it is in and the parts it holds now. */
export async function listAssemblies(teamId: string): Promise<AssemblyView[]> {
  const db = await getDb();
  const [rows, installs] = await Promise.all([
    db
      .select()
      .from(assemblies)
      .where(eq(assemblies.teamId, teamId))
      .orderBy(asc(assemblies.serial), asc(assemblies.id)),
    listCurrentInstalls(teamId),
  ]);
  return rows.map((row) => toView(row, installs));
}

function toView(row: Assembly, installs: Awaited<ReturnType<typeof listCurrentInstalls>> = []): AssemblyView {
  return {
    id: row.id,
    serial: row.serial,
    name: row.name,
    housing: row.housing,
    notes: row.notes,
    carId: installs.find((i) => i.subjectType === 'assembly' && i.subjectId === row.id)?.targetId ?? null,
    partIds: installs.filter((i) => i.targetType === 'assembly' && i.targetId === row.id).map((i) => i.subjectId),
    createdAt: row.createdAt.toISOString(),
  };
}

export async function getAssembly(teamId: string, id: string): Promise<AssemblyView> {
  const found = (await listAssemblies(teamId)).find((a) => a.id === id);
  if (!found) throw new HttpError(404, 'No such assembly in this team.');
  return found;
}

async function refuseDuplicateSerial(teamId: string, serial: string, exceptId?: string): Promise<void> {
  const db = await getDb();
  const clash = await db
    .select({ id: assemblies.id })
    .from(assemblies)
    .where(and(eq(assemblies.teamId, teamId), eq(assemblies.serial, serial)))
    .get();
  if (clash && clash.id !== exceptId)
    throw new HttpError(409, `serial: the team already has an assembly with serial ${serial}.`, {
      serial: 'already used',
    });
}

export async function createAssembly(
  access: TeamAccess,
  input: z.infer<typeof assemblyCreateSchema>,
): Promise<AssemblyView> {
  await refuseDuplicateSerial(access.team.id, input.serial);
  const row = await write(async (tx) => {
    const [created] = await tx
      .insert(assemblies)
      .values({ ...input, id: randomUUID(), teamId: access.team.id })
      .returning();
    if (!created) throw new Error('insert returned no row');
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'create',
      recordType: 'assembly',
      recordId: created.id,
      after: created,
    });
    return created;
  });
  return toView(row);
}

export async function updateAssembly(
  access: TeamAccess,
  id: string,
  changes: z.infer<typeof assemblyUpdateSchema>,
): Promise<AssemblyView> {
  // `{}` is a valid PATCH, and Drizzle refuses an UPDATE with nothing to SET: answer the assembly as it is.
  if (Object.values(changes).every((value) => value === undefined)) return getAssembly(access.team.id, id);
  if (changes.serial) await refuseDuplicateSerial(access.team.id, changes.serial, id);
  await write(async (tx) => {
    const before = await tx
      .select()
      .from(assemblies)
      .where(and(eq(assemblies.id, id), eq(assemblies.teamId, access.team.id)))
      .get();
    if (!before) throw new HttpError(404, 'No such assembly in this team.');
    const [after] = await tx.update(assemblies).set(changes).where(eq(assemblies.id, id)).returning();
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'update',
      recordType: 'assembly',
      recordId: id,
      before,
      after,
    });
  });
  return getAssembly(access.team.id, id);
}

/** Deletes an assembly that never held a part nor sat in a car. */
export async function deleteAssembly(access: TeamAccess, id: string): Promise<void> {
  await write(async (tx) => {
    const before = await tx
      .select()
      .from(assemblies)
      .where(and(eq(assemblies.id, id), eq(assemblies.teamId, access.team.id)))
      .get();
    if (!before) throw new HttpError(404, 'No such assembly in this team.');
    const used = await tx
      .select({ id: installationEvents.id })
      .from(installationEvents)
      .where(
        and(
          eq(installationEvents.teamId, access.team.id),
          or(
            and(eq(installationEvents.subjectType, 'assembly'), eq(installationEvents.subjectId, id)),
            and(eq(installationEvents.targetType, 'assembly'), eq(installationEvents.targetId, id)),
          ),
        ),
      )
      .limit(1)
      .get();
    if (used)
      throw new HttpError(
        409,
        'This assembly has an installation history, which the parts’ counts depend on; it cannot be deleted.',
      );
    await tx.delete(assemblies).where(eq(assemblies.id, id));
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'delete',
      recordType: 'assembly',
      recordId: id,
      before,
    });
  });
}
