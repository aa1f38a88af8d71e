import { useEffect, useId, useState } from 'react';
import { useController, useFormContext } from 'react-hook-form';
import type { SheetValues } from '../../lib/inspections/sheet-values';
import { dateToWhenText, parseWhenText, WHEN_TEXT_HINT } from '../../lib/inspections/when-text';
import { isoToLocalText } from '../shared/when';
import { FieldError } from './fields';

const NOT_A_TIME = `Not a date and time: type it as 2026-05-03 14:30, a time alone for today, or “now”.`;

/** The inspection's date and time in one field and a "Now" button: two Tab stops instead of seven. */
export function WhenField() {
  const { control } = useFormContext<SheetValues>();
  const when = useController({ control, name: 'inspectedAt' });
  const id = useId();
  const value = when.field.value;
  const [text, setText] = useState(() => (value ? dateToWhenText(new Date(value)) : ''));
  const [left, setLeft] = useState(false);

  // A value set from elsewhere (a restored draft, the server's answer) shows in the field.
  useEffect(() => {
    const read = parseWhenText(text, new Date());
    if (value && read?.toISOString() !== value) setText(dateToWhenText(new Date(value)));
    // eslint-disable-next-line react-hooks/exhaustive-deps -- follows the value only, not each keystroke
  }, [value]);

  const take = (typed: string) => {
    setText(typed);
    const read = parseWhenText(typed, new Date());
    when.field.onChange(read ? read.toISOString() : '');
  };
  // Text that is no time is told at once when the field is left; the form's own rules say the rest.
  const unreadable = left && text.trim() !== '' && !parseWhenText(text, new Date());
  const error = unreadable ? NOT_A_TIME : when.fieldState.error?.message;

  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id}>Date and time of the inspection</label>
      <p id={`${id}-hint`} className="text-sm text-ink-soft">
        {WHEN_TEXT_HINT}
      </p>
      <div className="flex gap-2">
        <input
          id={id}
          ref={when.field.ref}
          value={text}
          inputMode="text"
          autoComplete="off"
          className="min-w-0 flex-1"
          onChange={(e) => take(e.target.value)}
          onBlur={() => {
            when.field.onBlur();
            setLeft(true);
            const read = parseWhenText(text, new Date());
            if (read) setText(dateToWhenText(read));
          }}
          aria-invalid={error ? 'true' : undefined}
          aria-describedby={`${id}-hint ${id}-read${error ? ` ${id}-error` : ''}`}
          data-enter-next
          data-testid="inspected-at"
        />
        <button type="button" className="btn btn-quiet" onClick={() => take(dateToWhenText(new Date()))}>
          Now
        </button>
      </div>
      <p id={`${id}-read`} className="text-sm" data-testid="inspected-at-read">
        {value ? `= ${isoToLocalText(value)}` : ''}
      </p>
      <FieldError id={`${id}-error`} message={error} />
    </div>
  );
}
