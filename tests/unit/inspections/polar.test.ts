import { describe, expect, it } from 'vitest';
import { shapePolarPreview } from '../../../src/lib/inspections/polar';

describe('shapePolarPreview', () => {
  it('puts position 1 at the top and later positions clockwise, in the order of rotation', () => {
    const { points, centre } = shapePolarPreview([0.2, 0.1, 0.0, 0.1]);
    expect(points.map((p) => p.angleDeg)).toEqual([0, 90, 180, 270]);
    const [p1, p2, p3, p4] = points;
    expect(p1!.x).toBe(centre);
    expect(p1!.y).toBeLessThan(centre); // top
    expect(p2!.x).toBeGreaterThan(centre); // right: clockwise
    expect(p3!.y).toBeGreaterThan(centre); // bottom
    expect(p4!.x).toBeLessThan(centre); // left
  });

  it('draws looser readings farther out and marks the fitted tight spot opposite the loosest', () => {
    // Fit of [0.2, 0.1, 0, 0.1]: loosest at 0°, tightest at 180° (TRADE.md: ISO 4291 Annex F closed form).
    const shape = shapePolarPreview([0.2, 0.1, 0.0, 0.1]);
    const radius = (p: { x: number; y: number }) => Math.hypot(p.x - shape.centre, p.y - shape.centre);
    expect(radius(shape.points[0]!)).toBeGreaterThan(shape.meanRadius);
    expect(radius(shape.points[2]!)).toBeLessThan(shape.meanRadius);
    expect(radius(shape.points[1]!)).toBeCloseTo(shape.meanRadius, 6);
    expect(shape.tight?.angleDeg).toBe(180);
    expect(shape.tight!.x).toBeCloseTo(shape.centre, 6);
    expect(shape.tight!.y).toBeGreaterThan(shape.centre);
    expect(shape.curve).toMatch(/^M[\d.]+ [\d.]+( L[\d.]+ [\d.]+){72} Z$/);
  });

  it('keeps every point and the curve inside the drawing', () => {
    const shape = shapePolarPreview([0.3, 0.0, 0.0], 240);
    for (const p of shape.points) {
      for (const v of [p.x, p.y, p.labelX, p.labelY]) {
        expect(v).toBeGreaterThanOrEqual(0);
        expect(v).toBeLessThanOrEqual(240);
      }
    }
    const numbers = shape.curve!.match(/[\d.]+/g)!.map(Number);
    expect(Math.min(...numbers)).toBeGreaterThanOrEqual(0);
    expect(Math.max(...numbers)).toBeLessThanOrEqual(240);
  });

  it('leaves unread positions on the mean circle and draws no fit until every position is read', () => {
    const shape = shapePolarPreview([0.008, null, 0.006, null]);
    expect(shape.points[1]!.value).toBeNull();
    expect(Math.hypot(shape.points[1]!.x - shape.centre, shape.points[1]!.y - shape.centre)).toBeCloseTo(
      shape.meanRadius,
      6,
    );
    expect(shape.curve).toBeNull();
    expect(shape.tight).toBeNull();
  });

  it('draws equal readings on the mean circle, with no tight spot to mark', () => {
    const shape = shapePolarPreview([0.007, 0.007, 0.007, 0.007]);
    for (const p of shape.points)
      expect(Math.hypot(p.x - shape.centre, p.y - shape.centre)).toBeCloseTo(shape.meanRadius, 6);
    expect(shape.curve).not.toBeNull();
    expect(shape.tight).toBeNull();
  });
});
