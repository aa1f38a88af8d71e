import {
  decimalsForResolution,
  findResolution,
  formatLength,
  lengthToMm,
  readLengthEntry,
  type LengthFieldLimit,
  type LengthUnit,
} from '../units';
import { LIMITS } from './schemas';

/**
 * Reading what the technician typed into a sheet field. Every length field (backlash, runout, shims, depth
 * change, carrier shims) follows the one entry rule of units.ts (`readLengthEntry`) and shows the value as read
 * under the field; other fields take the number as typed. Pure.
 */
export interface ParsedEntry {
  /** The value in the entry unit; null for an empty or unreadable field. */
  value: number | null;
  /** Why the text is not a value, to show beside the field. */
  error?: string;
  /** The value as read, e.g. "= 0.0085 in". */
  note?: string;
}

/** The length fields of the sheet and what each accepts (the schema's limits, canonical mm). */
export type LengthField = 'indicator' | 'shim' | 'depth-change';

export const LENGTH_FIELD_LIMITS: Readonly<Record<LengthField, LengthFieldLimit>> = {
  indicator: { maxMm: LIMITS.backlashMm },
  shim: { maxMm: LIMITS.shimMm },
  'depth-change': { maxMm: LIMITS.depthChangeMm, signed: true },
};

/**
 * Reads a length entry and says how it was read; on an indicator field, also when it is finer than the dial.
 * @example parseLengthText('8.5', 'in', '0.0005in', 'indicator') // { value: 0.0085, note: '= 0.0085 in' }
 */
export function parseLengthText(text: string, unit: LengthUnit, resolutionId: string, field: LengthField): ParsedEntry {
  if (text.trim() === '') return { value: null };
  const entry = readLengthEntry(text, unit, LENGTH_FIELD_LIMITS[field]);
  if (!entry.ok) return { value: null, error: entry.text };
  const resolution = field === 'indicator' ? findResolution(resolutionId) : undefined;
  if (!resolution) return { value: entry.value, note: entry.text };
  const shown = formatLength(lengthToMm(entry.value, unit), unit, resolution);
  const finer = Number(shown) !== entry.value ? ` — finer than a ${resolution.label} indicator reads` : '';
  return { value: entry.value, note: `${entry.text}${finer}` };
}

/**
 * Reads an indicator entry (backlash, runout).
 * @example parseIndicatorText('10', 'in', '0.001in') // { value: 0.01, note: '= 0.01 in' }
 */
export function parseIndicatorText(text: string, unit: LengthUnit, resolutionId: string): ParsedEntry {
  return parseLengthText(text, unit, resolutionId, 'indicator');
}

const DECIMAL = /^[+-]?(?:\d+(?:[.,]\d*)?|[.,]\d+)$/;

/**
 * Reads a plain number (shim thickness, torque, runs), optionally signed or whole.
 * @example parseDecimalText('-0,004', { signed: true }) // { value: -0.004 }
 */
export function parseDecimalText(text: string, options: { signed?: boolean; whole?: boolean } = {}): ParsedEntry {
  const input = text.trim();
  if (input === '') return { value: null };
  if (!DECIMAL.test(input)) return { value: null, error: `"${input}" is not a number.` };
  const value = Number(input.replace(',', '.'));
  if (!options.signed && value < 0) return { value: null, error: 'Give 0 or more.' };
  if (options.whole && !Number.isInteger(value)) return { value: null, error: 'Give a whole number.' };
  return { value };
}

/** Decimals a typed length field starts with for a stored value, for the sheet's resolution. */
export function entryDecimals(resolutionId: string, unit: LengthUnit): number {
  const resolution = findResolution(resolutionId);
  return resolution ? decimalsForResolution(resolution, unit) : unit === 'in' ? 3 : 2;
}
