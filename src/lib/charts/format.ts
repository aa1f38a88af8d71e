// Numbers as the charts write them: never more digits than the indicator resolves, axis ticks on whole
// graduations, and run counts as whole runs. Pure.

import {
  decimalsForResolution,
  findResolution,
  formatLength,
  lengthToMm,
  mmToLength,
  type IndicatorResolutionId,
  type LengthUnit,
} from '../units';

/** The coarsest graduation we know, for a value with no inspection behind it (a limit, a fitted value). */
const FALLBACK_RESOLUTION: Readonly<Record<LengthUnit, IndicatorResolutionId>> = { in: '0.001in', mm: '0.01mm' };

/** A resolution id as stored, or the unit's coarsest one when it is unknown. */
export function toResolutionId(id: string | null | undefined, unit: LengthUnit): IndicatorResolutionId {
  return id && findResolution(id) ? (id as IndicatorResolutionId) : FALLBACK_RESOLUTION[unit];
}

/**
 * A length already in the reader's unit, with the digits its indicator supports (no unit label).
 * @example lengthToText(0.008749, 'in', '0.001in') // '0.009'
 */
export function lengthToText(value: number, unit: LengthUnit, resolution: IndicatorResolutionId): string {
  return formatLength(lengthToMm(value, unit), unit, resolution);
}

/**
 * A signed change, with a true minus sign and a plus for growth.
 * @example deltaToText(-0.001, 'in', '0.001in') // '−0.001'
 */
export function deltaToText(value: number, unit: LengthUnit, resolution: IndicatorResolutionId): string {
  const text = lengthToText(Math.abs(value), unit, resolution);
  if (Number(text) === 0) return text;
  return `${value > 0 ? '+' : '−'}${text}`;
}

/**
 * The graduation of a resolution in the reader's unit, as the charts step their ticks and domains. A
 * graduation converted to the other unit is no round number (0.001 in is 0.0254 mm, whose multiples read
 * 0.102, 0.152, 0.203): there the step is the largest power of ten not above it, the rule the digits follow.
 * @example resolutionStep('0.001in', 'mm') // 0.01
 */
export function resolutionStep(resolution: IndicatorResolutionId, unit: LengthUnit): number {
  const found = findResolution(resolution);
  if (!found) return unit === 'in' ? 0.001 : 0.01;
  if (found.unit === unit) return found.step;
  return Number((10 ** Math.floor(Math.log10(mmToLength(found.mm, unit)) + 1e-9)).toPrecision(1));
}

/** Decimals for a resolution in the reader's unit. */
export function decimalsFor(resolution: IndicatorResolutionId, unit: LengthUnit): number {
  return decimalsForResolution(resolution, unit);
}

/**
 * Of several resolutions, the coarsest (largest graduation): a value computed from all of them
 * resolves no better than that.
 * @example coarsestResolution(['0.0005in', '0.001in'], 'in') // '0.001in'
 */
export function coarsestResolution(ids: readonly IndicatorResolutionId[], unit: LengthUnit): IndicatorResolutionId {
  if (ids.length === 0) return FALLBACK_RESOLUTION[unit];
  // Compared as the dials' true graduations: the rounded chart steps of two dials can be equal.
  const graduation = (id: IndicatorResolutionId) => findResolution(id)?.mm ?? 0;
  return ids.reduce((a, b) => (graduation(b) > graduation(a) ? b : a));
}

/**
 * A torque for a chart: one decimal (pinion turning torque is read off a dial or beam wrench).
 * @example torqueToText(10.000000002) // '10.0'
 */
export function torqueToText(value: number): string {
  return value.toFixed(1);
}

/** Whole runs for labels ("run 54"); a projection is never more precise than one run. */
export function runsToText(runs: number): string {
  return String(Math.round(runs));
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/**
 * A date as the team reads it, in UTC so the server and the island agree.
 * @example isoToDayText('2026-10-26T16:00:00.000Z') // '26 Oct 2026'
 */
export function isoToDayText(iso: string): string {
  const day = Number(iso.slice(8, 10));
  const month = MONTHS[Number(iso.slice(5, 7)) - 1] ?? '';
  return `${day} ${month} ${iso.slice(0, 4)}`;
}

/**
 * Ticks on a multiple of `step` (1, 2 or 5 × a power of ten, never finer than `step`), at most `maxTicks`.
 * @example stepTicks(0.0044, 0.0101, 0.001) // [0.005, 0.006, 0.007, 0.008, 0.009, 0.01]
 */
export function stepTicks(
  low: number,
  high: number,
  step: number,
  maxTicks = 7,
  factors: readonly number[] = [1, 2, 2.5, 5],
): number[] {
  if (!(high > low) || !(step > 0)) return [low];
  let tick = step;
  for (let decade = step; ; decade *= 10) {
    const found = factors
      .map((f) => f * decade)
      .find((candidate) => candidate >= step && (high - low) / candidate <= maxTicks - 1);
    if (found) {
      tick = found;
      break;
    }
    if (decade > (high - low) * 10) break;
  }
  const first = Math.ceil(low / tick - 1e-9);
  const last = Math.floor(high / tick + 1e-9);
  const ticks: number[] = [];
  for (let i = first; i <= last; i++) ticks.push(Number((i * tick).toPrecision(12)));
  return ticks;
}

/**
 * A value domain around everything a chart draws, padded by a tenth and snapped to the graduation.
 * @example valueDomain([0.0065, 0.009], 0.001) // [0.005, 0.01]
 */
export function valueDomain(values: readonly number[], step: number, floorAtZero = true): [number, number] {
  const finite = values.filter(Number.isFinite);
  if (finite.length === 0) return [0, step * 4];
  let low = Math.min(...finite);
  let high = Math.max(...finite);
  const pad = Math.max((high - low) * 0.1, step);
  low = Math.floor((low - pad) / step + 1e-9) * step;
  high = Math.ceil((high + pad) / step - 1e-9) * step;
  if (floorAtZero) low = Math.max(0, low);
  return [Number(low.toPrecision(12)), Number(high.toPrecision(12))];
}
