import { createContext, useContext, useEffect, useId, useRef, useState, type ReactNode } from 'react';
import { useController, useFormContext, useWatch, type FieldPath } from 'react-hook-form';
import { entryDecimals, parseDecimalText, parseLengthText, type ParsedEntry } from '../../lib/inspections/entry-text';
import { valueToEntryText, type SheetValues } from '../../lib/inspections/sheet-values';
import type { LengthUnit } from '../../lib/units';

/**
 * The sheet's field kit. Entry fields keep what was typed (so "10" stays "10") beside the number
 * the form holds, and remember it through the sheet's text store so a reload shows it again.
 */
export interface EntryTexts {
  get(path: string): string | undefined;
  set(path: string, text: string): void;
}

export const EntryTextsContext = createContext<EntryTexts>({ get: () => undefined, set: () => {} });

export type EntryKind = 'indicator' | 'length' | 'signed-length' | 'decimal' | 'whole';

function parseFor(kind: EntryKind, text: string, unit: LengthUnit, resolution: string): ParsedEntry {
  if (kind === 'indicator') return parseLengthText(text, unit, resolution, 'indicator');
  if (kind === 'length') return parseLengthText(text, unit, resolution, 'shim');
  if (kind === 'signed-length') return parseLengthText(text, unit, resolution, 'depth-change');
  return parseDecimalText(text, { whole: kind === 'whole' });
}

const isLengthKind = (kind: EntryKind) => kind === 'indicator' || kind === 'length' || kind === 'signed-length';

export function FieldError({ id, message }: { id: string; message?: string }) {
  if (!message) return null;
  return (
    <p id={id} className="field-error text-sm" data-field-error>
      <span aria-hidden="true">✕ </span>
      {message}
    </p>
  );
}

interface EntryFieldProps {
  name: FieldPath<SheetValues>;
  label: ReactNode;
  kind: EntryKind;
  /** Shown after the input ("in", "lbf·in"). */
  unitLabel?: string;
  hint?: ReactNode;
  /** Stored value when the field is empty: null for most, undefined where the schema wants the key left out. */
  empty?: null | undefined;
  large?: boolean;
  testId?: string;
  disabled?: boolean;
}

/** A number typed as text; length fields apply the sheet's one entry rule and show the value as read. */
export function EntryField({
  name,
  label,
  kind,
  unitLabel,
  hint,
  empty = null,
  large,
  testId,
  disabled,
}: EntryFieldProps) {
  const { control } = useFormContext<SheetValues>();
  const texts = useContext(EntryTextsContext);
  const { field, fieldState } = useController({ control, name });
  const [unit, resolution] = useWatch({ control, name: ['unit', 'resolution'] });
  const value = field.value as number | null | undefined;
  const decimals = kind === 'whole' ? 0 : kind === 'decimal' ? 2 : entryDecimals(resolution, unit);
  const [text, setText] = useState(
    () =>
      texts.get(name) ??
      (kind === 'whole' || kind === 'decimal' ? (value ?? '').toString() : valueToEntryText(value, decimals)),
  );
  const parsed = parseFor(kind, text, unit, resolution);
  const first = useRef(true);
  const id = useId();

  // The entry unit changed: read the same text in the new unit (the usual fix for a wrong unit choice).
  useEffect(() => {
    if (first.current) return;
    if (!isLengthKind(kind) || parsed.value === (value ?? null)) return;
    field.onChange(parsed.value ?? empty);
    // eslint-disable-next-line react-hooks/exhaustive-deps -- only a unit change re-reads the text
  }, [unit]);

  // A value set from outside (a prefill, a resize, a restore): show it.
  useEffect(() => {
    if (first.current) {
      first.current = false;
      return;
    }
    const current = parseFor(kind, text, unit, resolution).value;
    if (current !== (value ?? null)) {
      const next =
        kind === 'whole' || kind === 'decimal' ? (value ?? '').toString() : valueToEntryText(value, decimals);
      setText(next);
      texts.set(name, next);
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps -- follows the value only
  }, [value]);

  const onText = (next: string) => {
    setText(next);
    texts.set(name, next);
    const read = parseFor(kind, next, unit, resolution);
    field.onChange(read.value ?? empty);
  };

  const error = fieldState.error?.message ?? parsed.error;
  const noteId = `${id}-note`;
  const errorId = `${id}-error`;
  const hintId = `${id}-hint`;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id}>{label}</label>
      {hint && (
        <p id={hintId} className="text-sm text-ink-soft">
          {hint}
        </p>
      )}
      <div className="flex items-center gap-2">
        <input
          id={id}
          ref={field.ref}
          name={name}
          type="text"
          inputMode={kind === 'whole' ? 'numeric' : 'decimal'}
          autoComplete="off"
          spellCheck={false}
          value={text}
          disabled={disabled}
          onChange={(e) => onText(e.target.value)}
          onBlur={field.onBlur}
          aria-invalid={error ? 'true' : undefined}
          aria-describedby={
            [hint ? hintId : '', parsed.note ? noteId : '', error ? errorId : ''].filter(Boolean).join(' ') || undefined
          }
          className={`tabular-nums ${large ? 'text-xl font-semibold' : ''} ${unitLabel ? 'max-w-[11rem]' : ''}`}
          data-testid={testId}
          data-enter-next
        />
        {unitLabel && <span className="shrink-0 font-semibold text-ink-soft">{unitLabel}</span>}
      </div>
      {parsed.note && !error && (
        <p id={noteId} className="text-sm text-ink-soft" data-testid={testId ? `${testId}-note` : undefined}>
          {parsed.note}
        </p>
      )}
      <FieldError id={errorId} message={error} />
    </div>
  );
}

/** A labelled select bound to the form. */
export function SelectField({
  name,
  label,
  options,
  hint,
  disabled,
  nullable,
}: {
  name: FieldPath<SheetValues>;
  label: ReactNode;
  options: readonly { value: string; label: string }[];
  hint?: ReactNode;
  disabled?: boolean;
  nullable?: boolean;
}) {
  const { register, getFieldState, formState } = useFormContext<SheetValues>();
  const id = useId();
  const error = getFieldState(name, formState).error?.message;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id}>{label}</label>
      {hint && <p className="text-sm text-ink-soft">{hint}</p>}
      <select
        id={id}
        {...register(name, nullable ? { setValueAs: (v: string | null) => (v === '' || v === null ? null : v) } : {})}
        disabled={disabled}
        aria-invalid={error ? 'true' : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        data-enter-next
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      <FieldError id={`${id}-error`} message={error} />
    </div>
  );
}

/** A section of the sheet: a landmark with its heading. */
export function SheetSection({
  id,
  title,
  children,
  aside,
}: {
  id: string;
  title: string;
  children: ReactNode;
  aside?: ReactNode;
}) {
  return (
    <section aria-labelledby={`${id}-heading`} className="card mb-5" id={id}>
      <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
        <h2 id={`${id}-heading`}>{title}</h2>
        {aside}
      </div>
      {children}
    </section>
  );
}
