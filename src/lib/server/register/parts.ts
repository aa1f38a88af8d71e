import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import type { z } from 'zod';
import { write } from '../../../db/client';
import { installationEvents, parts } from '../../../db/schema';
import type { PartKind } from '../../register/kinds';
import type { PartView } from '../../register/views';
import type { partCreateSchema, partUpdateSchema } from '../../register/schemas';
import { defaultLifeLimit } from '../../register/team-settings';
import type { TeamAccess } from '../guard';
import { HttpError } from '../http';
import { recordAudit } from '../audit';
import { partToView, readPartViews } from './part-views';
import { readTeamSettings } from './team-settings';

export type { PartView };

const toView = partToView;

/** Every part of the team (optionally one kind), with derived run counts and where each one is. */
export async function listParts(teamId: string, kind?: PartKind): Promise<PartView[]> {
  return (await readPartViews(teamId, { kind })).parts;
}

/** One part of the team; 404 for another team's part or an unknown id. */
export async function getPart(teamId: string, partId: string): Promise<PartView> {
  const found = (await readPartViews(teamId, { ids: [partId] })).parts[0];
  if (!found) throw new HttpError(404, 'No such part in this team.');
  return found;
}

export async function createPart(access: TeamAccess, input: z.infer<typeof partCreateSchema>): Promise<PartView> {
  const settings = await readTeamSettings(access.team.id);
  const lifeLimitRuns =
    input.lifeLimitRuns === undefined ? defaultLifeLimit(settings, input.kind) : input.lifeLimitRuns;
  const part = await write(async (tx) => {
    const clash = await tx
      .select({ id: parts.id })
      .from(parts)
      .where(and(eq(parts.teamId, access.team.id), eq(parts.kind, input.kind), eq(parts.serial, input.serial)))
      .get();
    if (clash)
      throw new HttpError(409, `serial: the team already has a ${input.kind} with serial ${input.serial}.`, {
        serial: 'already used',
      });
    const [row] = await tx
      .insert(parts)
      .values({ ...input, id: randomUUID(), teamId: access.team.id, status: input.status ?? 'spare', lifeLimitRuns })
      .returning();
    if (!row) throw new Error('insert returned no row');
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'create',
      recordType: 'part',
      recordId: row.id,
      after: row,
    });
    return row;
  });
  return toView(part);
}

export async function updatePart(
  access: TeamAccess,
  partId: string,
  changes: z.infer<typeof partUpdateSchema>,
): Promise<PartView> {
  // `{}` is a valid PATCH, and Drizzle refuses an UPDATE with nothing to SET: answer the part as it is.
  if (Object.values(changes).every((value) => value === undefined)) return getPart(access.team.id, partId);
  await write(async (tx) => {
    const before = await tx
      .select()
      .from(parts)
      .where(and(eq(parts.id, partId), eq(parts.teamId, access.team.id)))
      .get();
    if (!before) throw new HttpError(404, 'No such part in this team.');
    if (before.kind !== 'gear-set' && (changes.ringTeeth !== undefined || changes.pinionTeeth !== undefined)) {
      throw new HttpError(400, 'ringTeeth: only a gear set has tooth counts.', { ringTeeth: 'not a gear set' });
    }
    // One way of giving k at a time: setting one clears the other.
    if (typeof changes.spiralAngleDeg === 'number') changes = { ...changes, runoutK: null };
    if (typeof changes.runoutK === 'number') changes = { ...changes, spiralAngleDeg: null };
    const ring = changes.ringTeeth ?? before.ringTeeth;
    const pinion = changes.pinionTeeth ?? before.pinionTeeth;
    if (before.kind === 'gear-set' && ring !== null && pinion !== null && ring <= pinion) {
      throw new HttpError(400, 'ringTeeth: the ring gear has more teeth than the pinion.', {
        ringTeeth: 'not more than pinion',
      });
    }
    if (changes.serial && changes.serial !== before.serial) {
      const clash = await tx
        .select({ id: parts.id })
        .from(parts)
        .where(and(eq(parts.teamId, access.team.id), eq(parts.kind, before.kind), eq(parts.serial, changes.serial)))
        .get();
      if (clash)
        throw new HttpError(409, `serial: the team already has a ${before.kind} with serial ${changes.serial}.`, {
          serial: 'already used',
        });
    }
    const [after] = await tx.update(parts).set(changes).where(eq(parts.id, partId)).returning();
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'update',
      recordType: 'part',
      recordId: partId,
      before,
      after,
    });
  });
  return getPart(access.team.id, partId);
}

/** Deletes a part that was never installed; one with a history is retired or scrapped instead (409). */
export async function deletePart(access: TeamAccess, partId: string): Promise<void> {
  await write(async (tx) => {
    const before = await tx
      .select()
      .from(parts)
      .where(and(eq(parts.id, partId), eq(parts.teamId, access.team.id)))
      .get();
    if (!before) throw new HttpError(404, 'No such part in this team.');
    const history = await tx
      .select({ id: installationEvents.id })
      .from(installationEvents)
      .where(
        and(
          eq(installationEvents.teamId, access.team.id),
          eq(installationEvents.subjectType, 'part'),
          eq(installationEvents.subjectId, partId),
        ),
      )
      .limit(1)
      .get();
    if (history)
      throw new HttpError(
        409,
        'This part has an installation history; set its status to retired or scrapped instead of deleting it.',
      );
    await tx.delete(parts).where(eq(parts.id, partId));
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'delete',
      recordType: 'part',
      recordId: partId,
      before,
    });
  });
}
