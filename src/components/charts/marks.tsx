import type { RecommendedAction, Verdict } from '../../lib/analysis';
import { ACTION_TEXT, VERDICT_WORDS } from '../../lib/charts/action-text';

/**
 * A verdict or an action as a word with a shape — check, triangle, cross; for actions a filled circle
 * (keep), an open triangle (watch), a diamond (re-shim), a cross (retire). Static: renders the same on
 * the server (.astro pages, no JavaScript) and inside islands.
 */
const box = {
  width: 16,
  height: 16,
  viewBox: '0 0 16 16',
  'aria-hidden': true,
  focusable: false,
  className: 'shrink-0',
} as const;

function VerdictShape({ verdict }: { verdict: Verdict }) {
  if (verdict === 'in-band')
    return (
      <svg {...box}>
        <path d="M2.5 8.5 L6.5 12.5 L13.5 3.5" fill="none" stroke="currentColor" strokeWidth="2.6" />
      </svg>
    );
  if (verdict === 'near-limit')
    return (
      <svg {...box}>
        <path d="M8 1.5 L15 14.5 H1 Z" fill="currentColor" />
      </svg>
    );
  return (
    <svg {...box}>
      <path d="M2.5 2.5 L13.5 13.5 M13.5 2.5 L2.5 13.5" stroke="currentColor" strokeWidth="3" />
    </svg>
  );
}

export function VerdictMark({ verdict, testId }: { verdict: Verdict | null; testId?: string }) {
  if (verdict === null)
    return (
      <span className="text-ink-soft" data-testid={testId}>
        not judged
      </span>
    );
  const text = VERDICT_WORDS[verdict];
  return (
    <span
      className={`inline-flex items-center gap-1.5 font-semibold ${text.tone}`}
      data-verdict={verdict}
      data-testid={testId}
    >
      <VerdictShape verdict={verdict} />
      <span className="text-ink">{text.word}</span>
    </span>
  );
}

function ActionShape({ action }: { action: RecommendedAction }) {
  switch (action) {
    case 'keep':
      return (
        <svg {...box}>
          <circle cx="8" cy="8" r="6.5" fill="currentColor" />
        </svg>
      );
    case 'watch':
      return (
        <svg {...box}>
          <path d="M8 2 L14.5 14 H1.5 Z" fill="none" stroke="currentColor" strokeWidth="2.2" />
        </svg>
      );
    case 're-shim':
      return (
        <svg {...box}>
          <path d="M8 1 L15 8 L8 15 L1 8 Z" fill="currentColor" />
        </svg>
      );
    case 'retire':
      return (
        <svg {...box}>
          <path d="M2.5 2.5 L13.5 13.5 M13.5 2.5 L2.5 13.5" stroke="currentColor" strokeWidth="3.2" />
        </svg>
      );
  }
}

export function ActionMark({
  action,
  withHint = false,
  testId,
}: {
  action: RecommendedAction | null;
  withHint?: boolean;
  testId?: string;
}) {
  if (action === null)
    return (
      <span className="text-ink-soft" data-testid={testId}>
        no inspection yet
      </span>
    );
  const text = ACTION_TEXT[action];
  return (
    <span
      className={`inline-flex items-center gap-1.5 font-bold ${text.tone}`}
      data-action={action}
      data-testid={testId}
    >
      <ActionShape action={action} />
      <span className="text-ink">
        {text.word}
        {withHint && <span className="font-normal text-ink-soft"> — {text.hint}</span>}
      </span>
    </span>
  );
}
