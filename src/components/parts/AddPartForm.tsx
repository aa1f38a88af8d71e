import { useEffect, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useQuery } from '@tanstack/react-query';
import type { z } from 'zod';
import type { PartView } from '../../lib/register/views';
import { partCreateSchema } from '../../lib/register/schemas';
import { PART_KINDS, PART_KIND_LABELS, type PartKind } from '../../lib/register/kinds';
import { DEFAULT_LIFE_LIMITS, type LifeLimitDefault } from '../../lib/register/team-settings';
import { ratioToLabel, teethToRatio } from '../../lib/register/gear-ratio';
import { callApi, fieldMessage, problemToSummary, type Problem } from '../shared/api';
import { fetchTeamSettings, SETTINGS_KEY, type TeamSettingsAnswer } from './team-settings-query';

// The form holds what the schema takes in; the resolver hands over what it gives out (texts trimmed, blanks null).
type PartFormInput = z.input<typeof partCreateSchema>;
type PartFormOutput = z.output<typeof partCreateSchema>;

const FIELDS = [
  'kind',
  'serial',
  'ringTeeth',
  'pinionTeeth',
  'maker',
  'model',
  'material',
  'lifeLimitRuns',
  'notes',
] as const;

const blankToUndefined = (value: unknown) =>
  value === '' || value === null || value === undefined ? undefined : Number(value);
const blankToNull = (value: unknown) => (value === '' || value === null || value === undefined ? null : Number(value));

/** The life limit a new part of `kind` starts with, and where that figure comes from. */
export function defaultLimitFor(kind: PartKind, settings: TeamSettingsAnswer | undefined): LifeLimitDefault {
  const own = settings?.lifeLimitRuns[kind];
  if (own !== undefined) return { runs: own, source: 'The team’s own limit for this kind (team settings).' };
  return settings?.lifeLimitDefaults[kind] ?? DEFAULT_LIFE_LIMITS[kind];
}

interface Props {
  onCreated: (part: PartView) => void;
  onCancel: () => void;
}

/** Adds a part with the same schema the endpoint checks (`partCreateSchema`). */
export default function AddPartForm({ onCreated, onCancel }: Props) {
  const settings = useQuery({ queryKey: SETTINGS_KEY, queryFn: fetchTeamSettings });
  const [problem, setProblem] = useState<Problem | null>(null);
  const form = useForm<PartFormInput, unknown, PartFormOutput>({
    resolver: zodResolver(partCreateSchema),
    defaultValues: {
      kind: 'gear-set',
      serial: '',
      maker: '',
      model: '',
      material: '',
      notes: '',
      lifeLimitRuns: DEFAULT_LIFE_LIMITS['gear-set'].runs,
    },
    mode: 'onTouched',
  });
  const { register, handleSubmit, watch, setValue, setError, getFieldState, formState } = form;
  const kind: PartKind = watch('kind');
  const ring = watch('ringTeeth');
  const pinion = watch('pinionTeeth');
  const limit = defaultLimitFor(kind, settings.data);

  // Follow the kind's default until the person types their own limit.
  useEffect(() => {
    if (!getFieldState('lifeLimitRuns').isDirty) setValue('lifeLimitRuns', limit.runs);
  }, [kind, limit.runs, getFieldState, setValue]);

  const ratio =
    typeof ring === 'number' &&
    typeof pinion === 'number' &&
    Number.isInteger(ring) &&
    Number.isInteger(pinion) &&
    pinion > 0 &&
    ring > pinion
      ? ratioToLabel(teethToRatio(ring, pinion))
      : null;
  const error = (field: (typeof FIELDS)[number]) => formState.errors[field]?.message;

  const submit = handleSubmit(async (values) => {
    setProblem(null);
    const answer = await callApi<PartView>('/api/parts', { method: 'POST', body: values });
    if (answer.ok) {
      form.reset({ ...form.getValues(), serial: '', notes: '' });
      onCreated(answer.data);
      return;
    }
    setProblem(answer.problem);
    for (const field of FIELDS) {
      const message = fieldMessage(answer.problem, field);
      if (message) setError(field, { type: 'server', message });
    }
  });

  const describedBy = (field: string, hint?: boolean) =>
    [hint ? `part-${field}-hint` : '', formState.errors[field as keyof PartFormInput] ? `part-${field}-error` : '']
      .filter(Boolean)
      .join(' ') || undefined;
  const fieldError = (field: (typeof FIELDS)[number]) =>
    error(field) ? (
      <p id={`part-${field}-error`} className="field-error">
        {error(field)}
      </p>
    ) : null;

  return (
    <form onSubmit={submit} noValidate className="grid gap-4 md:grid-cols-2">
      {problem && (
        <p className="notice notice-error md:col-span-2" role="alert">
          {problemToSummary(problem)}
        </p>
      )}
      <div className="flex flex-col gap-1">
        <label htmlFor="part-kind">Kind</label>
        <select
          id="part-kind"
          {...register('kind')}
          aria-invalid={error('kind') ? true : undefined}
          aria-describedby={describedBy('kind')}
        >
          {PART_KINDS.map((k) => (
            <option key={k} value={k}>
              {PART_KIND_LABELS[k]}
            </option>
          ))}
        </select>
        {fieldError('kind')}
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor="part-serial">Serial</label>
        <input
          id="part-serial"
          autoComplete="off"
          spellCheck={false}
          {...register('serial')}
          aria-invalid={error('serial') ? true : undefined}
          aria-describedby={describedBy('serial')}
        />
        {fieldError('serial')}
      </div>

      {kind === 'gear-set' && (
        <fieldset className="grid gap-3 rounded-md border border-rule p-3 sm:grid-cols-3 sm:items-end md:col-span-2">
          <legend className="px-1 font-semibold">Tooth counts</legend>
          <div className="flex flex-col gap-1">
            <label htmlFor="part-ringTeeth">Ring gear teeth</label>
            <input
              id="part-ringTeeth"
              inputMode="numeric"
              autoComplete="off"
              {...register('ringTeeth', { setValueAs: blankToUndefined, shouldUnregister: true })}
              aria-invalid={error('ringTeeth') ? true : undefined}
              aria-describedby={describedBy('ringTeeth')}
            />
            {fieldError('ringTeeth')}
          </div>
          <div className="flex flex-col gap-1">
            <label htmlFor="part-pinionTeeth">Pinion teeth</label>
            <input
              id="part-pinionTeeth"
              inputMode="numeric"
              autoComplete="off"
              {...register('pinionTeeth', { setValueAs: blankToUndefined, shouldUnregister: true })}
              aria-invalid={error('pinionTeeth') ? true : undefined}
              aria-describedby={describedBy('pinionTeeth')}
            />
            {fieldError('pinionTeeth')}
          </div>
          <p className="min-h-11 self-center text-lg" aria-live="polite" data-testid="ratio">
            {ratio ? (
              <>
                Ratio <strong>{`${ring}:${pinion} → ${ratio}`}</strong>
              </>
            ) : (
              <span className="text-ink-soft">The ratio shows here, e.g. 41:10 → 4.10:1</span>
            )}
          </p>
        </fieldset>
      )}

      <div className="flex flex-col gap-1">
        <label htmlFor="part-maker">
          Maker <span className="font-normal text-ink-soft">(optional)</span>
        </label>
        <input
          id="part-maker"
          autoComplete="off"
          {...register('maker')}
          aria-invalid={error('maker') ? true : undefined}
          aria-describedby={describedBy('maker')}
        />
        {fieldError('maker')}
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor="part-model">
          Model <span className="font-normal text-ink-soft">(optional)</span>
        </label>
        <input
          id="part-model"
          autoComplete="off"
          {...register('model')}
          aria-invalid={error('model') ? true : undefined}
          aria-describedby={describedBy('model')}
        />
        {fieldError('model')}
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor="part-material">
          Material <span className="font-normal text-ink-soft">(optional)</span>
        </label>
        <input
          id="part-material"
          autoComplete="off"
          {...register('material')}
          aria-invalid={error('material') ? true : undefined}
          aria-describedby={describedBy('material')}
        />
        {fieldError('material')}
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor="part-lifeLimitRuns">Life limit, in runs</label>
        <input
          id="part-lifeLimitRuns"
          inputMode="numeric"
          autoComplete="off"
          {...register('lifeLimitRuns', { setValueAs: blankToNull })}
          aria-invalid={error('lifeLimitRuns') ? true : undefined}
          aria-describedby={describedBy('lifeLimitRuns', true)}
        />
        <p id="part-lifeLimitRuns-hint" className="text-sm text-ink-soft">
          {limit.runs === null ? 'No default for this kind. ' : `Default ${limit.runs} runs. `}
          {limit.source} Leave empty for no limit.
          {settings.isError && ' (Team settings could not be read; this is the built-in default.)'}
        </p>
        {fieldError('lifeLimitRuns')}
      </div>
      <div className="flex flex-col gap-1 md:col-span-2">
        <label htmlFor="part-notes">
          Notes <span className="font-normal text-ink-soft">(optional)</span>
        </label>
        <textarea
          id="part-notes"
          rows={2}
          {...register('notes')}
          aria-invalid={error('notes') ? true : undefined}
          aria-describedby={describedBy('notes')}
        />
        {fieldError('notes')}
      </div>
      <div className="flex flex-wrap gap-3 md:col-span-2">
        <button type="submit" className="btn" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? 'Adding…' : 'Add the part'}
        </button>
        <button type="button" className="btn btn-quiet" onClick={onCancel}>
          Cancel
        </button>
      </div>
    </form>
  );
}
