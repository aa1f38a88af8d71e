import type { StepChangeInput as StepChange } from '../../lib/procedures/schemas';
import type { StepRecordView } from '../../lib/procedures/views';

/**
 * The device's copy of a checklist: every tick and value is written here at once (localStorage is
 * synchronous, so it is on disk before the tab can close), and each finished step waits in `pending`
 * with its own Idempotency-Key until the server has it. A retry sends the same key, so a change that
 * reached the server before the connection dropped is stored once.
 */

/** What is typed or ticked on a step before it is marked done or skipped. */
export interface StepDraft {
  bolts: number[];
  torques: Record<string, string>;
  value: string;
  note: string;
  reason: string;
}

export interface PendingChange {
  key: string;
  stepId: string;
  body: StepChange;
}

export interface ChecklistCopy {
  v: 1;
  drafts: Record<string, StepDraft>;
  pending: PendingChange[];
  /** The torque unit the technician chose on this device. */
  torqueUnit: string | null;
}

const PREFIX = 'lashline:checklist:';

export const emptyDraft = (): StepDraft => ({ bolts: [], torques: {}, value: '', note: '', reason: '' });

function storage(): Storage | null {
  try {
    return typeof window === 'undefined' ? null : window.localStorage;
  } catch {
    return null;
  }
}

/** The device's copy of checklist `id`, or an empty one. */
export function loadCopy(id: string): ChecklistCopy {
  try {
    const raw = storage()?.getItem(PREFIX + id);
    const parsed = raw ? (JSON.parse(raw) as ChecklistCopy) : null;
    if (parsed?.v === 1 && Array.isArray(parsed.pending)) return parsed;
  } catch {
    // A copy that cannot be read is replaced by an empty one.
  }
  return { v: 1, drafts: {}, pending: [], torqueUnit: null };
}

/** Writes the copy; false when the device refused (full, or private mode). */
export function saveCopy(id: string, copy: ChecklistCopy): boolean {
  try {
    const store = storage();
    store?.setItem(PREFIX + id, JSON.stringify(copy));
    return Boolean(store);
  } catch {
    return false;
  }
}

export type SendResult =
  { kind: 'stored'; step: StepRecordView } | { kind: 'refused'; message: string } | { kind: 'offline' };

/** Sends one change; a 4xx other than 408 and 429 is final (the change is refused), anything else is retried. */
export async function sendChange(checklistId: string, change: PendingChange): Promise<SendResult> {
  let response: Response;
  try {
    response = await fetch(`/api/checklists/${checklistId}/steps/${change.stepId}`, {
      method: 'PATCH',
      headers: { 'Content-Type': 'application/json', 'Idempotency-Key': change.key },
      body: JSON.stringify(change.body),
    });
  } catch {
    return { kind: 'offline' };
  }
  if (response.ok) return { kind: 'stored', step: ((await response.json()) as { step: StepRecordView }).step };
  if (response.status >= 500 || response.status === 408 || response.status === 429) return { kind: 'offline' };
  const body = (await response.json().catch(() => null)) as { error?: { message?: string } } | null;
  return { kind: 'refused', message: body?.error?.message ?? `Refused (${response.status}).` };
}
