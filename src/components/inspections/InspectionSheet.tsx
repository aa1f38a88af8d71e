import { useEffect, useMemo, useRef, useState, type KeyboardEvent } from 'react';
import { FormProvider, useForm, useWatch, type FieldPath, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { findMissingForSubmit, inspectionDraftSchema, type InspectionDraft } from '../../lib/inspections/schemas';
import { defaultResolutionFor, needsRunsReason, type SheetValues } from '../../lib/inspections/sheet-values';
import { findSheetIssues, RUNS_REASON_MESSAGE } from '../../lib/inspections/sheet-validate';
import { findResolution } from '../../lib/units';
import { BacklashSection } from './BacklashSection';
import { ConditionSection } from './ConditionSection';
import { browserDraftStore, type DraftStore } from './draft-store';
import { DraftSync, type SyncState } from './draft-sync';
import { EntryTextsContext, type EntryTexts } from './fields';
import { inspectionApi, type InspectionViewLite } from './inspection-api';
import { MeasuresSection } from './MeasuresSection';
import { prepareOfflineShell } from './offline-shell';
import { PatternSection } from './PatternSection';
import { PhotosSection } from './PhotosSection';
import { PreloadSection } from './PreloadSection';
import { describeSaveStatus } from './save-status';
import { SetupSection } from './SetupSection';
import { bootSheet, newUuid, type BootResult } from './sheet-boot';
import type { SheetProps } from './sheet-context';
import { useSheetContext } from './use-sheet-context';

/**
 * The inspection sheet: the screen a technician lives in. The browser copy is opened first, so a
 * reload with or without a connection finds everything typed; the sheet then saves itself on this
 * device on every change and to Lashline when it can.
 */
export default function InspectionSheet(props: SheetProps) {
  const [opened, setOpened] = useState<{ boot: BootResult; store: DraftStore } | null>(null);
  useEffect(() => {
    const store = browserDraftStore();
    store.prune(Date.now());
    const boot = bootSheet(props, new URL(window.location.href), store, new Date());
    if (boot.url) window.history.replaceState(window.history.state, '', boot.url);
    setOpened({ boot, store });
    // eslint-disable-next-line react-hooks/exhaustive-deps -- opened once per page
  }, []);
  if (!opened) {
    return (
      <div className="card" aria-busy="true">
        <p>Opening the inspection sheet…</p>
        {/* Shown by CSS only after a few seconds: if the sheet's code never arrives, this is what remains. */}
        <p className="late-notice mt-2" data-testid="sheet-not-opening">
          The sheet has not opened: its code did not arrive, perhaps because the connection dropped. What you typed on
          this device is kept.{' '}
          {/* eslint-disable-next-line jsx-a11y/anchor-is-valid -- an empty address is this very page, query included: a reload with no script */}
          <a href="">Reload the sheet</a>
        </p>
      </div>
    );
  }
  return <Sheet props={props} boot={opened.boot} store={opened.store} />;
}

function Sheet({ props, boot, store }: { props: SheetProps; boot: BootResult; store: DraftStore }) {
  const textsRef = useRef<Record<string, string>>({ ...boot.draft.texts });
  const [shimRows, setShimRows] = useState<string[]>(boot.draft.shimRows);
  const shimRowsRef = useRef(shimRows);
  const countedRef = useRef<number | null>(
    boot.draft.countedRuns ?? (props.mode === 'edit' ? (props.inspection?.runsAtInspection ?? null) : null),
  );
  const [online, setOnline] = useState(() => navigator.onLine);
  const [offlineReady, setOfflineReady] = useState(false);
  const [submitted, setSubmitted] = useState<InspectionViewLite | null>(null);
  const applyFieldsRef = useRef<(fields: Record<string, string>) => void>(() => {});

  const resolver = useMemo(() => sheetResolver(() => countedRef.current), []);
  const form = useForm<SheetValues, unknown, InspectionDraft>({
    defaultValues: boot.draft.values,
    resolver,
    mode: 'onTouched',
  });
  const [sync] = useState(
    () =>
      new DraftSync({
        store,
        api: inspectionApi,
        draft: boot.draft,
        validate: (values) => findSheetIssues(values, countedRef.current),
        isOnline: () => navigator.onLine,
        onState: (state) => setSyncState(state),
        onServerFields: (fields) => applyFieldsRef.current(fields),
        onSubmitted: (view) => setSubmitted(view),
        newKey: newUuid,
      }),
  );
  const [syncState, setSyncState] = useState<SyncState>({
    serverId: boot.draft.serverId,
    status: boot.draft.status,
    savedLocallyAt: boot.restored ? boot.draft.savedLocallyAt : null,
    localSaveFailed: false,
    savedToServerAt: boot.draft.savedToServerAt,
    dirty: boot.draft.dirty,
    phase: 'idle',
    problem: null,
    submitPending: boot.draft.submitPending,
  });
  const { context, countedRuns } = useSheetContext({
    form,
    sync,
    initial: boot.draft.context,
    countedRef,
    online,
    fresh: boot.fresh,
    countRuns: props.mode === 'new',
  });

  applyFieldsRef.current = (fields) => {
    for (const [path, message] of Object.entries(fields))
      form.setError(path as FieldPath<SheetValues>, { type: 'server', message });
  };

  const texts = useMemo<EntryTexts>(
    () => ({
      get: (path) => textsRef.current[path],
      set: (path, text) => {
        textsRef.current[path] = text;
        sync.change({ texts: { ...textsRef.current } }, false);
      },
    }),
    [sync],
  );

  useEffect(() => {
    const subscription = form.watch((values) =>
      sync.change({ values: values as SheetValues, texts: { ...textsRef.current }, shimRows: shimRowsRef.current }),
    );
    const up = () => {
      setOnline(true);
      void sync.resume();
    };
    const down = () => {
      setOnline(false);
      sync.markOffline();
    };
    window.addEventListener('online', up);
    window.addEventListener('offline', down);
    if (navigator.onLine && (boot.draft.dirty || boot.draft.submitPending)) void sync.resume();
    void prepareOfflineShell().then(setOfflineReady);
    return () => {
      subscription.unsubscribe();
      window.removeEventListener('online', up);
      window.removeEventListener('offline', down);
      sync.dispose();
    };
  }, [form, sync, boot]);

  // A resolution belongs to a unit: switching the entry unit takes the common dial of the new one.
  const unit = useWatch({ control: form.control, name: 'unit' });
  const lastUnit = useRef(unit);
  useEffect(() => {
    if (lastUnit.current === unit) return;
    lastUnit.current = unit;
    const resolution = findResolution(form.getValues('resolution'));
    if (resolution && resolution.unit !== unit) form.setValue('resolution', defaultResolutionFor(unit));
  }, [unit, form]);

  const onShimRows = (rows: string[]) => {
    shimRowsRef.current = rows;
    setShimRows(rows);
    sync.change({ shimRows: rows }, false);
  };

  // The save bar sits over the bottom of the page: focus never lands behind it (scroll padding of its height).
  const barRef = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const bar = barRef.current;
    if (!bar || typeof ResizeObserver === 'undefined') return;
    const root = document.documentElement;
    const observer = new ResizeObserver(() => {
      root.style.scrollPaddingBottom = `${bar.offsetHeight + 12}px`;
    });
    observer.observe(bar);
    return () => {
      observer.disconnect();
      root.style.scrollPaddingBottom = '';
    };
  }, []);

  // Just submitted: the bar says so where the button was, and focus goes there with the next steps.
  const submittedRef = useRef<HTMLParagraphElement>(null);
  useEffect(() => {
    if (submitted) submittedRef.current?.focus();
  }, [submitted]);

  const status = syncState.status;
  const readOnly = status === 'submitted' && !props.canEditAny;
  const editingSubmitted = status === 'submitted' && props.canEditAny;
  const serverId = syncState.serverId;
  const canChangePhotos = props.mode === 'new' || props.canEditAny || props.inspection?.createdBy === props.user.id;
  const saveStatus = describeSaveStatus(syncState, online);

  const onSubmit = form.handleSubmit(async (data) => {
    if (editingSubmitted) {
      await sync.flush();
      return;
    }
    const missing = findMissingForSubmit(data);
    if (missing.length) {
      for (const m of missing)
        form.setError(m.path.join('.') as FieldPath<SheetValues>, { type: 'submit', message: m.message });
      form.setFocus(missing[0]!.path.join('.') as FieldPath<SheetValues>);
      return;
    }
    await sync.submit();
  });

  return (
    <FormProvider {...form}>
      <EntryTextsContext.Provider value={texts}>
        {/* eslint-disable-next-line jsx-a11y/no-noninteractive-element-interactions -- Enter in any field moves to the next one; the keys come from the fields inside */}
        <form
          onSubmit={onSubmit}
          onKeyDown={moveOnEnter}
          noValidate
          data-testid="inspection-sheet"
          data-offline-ready={offlineReady ? 'true' : 'false'}
          data-server-id={serverId ?? ''}
          data-status={status}
        >
          {boot.restored && (
            <p className="notice mb-4" role="status" data-testid="restored">
              Opened from this device’s copy
              {boot.draft.savedLocallyAt
                ? `, saved ${new Date(boot.draft.savedLocallyAt).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' })}`
                : ''}
              .
            </p>
          )}
          {(submitted || status === 'submitted') && serverId && (
            <p className="notice mb-4" role="status" data-testid="submitted">
              <strong>✓ Submitted.</strong> {readOnly ? 'The readings are locked; photos can still be added. ' : ''}
              <a href={`/inspections/${serverId}`}>Open the inspection</a>
            </p>
          )}
          <aside className="notice notice-caution mb-5 text-sm" aria-label="Safety">
            <p className="font-bold">Before you start</p>
            <ul className="ml-5 list-disc">
              <li>Support the car on rated stands; never work under a jack alone.</li>
              <li>
                Wear gloves for thread-locker (may cause an allergic skin reaction: H317, P280) and gear oil; dispose of
                used oil under local rules.
              </li>
              <li>Torque values come from the part maker; Lashline shows the team’s own figures, not specs.</li>
              <li>Right after a run the housing and the oil are hot: let them cool before opening the housing.</li>
              <li>
                Wear eye protection when turning the gears for a pattern check and when using a parts cleaner or
                compressed air.
              </li>
              <li>Work with solvents, cleaners and curing sealants in a ventilated space.</li>
              <li>Keep hands clear of the gear mesh when turning the gears for a pattern check.</li>
              <li>The part maker’s figures, the sanctioning body’s rules and local codes govern the work.</li>
            </ul>
          </aside>
          <SetupSection
            props={props}
            context={context}
            countedRuns={countedRuns}
            gearSetLocked={Boolean(serverId)}
            disabled={readOnly}
          />
          <BacklashSection context={context} disabled={readOnly} />
          <MeasuresSection context={context} disabled={readOnly} shimRows={shimRows} onShimRows={onShimRows} />
          <PreloadSection context={context} disabled={readOnly} />
          <PatternSection disabled={readOnly} cutMethod={context.gearSet?.cutMethod ?? 'unknown'} />
          <PhotosSection
            draftId={boot.draft.localId}
            inspectionId={serverId}
            online={online}
            canChange={canChangePhotos}
          />
          <ConditionSection disabled={readOnly} />
          <div
            ref={barRef}
            className="sticky bottom-0 z-10 -mx-4 flex flex-wrap items-center gap-3 border-t-2 border-ink-soft bg-panel px-4 py-2"
          >
            <p
              role="status"
              aria-live="polite"
              className={`min-w-0 flex-1 text-sm font-semibold sm:text-base ${saveStatus.tone === 'problem' ? 'text-alarm' : ''}`}
              data-testid="save-status"
            >
              <span aria-hidden="true">
                {saveStatus.tone === 'ok' ? '✓ ' : saveStatus.tone === 'problem' ? '✕ ' : '… '}
              </span>
              {saveStatus.text}
            </p>
            {submitted && serverId && (
              <p
                ref={submittedRef}
                tabIndex={-1}
                className="flex flex-wrap items-center gap-x-4 gap-y-1 font-semibold"
                data-testid="submitted-bar"
              >
                <span>Submitted.</span>
                <a href={`/inspections/${serverId}`}>Open the inspection</a>
                <a href="/inspections/new">Record another</a>
              </p>
            )}
            {!readOnly && (
              <button
                type="submit"
                className="btn"
                disabled={syncState.phase === 'submitting' || syncState.phase === 'saving'}
                data-testid="submit"
              >
                {editingSubmitted
                  ? 'Save changes'
                  : syncState.submitPending
                    ? 'Submit (waiting for a connection)'
                    : 'Submit inspection'}
              </button>
            )}
          </div>
          {offlineReady && (
            <p className="mt-2 text-sm text-ink-soft">This sheet opens on this device even without a connection.</p>
          )}
        </form>
      </EntryTextsContext.Provider>
    </FormProvider>
  );
}

/** The shared schema through zodResolver, plus the sheet's rule that a changed runs figure says why. */
function sheetResolver(counted: () => number | null): Resolver<SheetValues, unknown, InspectionDraft> {
  const base = zodResolver(inspectionDraftSchema) as unknown as Resolver<SheetValues, unknown, InspectionDraft>;
  return async (values, context, options) => {
    const result = await base(values, context, options);
    if (needsRunsReason(values.runsAtInspection, counted()) && !values.runsChangeReason?.trim()) {
      return {
        values: {},
        errors: { ...result.errors, runsChangeReason: { type: 'required', message: RUNS_REASON_MESSAGE } },
      };
    }
    return result;
  };
}

/** Enter moves to the next field (readings in order, then the next section) instead of submitting. */
function moveOnEnter(event: KeyboardEvent<HTMLFormElement>): void {
  if (event.key !== 'Enter' || event.shiftKey || event.altKey || event.ctrlKey || event.metaKey) return;
  const target = event.target;
  if (!(target instanceof HTMLInputElement || target instanceof HTMLSelectElement)) return;
  if (target instanceof HTMLInputElement && ['submit', 'button', 'file', 'reset'].includes(target.type)) return;
  event.preventDefault();
  const fields = Array.from(
    event.currentTarget.querySelectorAll<HTMLInputElement | HTMLSelectElement>('[data-enter-next]'),
  ).filter((el) => !el.disabled && !el.closest('fieldset:disabled'));
  const sameGroup = (el: Element) =>
    target instanceof HTMLInputElement &&
    target.type === 'radio' &&
    el instanceof HTMLInputElement &&
    el.type === 'radio' &&
    el.name === target.name;
  const next = fields.slice(fields.indexOf(target) + 1).find((el) => !sameGroup(el));
  if (!next) return;
  next.focus();
  if (next instanceof HTMLInputElement && next.type === 'text') next.select();
}
