import { useId, useState, type FormEvent } from 'react';
import { callApi, fieldMessage, problemToSummary, type Problem } from './api';

export interface RecordField {
  name: string;
  label: string;
  optional?: boolean;
  hint?: string;
  multiline?: boolean;
}

interface Props<T> {
  endpoint: string;
  fields: RecordField[];
  submitLabel: string;
  onSaved: (record: T) => void;
}

/**
 * A small create form for a register record (a car, an assembly). The endpoint checks the body
 * with the shared schema and names each bad field; this form shows those answers beside the fields.
 */
export function RecordForm<T>({ endpoint, fields, submitLabel, onSaved }: Props<T>) {
  const id = useId();
  const empty = () => Object.fromEntries(fields.map((f) => [f.name, '']));
  const [values, setValues] = useState<Record<string, string>>(empty);
  const [problem, setProblem] = useState<Problem | null>(null);
  const [sending, setSending] = useState(false);

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    setSending(true);
    setProblem(null);
    const answer = await callApi<T>(endpoint, { method: 'POST', body: values });
    setSending(false);
    if (!answer.ok) return setProblem(answer.problem);
    setValues(empty());
    onSaved(answer.data);
  };

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3">
      {problem && (
        <p className="notice notice-error" role="alert">
          {problemToSummary(problem)}
        </p>
      )}
      {fields.map((field) => {
        const inputId = `${id}-${field.name}`;
        const message = fieldMessage(problem, field.name);
        const describedBy =
          [field.hint ? `${inputId}-hint` : '', message ? `${inputId}-error` : ''].filter(Boolean).join(' ') ||
          undefined;
        const common = {
          id: inputId,
          name: field.name,
          value: values[field.name] ?? '',
          'aria-invalid': message ? true : undefined,
          'aria-describedby': describedBy,
          onChange: (e: { target: { value: string } }) => setValues((v) => ({ ...v, [field.name]: e.target.value })),
        };
        return (
          <div key={field.name} className="flex flex-col gap-1">
            <label htmlFor={inputId}>
              {field.label} {field.optional && <span className="font-normal text-ink-soft">(optional)</span>}
            </label>
            {field.hint && (
              <p id={`${inputId}-hint`} className="text-sm text-ink-soft">
                {field.hint}
              </p>
            )}
            {field.multiline ? <textarea rows={2} {...common} /> : <input autoComplete="off" {...common} />}
            {message && (
              <p id={`${inputId}-error`} className="field-error">
                {message}
              </p>
            )}
          </div>
        );
      })}
      <button type="submit" className="btn self-start" disabled={sending}>
        {sending ? 'Saving…' : submitLabel}
      </button>
    </form>
  );
}
