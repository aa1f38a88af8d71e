import { describe, expect, it } from 'vitest';
import { shapeSparkline } from '../../../src/lib/charts/sparkline';

describe('shapeSparkline', () => {
  it('joins the points left to right and shades the band', () => {
    const s = shapeSparkline(
      [
        { runs: 0, value: 0.0065 },
        { runs: 44, value: 0.0087 },
      ],
      { min: 0.005, max: 0.009 },
      50,
    );
    expect(s.dots).toHaveLength(2);
    expect(s.dots[0]!.x).toBeLessThan(s.dots[1]!.x);
    expect(s.dots[0]!.y).toBeGreaterThan(s.dots[1]!.y);
    expect(s.path).toMatch(/^M[\d.]+ [\d.]+ L/);
    expect(s.band!.height).toBeGreaterThan(0);
    expect(s.lifeX).toBeGreaterThan(s.dots[1]!.x);
  });

  it('marks a point outside the band and draws nothing without points', () => {
    expect(shapeSparkline([{ runs: 3, value: 0.01 }], { min: 0.005, max: 0.009 }, null).dots[0]!.outside).toBe(true);
    expect(shapeSparkline([], null, 50)).toMatchObject({ path: null, dots: [], band: null });
  });
});
