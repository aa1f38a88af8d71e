import { describe, expect, it } from 'vitest';
import { describePattern } from '../../../src/lib/analysis/contact-pattern';
import { recommendAction } from '../../../src/lib/analysis/recommendation';
import type { RecommendationInput } from '../../../src/lib/analysis/recommendation';

// Life 50 runs: TRADE.md (CP, common practice in top-level drag racing).
const BASE: RecommendationInput = { runsSinceInstall: 20, lifeLimitRuns: 50, serviceIntervalRuns: 5 };
const crossingIn = (runsToLimit: number) => ({
  projectedRunsAtLimit: 20 + runsToLimit,
  runsToLimit,
  limit: 'max' as const,
});

describe('recommendAction', () => {
  it('keeps a set with nothing to report, saying so', () => {
    // Precedence retire > re-shim > watch > keep (CP, the README decision).
    expect(recommendAction(BASE)).toEqual({
      action: 'keep',
      reasons: [{ code: 'all-clear', message: 'Every check is within its band.', severity: 'info', action: 'keep' }],
    });
  });

  it('retires a set that has reached its life limit', () => {
    // 50-run life (CP: TRADE.md, life in runs).
    const result = recommendAction({ ...BASE, runsSinceInstall: 50 });
    expect(result.action).toBe('retire');
    expect(result.reasons[0]).toMatchObject({ code: 'life-reached', severity: 'critical' });
  });

  it('watches a set whose life limit falls before the next service', () => {
    // 50-run life (CP); the service interval is the team’s setting.
    const result = recommendAction({ ...BASE, runsSinceInstall: 46 });
    expect(result).toMatchObject({ action: 'watch', reasons: [{ code: 'life-before-next-service' }] });
    expect(recommendAction({ ...BASE, runsSinceInstall: 44 }).action).toBe('keep');
  });

  it('retires for severe tooth damage, sets up again for a severe bearing, watches moderate and notes light marks', () => {
    // Severity to action is Lashline’s rule (CP); the manufacturer’s procedure governs.
    expect(recommendAction({ ...BASE, damage: [{ area: 'teeth', severity: 'severe' }] }).action).toBe('retire');
    expect(recommendAction({ ...BASE, damage: [{ area: 'bearing', severity: 'severe' }] }).action).toBe('re-shim');
    expect(recommendAction({ ...BASE, damage: [{ area: 'teeth', severity: 'moderate' }] }).action).toBe('watch');
    const light = recommendAction({ ...BASE, damage: [{ area: 'teeth', severity: 'light', note: 'polish marks' }] });
    expect(light).toMatchObject({ action: 'keep', reasons: [{ code: 'damage-light-teeth', severity: 'info' }] });
    expect(light.reasons[0]?.message).toContain('polish marks');
  });

  it('re-shims for backlash out of band, citing the GM shim rule', () => {
    // TRADE.md (S: GM 1996): 0.05 mm of shim moved changes backlash about 0.03 mm
    const result = recommendAction({ ...BASE, verdicts: [{ measure: 'backlash-min-point', verdict: 'out-of-band' }] });
    expect(result.action).toBe('re-shim');
    expect(result.reasons[0]?.message).toContain('GM 1996');
  });

  it('sets up again for spread out of band, naming burrs, flange, bolting or debris as the likely cause', () => {
    // TRADE.md (S: GM 1996): larger variation points to burrs, a distorted case flange, uneven bolting or debris
    const result = recommendAction({ ...BASE, verdicts: [{ measure: 'spread', verdict: 'out-of-band' }] });
    expect(result.action).toBe('re-shim');
    expect(result.reasons[0]?.message).toMatch(/burrs.*flange.*bolting.*debris/);
  });

  it('sends runout out of band to a check of the ring gear and case, saying shims cannot cure it', () => {
    // Runout is not a shim matter (S: Ford 1997 flange runout check; CP for the wording).
    const result = recommendAction({ ...BASE, verdicts: [{ measure: 'runout', verdict: 'out-of-band' }] });
    expect(result.action).toBe('re-shim');
    expect(result.reasons[0]?.message).toContain('cannot cure runout');
  });

  it('watches a measure near its limit and ignores one in band', () => {
    // Near-limit → watch (CP).
    const result = recommendAction({
      ...BASE,
      verdicts: [
        { measure: 'spread', verdict: 'near-limit' },
        { measure: 'backlash-max-point', verdict: 'in-band' },
      ],
    });
    expect(result).toMatchObject({ action: 'watch', reasons: [{ code: 'spread-near-limit' }] });
    expect(result.reasons).toHaveLength(1);
  });

  it('re-shims when backlash is projected out of band before the next service, and watches other measures', () => {
    // Backlash is set with carrier shims (S: GM 1996 shim rule); projected within the interval → act now (CP).
    expect(recommendAction({ ...BASE, trends: [{ measure: 'backlash', projection: crossingIn(4) }] }).action).toBe(
      're-shim',
    );
    expect(recommendAction({ ...BASE, trends: [{ measure: 'runout', projection: crossingIn(4) }] }).action).toBe(
      'watch',
    );
    expect(recommendAction({ ...BASE, trends: [{ measure: 'backlash', projection: crossingIn(6) }] }).action).toBe(
      'keep',
    );
  });

  it('treats a trend line already past its limit as crossing now', () => {
    // Past a limit is 0 runs left (CP).
    const projection = {
      projectedRunsAtLimit: null,
      runsToLimit: null,
      reason: { code: 'already-past-limit' as const, message: '' },
    };
    expect(recommendAction({ ...BASE, trends: [{ measure: 'spread', projection }] }).action).toBe('watch');
  });

  it('re-shims for a pattern outside the usual region and passes on its guidance', () => {
    // Drive pattern off the usual region (CP) → set up again; the rule itself (S: Nissan service manual).
    const pattern = describePattern({ side: 'drive', alongTooth: 0.5, upTooth: 0.9 });
    const result = recommendAction({
      ...BASE,
      patterns: [pattern, describePattern({ side: 'coast', alongTooth: 0.5, upTooth: 0.5 })],
    });
    expect(result).toMatchObject({
      action: 're-shim',
      reasons: [{ code: 'pattern-drive-face', message: pattern.guidance }],
    });
    expect(result.reasons).toHaveLength(1);
  });

  it('never re-shims for a coast pattern: a coast pattern toward the heel is a cross-check to watch', () => {
    // TRADE.md (axle maker's pattern guide): depth corrections are read from the drive side.
    const coast = describePattern({ side: 'coast', alongTooth: 0.9, upTooth: 0.5 }, { cutMethod: 'face-milled' });
    const result = recommendAction({ ...BASE, patterns: [coast] });
    expect(result.action).toBe('watch');
    expect(result.reasons[0]).toMatchObject({ code: 'pattern-coast-heel', action: 'watch' });
    // Slightly toward the toe on a new setup (S: GM/Geo): nothing to do.
    const slight = describePattern({ side: 'coast', alongTooth: 0.25, upTooth: 0.5 });
    expect(recommendAction({ ...BASE, patterns: [slight] }).action).toBe('keep');
  });

  it('lists every reason, strongest first, with retire over re-shim over watch', () => {
    // Precedence retire > re-shim > watch > keep (CP).
    const result = recommendAction({
      ...BASE,
      runsSinceInstall: 52,
      verdicts: [
        { measure: 'spread', verdict: 'near-limit' },
        { measure: 'backlash-min-point', verdict: 'out-of-band' },
      ],
      damage: [{ area: 'teeth', severity: 'moderate' }],
    });
    expect(result.action).toBe('retire');
    expect(result.reasons.map((r) => r.code)).toEqual([
      'life-reached',
      'backlash-min-point-out-of-band',
      'damage-moderate-teeth',
      'spread-near-limit',
    ]);
  });
});
