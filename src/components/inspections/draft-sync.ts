import type { Problem } from '../shared/api';
import { sheetToCreateBody, sheetToPatchBody, type SheetValues } from '../../lib/inspections/sheet-values';
import type { DraftStore, LocalDraft } from './draft-store';
import type { InspectionApi, InspectionViewLite } from './inspection-api';

/**
 * Keeps one sheet safe: every change is written to the browser at once, and to Lashline a moment
 * later when there is a connection (create with the local id as Idempotency-Key, then PATCH). A
 * failed save is retried when the browser comes back online. Saves run one after another.
 */
export type SyncPhase = 'idle' | 'saving' | 'saved' | 'offline' | 'invalid' | 'error' | 'submitting';

export interface SyncState {
  serverId: string | null;
  status: 'draft' | 'submitted';
  savedLocallyAt: string | null;
  localSaveFailed: boolean;
  savedToServerAt: string | null;
  dirty: boolean;
  phase: SyncPhase;
  problem: Problem | null;
  submitPending: boolean;
}

export interface DraftSyncOptions {
  store: DraftStore;
  api: Pick<InspectionApi, 'create' | 'patch' | 'submit'>;
  draft: LocalDraft;
  /** Field errors that keep the sheet from the server, or null when it may be sent. */
  validate: (values: SheetValues) => Record<string, string> | null;
  isOnline: () => boolean;
  onState: (state: SyncState) => void;
  onServerFields?: (fields: Record<string, string>) => void;
  onSubmitted?: (view: InspectionViewLite) => void;
  newKey: () => string;
  now?: () => Date;
  debounceMs?: number;
  retryMs?: number;
}

export class DraftSync {
  private draft: LocalDraft;
  private seq = 0;
  private queue: Promise<boolean> = Promise.resolve(true);
  private timer: ReturnType<typeof setTimeout> | undefined;
  private retry: ReturnType<typeof setTimeout> | undefined;
  private state: SyncState;

  constructor(private readonly o: DraftSyncOptions) {
    this.draft = o.draft;
    this.state = {
      serverId: o.draft.serverId,
      status: o.draft.status,
      savedLocallyAt: null,
      localSaveFailed: false,
      savedToServerAt: o.draft.savedToServerAt,
      dirty: o.draft.dirty,
      phase: 'idle',
      problem: null,
      submitPending: o.draft.submitPending,
    };
  }

  get current(): LocalDraft {
    return this.draft;
  }

  /** Autosave to the server only for drafts: a change to a submitted one is saved when asked (it is audited). */
  private get autosave(): boolean {
    return this.draft.status === 'draft';
  }

  private now(): string {
    return (this.o.now?.() ?? new Date()).toISOString();
  }

  private emit(patch: Partial<SyncState>): void {
    const before = this.state;
    const next = {
      ...before,
      ...patch,
      serverId: this.draft.serverId,
      status: this.draft.status,
      savedToServerAt: this.draft.savedToServerAt,
      dirty: this.draft.dirty,
      submitPending: this.draft.submitPending,
    };
    this.state = next;
    // A keystroke only moves the local save time, which the status line does not show: no re-render for it.
    const keys = Object.keys(next) as (keyof SyncState)[];
    const changed =
      keys.some((k) => k !== 'savedLocallyAt' && next[k] !== before[k]) ||
      (before.savedLocallyAt === null) !== (next.savedLocallyAt === null);
    if (changed) this.o.onState(next);
  }

  private persist(): void {
    this.draft = { ...this.draft, savedLocallyAt: this.now() };
    const ok = this.o.store.save(this.draft);
    this.emit({ savedLocallyAt: ok ? this.draft.savedLocallyAt : this.state.savedLocallyAt, localSaveFailed: !ok });
  }

  /** Records a change: on this device now, on the server after a pause in typing. */
  change(
    update: Partial<Pick<LocalDraft, 'values' | 'texts' | 'shimRows' | 'countedRuns' | 'context'>>,
    content = true,
  ): void {
    this.draft = { ...this.draft, ...update, dirty: this.draft.dirty || content };
    if (content) this.seq++;
    this.persist();
    if (content && this.autosave) this.schedule(this.o.debounceMs ?? 1500);
  }

  private schedule(ms: number): void {
    clearTimeout(this.timer);
    this.timer = setTimeout(() => void this.flush(), ms);
  }

  /** Saves to the server now (after any save already running); true when the server has every change. */
  flush(): Promise<boolean> {
    clearTimeout(this.timer);
    this.queue = this.queue.then(() => this.saveOnce());
    return this.queue;
  }

  private failed(problem: Problem): false {
    if (problem.status === 0) {
      this.emit({ phase: 'offline', problem });
      clearTimeout(this.retry);
      this.retry = setTimeout(() => void this.resume(), this.o.retryMs ?? 20_000);
    } else {
      if (Object.keys(problem.fields).length) this.o.onServerFields?.(problem.fields);
      this.emit({ phase: 'error', problem });
    }
    return false;
  }

  private async saveOnce(): Promise<boolean> {
    if (this.draft.serverId && !this.draft.dirty) return true;
    const fields = this.o.validate(this.draft.values);
    if (fields) {
      this.emit({
        phase: 'invalid',
        problem: { status: 400, message: 'Some fields need fixing before the sheet can go to Lashline.', fields },
      });
      return false;
    }
    if (!this.o.isOnline()) return this.failed({ status: 0, message: 'Offline.', fields: {} });
    const seq = this.seq;
    this.emit({ phase: 'saving' });
    const id = this.draft.serverId;
    const answer = id
      ? await this.o.api.patch(id, sheetToPatchBody(this.draft.values))
      : await this.o.api.create(sheetToCreateBody(this.draft.values), this.draft.localId);
    if (!answer.ok) return this.failed(answer.problem);
    const repeatedCreate = !id && answer.status === 200;
    this.draft = {
      ...this.draft,
      serverId: answer.data.id,
      status: answer.data.status,
      savedToServerAt: this.now(),
      dirty: repeatedCreate || seq !== this.seq,
    };
    this.persist();
    this.emit({ phase: 'saved', problem: null });
    // A repeated create answers the draft as first sent; this sheet may hold more since.
    if (repeatedCreate) return this.saveOnce();
    return !this.draft.dirty || this.saveOnce();
  }

  /** Submits once everything is on the server; offline, it waits and submits when the connection is back. */
  async submit(): Promise<boolean> {
    this.draft = { ...this.draft, submitPending: true, submitKey: this.draft.submitKey ?? this.o.newKey() };
    this.persist();
    if (!(await this.flush())) return false;
    if (!this.o.isOnline()) return this.failed({ status: 0, message: 'Offline.', fields: {} });
    this.emit({ phase: 'submitting' });
    const answer = await this.o.api.submit(this.draft.serverId!, this.draft.submitKey!);
    if (!answer.ok) {
      if (answer.problem.status !== 0) this.draft = { ...this.draft, submitPending: false };
      this.persist();
      return this.failed(answer.problem);
    }
    this.draft = { ...this.draft, status: answer.data.status, submitPending: false, dirty: false };
    this.persist();
    this.emit({ phase: 'saved', problem: null });
    this.o.onSubmitted?.(answer.data);
    return true;
  }

  /** Back online (or a retry is due): save what is waiting, and submit if that was asked for. */
  async resume(): Promise<void> {
    clearTimeout(this.retry);
    if (this.draft.submitPending && this.draft.status === 'draft') await this.submit();
    else if (this.draft.dirty && (this.autosave || !this.draft.serverId)) await this.flush();
  }

  /** The browser went offline: say so at once rather than at the next save. */
  markOffline(): void {
    this.emit({ phase: 'offline', problem: { status: 0, message: 'Offline.', fields: {} } });
  }

  dispose(): void {
    clearTimeout(this.timer);
    clearTimeout(this.retry);
  }
}
