import {
  closestCenter,
  DndContext,
  KeyboardSensor,
  PointerSensor,
  useSensor,
  useSensors,
  type DragEndEvent,
} from '@dnd-kit/core';
import {
  arrayMove,
  SortableContext,
  sortableKeyboardCoordinates,
  verticalListSortingStrategy,
} from '@dnd-kit/sortable';
import { useState } from 'react';
import type { ProcedureSection } from '../../lib/procedures/model';
import type { StepPhotoView } from '../../lib/procedures/views';
import {
  newSection,
  newStep,
  sectionsToEditor,
  toProcedureBody,
  type EditorState,
  type EditorStep,
} from './editor-model';
import { StepEditor } from './StepEditor';
import { useHydrated } from '../shared/use-hydrated';

export interface ProcedureEditorProps {
  /** Absent for a new procedure. */
  procedureId?: string;
  initial?: {
    name: string;
    purpose: string | null;
    appliesTo: string | null;
    notes: string | null;
    sections: ProcedureSection[];
  };
  photos?: StepPhotoView[];
}

/** Where a field path of the server's 400 points: the step it belongs to, as "section.step". */
function stepOfField(path: string): string | null {
  const match = /^sections\.(\d+)\.steps\.(\d+)/.exec(path);
  return match ? `${match[1]}.${match[2]}` : null;
}

/** The procedure editor: sections of steps, each list sortable by drag and by keyboard (dnd-kit). */
export default function ProcedureEditor({ procedureId, initial, photos = [] }: ProcedureEditorProps) {
  const [state, setState] = useState<EditorState>(() => ({
    name: initial?.name ?? '',
    purpose: initial?.purpose ?? '',
    appliesTo: initial?.appliesTo ?? '',
    notes: initial?.notes ?? '',
    sections: initial ? sectionsToEditor(initial.sections) : [newSection()],
  }));
  const [fields, setFields] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const hydrated = useHydrated();
  const sensors = useSensors(
    useSensor(PointerSensor),
    useSensor(KeyboardSensor, { coordinateGetter: sortableKeyboardCoordinates }),
  );

  const updateSection = (
    s: number,
    change: (section: EditorState['sections'][number]) => EditorState['sections'][number],
  ) =>
    setState((current) => ({
      ...current,
      sections: current.sections.map((section, i) => (i === s ? change(section) : section)),
    }));
  const updateStep = (s: number, key: string, change: Partial<EditorStep>) =>
    updateSection(s, (section) => ({
      ...section,
      steps: section.steps.map((step) => (step.key === key ? { ...step, ...change } : step)),
    }));
  const onDragEnd = (s: number) => (event: DragEndEvent) => {
    const { active, over } = event;
    if (!over || active.id === over.id) return;
    updateSection(s, (section) => {
      const from = section.steps.findIndex((step) => step.key === active.id);
      const to = section.steps.findIndex((step) => step.key === over.id);
      return { ...section, steps: arrayMove(section.steps, from, to) };
    });
  };

  const save = async () => {
    setSaving(true);
    setMessage(null);
    try {
      const response = await fetch(procedureId ? `/api/procedures/${procedureId}` : '/api/procedures', {
        method: procedureId ? 'PUT' : 'POST',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify(toProcedureBody(state)),
      });
      const body = (await response.json()) as {
        id?: string;
        error?: { message: string; fields?: Record<string, string> };
      };
      if (response.ok && body.id) {
        window.location.assign(`/procedures/${body.id}`);
        return;
      }
      setFields(body.error?.fields ?? {});
      setMessage(body.error?.message ?? `Not saved (${response.status}).`);
    } catch {
      setMessage('Not saved: no connection. Your edits are still here; try again when online.');
    } finally {
      setSaving(false);
    }
  };

  const stepErrors = new Map<string, string>();
  for (const [path, text] of Object.entries(fields)) {
    const at = stepOfField(path);
    if (at && !stepErrors.has(at)) stepErrors.set(at, `${path.split('.').slice(4).join('.') || 'step'}: ${text}`);
  }

  return (
    <form
      className="flex flex-col gap-4"
      data-testid="procedure-editor"
      data-ready={hydrated ? 'true' : undefined}
      onSubmit={(event) => {
        event.preventDefault();
        void save();
      }}
    >
      <div className="card grid gap-3 md:grid-cols-2">
        <label className="flex flex-col gap-1 font-semibold md:col-span-2">
          Name
          <input
            value={state.name}
            data-testid="procedure-name"
            onChange={(e) => setState({ ...state, name: e.target.value })}
          />
          {fields.name && <span className="field-error">{fields.name}</span>}
        </label>
        <label className="flex flex-col gap-1 font-semibold">
          Purpose
          <input
            value={state.purpose}
            placeholder="e.g. ring-and-pinion set-up"
            onChange={(e) => setState({ ...state, purpose: e.target.value })}
          />
        </label>
        <label className="flex flex-col gap-1 font-semibold">
          Applies to
          <input value={state.appliesTo} onChange={(e) => setState({ ...state, appliesTo: e.target.value })} />
        </label>
        <label className="flex flex-col gap-1 font-semibold md:col-span-2">
          Notes
          <textarea rows={2} value={state.notes} onChange={(e) => setState({ ...state, notes: e.target.value })} />
        </label>
      </div>
      {state.sections.map((section, s) => (
        <section key={section.key} className="card flex flex-col gap-3" data-testid="editor-section">
          <div className="flex flex-wrap items-end gap-2">
            <label className="flex grow flex-col gap-1 font-semibold">
              {`Section ${s + 1}`}
              <input
                value={section.title}
                data-testid="section-title"
                onChange={(e) => updateSection(s, (current) => ({ ...current, title: e.target.value }))}
              />
            </label>
            {state.sections.length > 1 && (
              <button
                type="button"
                className="btn btn-quiet"
                onClick={() => setState({ ...state, sections: state.sections.filter((_, i) => i !== s) })}
              >
                Remove section
              </button>
            )}
          </div>
          <DndContext sensors={sensors} collisionDetection={closestCenter} onDragEnd={onDragEnd(s)}>
            <SortableContext items={section.steps.map((step) => step.key)} strategy={verticalListSortingStrategy}>
              <ol className="flex flex-col gap-3">
                {section.steps.map((step, i) => (
                  <StepEditor
                    key={step.key}
                    step={step}
                    label={`${s + 1}.${i + 1}`}
                    error={stepErrors.get(`${s}.${i}`)}
                    photoUploadUrl={
                      procedureId && step.id ? `/api/procedures/${procedureId}/steps/${step.id}/photos` : null
                    }
                    photos={photos.filter((photo) => photo.stepId === step.id)}
                    onChange={(change) => updateStep(s, step.key, change)}
                    onRemove={() =>
                      updateSection(s, (current) => ({
                        ...current,
                        steps: current.steps.filter((x) => x.key !== step.key),
                      }))
                    }
                  />
                ))}
              </ol>
            </SortableContext>
          </DndContext>
          <button
            type="button"
            className="btn btn-quiet self-start"
            data-testid="add-step"
            onClick={() => updateSection(s, (current) => ({ ...current, steps: [...current.steps, newStep()] }))}
          >
            Add a step
          </button>
        </section>
      ))}
      <button
        type="button"
        className="btn btn-quiet self-start"
        data-testid="add-section"
        onClick={() => setState({ ...state, sections: [...state.sections, newSection()] })}
      >
        Add a section
      </button>
      {message && (
        <p className="notice notice-error" role="alert" data-testid="editor-message">
          {message}
        </p>
      )}
      <button type="submit" className="btn self-start" disabled={saving} data-testid="save-procedure">
        {procedureId ? 'Save as a new version' : 'Save the procedure'}
      </button>
    </form>
  );
}
