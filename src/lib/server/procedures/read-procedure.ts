import { and, desc, eq, inArray } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import { checklistSteps, checklists, procedureVersions } from '../../../db/schema';
import { listSteps } from '../../procedures/model';
import { sectionsToDisplay, type SectionDisplay } from '../../procedures/step-display';
import type { ProcedureView } from '../../procedures/views';
import type { TorqueUnit } from '../../units';
import type { TeamAccess } from '../guard';
import { getProcedure } from './procedures';

/** A deviation noted in one of the procedure's recent checklists: what a new crew member should read. */
export interface NotedDeviation {
  checklistId: string;
  startedAt: string;
  stepTitle: string;
  text: string;
}

export interface ProcedurePage {
  procedure: ProcedureView;
  sections: SectionDisplay[];
  deviations: NotedDeviation[];
  unit: TorqueUnit;
}

const RECENT_CHECKLISTS = 5;

/** The reading view: the current (or asked) version, ready to show, and the deviations of its last checklists. */
export async function readProcedurePage(
  access: TeamAccess,
  procedureId: string,
  version?: number,
): Promise<ProcedurePage> {
  const procedure = await getProcedure(access.team.id, procedureId, version);
  const unit = access.user.torqueUnit;
  const db = await getDb();
  const recent = await db
    .select({ checklist: checklists, sections: procedureVersions.sections })
    .from(checklists)
    .innerJoin(procedureVersions, eq(procedureVersions.id, checklists.procedureVersionId))
    .where(and(eq(checklists.teamId, access.team.id), eq(checklists.procedureId, procedureId)))
    .orderBy(desc(checklists.startedAt))
    .limit(RECENT_CHECKLISTS);
  const records =
    recent.length === 0
      ? []
      : await db
          .select()
          .from(checklistSteps)
          .where(
            inArray(
              checklistSteps.checklistId,
              recent.map((row) => row.checklist.id),
            ),
          );
  const deviations: NotedDeviation[] = [];
  for (const { checklist, sections } of recent) {
    const titles = new Map(listSteps(sections).map(({ step }) => [step.id, step.title]));
    for (const record of records.filter((r) => r.checklistId === checklist.id)) {
      const texts = [
        record.orderDeviation ? `Bolts tightened out of order: ${record.boltsInOrder?.join(', ')}.` : null,
        record.status === 'skipped' ? `Skipped: ${record.reason}` : null,
        record.note,
      ].filter((t): t is string => Boolean(t));
      for (const text of texts)
        deviations.push({
          checklistId: checklist.id,
          startedAt: checklist.startedAt.toISOString(),
          stepTitle: titles.get(record.stepId) ?? 'a step no longer in the procedure',
          text,
        });
    }
  }
  return { procedure, sections: sectionsToDisplay(procedure.sections, unit, procedure.example), deviations, unit };
}
