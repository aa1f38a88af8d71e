// Backlash around the ring gear as a polar chart: position 1 (the marked tooth) at the top, later
// positions clockwise in the order of rotation, the radius a real value scale (labelled rings, the
// centre is the lowest value drawn, not zero), the tolerance band as a shaded ring, the fitted
// once-per-turn curve and its tight spot. One inspection, or two overlaid to compare. Pure geometry.

import { fitFirstHarmonic, MIN_POSITIONS } from '../analysis/harmonic-fit';
import { computeMean } from '../analysis/statistics';
import { DEG, polarToXY, roundCoordinate as round } from './polar-geometry';
import type { IndicatorResolutionId, LengthUnit } from '../units';
import { coarsestResolution, lengthToText, resolutionStep, stepTicks, valueDomain } from './format';

export interface PolarSeriesInput {
  key: string;
  /** e.g. "26 Oct 2026, run 44". */
  name: string;
  /** Readings in the reader's unit, position 1 first; null = not read. */
  readings: readonly (number | null)[];
  resolution: IndicatorResolutionId;
}

export interface PolarPointShape {
  position: number;
  angleDeg: number;
  value: number;
  x: number;
  y: number;
  text: string;
}

export interface PolarSeriesShape {
  key: string;
  name: string;
  mark: 'circle' | 'square';
  dashed: boolean;
  points: PolarPointShape[];
  /** SVG path of the fitted once-per-turn curve; null until every position is read. */
  curve: string | null;
  /** The fitted tightest point; null without a fit or without a once-per-turn part. */
  tight: { angleDeg: number; value: number; x: number; y: number; labelX: number; labelY: number; text: string } | null;
  /** Rows of the accessible table: position, angle, reading, fitted value. */
  rows: { position: number; angleDeg: number; readingText: string; fittedText: string | null }[];
  summary: string;
}

export interface PolarShape {
  size: number;
  centre: number;
  innerRadius: number;
  outerRadius: number;
  unit: LengthUnit;
  domain: [number, number];
  rings: { value: number; radius: number; label: string; labelX: number; labelY: number }[];
  band: { path: string; label: string } | null;
  spokes: { angleDeg: number; x2: number; y2: number; labelX: number; labelY: number; label: string }[];
  series: PolarSeriesShape[];
  state: 'empty' | 'partial' | 'ready';
  summary: string;
}

const MARKS: PolarSeriesShape['mark'][] = ['circle', 'square'];

function circlePath(centre: number, r: number): string {
  return `M${round(centre - r)} ${centre} a${round(r)} ${round(r)} 0 1 0 ${round(2 * r)} 0 a${round(r)} ${round(r)} 0 1 0 ${round(-2 * r)} 0`;
}

/**
 * Shapes one or two sets of readings for the polar chart.
 * @example shapePolar([{ key: 'a', name: 'now', readings: [0.009, 0.008, 0.007, 0.008], resolution: '0.001in' }], 'in').series[0].tight?.angleDeg // 180
 */
export function shapePolar(
  inputs: readonly PolarSeriesInput[],
  unit: LengthUnit,
  band: { min: number; max: number } | null = null,
  size = 400,
): PolarShape {
  const centre = size / 2;
  const outerRadius = size * 0.36;
  const innerRadius = size * 0.08;
  const resolution = coarsestResolution(
    inputs.map((s) => s.resolution),
    unit,
  );
  const step = resolutionStep(resolution, unit);
  const format = (value: number) => lengthToText(value, unit, resolution);

  const fits = inputs.map((s) => {
    const read = s.readings.filter((r): r is number => r !== null);
    const complete = s.readings.length >= MIN_POSITIONS && read.length === s.readings.length;
    const mean = read.length ? computeMean(read) : 0;
    return { read, complete, mean, fit: complete ? fitFirstHarmonic(read, mean) : null };
  });
  const values = fits.flatMap((f) => [
    ...f.read,
    ...(f.fit ? [f.mean - f.fit.amplitude, f.mean + f.fit.amplitude] : []),
  ]);
  const domain = valueDomain(band ? [...values, band.min, band.max] : values, step);
  const [lo, hi] = domain;
  const radiusOf = (value: number) =>
    innerRadius + ((Math.min(hi, Math.max(lo, value)) - lo) / (hi - lo)) * (outerRadius - innerRadius);
  // Ring values are written just right of the top spoke, where the rings are furthest apart.
  const rings = stepTicks(lo, hi, step, 5).map((value) => {
    const radius = round(radiusOf(value));
    return { value, radius, label: format(value), labelX: round(centre + 4), labelY: round(centre - radius - 3) };
  });
  const bandShape = band
    ? {
        path: `${circlePath(centre, radiusOf(band.max))} ${circlePath(centre, radiusOf(band.min))}`,
        label: `band ${format(band.min)}–${format(band.max)} ${unit}`,
      }
    : null;

  const angles = new Set<number>();
  for (const s of inputs) s.readings.forEach((_, i) => angles.add(round((360 * i) / s.readings.length)));
  const positionOf = (angleDeg: number) => {
    const first = inputs[0];
    if (!first) return '';
    const k = (angleDeg * first.readings.length) / 360;
    return Number.isInteger(round(k)) && Math.abs(k - Math.round(k)) < 1e-6 ? String(Math.round(k) + 1) : '';
  };
  const spokes = [...angles]
    .sort((a, b) => a - b)
    .map((angleDeg) => {
      const end = polarToXY(centre, outerRadius, angleDeg);
      const label = polarToXY(centre, outerRadius + size * 0.07, angleDeg);
      return { angleDeg, x2: end.x, y2: end.y, labelX: label.x, labelY: label.y, label: positionOf(angleDeg) };
    });

  const series = inputs.map((s, index): PolarSeriesShape => {
    const { fit, mean, complete } = fits[index]!;
    const f = (value: number) => lengthToText(value, unit, s.resolution);
    const n = s.readings.length;
    const fitted = (angleDeg: number) =>
      fit ? mean + fit.a * Math.cos(angleDeg * DEG) + fit.b * Math.sin(angleDeg * DEG) : null;
    const points: PolarPointShape[] = [];
    s.readings.forEach((value, i) => {
      if (value === null) return;
      const angleDeg = (360 * i) / n;
      const at = polarToXY(centre, radiusOf(value), angleDeg);
      points.push({
        position: i + 1,
        angleDeg,
        value,
        x: at.x,
        y: at.y,
        text: `Position ${i + 1} at ${Math.round(angleDeg)}°: ${f(value)} ${unit}`,
      });
    });
    let curve: string | null = null;
    let tight: PolarSeriesShape['tight'] = null;
    if (fit) {
      const steps = 90;
      const parts: string[] = [];
      for (let k = 0; k <= steps; k++) {
        const angleDeg = (360 * k) / steps;
        const at = polarToXY(centre, radiusOf(fitted(angleDeg)!), angleDeg);
        parts.push(`${k === 0 ? 'M' : 'L'}${at.x} ${at.y}`);
      }
      curve = `${parts.join(' ')} Z`;
      if (fit.tightestAngleDeg !== null) {
        const angleDeg = fit.tightestAngleDeg;
        const value = mean - fit.amplitude;
        const at = polarToXY(centre, radiusOf(value), angleDeg);
        const label = polarToXY(centre, Math.max(innerRadius + 12, radiusOf(value) - 46), angleDeg);
        tight = {
          angleDeg,
          value,
          x: at.x,
          y: at.y,
          labelX: label.x,
          labelY: label.y,
          text: `tight spot at ${Math.round(angleDeg)}° from the marked tooth, ${f(value)} ${unit} on the fitted curve`,
        };
      }
    }
    const rows = s.readings.map((value, i) => {
      const angleDeg = (360 * i) / n;
      const fv = fitted(angleDeg);
      return {
        position: i + 1,
        angleDeg: Math.round(angleDeg),
        readingText: value === null ? 'not read' : `${f(value)} ${unit}`,
        fittedText: fv === null ? null : `${f(fv)} ${unit}`,
      };
    });
    const summary = !complete
      ? `${s.name}: ${points.length} of ${n} positions read; the once-per-turn fit needs every position.`
      : tight
        ? `${s.name}: ${n} positions, mean ${f(mean)} ${unit}; the once-per-turn wave is ±${f(fit!.amplitude)} ${unit}, with the ${tight.text}.`
        : `${s.name}: ${n} positions, mean ${f(mean)} ${unit}; no once-per-turn wave, the lash is even around the gear.`;
    return {
      key: s.key,
      name: s.name,
      mark: MARKS[index % MARKS.length]!,
      dashed: index > 0,
      points,
      curve,
      tight,
      rows,
      summary,
    };
  });

  const anyPoint = series.some((s) => s.points.length > 0);
  const state: PolarShape['state'] = !anyPoint ? 'empty' : fits.every((f) => f.complete) ? 'ready' : 'partial';
  const summary = !anyPoint
    ? 'No backlash readings to draw yet: read the lash at every marked position around the ring gear.'
    : `Backlash around the ring gear, position 1 (the marked tooth) at the top, clockwise in the order of rotation. ${series.map((s) => s.summary).join(' ')}${bandShape ? ` Shaded ring: the ${bandShape.label}.` : ''}`;
  return {
    size,
    centre,
    innerRadius,
    outerRadius,
    unit,
    domain,
    rings,
    band: bandShape,
    spokes,
    series,
    state,
    summary,
  };
}
