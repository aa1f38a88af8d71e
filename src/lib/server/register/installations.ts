import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { write, type Transaction } from '../../../db/client';
import { assemblies, cars, installationEvents, parts } from '../../../db/schema';
import { OUT_OF_USE } from '../../register/kinds';
import { checkRunTime } from '../../register/schemas';
import type { z } from 'zod';
import type { installationSchema } from '../../register/schemas';
import type { TeamAccess } from '../guard';
import { HttpError } from '../http';
import { recordAudit } from '../audit';
import { describeTarget, findInstalledIn, findLastEvent, findLocation, findPartKinds } from './locations';

export type InstallationInput = z.infer<typeof installationSchema>;

export interface InstallationEventView {
  id: string;
  action: 'install' | 'remove';
  subjectType: 'part' | 'assembly';
  subjectId: string;
  targetType: 'assembly' | 'car';
  targetId: string;
  at: string;
}

async function requireOwned(
  tx: Transaction,
  teamId: string,
  type: 'part' | 'assembly' | 'car',
  id: string,
  field: string,
) {
  const table = type === 'part' ? parts : type === 'assembly' ? assemblies : cars;
  const row = await tx
    .select({ id: table.id })
    .from(table)
    .where(and(eq(table.id, id), eq(table.teamId, teamId)))
    .get();
  if (!row) throw new HttpError(404, `${field}: no such ${type} in this team.`, { [field]: `unknown ${type}` });
}

function formatDate(date: Date): string {
  return date.toISOString().slice(0, 16).replace('T', ' ');
}

/** Installs or removes a part or an assembly, appending to the history; 409 when it is elsewhere. */
export async function recordInstallation(
  access: TeamAccess,
  input: InstallationInput,
  now = new Date(),
): Promise<InstallationEventView> {
  const at = input.at ? new Date(input.at) : now;
  if (input.at) {
    const ahead = checkRunTime(input.at, now);
    if (ahead) throw new HttpError(400, `at: ${ahead}`, { at: ahead });
  }
  const teamId = access.team.id;
  const subjectType = input.partId ? 'part' : 'assembly';
  const subjectId = (input.partId ?? input.assemblyId)!;
  return write(async (tx) => {
    await requireOwned(tx, teamId, subjectType, subjectId, subjectType === 'part' ? 'partId' : 'assemblyId');
    const last = await findLastEvent(tx, subjectType, subjectId, teamId);
    if (last && last.at.getTime() > at.getTime()) {
      throw new HttpError(
        409,
        `at: the history already has an event at ${formatDate(last.at)}; an install or remove must come after it.`,
        { at: 'before the last event' },
      );
    }
    let targetType: 'assembly' | 'car';
    let targetId: string;
    if (input.action === 'install') {
      const where = await findLocation(tx, subjectType, subjectId, teamId);
      if (where) {
        throw new HttpError(
          409,
          `It is already installed in ${where.targetLabel} since ${formatDate(where.since)}; remove it first.`,
          {
            [subjectType === 'part' ? 'partId' : 'assemblyId']: `installed in ${where.targetLabel}`,
          },
        );
      }
      targetType = subjectType === 'part' && input.assemblyId ? 'assembly' : 'car';
      targetId = (targetType === 'assembly' ? input.assemblyId : input.carId)!;
      await requireOwned(tx, teamId, targetType, targetId, targetType === 'assembly' ? 'assemblyId' : 'carId');
      await checkInstallRules(tx, subjectType, subjectId, targetType, targetId, teamId);
    } else {
      if (!last || last.action !== 'install') {
        throw new HttpError(409, 'It is not installed anywhere, so there is nothing to remove.', {
          [subjectType === 'part' ? 'partId' : 'assemblyId']: 'not installed',
        });
      }
      targetType = last.targetType;
      targetId = last.targetId;
    }
    const id = randomUUID();
    await tx.insert(installationEvents).values({
      id,
      teamId,
      action: input.action,
      subjectType,
      subjectId,
      targetType,
      targetId,
      at,
      actorId: access.user.id,
      notes: input.notes ?? null,
    });
    if (subjectType === 'part') await followStatus(tx, subjectId, input.action);
    const view: InstallationEventView = {
      id,
      action: input.action,
      subjectType,
      subjectId,
      targetType,
      targetId,
      at: at.toISOString(),
    };
    await recordAudit(tx, {
      teamId,
      actorId: access.user.id,
      action: input.action,
      recordType: subjectType,
      recordId: subjectId,
      after: view,
    });
    return view;
  });
}

/** One gear set per assembly, one assembly per car, and nothing retired goes back in. */
async function checkInstallRules(
  tx: Transaction,
  subjectType: 'part' | 'assembly',
  subjectId: string,
  targetType: 'assembly' | 'car',
  targetId: string,
  teamId: string,
): Promise<void> {
  const present = await findInstalledIn(tx, targetType, targetId, teamId);
  if (subjectType === 'part') {
    const part = await tx
      .select({ kind: parts.kind, status: parts.status, serial: parts.serial })
      .from(parts)
      .where(and(eq(parts.id, subjectId), eq(parts.teamId, teamId)))
      .get();
    if (part && OUT_OF_USE.includes(part.status)) {
      throw new HttpError(409, `Part ${part.serial} is ${part.status}; it cannot be installed.`, {
        partId: part.status,
      });
    }
    if (part?.kind === 'gear-set' && targetType === 'assembly') {
      const kinds = await findPartKinds(
        tx,
        present.filter((p) => p.subjectType === 'part').map((p) => p.subjectId),
        teamId,
      );
      if ([...kinds.values()].includes('gear-set')) {
        throw new HttpError(
          409,
          `${await describeTarget(tx, targetType, targetId, teamId)} already holds a gear set; remove it first.`,
          { assemblyId: 'holds a gear set' },
        );
      }
    }
    return;
  }
  if (present.some((p) => p.subjectType === 'assembly')) {
    throw new HttpError(
      409,
      `${await describeTarget(tx, 'car', targetId, teamId)} already has a rear-end assembly; remove it first.`,
      { carId: 'has an assembly' },
    );
  }
}

/** A spare that goes in is in service; a part in service that comes out is a spare again. */
async function followStatus(tx: Transaction, partId: string, action: 'install' | 'remove'): Promise<void> {
  const [from, to] = action === 'install' ? (['spare', 'in-service'] as const) : (['in-service', 'spare'] as const);
  await tx
    .update(parts)
    .set({ status: to })
    .where(and(eq(parts.id, partId), eq(parts.status, from)));
}
