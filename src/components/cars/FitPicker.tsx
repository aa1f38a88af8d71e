import { useId, useState } from 'react';

interface Props {
  label: string;
  options: { value: string; label: string }[];
  buttonLabel: string;
  emptyText: string;
  busy: boolean;
  onFit: (value: string) => void;
}

/** Choose what goes in, then one big button: the install half of the cars screen. */
export function FitPicker({ label, options, buttonLabel, emptyText, busy, onFit }: Props) {
  const id = useId();
  const [value, setValue] = useState('');
  const chosen = options.some((o) => o.value === value) ? value : '';
  if (options.length === 0) return <p className="text-ink-soft">{emptyText}</p>;
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      onSubmit={(event) => {
        event.preventDefault();
        if (chosen) onFit(chosen);
      }}
    >
      <div className="flex min-w-48 flex-1 flex-col gap-1">
        <label htmlFor={id}>{label}</label>
        <select id={id} value={chosen} onChange={(e) => setValue(e.target.value)}>
          <option value="">Choose…</option>
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      </div>
      <button type="submit" className="btn" disabled={busy || !chosen}>
        {buttonLabel}
      </button>
    </form>
  );
}
