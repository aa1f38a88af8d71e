import { useEffect, useId, useRef, useState } from 'react';

interface Props {
  /** The button that starts it, e.g. "Remove". */
  label: string;
  /** Accessible name of the starting button when the label alone is ambiguous. */
  ariaLabel?: string;
  question: string;
  confirmLabel: string;
  onConfirm: () => Promise<void> | void;
  busy?: boolean;
}

/**
 * A two-step action for anything that changes counts or removes a record: the first tap asks, the
 * second does it. Inline rather than a modal, so it stays next to the thing it acts on.
 */
export function ConfirmAction({ label, ariaLabel, question, confirmLabel, onConfirm, busy = false }: Props) {
  const [asking, setAsking] = useState(false);
  const questionId = useId();
  const keepRef = useRef<HTMLButtonElement>(null);
  const startRef = useRef<HTMLButtonElement>(null);
  const wasAsking = useRef(false);
  useEffect(() => {
    if (asking) keepRef.current?.focus();
    else if (wasAsking.current) startRef.current?.focus();
    wasAsking.current = asking;
  }, [asking]);

  if (!asking) {
    return (
      <button
        ref={startRef}
        type="button"
        className="btn btn-danger"
        aria-label={ariaLabel}
        onClick={() => setAsking(true)}
        disabled={busy}
      >
        {label}
      </button>
    );
  }
  return (
    <div
      role="group"
      aria-labelledby={questionId}
      className="flex flex-wrap items-center gap-2 rounded-md border-2 border-alarm bg-alarm-wash p-2"
    >
      <p id={questionId} className="font-semibold">
        {question}
      </p>
      <button
        type="button"
        className="btn btn-danger !bg-panel"
        disabled={busy}
        onClick={async () => {
          await onConfirm();
          setAsking(false);
        }}
      >
        {busy ? 'Working…' : confirmLabel}
      </button>
      <button ref={keepRef} type="button" className="btn btn-quiet" onClick={() => setAsking(false)} disabled={busy}>
        Keep it
      </button>
    </div>
  );
}
