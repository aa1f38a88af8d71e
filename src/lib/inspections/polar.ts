import { fitFirstHarmonic, MIN_POSITIONS } from '../analysis/harmonic-fit';
import { computeMean } from '../analysis/statistics';
import { DEG, polarToXY, roundCoordinate as round } from '../charts/polar-geometry';

/**
 * The polar preview of the backlash readings, as plain geometry for an SVG: position 1 (the marked
 * tooth) at the top, later positions clockwise in the order of rotation, each reading drawn at a
 * radius that exaggerates its difference from the mean so a few thousandths are visible. With every
 * position read, the fitted once-per-turn curve and its tight spot come too. Pure: no DOM.
 */
export interface PolarPoint {
  position: number;
  angleDeg: number;
  value: number | null;
  x: number;
  y: number;
  /** Where the position number goes, outside the ring. */
  labelX: number;
  labelY: number;
}

export interface PolarPreview {
  size: number;
  centre: number;
  /** Radius of the mean circle. */
  meanRadius: number;
  /** Every position; unread ones sit on the mean circle with value null. */
  points: PolarPoint[];
  /** SVG path of the fitted curve, or null until every position is read. */
  curve: string | null;
  /** The fitted tightest point, or null without a fit (or with no once-per-turn part). */
  tight: { angleDeg: number; x: number; y: number; labelX: number; labelY: number; rimX: number; rimY: number } | null;
  /** The rotation arrow: an arc just outside the labels, from 15° to 55°. */
  arrow: string;
  /** The marked tooth: a small triangle at the top, outside the labels. */
  marker: string;
}

/**
 * Shapes readings (null = not read yet) for the polar preview.
 * @example shapePolarPreview([0.2, 0.1, 0.0, 0.1]).tight?.angleDeg // 180
 */
export function shapePolarPreview(readings: readonly (number | null)[], size = 240): PolarPreview {
  const centre = size / 2;
  const meanRadius = size * 0.26;
  const swing = size * 0.12;
  const n = readings.length;
  const read = readings.filter((r): r is number => r !== null);
  const mean = read.length ? computeMean(read) : 0;
  const complete = n >= MIN_POSITIONS && read.length === n;
  const fit = complete ? fitFirstHarmonic(read, mean) : null;
  const largest = Math.max(0, ...read.map((r) => Math.abs(r - mean)), fit ? fit.amplitude : 0);
  const scale = largest > 0 ? swing / largest : 0;
  const radiusOf = (value: number) => meanRadius + (value - mean) * scale;
  const labelRadius = size * 0.44;

  const points = readings.map((value, i): PolarPoint => {
    const angleDeg = (360 * i) / n;
    const at = polarToXY(centre, value === null ? meanRadius : radiusOf(value), angleDeg);
    const label = polarToXY(centre, labelRadius, angleDeg);
    return { position: i + 1, angleDeg, value, x: at.x, y: at.y, labelX: label.x, labelY: label.y };
  });

  let curve: string | null = null;
  let tight: PolarPreview['tight'] = null;
  if (fit) {
    const steps = 72;
    const parts: string[] = [];
    for (let s = 0; s <= steps; s++) {
      const angleDeg = (360 * s) / steps;
      const theta = angleDeg * DEG;
      const at = polarToXY(centre, radiusOf(mean + fit.a * Math.cos(theta) + fit.b * Math.sin(theta)), angleDeg);
      parts.push(`${s === 0 ? 'M' : 'L'}${at.x} ${at.y}`);
    }
    curve = `${parts.join(' ')} Z`;
    if (fit.tightestAngleDeg !== null) {
      const angleDeg = fit.tightestAngleDeg;
      const at = polarToXY(centre, radiusOf(mean - fit.amplitude), angleDeg);
      const label = polarToXY(centre, Math.max(size * 0.06, meanRadius - swing - size * 0.08), angleDeg);
      const rim = polarToXY(centre, meanRadius, angleDeg);
      tight = { angleDeg, x: at.x, y: at.y, labelX: label.x, labelY: label.y, rimX: rim.x, rimY: rim.y };
    }
  }
  const arcRadius = size * 0.485;
  const from = polarToXY(centre, arcRadius, 15);
  const to = polarToXY(centre, arcRadius, 55);
  const arrow = `M${from.x} ${from.y} A ${round(arcRadius)} ${round(arcRadius)} 0 0 1 ${to.x} ${to.y}`;
  const apex = polarToXY(centre, size * 0.47, 0);
  const half = size * 0.03;
  const marker = `M${apex.x} ${apex.y} L${round(centre - half)} 0 L${round(centre + half)} 0 Z`;
  return { size, centre, meanRadius, points, curve, tight, arrow, marker };
}
