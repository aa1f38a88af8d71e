import { zodIssuesToFields } from '../validation';
import { inspectionDraftSchema } from './schemas';
import { needsRunsReason, sheetToCreateBody, type SheetValues } from './sheet-values';

export const RUNS_REASON_MESSAGE = 'Say why the runs differ from Lashline’s count (e.g. runs not logged yet).';

/**
 * What keeps a sheet from the server: the shared schema's issues by field path, plus the sheet's
 * own rule that a runs figure other than Lashline's count says why. Null when it may be sent.
 * @example findSheetIssues({ …, runsAtInspection: null }, 12) // { runsAtInspection: 'Runs at inspection must be a whole number.' }
 */
export function findSheetIssues(values: SheetValues, countedRuns: number | null): Record<string, string> | null {
  const parsed = inspectionDraftSchema.safeParse(sheetToCreateBody(values));
  const fields = parsed.success ? {} : zodIssuesToFields(parsed.error);
  if (needsRunsReason(values.runsAtInspection, countedRuns) && !values.runsChangeReason?.trim())
    fields.runsChangeReason ??= RUNS_REASON_MESSAGE;
  return Object.keys(fields).length ? fields : null;
}
