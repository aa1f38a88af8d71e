import { describe, expect, it } from 'vitest';
import { shapeBacklashTrend } from '../../../src/lib/charts/backlash-trend';
import { FALLING, makeInput, RISING } from '../../helpers/chart-fixtures';

describe('shapeBacklashTrend', () => {
  it('draws nothing for a set with no inspection and says what to do', () => {
    const shape = shapeBacklashTrend(makeInput([]));
    expect(shape.state).toBe('empty');
    expect(shape.points).toEqual([]);
    expect(shape.fit).toBeNull();
    expect(shape.projection).toBeNull();
    expect(shape.message).toMatch(/Record the first teardown inspection/);
  });

  it('draws one inspection as a point with its min–max, the band, and asks for two more', () => {
    const shape = shapeBacklashTrend(makeInput([{ runs: 12, mean: 0.007, spread: 0.002 }]));
    expect(shape.state).toBe('sparse');
    expect(shape.points).toHaveLength(1);
    const [point] = shape.points;
    expect(point).toMatchObject({
      runs: 12,
      value: 0.007,
      href: '/inspections/insp-1',
      valueText: '0.007 in',
      rangeText: '0.006–0.008 in',
    });
    expect(point!.range![0]).toBeCloseTo(0.001, 12);
    expect(point!.range![1]).toBeCloseTo(0.001, 12);
    expect(shape.bands).toEqual([{ low: 0.005, high: 0.009, label: 'band 0.005–0.009 in' }]);
    expect(shape.fit).toBeNull();
    expect(shape.projection).toBeNull();
    expect(shape.message).toBe('Two more inspections give a projection.');
  });

  it('says a trend needs different run counts when every inspection is at run 0', () => {
    const shape = shapeBacklashTrend(
      makeInput([
        { runs: 0, mean: 0.007 },
        { runs: 0, mean: 0.0075 },
        { runs: 0, mean: 0.008 },
      ]),
    );
    expect(shape.points.map((p) => p.runs)).toEqual([0, 0, 0]);
    expect(shape.fit).toBeNull();
    expect(shape.projection).toBeNull();
    expect(shape.message).toMatch(/same run count/);
    expect(shape.xDomain[0]).toBe(0);
    expect(shape.xDomain[1]).toBeGreaterThanOrEqual(50);
  });

  it('draws the mean but projects the loosest point to the upper limit, and labels the run', () => {
    const shape = shapeBacklashTrend(makeInput(RISING));
    // The mean line 0.0065 + 0.00005·runs stays on the chart; it would meet 0.009 at run 50, but the band is for
    // the points (S: GM 1996, "at the minimum point"): the loosest, 0.007 + 0.00005·runs, meets 0.009 at run 40.
    expect(shape.fit).toHaveLength(2);
    expect(shape.fit![0]).toMatchObject({ runs: 0 });
    expect(shape.fit![0]!.value).toBeCloseTo(0.0065, 12);
    expect(shape.projection).not.toBeNull();
    expect(shape.projection!.from.runs).toBe(30);
    expect(shape.projection!.from.value).toBeCloseTo(0.0085, 12);
    expect(shape.projection!.to.runs).toBeCloseTo(40, 9);
    expect(shape.projection!.to.value).toBe(0.009);
    expect(shape.projection!.label).toBe('run 40');
    expect(shape.message).toContain(
      'At this rate backlash at the loosest point reaches the upper limit (0.009 in) at about run 40, 10 runs after the last inspection.',
    );
    expect(shape.message).not.toContain('mean backlash reaches');
    expect(shape.xDomain[1]).toBeGreaterThan(50);
    expect(shape.state).toBe('ready');
  });

  it('projects a falling trend to the lower limit', () => {
    const shape = shapeBacklashTrend(makeInput(FALLING));
    // The tightest point 0.008 − 0.0001·runs meets 0.005 at run 30 (the mean would at 35).
    expect(shape.projection!.to.runs).toBeCloseTo(30, 9);
    expect(shape.projection!.to.value).toBe(0.005);
    expect(shape.projection!.label).toBe('run 30');
    expect(shape.message).toMatch(
      /tightest point reaches the lower limit \(0\.005 in\) at about run 30, 10 runs after/,
    );
  });

  it('says a far crossing in words instead of stretching the chart to it', () => {
    const shape = shapeBacklashTrend(
      makeInput([
        { runs: 0, mean: 0.007 },
        { runs: 10, mean: 0.007 },
        { runs: 20, mean: 0.0071 },
      ]),
    );
    expect(shape.projection).toBeNull();
    expect(shape.message).toMatch(/beyond this chart|nearly flat/);
    expect(shape.xDomain[1]).toBeLessThan(100);
  });

  it('says the latest reading is past its limit now, never that the line passed it before', () => {
    const shape = shapeBacklashTrend(
      makeInput([
        { runs: 0, mean: 0.008 },
        { runs: 10, mean: 0.0092 },
        { runs: 20, mean: 0.0104 },
      ]),
    );
    expect(shape.projection).toBeNull();
    // Loosest 0.0085, 0.0097, 0.0109 in: the latest is over the printed 0.009 in (S: GM 1996) now.
    expect(shape.message).toContain('The latest backlash at the loosest point is past its limit now.');
    expect(shape.message).not.toMatch(/since about run|before the last inspection/);
  });

  it('never writes more digits than the indicator resolves', () => {
    const coarse = shapeBacklashTrend(makeInput([{ runs: 5, mean: 0.00875 }]));
    expect(coarse.points[0]!.valueText).toBe('0.009 in');
    expect(coarse.yDecimals).toBe(3);
    const fine = shapeBacklashTrend(makeInput([{ runs: 5, mean: 0.00875, resolution: '0.0005in' }]));
    expect(fine.points[0]!.valueText).toBe('0.0088 in');
    expect(fine.yDecimals).toBe(4);
    for (const tick of coarse.yTicks) expect(Math.abs(tick * 1000 - Math.round(tick * 1000))).toBeLessThan(1e-9);
  });

  it('keeps the band, the points and the projection inside the value axis', () => {
    const shape = shapeBacklashTrend(makeInput(RISING));
    const [low, high] = shape.yDomain;
    expect(low).toBeLessThanOrEqual(0.005);
    expect(high).toBeGreaterThanOrEqual(0.009);
    for (const p of shape.points) expect(p.value - p.range![0]).toBeGreaterThanOrEqual(low);
  });

  it('marks the life limit and leaves it out when the set has none', () => {
    expect(shapeBacklashTrend(makeInput(RISING)).lifeLimit).toEqual({ runs: 50, label: 'life limit 50' });
    expect(shapeBacklashTrend(makeInput(RISING, { lifeLimitRuns: null })).lifeLimit).toBeNull();
  });
});

describe('limits on the charts as printed', () => {
  it('writes the band as printed in the reader’s unit, not converted to the graduation', () => {
    // 0.005–0.009 in and 0.002 in (S: GM 1996): on a 0.0005 in dial the graduation would write 0.0050–0.0090.
    const input = makeInput([{ runs: 5, mean: 0.007, resolution: '0.0005in' }]);
    const printed = { ...input, limitTexts: { backlashMin: '0.005', backlashMax: '0.009', maxSpread: '0.002' } };
    expect(shapeBacklashTrend(printed).bands[0]!.label).toBe('band 0.005–0.009 in');
    expect(shapeBacklashTrend(input).bands[0]!.label).toBe('band 0.0050–0.0090 in');
  });
});
