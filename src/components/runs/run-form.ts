import type { RunView } from '../../lib/register/views';
import { dateToLocalInput, localInputToIso } from '../shared/when';

/**
 * The log-run form's values as typed, and the body they make for POST /api/runs or PATCH
 * /api/runs/:id. The endpoint checks the body with `runCreateSchema`; nothing here repeats its rules.
 */
export interface RunFormValues {
  carId: string;
  /** datetime-local text, in the tablet's time zone. */
  at: string;
  /** False while the time follows the clock: the run is logged at the moment it is sent. */
  atEdited: boolean;
  event: string;
  round: string;
  lane: string;
  elapsed: string;
  speed: string;
  notes: string;
}

export const ROUND_PICKS = ['Q1', 'Q2', 'Q3', 'Q4', 'E1', 'E2', 'E3', 'Semi', 'Final', 'Test'] as const;
export const LANE_PICKS = [
  { value: 'left', label: 'Left lane' },
  { value: 'right', label: 'Right lane' },
] as const;

export function emptyRunForm(event = ''): RunFormValues {
  return { carId: '', at: '', atEdited: false, event, round: '', lane: '', elapsed: '', speed: '', notes: '' };
}

export function runToForm(run: RunView): RunFormValues {
  const fmt = (n: number | null) => (n === null ? '' : String(n));
  return {
    carId: run.carId,
    at: dateToLocalInput(new Date(run.at)),
    atEdited: true,
    event: run.event ?? '',
    round: run.round ?? '',
    lane: run.lane ?? '',
    elapsed: fmt(run.elapsedSeconds),
    speed: fmt(run.speedMph),
    notes: run.notes ?? '',
  };
}

/**
 * A typed measure as the body carries it: blank is null, a decimal comma is read as a point, and
 * anything else is passed on as text for the schema to refuse by name.
 * @example decimalTextToValue('5,981') // 5.981
 */
export function decimalTextToValue(text: string): number | string | null {
  const trimmed = text.trim().replace(',', '.');
  if (trimmed === '') return null;
  const value = Number(trimmed);
  return Number.isFinite(value) ? value : text.trim();
}

/** The request body; `now` is used when the time still follows the clock. */
export function runFormToBody(values: RunFormValues, now: Date): Record<string, unknown> {
  return {
    carId: values.carId,
    at: values.atEdited ? (localInputToIso(values.at) ?? values.at) : now.toISOString(),
    event: values.event,
    round: values.round,
    lane: values.lane,
    notes: values.notes,
    elapsedSeconds: decimalTextToValue(values.elapsed),
    speedMph: decimalTextToValue(values.speed),
  };
}

/** Checks only what the form itself must know before sending; every rule of a run is the schema's. */
export function checkBeforeSending(values: RunFormValues): Record<string, string> {
  const fields: Record<string, string> = {};
  if (!values.carId) fields.carId = 'Choose the car.';
  if (values.atEdited && !localInputToIso(values.at)) fields.at = 'Enter the date and time of the run, or tap Now.';
  return fields;
}

/**
 * The Idempotency-Key of a run being logged: the same body gives the same key, so a resend after a
 * lost answer is stored once (a car never makes two passes in the same second with the same details).
 * @example runKey({ carId: 'c1', at: '2026-05-03T14:20:00Z' }) // 'run-…'
 */
export function runKey(body: unknown): string {
  const text = JSON.stringify(body);
  // FNV-1a, twice with different seeds: enough to tell one team's runs apart, no crypto needed.
  let a = 0x811c9dc5;
  let b = 0x01000193 ^ 0x5bd1e995;
  for (let i = 0; i < text.length; i += 1) {
    const c = text.charCodeAt(i);
    a = Math.imul(a ^ c, 0x01000193) >>> 0;
    b = Math.imul(b ^ c, 0x5bd1e995) >>> 0;
  }
  return `run-${a.toString(36)}-${b.toString(36)}-${text.length}`;
}
