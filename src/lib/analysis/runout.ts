// From the once-per-turn lash amplitude to the ring gear's back-face runout (TIR).
// TRADE.md (D), bevel/hypoid extension of Elements of Metric Gear Technology §14: an axial shift Δx moves the
// mesh Δx·sin δ2 normal to the pitch cone, so a back-face runout Ra gives lash peak-to-peak ≈ k·Ra with
// k = 2·sin δ2·tan αn. The indicator is taken to sit at the mesh radius (heel of the tooth, GM 1996), so the
// mesh-radius / indicator-radius scale is 1.

/** Normal pressure angle default. M: from memory (TRADE.md gives 20° in its worked example, unsourced). */
export const DEFAULT_PRESSURE_ANGLE_DEG = 20;
export const DEFAULT_PRESSURE_ANGLE_SOURCE = {
  key: 'M',
  source: 'from memory; not checked against a published text',
} as const;

/** Gear-set geometry for the runout estimate (90° shaft angle), with the set's k setting. */
export interface GearGeometry {
  readonly ringTeeth: number;
  readonly pinionTeeth: number;
  readonly pressureAngleDeg?: number;
  /**
   * Mean spiral angle βm, degrees: the indicator reads along the rotation (transverse), so k is taken in the
   * transverse plane, k = 2·sin δ2·tan αn / cos βm. Absent: k as for a straight tooth (βm = 0).
   */
  readonly spiralAngleDeg?: number | null;
  /** A k typed in for the set (a maker's figure or the team's own); overrides the computed one. */
  readonly runoutK?: number | null;
}

/** How k was found: from the tooth counts alone, with the spiral angle, or typed in. */
export type RunoutFactorBasis = 'tooth-counts' | 'spiral-angle' | 'typed';

/** Factor from runout to lash peak-to-peak, with the ring gear's pitch angle. */
export interface RunoutFactor {
  readonly k: number;
  /** Ring-gear pitch angle δ2, degrees: tan δ2 = ringTeeth / pinionTeeth. */
  readonly deltaDeg: number;
  readonly basis: RunoutFactorBasis;
}

const DEG = Math.PI / 180;

/**
 * Computes k = 2·sin δ2·tan αn with tan δ2 = ringTeeth / pinionTeeth (TRADE.md, D). With a spiral angle βm the
 * indicator, reading along the rotation, sees transverse backlash: a centre-distance change Δa gives transverse
 * j_t = 2·Δa·tan αt (Elements of Metric Gear Technology §14) with tan αt = tan αn / cos β (the helical relation
 * of the same text; recalled, not checked against it: M), so k = 2·sin δ2·tan αn / cos βm (D). Ignoring a 45°
 * spiral would overstate the runout by 1 / cos 45° ≈ 1.41. A typed k is used as typed.
 * @example computeRunoutFactor({ ringTeeth: 41, pinionTeeth: 10 }) // { k: 0.7072…, deltaDeg: 76.29…, basis: 'tooth-counts' }
 */
export function computeRunoutFactor(geometry: GearGeometry): RunoutFactor {
  const { ringTeeth, pinionTeeth, pressureAngleDeg = DEFAULT_PRESSURE_ANGLE_DEG, spiralAngleDeg, runoutK } = geometry;
  if (!(ringTeeth > 0 && pinionTeeth > 0)) throw new RangeError('Tooth counts must be positive.');
  if (!(pressureAngleDeg > 0 && pressureAngleDeg < 90)) throw new RangeError('Pressure angle must be in (0°, 90°).');
  const delta = Math.atan2(ringTeeth, pinionTeeth);
  const deltaDeg = delta / DEG;
  if (typeof runoutK === 'number') {
    if (!(runoutK > 0)) throw new RangeError('A typed k must be positive.');
    return { k: runoutK, deltaDeg, basis: 'typed' };
  }
  const straight = 2 * Math.sin(delta) * Math.tan(pressureAngleDeg * DEG);
  if (typeof spiralAngleDeg === 'number' && spiralAngleDeg > 0) {
    if (!(spiralAngleDeg < 90)) throw new RangeError('Spiral angle must be below 90°.');
    return { k: straight / Math.cos(spiralAngleDeg * DEG), deltaDeg, basis: 'spiral-angle' };
  }
  return { k: straight, deltaDeg, basis: 'tooth-counts' };
}

/**
 * Says which k an estimate used, for the screen.
 * @example runoutFactorToText({ k: 0.7072, deltaDeg: 76.29, basis: 'typed' }) // 'k = 0.707, typed in for this set'
 */
export function runoutFactorToText(factor: RunoutFactor, spiralAngleDeg?: number | null): string {
  const k = `k = ${factor.k.toFixed(3)}`;
  if (factor.basis === 'typed') return `${k}, typed in for this set`;
  if (factor.basis === 'spiral-angle')
    return `${k}, from the tooth counts, the pressure angle and a ${spiralAngleDeg ?? '?'}° spiral angle`;
  return `${k}, from the tooth counts and the pressure angle (no spiral angle set)`;
}

/**
 * Converts a fitted lash amplitude to back-face runout: peak-to-peak 2C ≈ k·Ra, so Ra = 2C / k.
 * @example amplitudeToRunout(0.0354, 0.7072) // ≈ 0.1
 */
export function amplitudeToRunout(amplitude: number, k: number): number {
  return (2 * amplitude) / k;
}

/**
 * Converts a fitted lash amplitude to spur-gear eccentricity: j(θ) = j0 + 2e·tan α·cos(θ − φ), so e = C / (2 tan α).
 * Source: Elements of Metric Gear Technology §14 (TRADE.md, D).
 * @example amplitudeToEccentricity(2 * 0.05 * Math.tan(20 * Math.PI / 180), 20) // 0.05
 */
export function amplitudeToEccentricity(amplitude: number, pressureAngleDeg: number): number {
  return amplitude / (2 * Math.tan(pressureAngleDeg * DEG));
}
