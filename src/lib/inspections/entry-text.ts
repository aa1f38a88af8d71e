import {
  decimalsForResolution,
  findResolution,
  formatLength,
  interpretIndicatorEntry,
  lengthToMm,
  type LengthUnit,
} from '../units';

/**
 * Reading what the technician typed into a sheet field. Indicator fields (backlash, runout) follow
 * the thousandths entry rule of units.ts and say how they read the entry; other fields take the
 * number as typed. Pure.
 */
export interface ParsedEntry {
  /** The value in the entry unit; null for an empty or unreadable field. */
  value: number | null;
  /** Why the text is not a value, to show beside the field. */
  error?: string;
  /** How the entry was read, e.g. "read as 0.010 in". */
  note?: string;
}

/**
 * Reads an indicator entry and says how it was read, with the digits the resolution supports.
 * @example parseIndicatorText('10', 'in', '0.001in') // { value: 0.01, note: 'read as 0.010 in (thousandths)' }
 */
export function parseIndicatorText(text: string, unit: LengthUnit, resolutionId: string): ParsedEntry {
  if (text.trim() === '') return { value: null };
  const entry = interpretIndicatorEntry(text, unit);
  if (!entry.ok) return { value: null, error: entry.text };
  const resolution = findResolution(resolutionId);
  if (!resolution) return { value: entry.value, note: `read as ${entry.value} ${unit}` };
  const shown = formatLength(lengthToMm(entry.value, unit), unit, resolution);
  const how = entry.interpretedAs === 'as-typed' ? '' : ` (${entry.interpretedAs})`;
  const finer = Number(shown) !== entry.value ? ` — finer than a ${resolution.label} indicator reads` : '';
  return { value: entry.value, note: `read as ${shown} ${unit}${how}${finer}` };
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
