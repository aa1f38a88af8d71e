// A small static picture of mean backlash against runs for the board: the band, the points joined,
// and a tick at the life limit. No axes: the row beside it carries the numbers. Pure geometry.

export interface SparklineShape {
  width: number;
  height: number;
  band: { y: number; height: number } | null;
  path: string | null;
  dots: { x: number; y: number; outside: boolean }[];
  lifeX: number | null;
}

const round = (n: number) => Math.round(n * 10) / 10;

/**
 * Shapes the board's sparkline.
 * @example shapeSparkline([{ runs: 0, value: 0.0065 }, { runs: 44, value: 0.0087 }], { min: 0.005, max: 0.009 }, 50).dots.length // 2
 */
export function shapeSparkline(
  points: readonly { runs: number; value: number }[],
  band: { min: number; max: number } | null,
  lifeLimit: number | null,
  width = 120,
  height = 36,
): SparklineShape {
  const pad = 4;
  const values = [...points.map((p) => p.value), ...(band ? [band.min, band.max] : [])];
  if (points.length === 0 || values.length === 0)
    return { width, height, band: null, path: null, dots: [], lifeX: null };
  const low = Math.min(...values);
  const high = Math.max(...values);
  const span = high - low || Math.abs(high) || 1;
  const lo = low - span * 0.15;
  const hi = high + span * 0.15;
  const maxRuns = Math.max(1, ...points.map((p) => p.runs), lifeLimit ?? 0);
  const x = (runs: number) => round(pad + (runs / maxRuns) * (width - 2 * pad));
  const y = (value: number) => round(height - pad - ((value - lo) / (hi - lo)) * (height - 2 * pad));
  const dots = points.map((p) => ({
    x: x(p.runs),
    y: y(p.value),
    outside: band ? p.value < band.min || p.value > band.max : false,
  }));
  return {
    width,
    height,
    band: band ? { y: y(band.max), height: round(y(band.min) - y(band.max)) } : null,
    path: dots.length > 1 ? dots.map((d, i) => `${i ? 'L' : 'M'}${d.x} ${d.y}`).join(' ') : null,
    dots,
    lifeX: lifeLimit === null ? null : x(lifeLimit),
  };
}
