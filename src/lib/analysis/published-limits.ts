// Limits as published: each figure kept as printed, in each unit it is printed in, and judged in the unit the
// reading was taken in. A source printing 0.13–0.23 mm and 0.005–0.009 in gives both figures, and they are not
// the same numbers (0.005 in is 0.127 mm): an inch reading is judged against the inch figure, never a converted mm
// figure (TRADE.md, Units, CP).

import { lengthToMm, mmToLength, nmToTorque, torqueToNm, torqueUnitToLabel, type LengthUnit } from '../units';

/** Torque units a limit is published in and a reading is taken in. */
export type PublishedTorqueUnit = 'N-m' | 'lbf-in';

/** One length limit as printed, e.g. { mm: '0.13', in: '0.005' }. At least one unit. */
export type LengthFigures = Readonly<Partial<Record<LengthUnit, string>>>;
/** One torque limit as printed, e.g. { 'N-m': '1.0', 'lbf-in': '8' }. At least one unit. */
export type TorqueFigures = Readonly<Partial<Record<PublishedTorqueUnit, string>>>;

export interface TorqueBandFigures {
  readonly min: TorqueFigures;
  readonly max: TorqueFigures;
}

/** Every limit of a tolerance profile as published. */
export interface PublishedLimits {
  readonly backlashMin: LengthFigures;
  readonly backlashMax: LengthFigures;
  readonly maxSpread: LengthFigures;
  readonly runoutMax: LengthFigures;
  readonly pinionPreloadNew: TorqueBandFigures;
  readonly pinionPreloadUsed: TorqueBandFigures;
}

export type PublishedLengthField = 'backlashMin' | 'backlashMax' | 'maxSpread' | 'runoutMax';
export type PublishedTorqueField = 'pinionPreloadNew' | 'pinionPreloadUsed';

/** A figure as printed: digits, an optional point and more digits (no sign, no exponent). */
export const FIGURE_PATTERN = /^\d+(?:\.\d+)?$/;

const LENGTH_UNITS_IN_ORDER: readonly LengthUnit[] = ['mm', 'in'];
const TORQUE_UNITS_IN_ORDER: readonly PublishedTorqueUnit[] = ['N-m', 'lbf-in'];

/**
 * A number as a figure with no float tail, for limits known only as numbers (a profile typed in mm).
 * @example numberToFigure(0.12700000000000003) // '0.127'
 */
export function numberToFigure(value: number): string {
  return String(Number(value.toPrecision(12)));
}

/**
 * A length limit in mm from its figures: the mm figure when printed, else the inch figure converted.
 * @example lengthFiguresToMm({ in: '0.005' }) // 0.127
 */
export function lengthFiguresToMm(figures: LengthFigures): number {
  if (figures.mm !== undefined) return Number(figures.mm);
  if (figures.in !== undefined) return lengthToMm(Number(figures.in), 'in');
  throw new RangeError('A length limit needs a figure in mm or in.');
}

/**
 * A torque limit in N·m from its figures: the N·m figure when printed, else the lbf·in figure converted.
 * @example torqueFiguresToNm({ 'lbf-in': '8' }) // 0.9038…
 */
export function torqueFiguresToNm(figures: TorqueFigures): number {
  if (figures['N-m'] !== undefined) return Number(figures['N-m']);
  if (figures['lbf-in'] !== undefined) return torqueToNm(Number(figures['lbf-in']), 'lbf-in');
  throw new RangeError('A torque limit needs a figure in N·m or lbf·in.');
}

/** A limit as a reading in one unit is judged against it. */
export interface EffectiveLimit {
  /** The limit in the reading's unit: the printed figure itself, or the other unit's figure converted. */
  readonly value: number;
  /** How far past `value` a reading may sit and still be within: 0 when the figure is printed in that unit. */
  readonly allowance: number;
  /** True when the reading's unit has its own printed figure. */
  readonly asPublished: boolean;
}

/**
 * A length limit in the reading's unit. Printed in that unit: exactly that figure. Printed only in the other
 * unit: that figure converted, with half the indicator's graduation allowed before a reading is out (CP).
 * @example lengthLimitIn({ mm: '0.13' }, 'in', 0.001) // { value: 0.005118…, allowance: 0.0005, asPublished: false }
 */
export function lengthLimitIn(figures: LengthFigures, unit: LengthUnit, graduation: number): EffectiveLimit {
  const own = figures[unit];
  if (own !== undefined) return { value: Number(own), allowance: 0, asPublished: true };
  return { value: mmToLength(lengthFiguresToMm(figures), unit), allowance: graduation / 2, asPublished: false };
}

/**
 * Half a unit in the last printed digit: '1.0' → 0.05, '12' → 0.5.
 * @example halfLastDigit('1.4') // 0.05
 */
export function halfLastDigit(figure: string): number {
  const decimals = figure.includes('.') ? figure.length - figure.indexOf('.') - 1 : 0;
  return 0.5 * 10 ** -decimals;
}

/**
 * A torque limit in the reading's unit. Printed in that unit: exactly that figure. Printed only in the other unit:
 * that figure converted, with half a unit in its last printed digit allowed before a reading is out (CP).
 * @example torqueLimitIn({ 'N-m': '1.0' }, 'lbf-in') // { value: 8.85…, allowance: 0.4425…, asPublished: false }
 */
export function torqueLimitIn(figures: TorqueFigures, unit: PublishedTorqueUnit): EffectiveLimit {
  const own = figures[unit];
  if (own !== undefined) return { value: Number(own), allowance: 0, asPublished: true };
  const other = TORQUE_UNITS_IN_ORDER.find((u) => u !== unit && figures[u] !== undefined);
  if (!other) throw new RangeError('A torque limit needs a figure in N·m or lbf·in.');
  const printed = figures[other] as string;
  const toUnit = (value: number) => nmToTorque(torqueToNm(value, other), unit);
  return { value: toUnit(Number(printed)), allowance: toUnit(halfLastDigit(printed)), asPublished: false };
}

/**
 * A length limit for the reader: the printed figure in the reader's unit where there is one (0.005 in, never
 * 0.0051), otherwise `fallback` (the caller rounds the converted figure to the graduation).
 * @example lengthFiguresToText({ mm: '0.13', in: '0.005' }, 'in', () => '') // '0.005'
 */
export function lengthFiguresToText(
  figures: LengthFigures,
  unit: LengthUnit,
  fallback: (mm: number) => string,
): string {
  return figures[unit] ?? fallback(lengthFiguresToMm(figures));
}

/**
 * A torque limit for the reader: as printed in the reader's unit, else converted to one decimal.
 * @example torqueFiguresToText({ 'N-m': '1.0', 'lbf-in': '8' }, 'lbf-in') // '8'
 */
export function torqueFiguresToText(figures: TorqueFigures, unit: PublishedTorqueUnit): string {
  return figures[unit] ?? nmToTorque(torqueFiguresToNm(figures), unit).toFixed(1);
}

/**
 * A torque band for the reader, e.g. "8–12 lbf·in".
 * @example torqueBandToText({ min: { 'lbf-in': '8' }, max: { 'lbf-in': '12' } }, 'lbf-in') // '8–12 lbf·in'
 */
export function torqueBandToText(band: TorqueBandFigures, unit: PublishedTorqueUnit): string {
  return `${torqueFiguresToText(band.min, unit)}–${torqueFiguresToText(band.max, unit)} ${torqueUnitToLabel(unit)}`;
}

/** The units a length limit is printed in, for "published in mm and in". */
export function lengthFiguresUnits(figures: LengthFigures): LengthUnit[] {
  return LENGTH_UNITS_IN_ORDER.filter((unit) => figures[unit] !== undefined);
}

/** The units a torque limit is printed in. */
export function torqueFiguresUnits(figures: TorqueFigures): PublishedTorqueUnit[] {
  return TORQUE_UNITS_IN_ORDER.filter((unit) => figures[unit] !== undefined);
}
