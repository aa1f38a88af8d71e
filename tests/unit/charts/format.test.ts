import { describe, expect, it } from 'vitest';
import {
  coarsestResolution,
  deltaToText,
  isoToDayText,
  lengthToText,
  resolutionStep,
  stepTicks,
  valueDomain,
} from '../../../src/lib/charts/format';

describe('chart number formats', () => {
  it('writes lengths with the digits the indicator resolves', () => {
    expect(lengthToText(0.008749, 'in', '0.001in')).toBe('0.009');
    expect(lengthToText(0.008749, 'in', '0.0005in')).toBe('0.0087');
    expect(lengthToText(0.2222, 'mm', '0.01mm')).toBe('0.22');
    // 0.001 in is 0.0254 mm: the largest power of ten not above it is 0.01, so 2 decimals (TRADE.md, Units, CP).
    expect(lengthToText(0.2222, 'mm', '0.001in')).toBe('0.22');
  });

  it('signs a change with a plus or a true minus, and none for nothing', () => {
    expect(deltaToText(0.001, 'in', '0.001in')).toBe('+0.001');
    expect(deltaToText(-0.001, 'in', '0.001in')).toBe('−0.001');
    expect(deltaToText(0.0002, 'in', '0.001in')).toBe('0.000');
  });

  it('picks the coarser indicator', () => {
    expect(coarsestResolution(['0.0005in', '0.001in'], 'in')).toBe('0.001in');
    expect(coarsestResolution(['0.002mm', '0.0001in'], 'mm')).toBe('0.0001in');
    expect(coarsestResolution([], 'mm')).toBe('0.01mm');
  });

  it('steps a graduation read in the other unit by the largest power of ten not above it (TRADE.md digits rule, CP)', () => {
    // 0.001 in = 0.0254 mm (NIST SP 811: 1 in = 25.4 mm exactly): its multiples would read 0.102, 0.152, 0.203 mm.
    expect(resolutionStep('0.001in', 'mm')).toBe(0.01);
    expect(resolutionStep('0.0005in', 'mm')).toBe(0.01);
    expect(resolutionStep('0.0001in', 'mm')).toBe(0.001);
    // 0.01 mm = 0.000394 in and 0.002 mm = 0.0000787 in.
    expect(resolutionStep('0.01mm', 'in')).toBe(0.0001);
    expect(resolutionStep('0.002mm', 'in')).toBe(0.00001);
    // In its own unit a dial keeps its graduation.
    expect(resolutionStep('0.0005in', 'in')).toBe(0.0005);
    // Ticks of an inch dial read in mm are round millimetres (0.102, 0.152, 0.203 before).
    expect(stepTicks(0.09, 0.21, resolutionStep('0.001in', 'mm'))).toEqual([0.1, 0.12, 0.14, 0.16, 0.18, 0.2]);
  });

  it('puts ticks on whole graduations', () => {
    expect(stepTicks(0.004, 0.01, 0.001)).toEqual([0.004, 0.005, 0.006, 0.007, 0.008, 0.009, 0.01]);
    expect(stepTicks(0, 60, 1, 7, [1, 2, 5])).toEqual([0, 10, 20, 30, 40, 50, 60]);
    expect(stepTicks(0, 0.02, 0.001, 5)).toEqual([0, 0.005, 0.01, 0.015, 0.02]);
  });

  it('pads a domain to whole graduations and never below zero', () => {
    expect(valueDomain([0.0065, 0.009], 0.001)).toEqual([0.005, 0.01]);
    expect(valueDomain([0, 0.001], 0.001)).toEqual([0, 0.002]);
    expect(valueDomain([], 0.001)).toEqual([0, 0.004]);
  });

  it('writes a day in UTC', () => {
    expect(isoToDayText('2026-10-26T23:30:00.000Z')).toBe('26 Oct 2026');
  });
});
