import { computeTighteningSequence } from '../analysis/tightening-sequence';
import { nmToTorque, torqueToNm, torqueUnitToLabel, type TorqueUnit } from '../units';
import type { FastenerGroup, Torque } from './model';

/** One pass of a fastener group: its share of the figure and the torque that makes, in the reader's unit. */
export interface PassTorque {
  pass: number;
  percent: number;
  value: number | null;
  unit: TorqueUnit;
}

/**
 * Converts a torque to another unit through N·m (NIST SP 811 (2008) App. B constants in units.ts).
 * @example convertTorque({ value: 100, unit: 'lbf-ft' }, 'N-m') // { value: 135.58179483314004, unit: 'N-m' }
 */
export function convertTorque(torque: Torque, unit: TorqueUnit): Torque {
  return { value: nmToTorque(torqueToNm(torque.value, torque.unit), unit), unit };
}

/**
 * The passes of a group in the reader's unit (a null value where the group has no figure).
 * @example groupToPassTorques({ …, torque: { value: 100, unit: 'lbf-ft' }, passesPercent: [30, 70, 100] }, 'lbf-ft')
 * // values 30, 70, 100
 */
export function groupToPassTorques(group: FastenerGroup, unit: TorqueUnit): PassTorque[] {
  const full = group.torque ? convertTorque(group.torque, unit).value : null;
  return group.passesPercent.map((percent, i) => ({
    pass: i + 1,
    percent,
    value: full === null ? null : (full * percent) / 100,
    unit,
  }));
}

/**
 * A torque for display: at most one decimal, none from 100 up, and the unit's label.
 * @example formatTorque(135.58, 'N-m') // '136 N·m'
 */
export function formatTorque(value: number, unit: TorqueUnit): string {
  const digits = Math.abs(value) >= 100 ? 0 : 1;
  return `${Number(value.toFixed(digits)).toLocaleString('en-US')} ${torqueUnitToLabel(unit)}`;
}

/** The engine's order for the group, or null when no tightening order applies. */
export function groupToSequence(group: FastenerGroup): readonly number[] | null {
  return group.sequence ? computeTighteningSequence(group.count) : null;
}

/**
 * Whether `bolts` is a permutation of 1…count (every bolt once).
 * @example isBoltPermutation([1, 3, 2], 3) // true
 */
export function isBoltPermutation(bolts: readonly number[], count: number): boolean {
  if (bolts.length !== count) return false;
  const seen = new Set(bolts);
  return seen.size === count && bolts.every((bolt) => Number.isInteger(bolt) && bolt >= 1 && bolt <= count);
}

/** Whether bolts tapped in `tapped` order left the engine's order (a partial list is compared as far as it goes). */
export function isOrderDeviation(tapped: readonly number[], sequence: readonly number[]): boolean {
  return tapped.some((bolt, i) => sequence[i] !== bolt);
}

/**
 * A pass in words, its torque in the reader's unit.
 * @example passToText({ pass: 1, percent: 30, value: 16.5, unit: 'lbf-ft' }) // 'Pass 1: 30 % — 16.5 lbf·ft'
 */
export function passToText(pass: PassTorque): string {
  return `Pass ${pass.pass}: ${pass.percent} %${pass.value === null ? '' : ` — ${formatTorque(pass.value, pass.unit)}`}`;
}
