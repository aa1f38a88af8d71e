// Reading a contact pattern: is it in the usual region, and which way the usual correction goes.
// Guidance only: the axle maker's procedure governs, and which way a shim moves the pinion depends on where it sits.

export type ToothSide = 'drive' | 'coast';

/** Where the pattern's centre sits on the tooth. */
export interface PatternPosition {
  readonly side: ToothSide;
  /** 0 = toe (end nearest the centre), 1 = heel (farthest end). GM service manual, 9-1/2 in axle (S). */
  readonly alongTooth: number;
  /** 0 = flank (root), 1 = face (top). */
  readonly upTooth: number;
}

export type PatternCode =
  'centred' | 'heel' | 'toe' | 'face' | 'flank' | 'heel-face' | 'heel-flank' | 'toe-face' | 'toe-flank';

/** One usual correction and where the rule comes from. */
export interface PatternCorrection {
  readonly part: 'pinion' | 'ring-gear';
  readonly direction: 'toward-ring-gear' | 'away-from-ring-gear' | 'toward-pinion' | 'away-from-pinion';
  readonly source: string;
}

/** Guidance for one pattern. */
export interface PatternGuidance {
  readonly side: ToothSide;
  readonly code: PatternCode;
  readonly inUsualRegion: boolean;
  readonly corrections: readonly PatternCorrection[];
  readonly guidance: string;
}

/** Usual region, both ways (CP: no published source; a centred pattern, editable later). */
export const USUAL_REGION = { from: 0.3, to: 0.7 } as const;
/** Corrections come in steps of about 0.1 mm (0.004 in) (S: a motorcycle shaft-drive service manual; CP elsewhere). */
export const CORRECTION_STEP_MM = 0.1;

const NISSAN = 'Nissan service manual, final drive, pinion height washer';
const GEAR_MAKER = "gear maker's technical note (medium confidence)";

function placeOf(position: number, low: string, high: string): string | null {
  if (position < USUAL_REGION.from) return low;
  if (position > USUAL_REGION.to) return high;
  return null;
}

function requireUnitInterval(value: number, name: string): void {
  if (!(value >= 0 && value <= 1)) throw new RangeError(`${name} must be between 0 and 1, got ${value}.`);
}

/**
 * Reads a pattern and returns the usual correction, worded as guidance that defers to the maker's procedure.
 * Up the tooth decides the pinion (Nissan: face → pinion closer, flank → away). Along the tooth decides the
 * ring gear (gear maker's note: heel → toward the pinion, less backlash; toe → away, more backlash); with the
 * height centred, Nissan's heel → closer / toe → away for the pinion is given too.
 * @example describePattern({ side: 'drive', alongTooth: 0.9, upTooth: 0.5 }).code // 'heel'
 */
export function describePattern(position: PatternPosition): PatternGuidance {
  requireUnitInterval(position.alongTooth, 'alongTooth');
  requireUnitInterval(position.upTooth, 'upTooth');
  const along = placeOf(position.alongTooth, 'toe', 'heel');
  const up = placeOf(position.upTooth, 'flank', 'face');
  const code = ([along, up].filter(Boolean).join('-') || 'centred') as PatternCode;
  const corrections: PatternCorrection[] = [];
  const sentences: string[] = [];
  const pinionCue = up ?? along;
  if (pinionCue) {
    const closer = pinionCue === 'face' || pinionCue === 'heel';
    corrections.push({
      part: 'pinion',
      direction: closer ? 'toward-ring-gear' : 'away-from-ring-gear',
      source: NISSAN,
    });
    sentences.push(
      `Contact toward the ${pinionCue} usually calls for moving the pinion ${closer ? 'closer to' : 'away from'} the ring gear (${NISSAN}).`,
    );
  }
  if (along) {
    const heel = along === 'heel';
    corrections.push({ part: 'ring-gear', direction: heel ? 'toward-pinion' : 'away-from-pinion', source: GEAR_MAKER });
    sentences.push(
      `Contact toward the ${along} is often corrected by moving the ring gear ${heel ? 'toward the pinion (less backlash)' : 'away from the pinion (more backlash)'} (${GEAR_MAKER}).`,
    );
  }
  if (code === 'centred') {
    sentences.push('The pattern sits in the usual central region; no correction is usually needed.');
  } else {
    sentences.push(
      `Change one thing at a time, in steps of about ${CORRECTION_STEP_MM} mm (0.004 in), and check the pattern again.`,
    );
  }
  if (along === 'toe' || (along === null && position.alongTooth < 0.5)) {
    sentences.push(
      'Under load the pattern moves toward the heel, so a new setup may sit slightly toward the toe (GM/Geo service manual).',
    );
  }
  if (position.side === 'coast') {
    sentences.push(
      'These rules are usually read from the drive side; confirm on the drive side before changing shims (CP).',
    );
  }
  sentences.push("Which way a shim moves the pinion depends on where it sits: follow the axle maker's procedure.");
  return { side: position.side, code, inUsualRegion: code === 'centred', corrections, guidance: sentences.join(' ') };
}
