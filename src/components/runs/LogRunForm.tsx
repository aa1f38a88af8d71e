import { useEffect, useId, useRef, useState, type FormEvent } from 'react';
import type { RunView } from '../../lib/register/views';
import { fieldMessage, problemToSummary, type Answer, type Problem } from '../shared/api';
import { useHydrated } from '../shared/use-hydrated';
import { dateToLocalInput, isoToLocalText } from '../shared/when';
import {
  checkBeforeSending,
  emptyRunForm,
  LANE_PICKS,
  ROUND_PICKS,
  runFormToBody,
  runToForm,
  type RunFormValues,
} from './run-form';
import { clearDraft, readDraft, saveDraft } from './run-draft';

export interface RunCar {
  id: string;
  name: string;
  carClass: string | null;
}

interface Props {
  cars: RunCar[];
  /** Edit an existing run (PATCH) instead of logging a new one. */
  run?: RunView;
  /** The event of the team's latest run, to prefill a new one. */
  lastEvent?: string | null;
  /** Where an unsent run is kept on this device (create only). */
  draftKey?: string;
  send: (body: Record<string, unknown>) => Promise<Answer<RunView>>;
  onSaved: (run: RunView) => void;
  onCancel?: () => void;
}

/** Log a run in a few taps: the car, then send; the rest is optional or prefilled. */
export function LogRunForm({ cars, run, lastEvent, draftKey, send, onSaved, onCancel }: Props) {
  const id = useId();
  const hydrated = useHydrated();
  const editing = Boolean(run);
  const [values, setValues] = useState<RunFormValues>(() => (run ? runToForm(run) : emptyRunForm(lastEvent ?? '')));
  const [problem, setProblem] = useState<Problem | null>(null);
  const [sending, setSending] = useState(false);
  const [done, setDone] = useState('');
  const [restored, setRestored] = useState(false);
  const summaryRef = useRef<HTMLDivElement>(null);
  const initialAt = useRef(values.at);

  // After hydration: pick up an unsent draft, and keep the clock time fresh while it is not edited.
  useEffect(() => {
    if (editing) return;
    const draft = draftKey ? readDraft(draftKey) : null;
    if (draft) {
      setValues(draft);
      setRestored(true);
    }
    const tick = () => setValues((v) => (v.atEdited ? v : { ...v, at: dateToLocalInput(new Date()) }));
    tick();
    const timer = setInterval(tick, 20_000);
    return () => clearInterval(timer);
  }, [editing, draftKey]);

  // Whatever went wrong is read out first: focus moves to the summary.
  useEffect(() => {
    if (problem) summaryRef.current?.focus();
  }, [problem]);

  useEffect(() => {
    if (!editing && draftKey && hydrated) saveDraft(draftKey, values);
  }, [values, editing, draftKey, hydrated]);

  const set = (changes: Partial<RunFormValues>) => {
    setValues((v) => ({ ...v, ...changes }));
    setDone('');
  };
  const car = cars.find((c) => c.id === values.carId);
  const message = (field: string) => fieldMessage(problem, field);
  const describe = (field: string, hint?: string) =>
    [hint, message(field) ? `${id}-${field}-error` : ''].filter(Boolean).join(' ') || undefined;
  const errorText = (field: string) =>
    message(field) ? (
      <p id={`${id}-${field}-error`} className="field-error">
        {message(field)}
      </p>
    ) : null;

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    if (sending) return;
    setDone('');
    const local = checkBeforeSending(values);
    if (Object.keys(local).length) {
      setProblem({ status: 400, message: '', fields: local });
      return;
    }
    const body = runFormToBody(values, new Date());
    // An edit leaves the time alone unless it was changed (the input drops seconds).
    if (editing && values.at === initialAt.current) delete body.at;
    setSending(true);
    const answer = await send(body);
    setSending(false);
    if (!answer.ok) {
      setProblem(answer.problem);
      return;
    }
    setProblem(null);
    onSaved(answer.data);
    if (editing) return;
    if (draftKey) clearDraft(draftKey);
    setRestored(false);
    setDone(
      `Run logged for ${car?.name ?? 'the car'} at ${isoToLocalText(answer.data.at)}. Every part in the car counts it.`,
    );
    setValues({ ...emptyRunForm(values.event), at: dateToLocalInput(new Date()) });
  };

  return (
    <form
      onSubmit={submit}
      noValidate
      className="flex flex-col gap-5"
      aria-label={editing ? 'Edit the run' : 'Log a run'}
    >
      <div ref={summaryRef} tabIndex={-1} className="outline-none focus-visible:outline-3">
        {problem && (
          <p className="notice notice-error" role="alert">
            {problemToSummary(problem)}
          </p>
        )}
      </div>
      {restored && (
        <p className="notice flex flex-wrap items-center gap-3" role="status">
          This is the run you were logging on this device; it has not been sent yet.
          <button
            type="button"
            className="btn btn-quiet"
            onClick={() => {
              if (draftKey) clearDraft(draftKey);
              setRestored(false);
              setValues({ ...emptyRunForm(lastEvent ?? ''), at: dateToLocalInput(new Date()) });
            }}
          >
            Start again
          </button>
        </p>
      )}

      <fieldset aria-describedby={describe('carId')}>
        <legend className="mb-2 text-lg font-bold">Car</legend>
        <div className="grid grid-cols-2 gap-3 lg:grid-cols-3">
          {cars.map((c) => (
            <label key={c.id} className="choice !justify-start text-lg">
              <input
                type="radio"
                className="sr-only"
                name={`${id}-car`}
                value={c.id}
                checked={values.carId === c.id}
                onChange={() => set({ carId: c.id })}
              />
              <span>
                {c.name}
                {c.carClass && <span className="block text-sm font-normal">{c.carClass}</span>}
              </span>
            </label>
          ))}
        </div>
        {cars.length === 0 && (
          <p>
            No cars yet: a crew chief adds them on the <a href="/cars">cars page</a>.
          </p>
        )}
        {errorText('carId')}
      </fieldset>

      <div className="grid gap-4 md:grid-cols-2">
        <div className="flex min-w-0 flex-col gap-1">
          <label htmlFor={`${id}-at`}>Time of the run</label>
          <div className="flex gap-2">
            <input
              id={`${id}-at`}
              type="datetime-local"
              className="min-w-0 flex-1"
              value={values.at}
              onChange={(e) => set({ at: e.target.value, atEdited: true })}
              aria-invalid={message('at') ? true : undefined}
              aria-describedby={describe('at', `${id}-at-hint`)}
            />
            {!editing && (
              <button
                type="button"
                className="btn btn-quiet shrink-0"
                onClick={() => set({ at: dateToLocalInput(new Date()), atEdited: false })}
              >
                Now
              </button>
            )}
          </div>
          <p id={`${id}-at-hint`} className="text-sm text-ink-soft">
            {editing
              ? 'In this device’s time zone.'
              : values.atEdited
                ? 'Set by hand. Tap Now to follow the clock again.'
                : 'Follows the clock: the run is logged at the moment you send it.'}
          </p>
          {errorText('at')}
        </div>
        <div className="flex min-w-0 flex-col gap-1">
          <label htmlFor={`${id}-event`}>Event</label>
          <div className="flex gap-2">
            <input
              id={`${id}-event`}
              className="min-w-0 flex-1"
              autoComplete="off"
              value={values.event}
              onChange={(e) => set({ event: e.target.value })}
              aria-invalid={message('event') ? true : undefined}
              aria-describedby={describe('event', `${id}-event-hint`)}
            />
            <button
              type="button"
              className="btn btn-quiet shrink-0"
              onClick={() => set({ event: '' })}
              disabled={!values.event}
              aria-label="Clear the event"
            >
              Clear
            </button>
          </div>
          <p id={`${id}-event-hint`} className="text-sm text-ink-soft">
            {editing ? 'Optional.' : 'The last event used, until you change it.'}
          </p>
          {errorText('event')}
        </div>
      </div>

      <fieldset>
        <legend className="mb-2 font-semibold">
          Round <span className="font-normal text-ink-soft">(optional)</span>
        </legend>
        <div className="flex flex-wrap gap-2">
          {ROUND_PICKS.map((round) => (
            <button
              key={round}
              type="button"
              className="chip"
              aria-pressed={values.round === round}
              onClick={() => set({ round: values.round === round ? '' : round })}
            >
              {round}
            </button>
          ))}
          <label className="sr-only" htmlFor={`${id}-round`}>
            Round, typed
          </label>
          <input
            id={`${id}-round`}
            className="!w-32"
            placeholder="other"
            autoComplete="off"
            value={values.round}
            onChange={(e) => set({ round: e.target.value })}
            aria-invalid={message('round') ? true : undefined}
            aria-describedby={describe('round')}
          />
        </div>
        {errorText('round')}
      </fieldset>

      <fieldset>
        <legend className="mb-2 font-semibold">
          Lane <span className="font-normal text-ink-soft">(optional)</span>
        </legend>
        <div className="flex flex-wrap gap-2">
          {LANE_PICKS.map((lane) => (
            <button
              key={lane.value}
              type="button"
              className="chip"
              aria-pressed={values.lane === lane.value}
              onClick={() => set({ lane: values.lane === lane.value ? '' : lane.value })}
            >
              {lane.label}
            </button>
          ))}
        </div>
        {errorText('lane')}
      </fieldset>

      <div className="grid grid-cols-2 gap-4">
        <div className="flex min-w-0 flex-col gap-1">
          <label htmlFor={`${id}-et`}>
            ET, seconds <span className="font-normal text-ink-soft">(optional)</span>
          </label>
          <input
            id={`${id}-et`}
            inputMode="decimal"
            autoComplete="off"
            placeholder="e.g. 5.981"
            value={values.elapsed}
            onChange={(e) => set({ elapsed: e.target.value })}
            aria-invalid={message('elapsedSeconds') ? true : undefined}
            aria-describedby={describe('elapsedSeconds')}
          />
          {errorText('elapsedSeconds')}
        </div>
        <div className="flex min-w-0 flex-col gap-1">
          <label htmlFor={`${id}-mph`}>
            Speed, mph <span className="font-normal text-ink-soft">(optional)</span>
          </label>
          <input
            id={`${id}-mph`}
            inputMode="decimal"
            autoComplete="off"
            placeholder="e.g. 248.6"
            value={values.speed}
            onChange={(e) => set({ speed: e.target.value })}
            aria-invalid={message('speedMph') ? true : undefined}
            aria-describedby={describe('speedMph')}
          />
          {errorText('speedMph')}
        </div>
      </div>

      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-notes`}>
          Notes <span className="font-normal text-ink-soft">(optional)</span>
        </label>
        <textarea
          id={`${id}-notes`}
          rows={2}
          value={values.notes}
          onChange={(e) => set({ notes: e.target.value })}
          aria-invalid={message('notes') ? true : undefined}
          aria-describedby={describe('notes')}
        />
        {errorText('notes')}
      </div>

      <div className="flex flex-wrap items-center gap-3">
        <button type="submit" className="btn min-h-14 px-6 text-lg" disabled={sending}>
          {sending ? 'Sending…' : editing ? 'Save changes' : `Log run${car ? ` for ${car.name}` : ''}`}
        </button>
        {onCancel && (
          <button type="button" className="btn btn-quiet" onClick={onCancel}>
            Cancel
          </button>
        )}
      </div>
      <div role="status" aria-live="polite">
        {done && <p className="notice">{done}</p>}
      </div>
    </form>
  );
}
