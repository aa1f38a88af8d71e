import { describe, expect, it } from 'vitest';
import { DEFAULT_PROFILE } from '../../../src/lib/analysis/tolerance';
import { toleranceValuesSchema } from '../../../src/lib/inspections/profile-schema';

const { sources: _sources, ...DEFAULTS } = DEFAULT_PROFILE;

describe('a tolerance profile as the team sends it', () => {
  it('keeps a limit typed in inches in inches, its mm figure following from it', () => {
    // A team's own limit, invented: 0.006 in at the minimum point = 0.1524 mm (× 25.4, NIST SP 811)
    const { backlashMin: _min, ...rest } = DEFAULTS;
    const parsed = toleranceValuesSchema.parse({ ...rest, published: { backlashMin: { in: '0.006' } } });
    expect(parsed.published?.backlashMin).toEqual({ in: '0.006' });
    expect(parsed.backlashMin).toBeCloseTo(0.1524, 12);
    // The rest stand as the team's figures in mm / N·m … or as printed where they still agree.
    expect(parsed.published?.backlashMax).toEqual({ mm: '0.23' });
  });

  it('takes a changed canonical figure over the stale printed figures sent back beside it', () => {
    // Read the defaults (0.13–0.23 mm and 0.005–0.009 in, S: GM 1996), change the max to 0.30 mm, send it all back.
    const parsed = toleranceValuesSchema.parse({ ...DEFAULTS, backlashMax: 0.3 });
    expect(parsed.backlashMax).toBe(0.3);
    expect(parsed.published?.backlashMax).toEqual({ mm: '0.3' });
    // Untouched limits keep both printed figures.
    expect(parsed.published?.backlashMin).toEqual({ mm: '0.13', in: '0.005' });
  });

  it('refuses a limit given neither way, and a figure that is not a plain number', () => {
    const { runoutMax: _runout, ...rest } = DEFAULTS;
    const missing = toleranceValuesSchema.safeParse({ ...rest, published: undefined });
    expect(missing.success).toBe(false);
    expect(missing.error?.issues[0]?.path).toEqual(['runoutMax']);
    const odd = toleranceValuesSchema.safeParse({ ...DEFAULTS, published: { backlashMin: { in: '5e-3' } } });
    expect(odd.success).toBe(false);
    expect(odd.error?.issues[0]?.path.join('.')).toBe('published.backlashMin.in');
  });
});
