// Words and marks for the recommendation, shared by the board (.astro) and the gear-set page. An action
// is always a word and a shape; colour only repeats it.

import type { RecommendationReason, RecommendedAction, Verdict } from '../analysis';

export const ACTION_TEXT: Readonly<Record<RecommendedAction, { word: string; hint: string; tone: string }>> = {
  retire: { word: 'Retire', hint: 'replace the set', tone: 'text-alarm' },
  're-shim': { word: 'Re-shim', hint: 'set it up again', tone: 'text-amber' },
  watch: { word: 'Watch', hint: 'look again next time', tone: 'text-amber' },
  keep: { word: 'Keep', hint: 'run it', tone: 'text-steady' },
};

export const VERDICT_WORDS: Readonly<Record<Verdict, { word: string; tone: string }>> = {
  'in-band': { word: 'In band', tone: 'text-steady' },
  'near-limit': { word: 'Near a limit', tone: 'text-amber' },
  'out-of-band': { word: 'Out of band', tone: 'text-alarm' },
};

const MEASURES: Readonly<Record<string, string>> = {
  'backlash-min-point': 'backlash at the tightest point',
  'backlash-max-point': 'backlash at the loosest point',
  'backlash-mean': 'mean backlash',
  spread: 'spread',
  runout: 'runout estimated from the lash',
  'runout-measured': 'measured runout',
  'pinion-preload-new': 'pinion turning torque (new bearings)',
  'pinion-preload-used': 'pinion turning torque (used bearings)',
  'hub-left': 'the left hub check',
  'hub-right': 'the right hub check',
};

/** @example measureToWords('backlash-max-point') // 'backlash at the loosest point' */
export function measureToWords(measure: string): string {
  return MEASURES[measure] ?? measure.replace(/-/g, ' ');
}

const capitalise = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/**
 * A reason as the screen says it: the engine names measures by their codes in a few messages
 * ("backlash-max-point is near its limit"); those read as words here.
 * @example reasonToText({ code: 'spread-near-limit', message: 'spread is near its limit: …', … }) // 'Spread is near its limit: …'
 */
export function reasonToText(reason: Pick<RecommendationReason, 'code' | 'message'>): string {
  const near = /^(.+)-near-limit$/.exec(reason.code);
  if (near) return `${capitalise(measureToWords(near[1]!))} is near its limit: check it again at the next inspection.`;
  const ahead = /^(.+)-limit-before-next-service$/.exec(reason.code);
  if (ahead) {
    const measure = ahead[1]!;
    return reason.message.replace(new RegExp(`\\b${measure.replace(/[-]/g, '\\-')}\\b`), measureToWords(measure));
  }
  return reason.message;
}
