import { describe, expect, it, vi } from 'vitest';
import { createDraftStore, type LocalDraft } from '../../../src/components/inspections/draft-store';
import { DraftSync, type SyncState } from '../../../src/components/inspections/draft-sync';
import type { Answer } from '../../../src/components/shared/api';
import type { InspectionViewLite } from '../../../src/components/inspections/inspection-api';
import { createBlankSheet } from '../../../src/lib/inspections/sheet-values';
import { findSheetIssues } from '../../../src/lib/inspections/sheet-validate';

/** A Web Storage in memory. */
function memoryStorage(): Storage {
  const map = new Map<string, string>();
  return {
    get length() {
      return map.size;
    },
    clear: () => map.clear(),
    getItem: (k) => map.get(k) ?? null,
    key: (i) => [...map.keys()][i] ?? null,
    removeItem: (k) => void map.delete(k),
    setItem: (k, v) => void map.set(k, v),
  };
}

const LOCAL_ID = '0f7c2a4e-8b1d-4c3e-9a5f-6d7e8f901234';

function draft(overrides: Partial<LocalDraft> = {}): LocalDraft {
  const values = createBlankSheet({
    gearSetId: 'gs1',
    positions: 4,
    unit: 'in',
    torqueUnit: 'lbf-in',
    technicianId: 'u1',
    inspectedAt: '2026-06-01T10:00:00.000Z',
  });
  return {
    v: 1,
    localId: LOCAL_ID,
    serverId: null,
    status: 'draft',
    values: { ...values, runsAtInspection: 12 },
    texts: {},
    shimRows: [],
    countedRuns: 12,
    context: null,
    savedLocallyAt: '2026-06-01T10:00:00.000Z',
    savedToServerAt: null,
    dirty: false,
    submitKey: null,
    submitPending: false,
    ...overrides,
  };
}

describe('the draft store', () => {
  it('restores exactly what it saved, texts and shim rows included', () => {
    const store = createDraftStore(memoryStorage());
    const saved = draft({ texts: { 'readings.0': '10' }, shimRows: ['0.030', ''], dirty: true });
    saved.values.readings = [0.01, null, null, null];
    expect(store.save(saved)).toBe(true);
    expect(store.load(LOCAL_ID)).toEqual(saved);
    expect(store.load('another')).toBeNull();
  });

  it('ignores a damaged copy instead of failing to open', () => {
    const storage = memoryStorage();
    storage.setItem(`lashline:inspection-draft:${LOCAL_ID}`, '{not json');
    expect(createDraftStore(storage).load(LOCAL_ID)).toBeNull();
  });

  it('says when the browser refuses to keep the copy', () => {
    const storage = memoryStorage();
    storage.setItem = () => {
      throw new DOMException('full', 'QuotaExceededError');
    };
    expect(createDraftStore(storage).save(draft())).toBe(false);
  });

  it('removes submitted copies after two weeks but keeps drafts', () => {
    const store = createDraftStore(memoryStorage());
    store.save(draft({ localId: 'a', status: 'submitted', savedLocallyAt: '2026-01-01T00:00:00.000Z' }));
    store.save(draft({ localId: 'b', status: 'draft', savedLocallyAt: '2026-01-01T00:00:00.000Z' }));
    store.prune(Date.parse('2026-02-01T00:00:00.000Z'));
    expect(store.load('a')).toBeNull();
    expect(store.load('b')).not.toBeNull();
  });
});

function view(status: 'draft' | 'submitted' = 'draft'): InspectionViewLite {
  return { id: 'i1', status, createdBy: 'u1', revision: 1 } as InspectionViewLite;
}

function makeSync(
  api: {
    create?: () => Promise<Answer<InspectionViewLite>>;
    patch?: () => Promise<Answer<InspectionViewLite>>;
    submit?: () => Promise<Answer<InspectionViewLite>>;
  },
  online = { value: true },
) {
  const store = createDraftStore(memoryStorage());
  const states: SyncState[] = [];
  const calls = {
    create: vi.fn(api.create ?? (async () => ({ ok: true as const, status: 201, data: view() }))),
    patch: vi.fn(api.patch ?? (async () => ({ ok: true as const, status: 200, data: view() }))),
    submit: vi.fn(api.submit ?? (async () => ({ ok: true as const, status: 200, data: view('submitted') }))),
  };
  const sync = new DraftSync({
    store,
    api: calls,
    draft: draft(),
    validate: (v) => findSheetIssues(v, 12),
    isOnline: () => online.value,
    onState: (s) => states.push(s),
    newKey: () => 'submit-key',
    debounceMs: 10_000,
    retryMs: 60_000,
  });
  return { sync, store, calls, states };
}

describe('the draft sync', () => {
  it('writes every change to the browser at once, then creates with the local id as Idempotency-Key and patches after', async () => {
    const { sync, store, calls } = makeSync({});
    sync.change({ values: { ...sync.current.values, readings: [0.008, null, null, null] } });
    expect(store.load(LOCAL_ID)!.values.readings[0]).toBe(0.008);
    expect(await sync.flush()).toBe(true);
    expect(calls.create).toHaveBeenCalledWith(
      expect.objectContaining({ gearSetId: 'gs1', readings: [0.008, null, null, null] }),
      LOCAL_ID,
    );
    sync.change({ values: { ...sync.current.values, readings: [0.008, 0.007, null, null] } });
    expect(await sync.flush()).toBe(true);
    expect(calls.patch).toHaveBeenCalledWith('i1', expect.not.objectContaining({ gearSetId: expect.anything() }));
    expect(store.load(LOCAL_ID)).toMatchObject({ serverId: 'i1', dirty: false });
    sync.dispose();
  });

  it('keeps the change on the device when offline and sends it when the connection is back', async () => {
    const online = { value: false };
    const { sync, calls, store, states } = makeSync({}, online);
    sync.change({ values: { ...sync.current.values, notes: 'typed at the track' } });
    expect(await sync.flush()).toBe(false);
    expect(calls.create).not.toHaveBeenCalled();
    expect(states.at(-1)!.phase).toBe('offline');
    expect(store.load(LOCAL_ID)).toMatchObject({ dirty: true, values: { notes: 'typed at the track' } });
    online.value = true;
    await sync.resume();
    expect(calls.create).toHaveBeenCalledTimes(1);
    expect(store.load(LOCAL_ID)).toMatchObject({ serverId: 'i1', dirty: false });
    sync.dispose();
  });

  it('patches after a repeated create, because the server answers the draft as first sent', async () => {
    const { sync, calls } = makeSync({ create: async () => ({ ok: true, status: 200, data: view() }) });
    sync.change({ values: { ...sync.current.values, notes: 'newer' } });
    expect(await sync.flush()).toBe(true);
    expect(calls.patch).toHaveBeenCalledWith('i1', expect.objectContaining({ notes: 'newer' }));
    sync.dispose();
  });

  it('does not send a sheet the shared schema refuses, and names the fields', async () => {
    const { sync, calls, states } = makeSync({});
    sync.change({ values: { ...sync.current.values, runsAtInspection: null } });
    expect(await sync.flush()).toBe(false);
    expect(calls.create).not.toHaveBeenCalled();
    expect(states.at(-1)).toMatchObject({
      phase: 'invalid',
      problem: { fields: { runsAtInspection: expect.any(String) } },
    });
    sync.dispose();
  });

  it('submits with one Idempotency-Key, kept for a retry after a dropped answer', async () => {
    let lost = true;
    const { sync, calls, store } = makeSync({
      submit: async () => {
        if (lost) {
          lost = false;
          return { ok: false, problem: { status: 0, message: 'no answer', fields: {} } };
        }
        return { ok: true, status: 200, data: view('submitted') };
      },
    });
    sync.change({ values: { ...sync.current.values, readings: [0.008, 0.007, 0.006, 0.007] } });
    expect(await sync.submit()).toBe(false);
    expect(store.load(LOCAL_ID)).toMatchObject({ submitPending: true, submitKey: 'submit-key' });
    await sync.resume();
    expect(calls.submit).toHaveBeenCalledTimes(2);
    expect(calls.submit.mock.calls.map((c) => (c as unknown[])[1])).toEqual(['submit-key', 'submit-key']);
    expect(store.load(LOCAL_ID)).toMatchObject({ status: 'submitted', submitPending: false });
    sync.dispose();
  });
});
