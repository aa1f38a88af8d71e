/** Readable names of the measures the engine judges, for verdicts and recommendation reasons. */
export const MEASURE_LABELS: Readonly<Record<string, string>> = {
  'backlash-min-point': 'Backlash at the tightest point',
  'backlash-max-point': 'Backlash at the loosest point',
  'backlash-mean': 'Mean backlash',
  spread: 'Spread (max − min)',
  runout: 'Runout estimated from the lash',
  'runout-measured': 'Back-face runout (measured)',
  'pinion-preload-new': 'Pinion turning torque, new bearings',
  'pinion-preload-used': 'Pinion turning torque, used bearings',
  'hub-left': 'Left hub: effort unchanged to full nut torque',
  'hub-right': 'Right hub: effort unchanged to full nut torque',
};

/** @example measureToLabel('spread') // 'Spread (max − min)' */
export function measureToLabel(measure: string): string {
  return MEASURE_LABELS[measure] ?? measure;
}
