import { useCallback, useEffect, useRef, useState } from 'react';
import { convertTorque, formatTorque, passToText } from '../../lib/procedures/fasteners';
import type { StepChangeInput as StepChange } from '../../lib/procedures/schemas';
import type { SectionDisplay, StepDisplay } from '../../lib/procedures/step-display';
import type { StepPhotoView, StepRecordView } from '../../lib/procedures/views';
import { TORQUE_UNITS, torqueUnitToLabel, type LengthUnit, type TorqueUnit } from '../../lib/units';
import { BoltCircle } from './BoltCircle';
import { StepPhotos } from './StepPhotos';
import {
  emptyDraft,
  loadCopy,
  saveCopy,
  sendChange,
  type ChecklistCopy,
  type PendingChange,
  type StepDraft,
} from './checklist-queue';
import { prepareChecklistShell } from './checklist-shell';

export interface ChecklistRunnerProps {
  checklistId: string;
  sections: SectionDisplay[];
  records: Record<string, StepRecordView>;
  torqueUnit: TorqueUnit;
  lengthUnit: LengthUnit;
  canRecord: boolean;
  gearSetId: string | null;
  photos: StepPhotoView[];
}

const newKey = () => crypto.randomUUID();

/**
 * The checklist on a tablet: big targets, every tick written to the device at once, finished steps
 * sent with an Idempotency-Key whenever there is a connection (and again after a reload).
 */
export default function ChecklistRunner(props: ChecklistRunnerProps) {
  const { checklistId } = props;
  const [copy, setCopy] = useState<ChecklistCopy>(() => ({ v: 1, drafts: {}, pending: [], torqueUnit: null }));
  const [records, setRecords] = useState(props.records);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [loaded, setLoaded] = useState(false);
  const [sending, setSending] = useState(false);
  const [offlineReady, setOfflineReady] = useState(false);
  const copyRef = useRef(copy);
  const sendingRef = useRef(false);

  const update = useCallback(
    (change: (current: ChecklistCopy) => ChecklistCopy) => {
      const next = change(copyRef.current);
      copyRef.current = next;
      saveCopy(checklistId, next);
      setCopy(next);
    },
    [checklistId],
  );

  const flush = useCallback(async () => {
    if (sendingRef.current) return;
    sendingRef.current = true;
    setSending(true);
    try {
      for (;;) {
        const first: PendingChange | undefined = copyRef.current.pending[0];
        if (!first) break;
        const result = await sendChange(checklistId, first);
        if (result.kind === 'offline') break;
        update((current) => ({ ...current, pending: current.pending.filter((p) => p.key !== first.key) }));
        if (result.kind === 'stored') {
          setRecords((current) => ({ ...current, [first.stepId]: result.step }));
          setErrors(({ [first.stepId]: _gone, ...rest }) => rest);
        } else setErrors((current) => ({ ...current, [first.stepId]: result.message }));
      }
    } finally {
      sendingRef.current = false;
      setSending(false);
    }
  }, [checklistId, update]);

  useEffect(() => {
    copyRef.current = loadCopy(checklistId);
    setCopy(copyRef.current);
    setLoaded(true);
    void flush();
    void prepareChecklistShell().then(setOfflineReady);
    const retry = () => void flush();
    window.addEventListener('online', retry);
    const timer = window.setInterval(retry, 10_000);
    return () => {
      window.removeEventListener('online', retry);
      window.clearInterval(timer);
    };
  }, [checklistId, flush]);

  const unit = (copy.torqueUnit as TorqueUnit | null) ?? props.torqueUnit;
  const draftOf = (stepId: string): StepDraft => copy.drafts[stepId] ?? emptyDraft();
  const setDraft = (stepId: string, change: Partial<StepDraft>) =>
    update((current) => ({
      ...current,
      drafts: { ...current.drafts, [stepId]: { ...(current.drafts[stepId] ?? emptyDraft()), ...change } },
    }));
  const pendingOf = (stepId: string) => copy.pending.filter((p) => p.stepId === stepId).at(-1);

  const finish = (step: StepDisplay, status: 'done' | 'skipped') => {
    const draft = draftOf(step.id);
    const group = step.fasteners;
    if (status === 'skipped' && !draft.reason.trim()) {
      setErrors((current) => ({ ...current, [step.id]: 'Say why the step is skipped.' }));
      return;
    }
    if (status === 'done' && group?.sequence && draft.bolts.length !== group.count) {
      setErrors((current) => ({ ...current, [step.id]: `Tick all ${group.count} bolts on the diagram first.` }));
      return;
    }
    const torqueApplied = Object.entries(draft.torques)
      .filter(([, value]) => value.trim() !== '')
      .map(([pass, value]) => ({ pass: Number(pass), value: Number(value), unit }));
    if (torqueApplied.some((t) => !(t.value > 0))) {
      setErrors((current) => ({ ...current, [step.id]: 'Each torque applied is a number above 0.' }));
      return;
    }
    const valueUnit = step.records === 'turning-torque' ? unit : props.lengthUnit;
    const body: StepChange = {
      status,
      at: new Date().toISOString(),
      ...(status === 'skipped' ? { reason: draft.reason.trim() } : {}),
      ...(status === 'done' && torqueApplied.length ? { torqueApplied } : {}),
      ...(status === 'done' && group?.sequence ? { boltsInOrder: draft.bolts } : {}),
      ...(status === 'done' && step.records && step.records !== 'note' && draft.value.trim() !== ''
        ? { value: Number(draft.value), valueUnit }
        : {}),
      ...(draft.note.trim() ? { note: draft.note.trim() } : {}),
    };
    setErrors(({ [step.id]: _gone, ...rest }) => rest);
    update((current) => ({ ...current, pending: [...current.pending, { key: newKey(), stepId: step.id, body }] }));
    void flush();
  };

  const waiting = copy.pending.length;
  return (
    <div
      className="flex flex-col gap-5"
      data-testid="checklist-runner"
      data-loaded={loaded ? 'true' : undefined}
      data-offline-ready={offlineReady ? 'true' : undefined}
    >
      <div className="sticky top-0 z-10 flex flex-wrap items-center gap-3 border-b border-rule bg-paper py-2">
        <p role="status" data-testid="sync-status" className="font-semibold">
          {waiting === 0
            ? 'Everything is saved on the server.'
            : `${waiting} change${waiting === 1 ? '' : 's'} kept on this device${sending ? ', sending…' : ', waiting for a connection.'}`}
        </p>
        <label className="ml-auto flex items-center gap-2 font-semibold">
          Torque unit
          <select
            value={unit}
            className="!w-auto"
            data-testid="torque-unit"
            onChange={(event) => update((current) => ({ ...current, torqueUnit: event.target.value }))}
          >
            {TORQUE_UNITS.map((u) => (
              <option key={u} value={u}>
                {torqueUnitToLabel(u)}
              </option>
            ))}
          </select>
        </label>
      </div>
      {props.sections.map((section) => (
        <section key={section.id} className="card" aria-labelledby={`run-${section.id}`}>
          <h2 id={`run-${section.id}`} className="mb-3">
            {section.title}
          </h2>
          <ol className="flex flex-col gap-6">
            {section.steps.map((step) => (
              <RunnerStep
                key={step.id}
                step={step}
                unit={unit}
                lengthUnit={props.lengthUnit}
                draft={draftOf(step.id)}
                record={records[step.id]}
                pending={pendingOf(step.id)?.body}
                error={errors[step.id]}
                canRecord={props.canRecord}
                gearSetId={props.gearSetId}
                photos={props.photos.filter((photo) => photo.stepId === step.id)}
                uploadUrl={`/api/checklists/${checklistId}/steps/${step.id}/photos`}
                onDraft={(change) => setDraft(step.id, change)}
                onFinish={(status) => finish(step, status)}
              />
            ))}
          </ol>
        </section>
      ))}
    </div>
  );
}

interface StepProps {
  step: StepDisplay;
  unit: TorqueUnit;
  lengthUnit: LengthUnit;
  draft: StepDraft;
  record: StepRecordView | undefined;
  pending: StepChange | undefined;
  error: string | undefined;
  canRecord: boolean;
  gearSetId: string | null;
  photos: StepPhotoView[];
  uploadUrl: string;
  onDraft: (change: Partial<StepDraft>) => void;
  onFinish: (status: 'done' | 'skipped') => void;
}

function RunnerStep({
  step,
  unit,
  lengthUnit,
  draft,
  record,
  pending,
  error,
  canRecord,
  gearSetId,
  photos,
  uploadUrl,
  onDraft,
  onFinish,
}: StepProps) {
  const group = step.fasteners;
  const state = pending?.status ?? record?.status;
  const passes = group
    ? group.passes.map((p) => ({
        ...p,
        value: p.value === null ? null : convertTorque({ value: p.value, unit: p.unit }, unit).value,
        unit,
      }))
    : [];
  const tapped = draft.bolts.length ? draft.bolts : (record?.boltsInOrder ?? []);
  return (
    <li
      data-testid={`run-step-${step.number}`}
      data-state={state ?? 'open'}
      data-saved={record && !pending ? 'true' : undefined}
    >
      <h3 className="mb-2 flex flex-wrap items-center gap-2 text-xl font-bold">
        <StateMark state={state} />
        {`${step.number} ${step.title}`}
        {pending && <span className="text-base font-semibold text-amber">kept on this device</span>}
      </h3>
      {step.instructionsHtml && (
        <div className="instructions mb-2" dangerouslySetInnerHTML={{ __html: step.instructionsHtml }} />
      )}
      {step.cautions.map((caution) => (
        <p key={caution} className="notice notice-caution mb-2 font-semibold">
          {caution}
        </p>
      ))}
      {group && (
        <div className="mb-3 flex flex-col gap-2">
          <p className="font-semibold">
            {`${group.count} × ${group.description ?? 'fastener'}`}
            {group.figure ? ` — team figure ${group.figure}, from ${group.source}` : ''}
          </p>
          {group.compound && <p>{group.compound}</p>}
          {group.sequence && (
            <>
              <BoltCircle
                stepNumber={step.number}
                sequence={group.sequence}
                tapped={tapped}
                disabled={!canRecord || Boolean(state)}
                onTap={(bolt) => onDraft({ bolts: [...draft.bolts, bolt] })}
              />
              <p>{`Order: ${group.sequence.join(', ')}, then the final check pass once more in order.`}</p>
              {!state && canRecord && draft.bolts.length > 0 && (
                <button
                  type="button"
                  className="btn btn-quiet self-start"
                  onClick={() => onDraft({ bolts: draft.bolts.slice(0, -1) })}
                >
                  Undo last bolt
                </button>
              )}
            </>
          )}
          {group.figure && (
            <div className="flex flex-wrap gap-3">
              {passes.map((pass) => (
                <label key={pass.pass} className="flex flex-col gap-1 font-semibold">
                  {passToText(pass)}
                  <input
                    inputMode="decimal"
                    className="!w-36 text-lg"
                    data-testid={`torque-${step.number}-${pass.pass}`}
                    disabled={!canRecord || Boolean(state)}
                    value={
                      draft.torques[pass.pass] ??
                      record?.torqueApplied?.find((t) => t.pass === pass.pass)?.value?.toString() ??
                      ''
                    }
                    onChange={(event) => onDraft({ torques: { ...draft.torques, [pass.pass]: event.target.value } })}
                    aria-label={`Torque applied, pass ${pass.pass}, in ${torqueUnitToLabel(unit)}`}
                  />
                </label>
              ))}
            </div>
          )}
          <p className="text-sm font-semibold">
            Follow the part maker’s figures, sequence and passes; Lashline never supplies a torque figure.
          </p>
        </div>
      )}
      {step.records === 'backlash' && gearSetId && (
        <p className="mb-2">
          <a
            className="btn btn-quiet"
            href={`/inspections/new?gearSetId=${gearSetId}&draft=${crypto.randomUUID()}`}
            data-testid="open-inspection"
          >
            Open the inspection sheet for this set
          </a>
        </p>
      )}
      {step.records && step.records !== 'note' && (
        <label className="mb-2 flex flex-col gap-1 font-semibold">
          {`${step.records === 'turning-torque' ? 'Turning torque' : step.records === 'backlash' ? 'Backlash' : 'Runout'} (${step.records === 'turning-torque' ? torqueUnitToLabel(unit) : lengthUnit})`}
          <input
            inputMode="decimal"
            className="!w-40 text-lg"
            disabled={!canRecord || Boolean(state)}
            data-testid={`value-${step.number}`}
            value={draft.value || (record?.value?.toString() ?? '')}
            onChange={(event) => onDraft({ value: event.target.value })}
          />
        </label>
      )}
      <StepPhotos uploadUrl={uploadUrl} stepNumber={step.number} initial={photos} canAdd={canRecord} />
      {canRecord && !state && (
        <>
          <label className="mb-2 flex flex-col gap-1 font-semibold">
            Note or deviation
            <textarea
              rows={2}
              value={draft.note}
              data-testid={`note-${step.number}`}
              onChange={(event) => onDraft({ note: event.target.value })}
            />
          </label>
          <div className="flex flex-wrap items-end gap-3">
            <button
              type="button"
              className="btn min-h-14 min-w-32 text-lg"
              data-testid={`done-${step.number}`}
              onClick={() => onFinish('done')}
            >
              Done
            </button>
            <label className="flex flex-col gap-1 font-semibold">
              Reason to skip
              <input
                value={draft.reason}
                data-testid={`reason-${step.number}`}
                onChange={(event) => onDraft({ reason: event.target.value })}
              />
            </label>
            <button
              type="button"
              className="btn btn-quiet min-h-14"
              data-testid={`skip-${step.number}`}
              onClick={() => onFinish('skipped')}
            >
              Skip
            </button>
          </div>
        </>
      )}
      {record && !pending && <RecordLine record={record} />}
      {error && (
        <p className="field-error mt-2" role="alert">
          {error}
        </p>
      )}
    </li>
  );
}

function RecordLine({ record }: { record: StepRecordView }) {
  const parts = [
    `${record.status === 'done' ? 'Done' : `Skipped: ${record.reason}`} by ${record.by.name}, ${record.at.slice(0, 16).replace('T', ' ')}`,
    record.torqueApplied?.length
      ? `torques ${record.torqueApplied.map((t) => formatTorque(t.value, t.unit)).join(', ')}`
      : null,
    record.boltsInOrder
      ? `bolts ${record.boltsInOrder.join(', ')}${record.orderDeviation ? ' — out of the engine’s order (deviation)' : ''}`
      : null,
    record.value !== null ? `measured ${record.value} ${record.valueUnit ?? ''}` : null,
    record.note ? `note: ${record.note}` : null,
  ].filter(Boolean);
  return (
    <p className="mt-2 text-ink-soft" data-testid="record-line">
      {parts.join(' · ')}
    </p>
  );
}

function StateMark({ state }: { state: string | undefined }) {
  // A shape, not a character: the preloaded font's range stays untouched.
  if (state === 'done')
    return (
      <svg width="22" height="22" viewBox="0 0 22 22" role="img" aria-label="done">
        <circle cx="11" cy="11" r="10" fill="currentColor" />
        <path d="M6 11.5 L9.5 15 L16 7.5" stroke="#fff" strokeWidth="2.5" fill="none" />
      </svg>
    );
  if (state === 'skipped')
    return (
      <svg width="22" height="22" viewBox="0 0 22 22" role="img" aria-label="skipped">
        <circle cx="11" cy="11" r="10" fill="none" stroke="currentColor" strokeWidth="2" />
        <path d="M6 11 H16" stroke="currentColor" strokeWidth="2.5" />
      </svg>
    );
  return (
    <svg width="22" height="22" viewBox="0 0 22 22" role="img" aria-label="open">
      <circle cx="11" cy="11" r="10" fill="none" stroke="currentColor" strokeWidth="2" />
    </svg>
  );
}
