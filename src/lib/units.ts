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

/** One graduation of a resolution, in `unit`. */
export function resolutionToStep(resolutionLike: ResolutionLike, unit: LengthUnit): number {
  const resolution = requireResolution(resolutionLike);
  return resolution.unit === unit ? resolution.step : mmToLength(resolution.mm, unit);
}

/**
 * Number of decimals a value may show in `displayUnit` without claiming more than the indicator resolves.
 * TRADE.md's rule (CP): d decimals where 10^-d is the largest power of ten not above the graduation in the
 * reader's unit (0.01 mm is 0.000394 in: 4 decimals; 0.001 in is 0.0254 mm: 2 decimals).
 * @example decimalsForResolution('0.001in', 'mm') // 2 (0.0254 mm → 0.03)
 */
export function decimalsForResolution(resolutionLike: ResolutionLike, displayUnit: LengthUnit): number {
  const step = resolutionToStep(resolutionLike, displayUnit);
  return Math.max(0, -Math.floor(Math.log10(step) + DIGIT_TOLERANCE));
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

/** How a typed length entry was read. */
export type EntryInterpretation = 'as-typed' | 'thousandths' | 'hundredths';

/** Result of reading a typed length entry. */
export type LengthEntry =
  | {
      readonly ok: true;
      /** The value in the entry unit. */
      readonly value: number;
      readonly interpretedAs: EntryInterpretation;
      /** What was typed, trimmed. */
      readonly input: string;
      /** The value as read, to show under the field: "= 0.0085 in". */
      readonly text: string;
    }
  | {
      readonly ok: false;
      readonly code: 'empty' | 'not-a-number' | 'negative' | 'too-large';
      readonly input: string;
      /** Why the entry is refused, worded in the entry unit. */
      readonly text: string;
    };

/** What a length field accepts: its largest magnitude in mm, and whether it may be negative. */
export interface LengthFieldLimit {
  readonly maxMm: number;
  readonly signed?: boolean;
}

const NUMBER_PATTERN = /^[+-]?(?:\d+(?:[.,]\d*)?|[.,]\d+)$/;

// Twelve significant digits: far below any graduation, and no float tail in "= 0.0085 in".
const cleanNumber = (value: number): number => Number(value.toPrecision(12));

/**
 * A field's limit in its entry unit, for messages: 2.5 mm → "0.0984 in".
 * @example lengthLimitToText(5, 'in') // '0.1969 in'
 */
export function lengthLimitToText(maxMm: number, unit: LengthUnit): string {
  return unit === 'in' ? `${mmToLength(maxMm, 'in').toFixed(4)} in` : `${maxMm} mm`;
}

/**
 * Reads a typed length with the sheet's one entry rule. A number within the field's limit is taken as typed; a
 * number above it is read as thousandths of an inch (hundredths of a millimetre on a metric sheet) when that lands
 * inside the limit, as technicians say "eight and a half thou" and a metric dial reads in hundredths; otherwise it
 * is refused, in the entry unit. The value as read is always given back to show under the field (CP).
 * @example readLengthEntry('8.5', 'in', { maxMm: 2.5 }) // { ok: true, value: 0.0085, interpretedAs: 'thousandths', text: '= 0.0085 in' }
 */
export function readLengthEntry(text: string, unit: LengthUnit, limit: LengthFieldLimit): LengthEntry {
  const input = text.trim();
  if (input === '') return { ok: false, code: 'empty', input, text: 'Type a value.' };
  if (!NUMBER_PATTERN.test(input)) {
    return { ok: false, code: 'not-a-number', input, text: `"${input}" is not a number; type e.g. 0.008 or 8.` };
  }
  const typed = Number(input.replace(',', '.'));
  if (typed < 0 && !limit.signed) {
    return { ok: false, code: 'negative', input, text: `"${input}" is negative; give 0 or more.` };
  }
  const fits = (value: number) => Math.abs(lengthToMm(value, unit)) <= limit.maxMm * (1 + DIGIT_TOLERANCE);
  const read = (value: number, interpretedAs: EntryInterpretation): LengthEntry => {
    const clean = cleanNumber(value);
    return { ok: true, value: clean, interpretedAs, input, text: `= ${clean} ${unit}` };
  };
  if (fits(typed)) return read(typed, 'as-typed');
  const isInch = unit === 'in';
  const scaled = typed / (isInch ? 1000 : 100);
  if (fits(scaled)) return read(scaled, isInch ? 'thousandths' : 'hundredths');
  const most = `${limit.signed ? '±' : ''}${lengthLimitToText(limit.maxMm, unit)}`;
  const how = isInch ? 'thousandths' : 'hundredths';
  return { ok: false, code: 'too-large', input, text: `"${input}" is over ${most}, even read as ${how}.` };
}
