import { DEFAULT_PROFILE, type SourceNote, type ToleranceProfile } from '../analysis/tolerance';
import { torqueUnitToLabel, type TorqueUnit } from '../units';

/**
 * Measure names, profile fields and band sources for verdicts, shared by the sheet (React) and the detail page
 * (.astro). The verdict's own word and shape are `VerdictMark` (components/charts/marks.tsx).
 */

// One list of measure names for the whole product, kept beside the engine that judges them.
export { measureToLabel } from '../analysis/measure-labels';

const MEASURE_FIELDS: Readonly<Record<string, keyof ToleranceProfile>> = {
  'backlash-min-point': 'backlashMin',
  'backlash-max-point': 'backlashMax',
  spread: 'maxSpread',
  runout: 'runoutMax',
  'runout-measured': 'runoutMax',
  'pinion-preload-new': 'pinionPreloadNew',
  'pinion-preload-used': 'pinionPreloadUsed',
  'hub-left': 'hubPreloadCheck',
  'hub-right': 'hubPreloadCheck',
};

/** The profile field a measure is judged against. */
export function measureToProfileField(measure: string): keyof ToleranceProfile | undefined {
  return MEASURE_FIELDS[measure];
}

/**
 * Where the band came from: the published default's source when the profile still holds the default
 * figure, otherwise the team's own figure (the profile names no other source for it).
 * @example bandToSourceText(DEFAULT_PROFILE, 'maxSpread', sources) // 'S: GM light-truck service manual … — variation …'
 */
export function bandToSourceText(
  values: ToleranceProfile,
  field: keyof ToleranceProfile,
  sources: Readonly<Partial<Record<keyof ToleranceProfile, SourceNote>>>,
  profileName?: string,
): string {
  const same = JSON.stringify(values[field]) === JSON.stringify(DEFAULT_PROFILE[field]);
  const note = sources[field];
  if (same && note) return `${note.key}: ${note.source}${note.note ? ` — ${note.note}` : ''}`;
  return `The team’s own figure${profileName ? ` (profile “${profileName}”)` : ''}`;
}

/**
 * A torque for display: one decimal, with its unit label.
 * @example formatTorque(2.7, 'N-m') // '2.7 N·m'
 */
export function formatTorque(value: number, unit: TorqueUnit): string {
  return `${value.toFixed(1)} ${torqueUnitToLabel(unit)}`;
}
