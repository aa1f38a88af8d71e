import type { PartStatus } from '../../lib/register/kinds';
import { LIFE_STATE_LABELS, type LifeState } from '../../lib/register/part-life';

/**
 * The colours and words of the status and life marks, shared by the React marks the islands draw
 * (StatusMark.tsx) and the Astro ones server-rendered tables draw (StatusMark.astro, LifeMark.astro).
 */
export const STATUS_TONE: Readonly<Record<PartStatus, string>> = {
  spare: 'text-petrol',
  'in-service': 'text-steady',
  'under-review': 'text-amber',
  retired: 'text-ink-soft',
  scrapped: 'text-alarm',
};

/**
 * The life mark for a state, or null for a part within its life. Past the limit the number already
 * says "N over", so the mark then only adds its shape and "limit passed".
 * @example lifeStateToMark('due') // { tone: 'text-amber', word: 'due soon', filled: false }
 */
export function lifeStateToMark(state: LifeState): { tone: string; word: string; filled: boolean } | null {
  if (state === 'ok' || state === 'no-limit') return null;
  return {
    tone: state === 'over' ? 'text-alarm' : 'text-amber',
    word: state === 'over' ? 'limit passed' : LIFE_STATE_LABELS[state],
    filled: state !== 'due',
  };
}
