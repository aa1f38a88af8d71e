import type { RunFormValues } from './run-form';

/**
 * An unsent run kept on this device, so a closed tab or a dropped connection loses nothing. Only
 * drafts younger than half a day come back; older ones belong to another session at the track.
 */
const MAX_AGE_MS = 12 * 60 * 60 * 1000;

function isWorthKeeping(values: RunFormValues): boolean {
  return Boolean(
    values.carId || values.round || values.lane || values.elapsed || values.speed || values.notes || values.atEdited,
  );
}

export function saveDraft(key: string, values: RunFormValues): void {
  try {
    if (isWorthKeeping(values)) localStorage.setItem(key, JSON.stringify({ values, savedAt: Date.now() }));
    else localStorage.removeItem(key);
  } catch {
    // Private browsing or a full store: the form still works, only without a draft.
  }
}

export function readDraft(key: string): RunFormValues | null {
  try {
    const raw = localStorage.getItem(key);
    if (!raw) return null;
    const { values, savedAt } = JSON.parse(raw) as { values: RunFormValues; savedAt: number };
    if (Date.now() - savedAt > MAX_AGE_MS || !isWorthKeeping(values)) return null;
    return values;
  } catch {
    return null;
  }
}

export function clearDraft(key: string): void {
  try {
    localStorage.removeItem(key);
  } catch {
    // See saveDraft.
  }
}
