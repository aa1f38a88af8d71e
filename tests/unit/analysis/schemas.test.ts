import { describe, expect, it } from 'vitest';
import {
  backlashRequestSchema,
  tighteningQuerySchema,
  trendRequestSchema,
  zodIssuesToFields,
  zodIssuesToMessage,
} from '../../../src/lib/analysis/schemas';
import type { z } from 'zod';

function fieldsOf(schema: z.ZodType, body: unknown): Record<string, string> {
  const result = schema.safeParse(body);
  if (result.success) throw new Error('expected the body to be refused');
  return zodIssuesToFields(result.error);
}

const VALID = { unit: 'mm', readings: [0.15, 0.17, 0.16, 0.14] };

describe('backlashRequestSchema', () => {
  it('accepts a full, valid body', () => {
    const body = {
      ...VALID,
      profile: { min: 0.13, max: 0.23, maxSpread: 0.05 },
      ringTeeth: 41,
      pinionTeeth: 10,
      pressureAngleDeg: 20,
    };
    expect(backlashRequestSchema.parse(body)).toEqual(body);
  });

  it('asks for 3 to 24 readings', () => {
    expect(fieldsOf(backlashRequestSchema, { ...VALID, readings: [0.1, 0.2] }).readings).toMatch(/at least 3/);
    expect(fieldsOf(backlashRequestSchema, { ...VALID, readings: Array(25).fill(0.1) }).readings).toMatch(/at most 24/);
  });

  it('names the reading that is negative, not a number or not finite', () => {
    expect(fieldsOf(backlashRequestSchema, { ...VALID, readings: [0.1, 0.2, -0.1] })).toEqual({
      'readings.2': 'Each reading must be 0 or more.',
    });
    expect(Object.keys(fieldsOf(backlashRequestSchema, { ...VALID, readings: [0.1, '0.2', Infinity] }))).toEqual([
      'readings.1',
      'readings.2',
    ]);
  });

  it('caps readings at 2.5 mm, or 2.5/25.4 in, and says to check the unit', () => {
    // 2.5/25.4: NIST SP 811 (2008) App. B
    expect(backlashRequestSchema.safeParse({ unit: 'mm', readings: [2.5, 0.1, 0.1] }).success).toBe(true);
    expect(fieldsOf(backlashRequestSchema, { unit: 'mm', readings: [2.51, 0.1, 0.1] })['readings.0']).toMatch(
      /check the unit/,
    );
    expect(backlashRequestSchema.safeParse({ unit: 'in', readings: [2.5 / 25.4, 0.1, 0.1] }).success).toBe(false);
    expect(backlashRequestSchema.safeParse({ unit: 'in', readings: [2.5 / 25.4, 0.01, 0.01] }).success).toBe(true);
    expect(Object.keys(fieldsOf(backlashRequestSchema, { unit: 'in', readings: [0.008, 0.1, 0.006] }))).toEqual([
      'readings.1',
    ]);
  });

  it('puts a profile min above its max on profile.min', () => {
    const fields = fieldsOf(backlashRequestSchema, { ...VALID, profile: { min: 0.3, max: 0.2, maxSpread: 0.05 } });
    expect(fields).toEqual({ 'profile.min': 'Backlash min (0.3) is above max (0.2).' });
  });

  it('wants both tooth counts or neither, as positive whole numbers', () => {
    expect(fieldsOf(backlashRequestSchema, { ...VALID, ringTeeth: 41 })).toEqual({
      pinionTeeth: 'Give both tooth counts or neither; pinionTeeth is missing.',
    });
    expect(fieldsOf(backlashRequestSchema, { ...VALID, ringTeeth: 41.5, pinionTeeth: 0 })).toEqual({
      ringTeeth: 'ringTeeth must be a whole number.',
      pinionTeeth: 'pinionTeeth must be 1 or more.',
    });
  });

  it('keeps the pressure angle between 10° and 30°', () => {
    expect(fieldsOf(backlashRequestSchema, { ...VALID, pressureAngleDeg: 5 }).pressureAngleDeg).toMatch(/10°/);
  });

  it('names an unexpected field instead of ignoring it', () => {
    expect(fieldsOf(backlashRequestSchema, { ...VALID, pressureAngle: 25 })).toEqual({
      pressureAngle: 'This field is not expected.',
    });
  });

  it('refuses a unit other than in or mm, and a body that is not an object', () => {
    expect(fieldsOf(backlashRequestSchema, { ...VALID, unit: 'ft' }).unit).toBe('unit must be "in" or "mm".');
    expect(fieldsOf(backlashRequestSchema, null)).toEqual({
      '': 'The body must be a JSON object with unit and readings.',
    });
  });
});

describe('trendRequestSchema', () => {
  it('accepts points with a bare or a banded limit', () => {
    const points = [{ runs: 0, value: 0.15 }];
    expect(trendRequestSchema.parse({ points, limit: 0.23 }).limit).toBe(0.23);
    expect(trendRequestSchema.parse({ points, limit: { max: 0.23 } }).limit).toEqual({ max: 0.23 });
  });

  it('names the point field at fault', () => {
    const fields = fieldsOf(trendRequestSchema, {
      points: [
        { runs: 1, value: 0.1 },
        { runs: -1, value: 'x' },
      ],
    });
    expect(fields).toEqual({ 'points.1.runs': 'runs must be 0 or more.', 'points.1.value': 'value must be a number.' });
  });

  it('asks for 1 to 1000 points', () => {
    expect(fieldsOf(trendRequestSchema, { points: [] }).points).toBe('Give at least one point.');
    const many = Array.from({ length: 1001 }, (_, runs) => ({ runs, value: 0.1 }));
    expect(fieldsOf(trendRequestSchema, { points: many }).points).toBe('Give at most 1000 points.');
  });

  it('checks the limit: a number or a band with a side, min not above max', () => {
    const points = [{ runs: 0, value: 0.15 }];
    expect(fieldsOf(trendRequestSchema, { points, limit: { min: 0.3, max: 0.2 } })).toEqual({
      'limit.min': 'limit.min (0.3) is above limit.max (0.2).',
    });
    expect(fieldsOf(trendRequestSchema, { points, limit: {} })).toEqual({ limit: 'limit needs a min, a max or both.' });
    expect(fieldsOf(trendRequestSchema, { points, limit: 'high' })).toEqual({
      limit: 'limit must be a number or { min, max }.',
    });
  });
});

describe('tighteningQuerySchema', () => {
  it('coerces the bolt count from a query string', () => {
    expect(tighteningQuerySchema.parse({ bolts: '12' })).toEqual({ bolts: 12 });
  });

  it('refuses counts outside 3..36 and text, naming bolts', () => {
    expect(fieldsOf(tighteningQuerySchema, { bolts: '37' })).toEqual({ bolts: 'bolts must be 36 or fewer.' });
    expect(fieldsOf(tighteningQuerySchema, { bolts: '2' })).toEqual({ bolts: 'bolts must be 3 or more.' });
    expect(fieldsOf(tighteningQuerySchema, { bolts: 'ten' })).toEqual({ bolts: 'bolts must be a number.' });
    expect(fieldsOf(tighteningQuerySchema, { bolts: '7.5' })).toEqual({ bolts: 'bolts must be a whole number.' });
  });
});

describe('zodIssuesToMessage', () => {
  it('names the first field at fault and counts the others', () => {
    const result = backlashRequestSchema.safeParse({ unit: 'mm', readings: [0.1, -1, -2] });
    if (result.success) throw new Error('expected a refusal');
    expect(zodIssuesToMessage(result.error)).toBe('readings.1: Each reading must be 0 or more. (1 more field to fix)');
  });

  it('puts root issues under the root key it is given', () => {
    const result = tighteningQuerySchema.safeParse('x');
    if (result.success) throw new Error('expected a refusal');
    expect(Object.keys(zodIssuesToFields(result.error, 'query'))).toEqual(['query']);
  });
});
