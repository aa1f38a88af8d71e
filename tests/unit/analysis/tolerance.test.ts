import { describe, expect, it } from 'vitest';
import { DEFAULT_PROFILE, requireValidProfile, validateProfile } from '../../../src/lib/analysis/tolerance';
import type { ToleranceProfile } from '../../../src/lib/analysis/tolerance';

describe('DEFAULT_PROFILE', () => {
  it('holds the GM 1996 backlash band at the minimum point', () => {
    // TRADE.md (S: GM light-truck service manual, 8-5/8 in ring gear axle, 1996): 0.13–0.23 mm
    expect([DEFAULT_PROFILE.backlashMin, DEFAULT_PROFILE.backlashMax]).toEqual([0.13, 0.23]);
    expect(DEFAULT_PROFILE.sources.backlashMin).toMatchObject({
      key: 'S',
      source: 'GM light-truck service manual, 8-5/8 in ring gear axle, 1996',
    });
  });

  it('holds the 0.05 mm variation from both GM manuals and the 0.076 mm Ford runout limit', () => {
    // TRADE.md (S: both GM manuals above); (S: Ford light-truck service manual, 1997)
    expect(DEFAULT_PROFILE.maxSpread).toBe(0.05);
    expect(DEFAULT_PROFILE.sources.maxSpread.source).toContain('GM medium-duty truck service manual, 2005');
    expect(DEFAULT_PROFILE.runoutMax).toBe(0.076);
    expect(DEFAULT_PROFILE.sources.runoutMax).toEqual(
      expect.objectContaining({ key: 'S', source: 'Ford light-truck service manual, 1997' }),
    );
  });

  it('holds the GM 7-1/2 in axle pinion preloads for new and used bearings', () => {
    // TRADE.md (S: GM, 7-1/2 in axle): new 2.7–3.6 N·m, used 1.0–1.4 N·m
    expect(DEFAULT_PROFILE.pinionPreloadNew).toEqual({ min: 2.7, max: 3.6 });
    expect(DEFAULT_PROFILE.pinionPreloadUsed).toEqual({ min: 1.0, max: 1.4 });
    expect(DEFAULT_PROFILE.sources.pinionPreloadUsed).toMatchObject({ key: 'S', source: 'GM, 7-1/2 in axle' });
  });

  it('marks the 50-run life and the hub preload check as common practice', () => {
    // TRADE.md (CP): ring-and-pinion often replaced after roughly 50 runs; hub effort unchanged on a solid spacer
    expect(DEFAULT_PROFILE.lifeLimitRuns).toBe(50);
    expect(DEFAULT_PROFILE.hubPreloadCheck).toBe(true);
    expect(DEFAULT_PROFILE.sources.lifeLimitRuns.key).toBe('CP');
    expect(DEFAULT_PROFILE.sources.hubPreloadCheck.key).toBe('CP');
  });

  it('gives every figure a source with a TRADE.md key', () => {
    // The printed figures (`published`) sit beside the figures; their source is the figure's own.
    const fields = Object.keys(DEFAULT_PROFILE).filter((key) => key !== 'sources' && key !== 'published');
    expect(Object.keys(DEFAULT_PROFILE.sources).sort()).toEqual(fields.sort());
    for (const note of Object.values(DEFAULT_PROFILE.sources)) {
      expect(['S', 'D', 'M', 'CP']).toContain(note.key);
      expect(note.source.length).toBeGreaterThan(0);
    }
  });

  it('passes its own validation', () => {
    expect(validateProfile(DEFAULT_PROFILE)).toEqual([]);
  });
});

describe('validateProfile', () => {
  const valid: ToleranceProfile = { ...DEFAULT_PROFILE };

  it('reports a backlash min above the max on the min field', () => {
    const issues = validateProfile({ ...valid, backlashMin: 0.3 });
    expect(issues).toEqual([{ field: 'backlashMin', message: expect.stringContaining('above max') }]);
  });

  it('reports a preload band whose min is above its max', () => {
    const issues = validateProfile({ ...valid, pinionPreloadNew: { min: 4, max: 3 } });
    expect(issues.map((issue) => issue.field)).toEqual(['pinionPreloadNew.min']);
  });

  it('reports negative or non-finite lengths, a zero life and an impossible near share', () => {
    const issues = validateProfile({
      ...valid,
      runoutMax: -1,
      maxSpread: Number.NaN,
      lifeLimitRuns: 0,
      nearShare: 0.6,
    });
    expect(issues.map((issue) => issue.field)).toEqual(['maxSpread', 'runoutMax', 'lifeLimitRuns', 'nearShare']);
  });

  it('throws naming the field when a profile is required to be valid', () => {
    expect(() => requireValidProfile({ ...valid, backlashMax: 0.1 })).toThrow(/backlashMin/);
    expect(requireValidProfile(valid)).toBe(valid);
  });
});
