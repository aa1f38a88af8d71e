// Length and torque units, dial-indicator resolutions, display rounding and the thousandths entry rule.
// Canonical units are mm and N·m. Unit ids are ASCII ('lbf-in', 'N-m') so they survive URLs, CSV and
// database columns; the labels with the middle dot are for display only.

/** Length unit id: inches or millimetres. */
export type LengthUnit = 'in' | 'mm';
/** Torque unit id (ASCII): 'N-m' = N·m, 'lbf-in' = lbf·in, 'lbf-ft' = lbf·ft. */
export type TorqueUnit = 'N-m' | 'lbf-in' | 'lbf-ft';

export const LENGTH_UNITS: readonly LengthUnit[] = ['in', 'mm'];
export const TORQUE_UNITS: readonly TorqueUnit[] = ['N-m', 'lbf-in', 'lbf-ft'];

// NIST SP 811 (2008) App. B: exact by definition of the inch and the pound-force.
export const MM_PER_INCH = 25.4;
export const NM_PER_LBFIN = 0.1129848290276167;
// eslint-disable-next-line no-loss-of-precision -- kept with every digit NIST prints; the nearest double is what arithmetic uses
export const NM_PER_LBFFT = 1.3558179483314004;

const NM_PER_TORQUE_UNIT: Readonly<Record<TorqueUnit, number>> = {
  'N-m': 1,
  'lbf-in': NM_PER_LBFIN,
  'lbf-ft': NM_PER_LBFFT,
};

const TORQUE_LABELS: Readonly<Record<TorqueUnit, string>> = {
  'N-m': 'N·m',
  'lbf-in': 'lbf·in',
  'lbf-ft': 'lbf·ft',
};

/**
 * Converts a length in `unit` to millimetres.
 * @example lengthToMm(0.005, 'in') // 0.127
 */
export function lengthToMm(value: number, unit: LengthUnit): number {
  return unit === 'in' ? value * MM_PER_INCH : value;
}

/**
 * Converts millimetres to a length in `unit`.
 * @example mmToLength(0.127, 'in') // 0.005
 */
export function mmToLength(mm: number, unit: LengthUnit): number {
  return unit === 'in' ? mm / MM_PER_INCH : mm;
}

/**
 * Converts a torque in `unit` to N·m.
 * @example torqueToNm(24, 'lbf-in') // 2.7116…
 */
export function torqueToNm(value: number, unit: TorqueUnit): number {
  return value * NM_PER_TORQUE_UNIT[unit];
}

/**
 * Converts N·m to a torque in `unit`.
 * @example nmToTorque(1.3558179483314004, 'lbf-ft') // 1
 */
export function nmToTorque(nm: number, unit: TorqueUnit): number {
  return unit === 'N-m' ? nm : nm / NM_PER_TORQUE_UNIT[unit];
}

/** Returns the display label of a length unit ("in", "mm"). */
export function lengthUnitToLabel(unit: LengthUnit): string {
  return unit;
}

/**
 * Returns the display label of a torque unit.
 * @example torqueUnitToLabel('lbf-in') // 'lbf·in'
 */
export function torqueUnitToLabel(unit: TorqueUnit): string {
  return TORQUE_LABELS[unit];
}

/** Id of a dial-indicator resolution (the value of one graduation). */
export type IndicatorResolutionId = '0.001in' | '0.0005in' | '0.0001in' | '0.01mm' | '0.002mm';

/** One dial-indicator resolution: its graduation in its own unit and in mm. */
export interface IndicatorResolution {
  readonly id: IndicatorResolutionId;
  readonly label: string;
  readonly unit: LengthUnit;
  /** One graduation in `unit`. */
  readonly step: number;
  /** One graduation in mm (exact decimal, NIST SP 811 (2008) App. B). */
  readonly mm: number;
}

// The five graduations TRADE.md lists; mm sizes are exact decimals (0.001 in = 0.0254 mm).
export const INDICATOR_RESOLUTIONS: readonly IndicatorResolution[] = Object.freeze([
  { id: '0.001in', label: '0.001 in', unit: 'in', step: 0.001, mm: 0.0254 },
  { id: '0.0005in', label: '0.0005 in', unit: 'in', step: 0.0005, mm: 0.0127 },
  { id: '0.0001in', label: '0.0001 in', unit: 'in', step: 0.0001, mm: 0.00254 },
  { id: '0.01mm', label: '0.01 mm', unit: 'mm', step: 0.01, mm: 0.01 },
  { id: '0.002mm', label: '0.002 mm', unit: 'mm', step: 0.002, mm: 0.002 },
]);

/** Returns the indicator resolution with this id, or undefined for an unknown id. */
export function findResolution(id: string): IndicatorResolution | undefined {
  return INDICATOR_RESOLUTIONS.find((resolution) => resolution.id === id);
}

/** A resolution, or its id as stored with an inspection. */
export type ResolutionLike = IndicatorResolution | IndicatorResolutionId;

function requireResolution(resolution: ResolutionLike): IndicatorResolution {
  if (typeof resolution !== 'string') return resolution;
  const found = findResolution(resolution);
  if (!found) throw new RangeError(`Unknown indicator resolution "${resolution}".`);
  return found;
}

// Float products such as 0.0254 / 25.4 land a hair off a decade; this keeps them on it.
const DIGIT_TOLERANCE = 1e-9;

/**
 * Number of decimals a value may show in `displayUnit` without claiming more than the indicator resolves.
 * Rule: show down to the decimal place of the graduation's leading digit; if the graduation is not a
 * whole number of units at that place (a converted step such as 0.0254 mm), show one digit more, so rounding
 * moves a value by at most a twentieth of a graduation. Never more than one digit finer than the graduation.
 * @example decimalsForResolution('0.001in', 'mm') // 3 (0.0254 mm → 0.025)
 */
export function decimalsForResolution(resolutionLike: ResolutionLike, displayUnit: LengthUnit): number {
  const resolution = requireResolution(resolutionLike);
  const step = resolution.unit === displayUnit ? resolution.step : mmToLength(resolution.mm, displayUnit);
  const leadingPlace = -Math.floor(Math.log10(step) + DIGIT_TOLERANCE);
  const scaled = step * 10 ** leadingPlace;
  const isWholeAtPlace = Math.abs(scaled - Math.round(scaled)) <= DIGIT_TOLERANCE * scaled;
  return Math.max(0, isWholeAtPlace ? leadingPlace : leadingPlace + 1);
}

/**
 * Formats a length held in mm for display in `unit`, with the digits the resolution supports (no unit label).
 * @example formatLength(0.2032, 'in', '0.001in') // '0.008'
 */
export function formatLength(mm: number, unit: LengthUnit, resolution: ResolutionLike): string {
  const decimals = decimalsForResolution(resolution, unit);
  const factor = 10 ** decimals;
  const scaled = mmToLength(mm, unit) * factor;
  // Half away from zero, with a tolerance so 0.0127 mm → 0.0005 in does not round on float noise.
  const magnitude = Math.floor(Math.abs(scaled) + 0.5 + DIGIT_TOLERANCE);
  const rounded = magnitude === 0 ? 0 : Math.sign(scaled) * magnitude;
  return (rounded / factor).toFixed(decimals);
}

/** How a typed indicator entry was read. */
export type EntryInterpretation = 'as-typed' | 'thousandths' | 'hundredths';

/** Result of reading a typed indicator entry. */
export type IndicatorEntry =
  | {
      readonly ok: true;
      /** The reading in the entry unit. */
      readonly value: number;
      readonly interpretedAs: EntryInterpretation;
      /** What was typed, trimmed. */
      readonly input: string;
      /** Sentence to show beside the field, e.g. "10 read as thousandths: 0.010 in". */
      readonly text: string;
    }
  | {
      readonly ok: false;
      readonly code: 'empty' | 'not-a-number' | 'negative';
      readonly input: string;
      readonly text: string;
    };

const NUMBER_PATTERN = /^\+?(?:\d+(?:[.,]\d*)?|[.,]\d+)$/;
const WHOLE_PATTERN = /^\+?\d+$/;

/**
 * Reads a typed dial-indicator entry with the shop's "thousandths entry rule".
 * Inches: a whole number ≥ 1 is thousandths ("10" → 0.010 in), as technicians say "ten thou".
 * Millimetres: a whole number ≥ 1 is hundredths ("13" → 0.13 mm), the graduation of a metric dial.
 * A whole number ≥ 1 in or ≥ 1 mm is never a lash or runout reading, so the rule cannot hide a real value.
 * Anything with a decimal point (or comma) is taken as typed; "0" stays 0.
 * @example interpretIndicatorEntry('10', 'in') // { ok: true, value: 0.01, interpretedAs: 'thousandths', … }
 */
export function interpretIndicatorEntry(text: string, unit: LengthUnit): IndicatorEntry {
  const input = text.trim();
  if (input === '') return { ok: false, code: 'empty', input, text: 'Type a reading.' };
  if (input.startsWith('-') && NUMBER_PATTERN.test(input.slice(1))) {
    return { ok: false, code: 'negative', input, text: `"${input}" is negative; an indicator reading is 0 or more.` };
  }
  if (!NUMBER_PATTERN.test(input)) {
    return { ok: false, code: 'not-a-number', input, text: `"${input}" is not a number; type e.g. 0.008 or 8.` };
  }
  const typed = Number(input.replace(',', '.'));
  if (WHOLE_PATTERN.test(input) && typed >= 1) {
    const isInch = unit === 'in';
    const value = typed / (isInch ? 1000 : 100);
    const interpretedAs: EntryInterpretation = isInch ? 'thousandths' : 'hundredths';
    const shown = value.toFixed(isInch ? 3 : 2);
    return { ok: true, value, interpretedAs, input, text: `${input} read as ${interpretedAs}: ${shown} ${unit}` };
  }
  return { ok: true, value: typed, interpretedAs: 'as-typed', input, text: `${input} ${unit} as typed` };
}
