import { z } from 'zod';
import { zodIssuesToFields } from '../validation';

/**
 * The bookkeeping of a team import (archive-import.ts): the archive's tables, each old id's new one, and
 * every problem found, by table, row and field.
 */

/** The tables of an archive, in the order they are written (each refers only to earlier ones). */
export const ARCHIVE_TABLES = [
  'cars',
  'assemblies',
  'toleranceProfileVersions',
  'parts',
  'installationEvents',
  'runs',
  'inspections',
  'inspectionPhotos',
  'reviews',
  'reviewComments',
  'auditEvents',
] as const;
export type ArchiveTable = (typeof ARCHIVE_TABLES)[number];

export interface ImportProblem {
  table: string;
  row: number;
  field: string;
  message: string;
}

export interface ImportContext {
  teamId: string;
  /** The importing Lashline's account for each person id the archive lists. */
  people: ReadonlyMap<string, string>;
  newId: () => string;
  now: Date;
}

export type Row = Record<string, unknown>;

/** An archive's id: text, as the API takes ids. */
export const idField = z
  .string({ error: 'an id (text)' })
  .min(1, 'an id (text)')
  .max(64, 'an id of at most 64 characters');
/** A time in an archive: ISO text with its offset. */
export const dateField = z.iso.datetime({ offset: true, error: 'an ISO date-time, e.g. 2026-05-03T14:20:00Z' });

/** Fields whose null means "not given" to the API's schemas, which take them as optional. */
export function withoutNulls(row: Row, keys: readonly string[]): Row {
  const copy: Row = {};
  for (const key of keys) if (row[key] !== null && row[key] !== undefined) copy[key] = row[key];
  return copy;
}

/** The import in progress: the new id of every old one, and the problems found so far. */
export class Planner {
  readonly problems: ImportProblem[] = [];
  readonly ids = new Map<ArchiveTable, Map<string, string>>();
  readonly profileIds = new Map<string, string>();
  /** Every old id to its new one, for the free-form JSON of snapshots and audit entries. */
  readonly allIds = new Map<string, string>();
  private table: ArchiveTable = 'cars';
  private row = 0;

  constructor(readonly context: ImportContext) {
    for (const [from, to] of context.people) this.allIds.set(from, to);
  }

  at(table: ArchiveTable, row: number): this {
    this.table = table;
    this.row = row;
    return this;
  }

  problem(field: string, message: string): void {
    this.problems.push({ table: this.table, row: this.row, field, message });
  }

  /** The value parsed by `schema`, or undefined with each issue reported under `field`. */
  check<S extends z.ZodType>(schema: S, value: unknown, prefix = ''): z.infer<S> | undefined {
    const parsed = schema.safeParse(value);
    if (parsed.success) return parsed.data;
    for (const [field, message] of Object.entries(zodIssuesToFields(parsed.error)))
      this.problem([prefix, field].filter(Boolean).join('.'), message);
    return undefined;
  }

  date(row: Row, field: string, required = false): Date | null {
    const value = row[field];
    if (value === null || value === undefined) {
      if (required) this.problem(field, 'an ISO date-time is required here');
      return required ? this.context.now : null;
    }
    const text = this.check(dateField, value, field);
    return text ? new Date(text) : null;
  }

  /** The new id of the row of `table` that `value` names; anything else is reported. */
  ref(tables: ArchiveTable | ArchiveTable[], field: string, value: unknown, nullable = false): string | null {
    if ((value === null || value === undefined) && nullable) return null;
    const names = Array.isArray(tables) ? tables : [tables];
    for (const name of names) {
      const mapped = typeof value === 'string' ? this.ids.get(name)?.get(value) : undefined;
      if (mapped) return mapped;
    }
    this.problem(field, `refers to no row of ${names.join(' or ')} in this archive`);
    return null;
  }

  person(field: string, value: unknown, nullable = true): string | null {
    if ((value === null || value === undefined) && nullable) return null;
    const mapped = typeof value === 'string' ? this.context.people.get(value) : undefined;
    if (!mapped) this.problem(field, 'refers to no person in this archive’s people or formerPeople');
    return mapped ?? null;
  }

  /** Gives every row of every table a new id; a missing or repeated id is reported. */
  assignIds(archive: Record<ArchiveTable, Row[]>): void {
    for (const table of ARCHIVE_TABLES) {
      const map = new Map<string, string>();
      archive[table].forEach((row, index) => {
        this.at(table, index);
        const id = this.check(idField, row.id, 'id');
        if (id === undefined) return;
        if (map.has(id)) return this.problem('id', 'the same id is on an earlier row of this table');
        const fresh = this.context.newId();
        map.set(id, fresh);
        this.allIds.set(id, fresh);
      });
      this.ids.set(table, map);
    }
  }
}

/** Reports a row whose `key` an earlier row of the same table already has. */
export function unique(planner: Planner, seen: Set<string>, key: string, field: string, what: string): void {
  if (seen.has(key)) planner.problem(field, `another row of this archive has the same ${what}`);
  seen.add(key);
}

/** The new id given to `row` of `table`. */
export const newIdOf = (planner: Planner, table: ArchiveTable, row: Row): string =>
  planner.ids.get(table)!.get(row.id as string) ?? '';
