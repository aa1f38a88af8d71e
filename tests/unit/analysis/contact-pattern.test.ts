import { describe, expect, it } from 'vitest';
import { CORRECTION_STEP_MM, describePattern, USUAL_REGION } from '../../../src/lib/analysis/contact-pattern';

const NISSAN = 'Nissan service manual, final drive, pinion height washer';

describe('describePattern', () => {
  it('finds a centred pattern in the usual region with no correction', () => {
    // Usual region 0.3–0.7 both ways: CP
    const guidance = describePattern({ side: 'drive', alongTooth: 0.5, upTooth: 0.5 });
    expect(guidance).toMatchObject({ code: 'centred', inUsualRegion: true, corrections: [] });
    expect(guidance.guidance).toContain("axle maker's procedure");
  });

  it('counts the edges of the usual region as inside it', () => {
    // CP
    expect(USUAL_REGION).toEqual({ from: 0.3, to: 0.7 });
    expect(describePattern({ side: 'drive', alongTooth: 0.3, upTooth: 0.7 }).inUsualRegion).toBe(true);
    expect(describePattern({ side: 'drive', alongTooth: 0.29, upTooth: 0.5 }).inUsualRegion).toBe(false);
  });

  it('moves the pinion closer to the ring gear for face contact', () => {
    // TRADE.md (S: Nissan service manual, final drive, pinion height washer)
    const guidance = describePattern({ side: 'drive', alongTooth: 0.5, upTooth: 0.9 });
    expect(guidance.code).toBe('face');
    expect(guidance.corrections).toEqual([{ part: 'pinion', direction: 'toward-ring-gear', source: NISSAN }]);
    expect(guidance.guidance).toContain('closer to the ring gear');
  });

  it('moves the pinion away from the ring gear for flank contact', () => {
    // TRADE.md (S: Nissan service manual, final drive, pinion height washer)
    const guidance = describePattern({ side: 'drive', alongTooth: 0.5, upTooth: 0.1 });
    expect(guidance.code).toBe('flank');
    expect(guidance.corrections).toEqual([{ part: 'pinion', direction: 'away-from-ring-gear', source: NISSAN }]);
  });

  it('for heel contact gives the pinion closer and the ring gear toward the pinion, less backlash', () => {
    // TRADE.md (S: Nissan …) and (gear maker's technical note, medium confidence)
    const guidance = describePattern({ side: 'drive', alongTooth: 0.9, upTooth: 0.5 });
    expect(guidance.code).toBe('heel');
    expect(guidance.corrections.map((c) => [c.part, c.direction])).toEqual([
      ['pinion', 'toward-ring-gear'],
      ['ring-gear', 'toward-pinion'],
    ]);
    expect(guidance.corrections[1]?.source).toContain("gear maker's technical note");
    expect(guidance.guidance).toContain('less backlash');
  });

  it('for toe contact gives the pinion away and the ring gear away, more backlash, and notes the load shift', () => {
    // TRADE.md (S: Nissan …), (gear maker's technical note), (S: GM/Geo): pattern moves toward the heel under load
    const guidance = describePattern({ side: 'drive', alongTooth: 0.1, upTooth: 0.5 });
    expect(guidance.code).toBe('toe');
    expect(guidance.corrections.map((c) => c.direction)).toEqual(['away-from-ring-gear', 'away-from-pinion']);
    expect(guidance.guidance).toContain('more backlash');
    expect(guidance.guidance).toContain('slightly toward the toe');
  });

  it('lets the height decide the pinion when the pattern is off both ways', () => {
    const guidance = describePattern({ side: 'drive', alongTooth: 0.1, upTooth: 0.9 });
    expect(guidance.code).toBe('toe-face');
    expect(guidance.corrections.map((c) => c.direction)).toEqual(['toward-ring-gear', 'away-from-pinion']);
  });

  it('mentions correction steps of about 0.1 mm (0.004 in)', () => {
    // TRADE.md (S: a motorcycle shaft-drive service manual; CP elsewhere)
    expect(CORRECTION_STEP_MM).toBe(0.1);
    expect(describePattern({ side: 'drive', alongTooth: 0.5, upTooth: 0.2 }).guidance).toContain('0.1 mm (0.004 in)');
  });

  it('asks to confirm on the drive side when reading the coast side', () => {
    const guidance = describePattern({ side: 'coast', alongTooth: 0.5, upTooth: 0.9 });
    expect(guidance.side).toBe('coast');
    expect(guidance.guidance).toContain('confirm on the drive side');
  });

  it('refuses positions outside 0..1', () => {
    expect(() => describePattern({ side: 'drive', alongTooth: 1.2, upTooth: 0.5 })).toThrow(RangeError);
    expect(() => describePattern({ side: 'drive', alongTooth: 0.5, upTooth: Number.NaN })).toThrow(RangeError);
  });
});
