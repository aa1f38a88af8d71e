import { describe, expect, it } from 'vitest';
import { shapePolar } from '../../../src/lib/charts/polar';

const series = (readings: (number | null)[], key = 'a', resolution: '0.001in' | '0.0005in' = '0.001in') => ({
  key,
  name: key,
  readings,
  resolution,
});

describe('shapePolar', () => {
  it('puts position 1 at the top and goes clockwise', () => {
    const shape = shapePolar([series([0.008, 0.008, 0.008, 0.008])], 'in', null, 400);
    const [p1, p2, p3, p4] = shape.series[0]!.points;
    expect(p1!.x).toBe(200);
    expect(p1!.y).toBeLessThan(200);
    expect(p2!.x).toBeGreaterThan(200);
    expect(p3!.y).toBeGreaterThan(200);
    expect(p4!.x).toBeLessThan(200);
  });

  it('finds the tight spot of the once-per-turn fit and writes its angle', () => {
    // Loosest at position 1 (0°), tightest opposite at 180°: the fit's phase.
    const shape = shapePolar([series([0.009, 0.008, 0.007, 0.008])], 'in');
    const tight = shape.series[0]!.tight!;
    expect(tight.angleDeg).toBeCloseTo(180, 9);
    expect(tight.value).toBeCloseTo(0.007, 12);
    expect(tight.text).toBe('tight spot at 180° from the marked tooth, 0.007 in on the fitted curve');
    expect(shape.series[0]!.curve).toMatch(/^M.* Z$/);
    expect(shape.state).toBe('ready');
  });

  it('has no tight spot when the lash is even all round', () => {
    const shape = shapePolar([series([0.008, 0.008, 0.008])], 'in');
    expect(shape.series[0]!.tight).toBeNull();
    expect(shape.series[0]!.summary).toMatch(/even around the gear/);
  });

  it('draws what is read and waits for every position before fitting', () => {
    const shape = shapePolar([series([0.008, null, 0.007, 0.008])], 'in');
    expect(shape.state).toBe('partial');
    expect(shape.series[0]!.points.map((p) => p.position)).toEqual([1, 3, 4]);
    expect(shape.series[0]!.curve).toBeNull();
    expect(shape.series[0]!.rows[1]!.readingText).toBe('not read');
  });

  it('says what to do when nothing is read', () => {
    const shape = shapePolar([series([null, null, null])], 'in');
    expect(shape.state).toBe('empty');
    expect(shape.summary).toMatch(/read the lash/);
  });

  it('overlays two inspections, the second dashed with square marks', () => {
    const shape = shapePolar(
      [
        series([0.008, 0.008, 0.008, 0.008], 'before'),
        series([0.009, 0.008, 0.007, 0.008, 0.009, 0.008, 0.007, 0.008], 'after', '0.0005in'),
      ],
      'in',
      { min: 0.005, max: 0.009 },
    );
    expect(shape.series.map((s) => [s.mark, s.dashed])).toEqual([
      ['circle', false],
      ['square', true],
    ]);
    // Eight spokes for the union of 4 and 8 positions; labels follow the first inspection's positions.
    expect(shape.spokes).toHaveLength(8);
    expect(shape.spokes.filter((s) => s.label).map((s) => s.label)).toEqual(['1', '2', '3', '4']);
    expect(shape.band!.label).toBe('band 0.005–0.009 in');
    // The rings and band use the coarser of the two indicators.
    expect(shape.rings.every((r) => /^0\.\d{3}$/.test(r.label))).toBe(true);
  });

  it('keeps every reading between the centre and the outer ring', () => {
    const shape = shapePolar([series([0.004, 0.012, 0.006, 0.01])], 'in', { min: 0.005, max: 0.009 });
    for (const p of shape.series[0]!.points) {
      const r = Math.hypot(p.x - shape.centre, p.y - shape.centre);
      expect(r).toBeGreaterThanOrEqual(shape.innerRadius - 0.01);
      expect(r).toBeLessThanOrEqual(shape.outerRadius + 0.01);
    }
  });
});
