// Reading a contact pattern: is it in the usual region, and which way the usual correction goes.
// Guidance only: the axle maker's procedure governs, and which way a shim moves the pinion depends on where it sits.
// Depth corrections are read from the drive side. The coast side answers the other way along the tooth on a
// face-milled gear, so it is reported and cross-checked against the drive side, never given the drive rule
// (TRADE.md: axle maker's pattern guide). A face-hobbed set answers differently again: no toe/heel advice, a
// pointer to the gear maker (CP).

export type ToothSide = 'drive' | 'coast';
/** How the gear teeth were cut, a per-set setting; 'unknown' reads as face-milled with a word of caution. */
export type CutMethod = 'face-milled' | 'face-hobbed' | 'unknown';
export const CUT_METHODS: readonly CutMethod[] = ['face-milled', 'face-hobbed', 'unknown'];

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
  /** What the pattern calls for on its own: a drive pattern off the usual region sets up again; a coast one never does. */
  readonly action: 'keep' | 'watch' | 're-shim';
}

/** What else the reading depends on: the set's cut method and, for the coast side, the drive pattern beside it. */
export interface PatternContext {
  readonly cutMethod?: CutMethod;
  readonly drive?: { readonly alongTooth: number; readonly upTooth: number } | null;
}

/** Usual region, both ways (CP: no published source; a centred pattern, editable later). */
export const USUAL_REGION = { from: 0.3, to: 0.7 } as const;
/** "Slightly toward the toe": the band below the usual region a new setup may sit in (CP, after GM/Geo). */
export const SLIGHT_TOE_FROM = 0.2;
/** Corrections come in steps of about 0.1 mm (0.004 in) (S: a motorcycle shaft-drive service manual; CP elsewhere). */
export const CORRECTION_STEP_MM = 0.1;

const NISSAN = 'Nissan service manual, final drive, pinion height washer';
const GEAR_MAKER = "gear maker's technical note (medium confidence)";
const AXLE_MAKER = "axle maker's pattern guide (medium confidence)";
const GM_GEO = 'GM/Geo service manual';
const LOAD_SHIFT = `Under load the pattern moves toward the heel, so a new setup may sit slightly toward the toe (${GM_GEO}).`;
const SHIM_SEAT = "Which way a shim moves the pinion depends on where it sits: follow the axle maker's procedure.";

function placeOf(position: number, low: string, high: string): string | null {
  if (position < USUAL_REGION.from) return low;
  if (position > USUAL_REGION.to) return high;
  return null;
}

function requireUnitInterval(value: number, name: string): void {
  if (!(value >= 0 && value <= 1)) throw new RangeError(`${name} must be between 0 and 1, got ${value}.`);
}

function codeOf(alongTooth: number, upTooth: number): { code: PatternCode; along: string | null; up: string | null } {
  const along = placeOf(alongTooth, 'toe', 'heel');
  const up = placeOf(upTooth, 'flank', 'face');
  return { code: ([along, up].filter(Boolean).join('-') || 'centred') as PatternCode, along, up };
}

const stepSentence = `Change one thing at a time, in steps of about ${CORRECTION_STEP_MM} mm (0.004 in), and check the pattern again.`;

/** The drive side: Nissan's depth rule and the gear maker's ring-gear rule, or the gear maker's chart if face-hobbed. */
function describeDrive(alongTooth: number, upTooth: number, cutMethod: CutMethod): PatternGuidance {
  const { code, along, up } = codeOf(alongTooth, upTooth);
  const corrections: PatternCorrection[] = [];
  const sentences: string[] = [];
  if (code === 'centred') {
    sentences.push('The pattern sits in the usual central region; no correction is usually needed.');
  } else if (cutMethod === 'face-hobbed') {
    // No toe/heel depth rule for a face-hobbed set: its pattern answers a depth change differently (CP).
    sentences.push(
      "This set is face-hobbed: its pattern answers a pinion depth change differently from a face-milled set, so read the correction from the gear maker's pattern chart for this set (CP).",
    );
  } else {
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
      corrections.push({
        part: 'ring-gear',
        direction: heel ? 'toward-pinion' : 'away-from-pinion',
        source: GEAR_MAKER,
      });
      sentences.push(
        `Contact toward the ${along} is often corrected by moving the ring gear ${heel ? 'toward the pinion (less backlash)' : 'away from the pinion (more backlash)'} (${GEAR_MAKER}).`,
      );
    }
    if (cutMethod === 'unknown') {
      sentences.push(
        "These are the rules for a face-milled set; a face-hobbed set answers differently, so if this set is face-hobbed follow the gear maker's chart instead (CP).",
      );
    }
  }
  if (code !== 'centred') sentences.push(stepSentence);
  if (along === 'toe' || (along === null && alongTooth < 0.5)) sentences.push(LOAD_SHIFT);
  sentences.push(SHIM_SEAT);
  return {
    side: 'drive',
    code,
    inUsualRegion: code === 'centred',
    corrections,
    guidance: sentences.join(' '),
    action: code === 'centred' ? 'keep' : 're-shim',
  };
}

/** The pinion move a pattern toward the toe or heel points to, read by each side's own rule (axle maker's guide). */
function depthCueOf(side: ToothSide, along: string | null): 'closer' | 'away' | null {
  if (along === null) return null;
  // Pinion moved away: the drive pattern goes toward the heel, the coast pattern toward the toe.
  const tooFarAway = side === 'drive' ? along === 'heel' : along === 'toe';
  return tooFarAway ? 'closer' : 'away';
}

/** The coast side: reported, cross-checked against the drive side, never given the drive rule. */
function describeCoast(alongTooth: number, upTooth: number, context: PatternContext): PatternGuidance {
  const cutMethod = context.cutMethod ?? 'unknown';
  const { code, along } = codeOf(alongTooth, upTooth);
  const slightToe = along === 'toe' && alongTooth >= SLIGHT_TOE_FROM && placeOf(upTooth, 'flank', 'face') === null;
  const sentences: string[] = [];
  if (code === 'centred') {
    sentences.push('The coast pattern sits in the usual central region.');
  } else {
    sentences.push(
      `The coast pattern sits toward the ${code.replace('-', ' and the ')}. Pinion depth is corrected from the drive side; the coast side is a cross-check (${AXLE_MAKER}).`,
    );
  }
  if (cutMethod === 'face-hobbed') {
    sentences.push(
      "This set is face-hobbed: read both sides against the gear maker's pattern chart for this set (CP).",
    );
  } else if (along) {
    const coastCue = depthCueOf('coast', along);
    const driveAlong = context.drive ? placeOf(context.drive.alongTooth, 'toe', 'heel') : undefined;
    const cutWords =
      cutMethod === 'unknown' ? ' (read as a face-milled set; a face-hobbed set answers differently, CP)' : '';
    if (driveAlong === undefined) {
      sentences.push(`Record the drive pattern to cross-check it${cutWords}.`);
    } else if (driveAlong === null) {
      sentences.push(
        `The drive pattern is centred along the tooth, so the coast pattern alone is no reason to move the pinion; check it again under load (CP)${cutWords}.`,
      );
    } else if (depthCueOf('drive', driveAlong) === coastCue) {
      sentences.push(
        `On a face-milled set the coast pattern moves the other way along the tooth from the drive pattern as the pinion moves; this one agrees with the drive side, which points to moving the pinion ${coastCue === 'closer' ? 'closer to' : 'away from'} the ring gear (${AXLE_MAKER})${cutWords}.`,
      );
    } else {
      sentences.push(
        `Both patterns sit toward the ${along}: a pinion depth change moves them opposite ways along the tooth, so it will not centre both; check backlash, runout and the bearings before moving the pinion (${AXLE_MAKER}; CP)${cutWords}.`,
      );
    }
  }
  if (along === 'toe' || (along === null && alongTooth < 0.5)) sentences.push(LOAD_SHIFT);
  sentences.push(SHIM_SEAT);
  return {
    side: 'coast',
    code,
    inUsualRegion: code === 'centred' || slightToe,
    corrections: [],
    guidance: sentences.join(' '),
    action: code === 'centred' || slightToe ? 'keep' : 'watch',
  };
}

/**
 * Reads a pattern and returns the usual correction, worded as guidance that defers to the maker's procedure.
 * Drive side (face-milled or not known): up the tooth decides the pinion (Nissan: face → closer, flank → away),
 * along the tooth the ring gear (gear maker's note: heel → toward the pinion, toe → away); with the height centred,
 * Nissan's heel → closer / toe → away for the pinion too. Coast side: reported and cross-checked with the drive
 * pattern, no correction of its own. Face-hobbed: no toe/heel advice, the gear maker's chart.
 * @example describePattern({ side: 'drive', alongTooth: 0.9, upTooth: 0.5 }).code // 'heel'
 */
export function describePattern(position: PatternPosition, context: PatternContext = {}): PatternGuidance {
  requireUnitInterval(position.alongTooth, 'alongTooth');
  requireUnitInterval(position.upTooth, 'upTooth');
  if (position.side === 'coast') return describeCoast(position.alongTooth, position.upTooth, context);
  return describeDrive(position.alongTooth, position.upTooth, context.cutMethod ?? 'unknown');
}
