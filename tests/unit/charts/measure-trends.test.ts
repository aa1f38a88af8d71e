import { describe, expect, it } from 'vitest';
import { shapePreloadTrend, shapeRunoutTrend, shapeSpreadTrend } from '../../../src/lib/charts/measure-trends';
import { makeInput, RISING } from '../../helpers/chart-fixtures';

describe('shapeSpreadTrend', () => {
  it('draws each spread against its limit line', () => {
    const shape = shapeSpreadTrend(makeInput(RISING.map((r, i) => ({ ...r, spread: 0.001 * (i % 2) }))));
    expect(shape.points.map((p) => p.value)).toEqual([0, 0.001, 0, 0.001]);
    expect(shape.limitLines).toEqual([{ value: 0.002, label: 'limit 0.002 in' }]);
    expect(shape.yDomain[1]).toBeGreaterThanOrEqual(0.002);
    expect(shape.yDomain[0]).toBe(0);
  });

  it('projects a growing spread to its limit', () => {
    const shape = shapeSpreadTrend(
      makeInput([
        { runs: 0, mean: 0.007, spread: 0 },
        { runs: 10, mean: 0.007, spread: 0.0005 },
        { runs: 20, mean: 0.007, spread: 0.001 },
      ]),
    );
    // 0.00005 a run from 0 meets 0.002 at run 40.
    expect(shape.projection!.to.runs).toBeCloseTo(40, 9);
    expect(shape.projection!.label).toBe('run 40');
  });

  it('says a shrinking spread is heading away from its limit', () => {
    const shape = shapeSpreadTrend(
      makeInput([
        { runs: 0, mean: 0.007, spread: 0.0015 },
        { runs: 10, mean: 0.007, spread: 0.001 },
        { runs: 20, mean: 0.007, spread: 0.0005 },
      ]),
    );
    expect(shape.projection).toBeNull();
    expect(shape.message).toMatch(/heading away from its limit/);
  });

  it('has an empty state that says where spread comes from', () => {
    const shape = shapeSpreadTrend(makeInput([]));
    expect(shape.state).toBe('empty');
    expect(shape.message).toMatch(/every position read/);
  });
});

describe('shapeRunoutTrend', () => {
  it('draws measured runout as circles and the estimate from the lash as diamonds', () => {
    const shape = shapeRunoutTrend(
      makeInput([
        { runs: 0, mean: 0.007, runout: 0.001, estimate: 0.0014 },
        { runs: 20, mean: 0.007, runout: 0.004, estimate: null },
      ]),
    );
    expect(shape.series.map((s) => [s.key, s.mark])).toEqual([
      ['main', 'circle'],
      ['second', 'diamond'],
    ]);
    expect(shape.points.filter((p) => p.series === 'main').map((p) => p.value)).toEqual([0.001, 0.004]);
    expect(shape.points.filter((p) => p.series === 'second').map((p) => p.value)).toEqual([0.0014]);
    expect(shape.limitLines[0]!.value).toBe(0.003);
    expect(shape.message).toBe('Latest measured runout 0.004 in against a limit of 0.003 in; 1 inspection over it.');
    expect(shape.fit).toBeNull();
  });

  it('asks for a measurement when none was taken', () => {
    const shape = shapeRunoutTrend(makeInput([{ runs: 3, mean: 0.007, runout: null }]));
    expect(shape.state).toBe('empty');
    expect(shape.message).toMatch(/measure the ring-gear back face/);
  });
});

describe('shapePreloadTrend', () => {
  it('shades the new-bearing band until the bearings are used, then the used band', () => {
    const shape = shapePreloadTrend(makeInput(RISING));
    expect(shape.points.map((p) => p.valueText)).toEqual(['26.0 lbf·in', '10.0 lbf·in', '10.0 lbf·in', '10.0 lbf·in']);
    expect(shape.bands).toHaveLength(2);
    expect(shape.bands[0]).toMatchObject({
      from: 0,
      to: 10,
      low: 24,
      high: 32,
      label: 'new bearings 24.0–32.0 lbf·in',
    });
    expect(shape.bands[1]).toMatchObject({
      from: 10,
      to: shape.xDomain[1],
      low: 8,
      high: 12,
      label: 'used bearings 8.0–12.0 lbf·in',
    });
    expect(shape.yLabel).toBe('Turning torque (lbf·in)');
  });

  it('has an empty state when no torque was read', () => {
    const shape = shapePreloadTrend(makeInput([{ runs: 0, mean: 0.007, preload: null }]));
    expect(shape.state).toBe('empty');
    expect(shape.bands).toEqual([]);
  });
});
