import Papa from 'papaparse';
import { checkRunTime, runCreateSchema, type RunInput } from './schemas';
import { zodIssuesToFields } from '../validation';

/**
 * CSV import of runs: the columns, the parse, and the check of every row with the same schema the
 * runs endpoint uses. Pure, so the browser's preview and the server say the same thing.
 */
export const RUN_CSV_COLUMNS = [
  'car',
  'at',
  'event',
  'round',
  'lane',
  'elapsed_seconds',
  'speed_mph',
  'notes',
] as const;

export interface RowProblem {
  /**
   * The record's line: the header is line 1 and each record the next. Blank lines are skipped and not
   * counted (a file of runs seldom has one), so after a blank line this is the record's row number.
   */
  line: number;
  fields: Record<string, string>;
}

export interface ImportCheck {
  valid: { line: number; run: RunInput }[];
  problems: RowProblem[];
}

/** Parses CSV text with a header row into records (papaparse). */
export function parseRunCsv(text: string): { records: Record<string, string>[]; problems: RowProblem[] } {
  const result = Papa.parse<Record<string, string>>(text, {
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (h) => h.trim().toLowerCase(),
  });
  const problems: RowProblem[] = result.errors.map((error) => ({
    line: (error.row ?? 0) + 2,
    fields: { file: error.message },
  }));
  const missing = ['car', 'at'].filter((column) => !result.meta.fields?.includes(column));
  if (missing.length)
    problems.unshift({
      line: 1,
      fields: { header: `The header needs the column${missing.length > 1 ? 's' : ''} ${missing.join(', ')}.` },
    });
  return { records: result.data, problems };
}

function textToNumber(text: string | undefined): number | null | string {
  const trimmed = (text ?? '').trim();
  if (trimmed === '') return null;
  const value = Number(trimmed);
  // Leave the text for the schema to refuse by name rather than turning it into NaN here.
  return Number.isFinite(value) ? value : trimmed;
}

/** A CSV record as the runs endpoint's body, with the car's name looked up among the team's cars. */
export function recordToRunBody(
  record: Record<string, string>,
  carIdsByName: ReadonlyMap<string, string>,
): Record<string, unknown> {
  const carName = (record.car ?? '').trim();
  return {
    carId: carIdsByName.get(carName.toLowerCase()) ?? '',
    at: (record.at ?? '').trim(),
    event: record.event ?? null,
    round: record.round ?? null,
    lane: record.lane ?? null,
    notes: record.notes ?? null,
    elapsedSeconds: textToNumber(record.elapsed_seconds),
    speedMph: textToNumber(record.speed_mph),
  };
}

/** Checks every record; a row whose car is not one of the team's is refused by name. */
export function checkRunRecords(
  records: Record<string, string>[],
  cars: readonly { id: string; name: string }[],
  now: Date,
  firstLine = 2,
): ImportCheck {
  const carIdsByName = new Map(cars.map((car) => [car.name.trim().toLowerCase(), car.id]));
  const check: ImportCheck = { valid: [], problems: [] };
  records.forEach((record, index) => {
    const line = firstLine + index;
    const body = recordToRunBody(record, carIdsByName);
    const parsed = runCreateSchema.safeParse(body);
    const fields: Record<string, string> = parsed.success ? {} : zodIssuesToFields(parsed.error);
    if (!body.carId) {
      delete fields.carId;
      fields.car = record.car?.trim() ? `No car called “${record.car.trim()}” in this team.` : 'Name the car.';
    }
    // A date too far ahead is named even when something else in the row is wrong too.
    const ahead = !fields.at && typeof body.at === 'string' && body.at ? checkRunTime(body.at, now) : null;
    if (ahead) fields.at = ahead;
    if (parsed.success && Object.keys(fields).length === 0) check.valid.push({ line, run: parsed.data });
    else check.problems.push({ line, fields });
  });
  return check;
}
