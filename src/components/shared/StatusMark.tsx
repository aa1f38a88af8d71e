import { PART_STATUS_LABELS, type PartStatus } from '../../lib/register/kinds';
import { LIFE_STATE_LABELS, type LifeState } from '../../lib/register/part-life';

/**
 * A part's status as a word with a small shape: hollow circle spare, filled circle in service,
 * triangle under review, square retired, cross scrapped. Rendered by islands and, without
 * hydration, by .astro pages.
 */
const STATUS_TONE: Record<PartStatus, string> = {
  spare: 'text-petrol',
  'in-service': 'text-steady',
  'under-review': 'text-amber',
  retired: 'text-ink-soft',
  scrapped: 'text-alarm',
};

function Shape({ status }: { status: PartStatus }) {
  const common = {
    width: 14,
    height: 14,
    viewBox: '0 0 14 14',
    'aria-hidden': true,
    focusable: false,
    className: 'shrink-0',
  } as const;
  switch (status) {
    case 'spare':
      return (
        <svg {...common}>
          <circle cx="7" cy="7" r="5" fill="none" stroke="currentColor" strokeWidth="2.2" />
        </svg>
      );
    case 'in-service':
      return (
        <svg {...common}>
          <circle cx="7" cy="7" r="6" fill="currentColor" />
        </svg>
      );
    case 'under-review':
      return (
        <svg {...common}>
          <path d="M7 1 L13 13 H1 Z" fill="currentColor" />
        </svg>
      );
    case 'retired':
      return (
        <svg {...common}>
          <rect x="1.5" y="1.5" width="11" height="11" fill="currentColor" />
        </svg>
      );
    case 'scrapped':
      return (
        <svg {...common}>
          <path d="M2 2 L12 12 M12 2 L2 12" stroke="currentColor" strokeWidth="2.6" />
        </svg>
      );
  }
}

export function StatusMark({ status }: { status: PartStatus }) {
  return (
    <span className={`inline-flex items-center gap-1.5 font-semibold ${STATUS_TONE[status]}`} data-status={status}>
      <Shape status={status} />
      <span className="text-ink">{PART_STATUS_LABELS[status]}</span>
    </span>
  );
}

/**
 * The life state beside runs left; nothing for a part within its life. Past the limit the number
 * already says "N over", so the mark then only adds its shape.
 */
export function LifeMark({ state }: { state: LifeState }) {
  if (state === 'ok' || state === 'no-limit') return null;
  const tone = state === 'over' ? 'text-alarm' : 'text-amber';
  const word = state === 'over' ? 'limit passed' : LIFE_STATE_LABELS[state];
  return (
    <span className={`inline-flex items-center gap-1 text-sm font-semibold whitespace-nowrap ${tone}`}>
      <svg width="12" height="12" viewBox="0 0 14 14" aria-hidden="true" focusable="false">
        {state === 'due' ? (
          <path d="M7 1.5 L12.5 12.5 H1.5 Z" fill="none" stroke="currentColor" strokeWidth="2" />
        ) : (
          <path d="M7 1 L13 13 H1 Z" fill="currentColor" />
        )}
      </svg>
      <span className="text-ink">{word}</span>
    </span>
  );
}
