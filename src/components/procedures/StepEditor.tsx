import { useSortable } from '@dnd-kit/sortable';
import { CSS } from '@dnd-kit/utilities';
import { COMPOUND_KINDS, STEP_RECORDS } from '../../lib/procedures/model';
import { TORQUE_UNITS, torqueUnitToLabel, type TorqueUnit } from '../../lib/units';
import type { StepPhotoView } from '../../lib/procedures/views';
import type { EditorStep } from './editor-model';
import { StepPhotos } from './StepPhotos';

interface Props {
  step: EditorStep;
  label: string;
  error: string | undefined;
  /** Where a photo or diagram of this step is sent; null until the step is saved once. */
  photoUploadUrl: string | null;
  photos: StepPhotoView[];
  onChange: (change: Partial<EditorStep>) => void;
  onRemove: () => void;
}

const RECORD_LABELS = {
  'turning-torque': 'a turning torque',
  backlash: 'backlash (opens the inspection sheet)',
  runout: 'runout',
  note: 'a note',
} as const;

/** One step in the editor: a sortable item whose handle moves it by drag or by keyboard. */
export function StepEditor({ step, label, error, photoUploadUrl, photos, onChange, onRemove }: Props) {
  const { attributes, listeners, setNodeRef, setActivatorNodeRef, transform, transition, isDragging } = useSortable({
    id: step.key,
  });
  const field = (name: string) => `${step.key}-${name}`;
  return (
    <li
      ref={setNodeRef}
      style={{ transform: CSS.Transform.toString(transform), transition }}
      className={`rounded-md border-2 bg-panel p-3 ${isDragging ? 'border-petrol' : 'border-rule'}`}
      data-testid="editor-step"
    >
      <div className="mb-2 flex flex-wrap items-center gap-2">
        <button
          type="button"
          ref={setActivatorNodeRef}
          className="btn btn-quiet cursor-grab"
          aria-label={`Move step ${label}${step.title ? ` (${step.title})` : ''}: drag, or press Space then the arrow keys`}
          data-testid="step-handle"
          {...attributes}
          {...listeners}
        >
          <svg width="18" height="18" viewBox="0 0 18 18" aria-hidden="true">
            <path d="M3 5h12M3 9h12M3 13h12" stroke="currentColor" strokeWidth="2" />
          </svg>
        </button>
        <span className="font-bold">{`Step ${label}`}</span>
        <button type="button" className="btn btn-quiet ml-auto" onClick={onRemove}>
          Remove step
        </button>
      </div>
      <div className="grid gap-3 md:grid-cols-2">
        <label className="flex flex-col gap-1 font-semibold md:col-span-2">
          Title
          <input value={step.title} data-testid="step-title" onChange={(e) => onChange({ title: e.target.value })} />
        </label>
        <label className="flex flex-col gap-1 font-semibold md:col-span-2">
          Instructions (Markdown: **bold**, lists, links)
          <textarea
            rows={3}
            value={step.instructions}
            data-testid="step-instructions"
            onChange={(e) => onChange({ instructions: e.target.value })}
          />
        </label>
        <label className="flex flex-col gap-1 font-semibold md:col-span-2">
          Caution (shown highlighted)
          <input value={step.caution} onChange={(e) => onChange({ caution: e.target.value })} />
        </label>
        <label className="flex flex-col gap-1 font-semibold">
          The step records
          <select
            value={step.records}
            data-testid="step-records"
            onChange={(e) => onChange({ records: e.target.value as EditorStep['records'] })}
          >
            <option value="">nothing</option>
            {STEP_RECORDS.map((r) => (
              <option key={r} value={r}>
                {RECORD_LABELS[r]}
              </option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-2 font-semibold">
          <input
            type="checkbox"
            className="!h-6 !w-6"
            checked={step.hasFasteners}
            data-testid="step-has-fasteners"
            onChange={(e) => onChange({ hasFasteners: e.target.checked })}
          />
          A fastener group
        </label>
      </div>
      {step.hasFasteners && (
        <fieldset className="mt-3 grid gap-3 rounded-md border border-rule p-3 md:grid-cols-3">
          <legend className="px-1 font-bold">Fastener group</legend>
          <label className="flex flex-col gap-1 font-semibold">
            How many
            <input
              inputMode="numeric"
              value={step.count}
              id={field('count')}
              data-testid="fasteners-count"
              onChange={(e) => onChange({ count: e.target.value })}
            />
          </label>
          <label className="flex flex-col gap-1 font-semibold md:col-span-2">
            Description (size, grade)
            <input value={step.description} onChange={(e) => onChange({ description: e.target.value })} />
          </label>
          <label className="flex flex-col gap-1 font-semibold">
            The team's torque figure
            <input
              inputMode="decimal"
              value={step.torqueValue}
              data-testid="fasteners-torque"
              onChange={(e) => onChange({ torqueValue: e.target.value })}
            />
          </label>
          <label className="flex flex-col gap-1 font-semibold">
            Unit
            <select
              value={step.torqueUnit}
              data-testid="fasteners-unit"
              onChange={(e) => onChange({ torqueUnit: e.target.value as TorqueUnit })}
            >
              {TORQUE_UNITS.map((u) => (
                <option key={u} value={u}>
                  {torqueUnitToLabel(u)}
                </option>
              ))}
            </select>
          </label>
          <label className="flex flex-col gap-1 font-semibold">
            Where the figure comes from
            <input
              value={step.torqueSource}
              placeholder="part maker’s sheet"
              data-testid="fasteners-source"
              onChange={(e) => onChange({ torqueSource: e.target.value })}
            />
          </label>
          <label className="flex flex-col gap-1 font-semibold">
            Passes, % rising to 100
            <input
              value={step.passes}
              data-testid="fasteners-passes"
              onChange={(e) => onChange({ passes: e.target.value })}
            />
          </label>
          <label className="flex items-center gap-2 font-semibold">
            <input
              type="checkbox"
              className="!h-6 !w-6"
              checked={step.sequence}
              data-testid="fasteners-sequence"
              onChange={(e) => onChange({ sequence: e.target.checked })}
            />
            Tightening order (3–36 bolts)
          </label>
          <label className="flex flex-col gap-1 font-semibold">
            Compound
            <select
              value={step.compoundKind}
              data-testid="fasteners-compound"
              onChange={(e) => onChange({ compoundKind: e.target.value as EditorStep['compoundKind'] })}
            >
              <option value="">none</option>
              {COMPOUND_KINDS.map((k) => (
                <option key={k} value={k}>
                  {k}
                </option>
              ))}
            </select>
          </label>
          {step.compoundKind && (
            <label className="flex flex-col gap-1 font-semibold md:col-span-3">
              Compound note
              <input value={step.compoundNote} onChange={(e) => onChange({ compoundNote: e.target.value })} />
            </label>
          )}
          <p className="text-sm md:col-span-3">The figure is the part maker's; Lashline never supplies one.</p>
        </fieldset>
      )}
      {photoUploadUrl ? (
        <div className="mt-3">
          <StepPhotos uploadUrl={photoUploadUrl} stepNumber={label} initial={photos} canAdd />
        </div>
      ) : (
        <p className="mt-3 text-sm text-ink-soft">Photos and diagrams can be added once the step is saved.</p>
      )}
      {error && (
        <p className="field-error mt-2" role="alert">
          {error}
        </p>
      )}
    </li>
  );
}
