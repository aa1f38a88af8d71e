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
    // TRADE.md (S: Nissan …): face → pinion closer; (gear maker’s technical note): toe → ring gear away.
    const guidance = describePattern({ side: 'drive', alongTooth: 0.1, upTooth: 0.9 });
    expect(guidance.code).toBe('toe-face');
    expect(guidance.corrections.map((c) => c.direction)).toEqual(['toward-ring-gear', 'away-from-pinion']);
  });

  it('mentions correction steps of about 0.1 mm (0.004 in)', () => {
    // TRADE.md (S: a motorcycle shaft-drive service manual; CP elsewhere)
    expect(CORRECTION_STEP_MM).toBe(0.1);
    expect(describePattern({ side: 'drive', alongTooth: 0.5, upTooth: 0.2 }).guidance).toContain('0.1 mm (0.004 in)');
  });

  it('refuses positions outside 0..1 on the coast side too', () => {
    // 0 = toe, 1 = heel (S: GM service manual, 9-1/2 in axle); outside is no position.
    expect(() => describePattern({ side: 'coast', alongTooth: -0.1, upTooth: 0.5 })).toThrow(RangeError);
  });
});

describe('describePattern: the coast side', () => {
  // TRADE.md (axle maker's pattern guide, medium confidence): on a face-milled gear, as the pinion moves away from
  // the ring-gear centreline, the drive pattern moves toward the heel and the coast pattern toward the toe. So a
  // depth correction is read from the drive side; the coast rule is never the drive rule applied to the coast.
  const FACE_MILLED = { cutMethod: 'face-milled' as const };

  it('never tells a coast pattern toward the heel to move the pinion closer (the drive rule)', () => {
    // TRADE.md (axle maker’s pattern guide): the coast side answers the other way along the tooth.
    const guidance = describePattern({ side: 'coast', alongTooth: 0.9, upTooth: 0.5 }, FACE_MILLED);
    expect(guidance.corrections).toEqual([]);
    expect(guidance.guidance).not.toContain('closer to the ring gear');
    expect(guidance.guidance).toContain('corrected from the drive side');
    expect(guidance.action).toBe('watch');
  });

  it('reads a coast pattern toward the toe with a drive pattern toward the heel as agreeing: pinion closer', () => {
    // Drive at the heel: pinion too far away (Nissan: heel → closer). Coast at the toe: the same cause (axle maker).
    const guidance = describePattern(
      { side: 'coast', alongTooth: 0.1, upTooth: 0.5 },
      { ...FACE_MILLED, drive: { alongTooth: 0.9, upTooth: 0.5 } },
    );
    expect(guidance.guidance).toContain('agrees with the drive side');
    expect(guidance.guidance).toContain('closer to the ring gear');
  });

  it('reads a coast pattern toward the heel with a drive pattern toward the toe as agreeing: pinion away', () => {
    // Drive at the toe: pinion too close (S: Nissan, toe → away); coast at the heel: the same cause (axle maker’s guide).
    const guidance = describePattern(
      { side: 'coast', alongTooth: 0.9, upTooth: 0.5 },
      { ...FACE_MILLED, drive: { alongTooth: 0.1, upTooth: 0.5 } },
    );
    expect(guidance.guidance).toContain('agrees with the drive side');
    expect(guidance.guidance).toContain('away from the ring gear');
  });

  it('says a depth change cannot centre both when drive and coast sit toward the same end', () => {
    // A depth change moves drive and coast opposite ways along the tooth (axle maker’s pattern guide).
    const guidance = describePattern(
      { side: 'coast', alongTooth: 0.9, upTooth: 0.5 },
      { ...FACE_MILLED, drive: { alongTooth: 0.9, upTooth: 0.5 } },
    );
    expect(guidance.guidance).toContain('will not centre both');
    expect(guidance.corrections).toEqual([]);
  });

  it('takes a coast pattern slightly toward the toe as usual for a new setup, not a reason to set up again', () => {
    // TRADE.md (S: GM/Geo): under road load the pattern moves toward the heel, so a new setup may sit slightly
    // toward the toe; "slightly" = 0.2–0.3 of the tooth (CP).
    const guidance = describePattern({ side: 'coast', alongTooth: 0.25, upTooth: 0.5 }, FACE_MILLED);
    expect(guidance).toMatchObject({ code: 'toe', inUsualRegion: true, action: 'keep' });
    expect(guidance.guidance).toContain('GM/Geo');
  });

  it('never makes a coast pattern a reason to re-shim on its own', () => {
    // Depth corrections are read from the drive side (axle maker’s pattern guide).
    for (const alongTooth of [0, 0.1, 0.9, 1]) {
      for (const upTooth of [0, 0.5, 1]) {
        expect(describePattern({ side: 'coast', alongTooth, upTooth }, FACE_MILLED).action).not.toBe('re-shim');
      }
    }
  });
});

describe('describePattern: the cut method', () => {
  it('gives a face-hobbed set no toe/heel depth advice, only a pointer to the gear maker (CP)', () => {
    for (const side of ['drive', 'coast'] as const) {
      const guidance = describePattern({ side, alongTooth: 0.9, upTooth: 0.5 }, { cutMethod: 'face-hobbed' });
      expect(guidance.corrections).toEqual([]);
      expect(guidance.guidance).not.toMatch(/closer to the ring gear|away from the ring gear/);
      expect(guidance.guidance).toContain("gear maker's pattern chart");
    }
  });

  it('reads a set of unknown cut as face-milled, saying face-hobbed sets answer differently', () => {
    // TRADE.md (S: Nissan …) for the rule; (CP) for the caution
    const guidance = describePattern({ side: 'drive', alongTooth: 0.9, upTooth: 0.5 }, { cutMethod: 'unknown' });
    expect(guidance.corrections[0]).toEqual({ part: 'pinion', direction: 'toward-ring-gear', source: NISSAN });
    expect(guidance.guidance).toContain('face-hobbed set answers differently');
    const milled = describePattern({ side: 'drive', alongTooth: 0.9, upTooth: 0.5 }, { cutMethod: 'face-milled' });
    expect(milled.guidance).not.toContain('face-hobbed');
  });

  it('refuses positions outside 0..1', () => {
    // 0 = toe, 1 = heel (S: GM service manual, 9-1/2 in axle); outside is no position.
    expect(() => describePattern({ side: 'drive', alongTooth: 1.2, upTooth: 0.5 })).toThrow(RangeError);
    expect(() => describePattern({ side: 'drive', alongTooth: 0.5, upTooth: Number.NaN })).toThrow(RangeError);
  });
});
