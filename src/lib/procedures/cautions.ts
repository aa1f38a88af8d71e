/**
 * The cautions Lashline shows by itself, worded from ../shared/TRADE.md. A screen that guides work on a
 * part shows them beside the step; none of them is a torque figure: those are always the part maker's.
 */

/** Beside every torque figure and tightening diagram. */
export const MAKER_FIGURES_NOTICE =
  'Follow the part maker’s figures, sequence and passes; Lashline never supplies a torque figure.';

/** Thread-locking compounds (S: safety data sheets, hazard H317, precaution P280). */
export const THREAD_LOCKER_CAUTION =
  'Thread-locking compounds may cause an allergic skin reaction (H317): wear protective gloves (P280).';

/** After the last pass of a tightening order (TRADE.md: cross sequence, several passes, then checked once more). */
export const FINAL_CHECK_PASS =
  'Final check pass: once more round every bolt in the same order at the full figure, until none turns.';

/** Shown on demo procedures, whose figures are invented. */
export const EXAMPLE_FIGURE_NOTICE = 'example figure — use the part maker’s';

/** Opening a housing, the general cautions of a teardown (TRADE.md, CP). */
export const TEARDOWN_CAUTIONS: readonly string[] = [
  'Right after a run the housing and the oil are hot: let them cool before opening the housing.',
  'Gear oil: wear gloves, and dispose of used oil under local rules.',
  'Wear eye protection when turning the gears for a pattern check and when using a parts cleaner or compressed air.',
];
