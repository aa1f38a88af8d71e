/**
 * The axle ratio of a ring-and-pinion set from its tooth counts.
 * @example teethToRatio(41, 10) // 4.1
 */
export function teethToRatio(ringTeeth: number, pinionTeeth: number): number {
  return ringTeeth / pinionTeeth;
}

/**
 * The ratio as racers write it, to two decimals.
 * @example ratioToLabel(4.1) // '4.10:1'
 */
export function ratioToLabel(ratio: number): string {
  return `${ratio.toFixed(2)}:1`;
}
