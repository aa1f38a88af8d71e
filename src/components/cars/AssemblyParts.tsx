import type { PartView } from '../../lib/register/views';
import { PART_KIND_LABELS } from '../../lib/register/kinds';
import { lifeStateOf, runsLeftToText } from '../../lib/register/part-life';
import { ConfirmAction } from '../shared/ConfirmAction';
import { LifeMark, StatusMark } from '../shared/StatusMark';

interface Props {
  placeName: string;
  parts: PartView[];
  dueWithin: number;
  canInstall: boolean;
  busy: boolean;
  onRemove: (part: PartView) => Promise<void>;
}

/** The parts in one assembly (or straight in a car), with their counts and a remove for each. */
export function AssemblyParts({ placeName, parts, dueWithin, canInstall, busy, onRemove }: Props) {
  if (parts.length === 0) return <p className="text-ink-soft">No parts recorded in {placeName}.</p>;
  return (
    <ul className="flex flex-col divide-y divide-rule border-y border-rule">
      {parts.map((part) => (
        <li
          key={part.id}
          className="flex flex-wrap items-center gap-x-4 gap-y-2 py-2"
          data-testid="installed-part"
          data-serial={part.serial}
        >
          <div className="min-w-40 flex-1">
            <a href={`/parts/${encodeURIComponent(part.id)}`} className="tap-link text-lg font-bold">
              {part.serial}
            </a>{' '}
            <span className="text-ink-soft">
              {PART_KIND_LABELS[part.kind]}
              {part.ratioLabel ? ` ${part.ratioLabel}` : ''}
            </span>
            <div>
              <StatusMark status={part.status} />
            </div>
          </div>
          <dl className="grid w-full grid-cols-3 gap-x-2 text-center sm:w-72">
            <div>
              <dt className="text-sm text-ink-soft">Since install</dt>
              <dd className="text-lg font-bold tabular-nums" data-testid="since-install">
                {part.runsSinceInstall}
              </dd>
            </div>
            <div>
              <dt className="text-sm text-ink-soft">Total</dt>
              <dd className="text-lg font-bold tabular-nums" data-testid="total-runs">
                {part.totalRuns}
              </dd>
            </div>
            <div>
              <dt className="text-sm text-ink-soft">Left</dt>
              <dd className="text-lg font-bold tabular-nums">{runsLeftToText(part.runsLeft)}</dd>
              <dd>
                <LifeMark state={lifeStateOf(part.runsLeft, dueWithin)} />
              </dd>
            </div>
          </dl>
          {canInstall && (
            <ConfirmAction
              label="Take out"
              ariaLabel={`Take ${part.serial} out of ${placeName}`}
              question={`Take ${part.serial} out of ${placeName}? It stops counting runs from now; its history stays.`}
              confirmLabel="Yes, take it out"
              busy={busy}
              onConfirm={() => onRemove(part)}
            />
          )}
        </li>
      ))}
    </ul>
  );
}
