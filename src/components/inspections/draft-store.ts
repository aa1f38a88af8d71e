import type { SheetValues } from '../../lib/inspections/sheet-values';
import type { SheetContext } from './sheet-context';

/**
 * The browser copy of an inspection sheet, written on every change so a closed tab, a reload or a
 * dropped connection loses nothing. localStorage is enough: a sheet is a few kilobytes, and it is
 * written synchronously, so the copy is on disk before the tab can close.
 */
export interface LocalDraft {
  v: 1;
  /** The local draft id (in the URL as ?draft=); also the Idempotency-Key of the create. */
  localId: string;
  /** The inspection on the server, once created. */
  serverId: string | null;
  status: 'draft' | 'submitted';
  values: SheetValues;
  /** What was typed in each entry field, by field path, so "10" reads back as "10". */
  texts: Record<string, string>;
  /** The shim rows as typed (an empty row has no value yet). */
  shimRows: string[];
  /** The runs Lashline counted for the set at the inspection time, when known. */
  countedRuns: number | null;
  /** Gear set, profile and lists last seen, so the sheet works offline after a reload. */
  context: SheetContext | null;
  savedLocallyAt: string;
  savedToServerAt: string | null;
  /** Changes not yet on the server. */
  dirty: boolean;
  /** The Idempotency-Key of the submission, kept so a retry after a reload is the same submission. */
  submitKey: string | null;
  /** Submit was asked for and has not been confirmed yet (e.g. offline). */
  submitPending: boolean;
}

const PREFIX = 'lashline:inspection-draft:';
/** Submitted copies older than this are removed when a sheet opens. */
const KEEP_SUBMITTED_MS = 14 * 24 * 3600 * 1000;

export interface DraftStore {
  load(localId: string): LocalDraft | null;
  save(draft: LocalDraft): boolean;
  remove(localId: string): void;
  /** Local drafts not yet on the server or not submitted, newest first. */
  list(): LocalDraft[];
  prune(now: number): void;
}

function isDraft(value: unknown): value is LocalDraft {
  const d = value as LocalDraft | null;
  return Boolean(d && d.v === 1 && typeof d.localId === 'string' && d.values && typeof d.values === 'object');
}

/** A draft store over a Web Storage (localStorage in the browser, a fake in tests). */
export function createDraftStore(storage: Storage | null): DraftStore {
  const read = (key: string): LocalDraft | null => {
    try {
      const raw = storage?.getItem(key);
      const parsed: unknown = raw ? JSON.parse(raw) : null;
      return isDraft(parsed) ? parsed : null;
    } catch {
      return null;
    }
  };
  const keys = (): string[] => {
    if (!storage) return [];
    const found: string[] = [];
    for (let i = 0; i < storage.length; i++) {
      const key = storage.key(i);
      if (key?.startsWith(PREFIX)) found.push(key);
    }
    return found;
  };
  return {
    load: (localId) => read(PREFIX + localId),
    save: (draft) => {
      try {
        storage?.setItem(PREFIX + draft.localId, JSON.stringify(draft));
        return Boolean(storage);
      } catch {
        // Full or refused (private mode): the caller says the copy could not be kept.
        return false;
      }
    },
    remove: (localId) => storage?.removeItem(PREFIX + localId),
    list: () =>
      keys()
        .map(read)
        .filter((d): d is LocalDraft => d !== null && d.status === 'draft')
        .sort((a, b) => b.savedLocallyAt.localeCompare(a.savedLocallyAt)),
    prune: (now) => {
      for (const key of keys()) {
        const d = read(key);
        if (d && d.status === 'submitted' && !d.dirty && now - Date.parse(d.savedLocallyAt) > KEEP_SUBMITTED_MS)
          storage?.removeItem(key);
      }
    },
  };
}

/** The browser's store, or one that keeps nothing where storage is refused. */
export function browserDraftStore(): DraftStore {
  let storage: Storage | null = null;
  try {
    storage = typeof window === 'undefined' ? null : window.localStorage;
  } catch {
    storage = null;
  }
  return createDraftStore(storage);
}
