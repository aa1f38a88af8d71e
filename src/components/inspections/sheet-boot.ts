import { createBlankSheet, valueToEntryText, viewToSheet } from '../../lib/inspections/sheet-values';
import { entryDecimals } from '../../lib/inspections/entry-text';
import type { DraftStore, LocalDraft } from './draft-store';
import type { SheetProps } from './sheet-context';

/**
 * Which sheet to open: the browser copy first (a reload finds what was typed, with or without a
 * connection), else the inspection being edited, else a new blank sheet for the set in the URL.
 */
export interface BootResult {
  draft: LocalDraft;
  /** Opened from the browser copy. */
  restored: boolean;
  /** A new sheet: prefills (positions, assembly, runs) may fill it in. */
  fresh: boolean;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** A random UUID, also where crypto.randomUUID is missing (a plain-http LAN address is not a secure context). */
export function newUuid(): string {
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID();
  const b = crypto.getRandomValues(new Uint8Array(16));
  b[6] = (b[6]! & 0x0f) | 0x40;
  b[8] = (b[8]! & 0x3f) | 0x80;
  const h = Array.from(b, (x) => x.toString(16).padStart(2, '0')).join('');
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}

function emptyDraft(localId: string, values: LocalDraft['values'], now: string): LocalDraft {
  return {
    v: 1,
    localId,
    serverId: null,
    status: 'draft',
    values,
    texts: {},
    shimRows: [],
    countedRuns: null,
    context: null,
    savedLocallyAt: now,
    savedToServerAt: null,
    dirty: false,
    submitKey: null,
    submitPending: false,
  };
}

/** Opens the sheet for `url`; may give back a URL to put in the address bar (a new ?draft= id). */
export function bootSheet(props: SheetProps, url: URL, store: DraftStore, now: Date): BootResult & { url?: URL } {
  const iso = now.toISOString();
  if (props.mode === 'edit' && props.inspection) {
    const view = props.inspection;
    const localId = `edit-${view.id}`;
    // Unsent changes to this inspection, from this page or from the sheet that created it.
    const local = store.load(localId) ?? store.list().find((d) => d.serverId === view.id) ?? null;
    if (local && local.dirty) return { draft: local, restored: true, fresh: false };
    const values = viewToSheet(view);
    const draft = emptyDraft(localId, values, iso);
    const decimals = entryDecimals(values.resolution, values.unit);
    draft.serverId = view.id;
    draft.status = view.status;
    draft.savedToServerAt = iso;
    draft.countedRuns = local?.countedRuns ?? null;
    draft.context = local?.context ?? null;
    draft.shimRows = (values.pinion?.shims ?? []).map((s) => valueToEntryText(s, decimals));
    return { draft, restored: false, fresh: false };
  }
  const given = url.searchParams.get('draft');
  if (given && UUID.test(given)) {
    const local = store.load(given);
    if (local) return { draft: local, restored: true, fresh: false };
  }
  const localId = given && UUID.test(given) ? given : newUuid();
  const values = createBlankSheet({
    gearSetId: url.searchParams.get('gearSetId') ?? '',
    positions: props.positionsDefault,
    unit: props.user.lengthUnit,
    torqueUnit: props.user.torqueUnit,
    technicianId: props.user.id,
    inspectedAt: new Date(Math.floor(now.getTime() / 60_000) * 60_000).toISOString(),
  });
  const next = new URL(url);
  next.searchParams.set('draft', localId);
  return {
    draft: emptyDraft(localId, values, iso),
    restored: false,
    fresh: true,
    url: next.toString() === url.toString() ? undefined : next,
  };
}
