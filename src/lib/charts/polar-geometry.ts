// The geometry shared by the polar chart and the sheet's polar preview: the ring gear drawn with
// position 1 (the marked tooth) at the top and later positions clockwise, in the order of rotation.

/** Degrees to radians. */
export const DEG = Math.PI / 180;

/** Rounds an SVG coordinate to hundredths, enough for any screen and short in the markup. */
export function roundCoordinate(n: number): number {
  return Math.round(n * 100) / 100;
}

/**
 * The SVG point at `radius` from `centre` (a square figure) and `angleDeg` clockwise from the top.
 * @example polarToXY(100, 50, 90) // { x: 150, y: 100 }
 */
export function polarToXY(centre: number, radius: number, angleDeg: number): { x: number; y: number } {
  return {
    x: roundCoordinate(centre + radius * Math.sin(angleDeg * DEG)),
    y: roundCoordinate(centre - radius * Math.cos(angleDeg * DEG)),
  };
}
