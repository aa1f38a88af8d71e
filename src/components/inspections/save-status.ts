import type { SyncState } from './draft-sync';

/** The status line: where the sheet is saved, in words. */
export interface SaveStatus {
  text: string;
  tone: 'ok' | 'waiting' | 'problem';
}

const hhmm = (iso: string) => {
  const d = new Date(iso);
  return `${String(d.getHours()).padStart(2, '0')}:${String(d.getMinutes()).padStart(2, '0')}`;
};

/**
 * @example describeSaveStatus({ …, savedLocallyAt, savedToServerAt: '…14:02…', phase: 'saved' }, true) // 'Saved on this device · Saved to Lashline 14:02'
 */
export function describeSaveStatus(
  state: SyncState,
  online: boolean,
  time: (iso: string) => string = hhmm,
): SaveStatus {
  if (state.localSaveFailed)
    return {
      text: 'Could not save on this device (storage is full or blocked) — keep this tab open until it reaches Lashline.',
      tone: 'problem',
    };
  const local = state.savedLocallyAt ? 'Saved on this device' : 'Not changed yet';
  if (!online || state.phase === 'offline') {
    return {
      text: state.submitPending
        ? 'Offline — saved on this device; it submits when the connection is back'
        : 'Offline — saved on this device',
      tone: 'waiting',
    };
  }
  if (state.phase === 'saving') return { text: `${local} · Saving to Lashline…`, tone: 'waiting' };
  if (state.phase === 'submitting') return { text: `${local} · Submitting…`, tone: 'waiting' };
  if (state.phase === 'invalid') {
    const messages = Object.values(state.problem?.fields ?? {});
    const more = messages.length > 1 ? ` (and ${messages.length - 1} more)` : '';
    return { text: `${local} · Not on Lashline yet: ${messages[0] ?? 'a field needs fixing'}${more}`, tone: 'problem' };
  }
  if (state.phase === 'error')
    return {
      text: `${local} · Lashline did not take the last change: ${state.problem?.message ?? 'unknown error'}`,
      tone: 'problem',
    };
  if (state.status === 'submitted' && state.dirty)
    return { text: `${local} · Changes not yet saved to Lashline`, tone: 'waiting' };
  if (state.savedToServerAt)
    return {
      text: `${local} · Saved to Lashline ${time(state.savedToServerAt)}${state.dirty ? ' (newer changes waiting)' : ''}`,
      tone: state.dirty ? 'waiting' : 'ok',
    };
  return { text: `${local} · Not on Lashline yet`, tone: 'waiting' };
}
