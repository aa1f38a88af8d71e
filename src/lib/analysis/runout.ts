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

/** Gear-set geometry for the runout estimate (90° shaft angle). */
export interface GearGeometry {
  readonly ringTeeth: number;
  readonly pinionTeeth: number;
  readonly pressureAngleDeg?: number;
}

/** Factor from runout to lash peak-to-peak, with the ring gear's pitch angle. */
export interface RunoutFactor {
  readonly k: number;
  /** Ring-gear pitch angle δ2, degrees: tan δ2 = ringTeeth / pinionTeeth. */
  readonly deltaDeg: number;
}

const DEG = Math.PI / 180;

/**
 * Computes k = 2·sin δ2·tan αn with tan δ2 = ringTeeth / pinionTeeth.
 * @example computeRunoutFactor({ ringTeeth: 41, pinionTeeth: 10 }) // { k: 0.7072…, deltaDeg: 76.29… }
 */
export function computeRunoutFactor(geometry: GearGeometry): RunoutFactor {
  const { ringTeeth, pinionTeeth, pressureAngleDeg = DEFAULT_PRESSURE_ANGLE_DEG } = geometry;
  if (!(ringTeeth > 0 && pinionTeeth > 0)) throw new RangeError('Tooth counts must be positive.');
  if (!(pressureAngleDeg > 0 && pressureAngleDeg < 90)) throw new RangeError('Pressure angle must be in (0°, 90°).');
  const delta = Math.atan2(ringTeeth, pinionTeeth);
  return { k: 2 * Math.sin(delta) * Math.tan(pressureAngleDeg * DEG), deltaDeg: delta / DEG };
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
