import type { KeyboardEvent } from 'react';
import { boltPosition, sequenceToPlaces } from '../../lib/procedures/diagram';

interface Props {
  stepNumber: string;
  sequence: readonly number[];
  tapped: readonly number[];
  disabled: boolean;
  onTap: (bolt: number) => void;
}

/** Room per bolt round the circle, so each 48 px target stays clear of its neighbours for a gloved finger. */
const TARGET = 52;
const BOLT_RADIUS = 24;

/**
 * The bolt circle drawn in SVG (positions are attributes, so the page's style policy never hides
 * them), each bolt a 48 px button at its clockwise position labelled with its place in the order.
 * Tightened bolts are filled; the next one in the order has a thick ring and the word "next", so
 * nothing rests on colour alone. A bolt tapped out of order is allowed and kept as tapped.
 */
export function BoltCircle({ stepNumber, sequence, tapped, disabled, onTap }: Props) {
  const count = sequence.length;
  const places = sequenceToPlaces(sequence);
  const radius = Math.max(110, (count * TARGET) / (2 * Math.PI));
  const size = Math.ceil(2 * (radius + TARGET));
  const c = size / 2;
  const next = sequence.find((bolt) => !tapped.includes(bolt));
  const press = (bolt: number, done: boolean) => {
    if (!disabled && !done) onTap(bolt);
  };
  return (
    <svg
      width={size}
      height={size}
      viewBox={`0 0 ${size} ${size}`}
      className="mx-auto block h-auto max-w-full"
      role="group"
      aria-label={`Bolts of step ${stepNumber}, bolt 1 at the top, clockwise`}
    >
      <circle cx={c} cy={c} r={radius} fill="none" stroke="currentColor" strokeDasharray="4 6" />
      {places.map((place, i) => {
        const bolt = i + 1;
        const { x, y } = boltPosition(bolt, count, radius, c, c);
        const done = tapped.includes(bolt);
        const isNext = bolt === next;
        return (
          <g
            key={bolt}
            role="button"
            tabIndex={disabled || done ? -1 : 0}
            aria-disabled={disabled || done}
            aria-label={`Bolt ${bolt}, number ${place} in the order${done ? ', tightened' : isNext ? ', next' : ''}`}
            data-testid={`bolt-${bolt}`}
            data-next={isNext ? 'true' : undefined}
            data-tightened={done ? 'true' : undefined}
            className={disabled || done ? '' : 'cursor-pointer'}
            onClick={() => press(bolt, done)}
            onKeyDown={(event: KeyboardEvent) => {
              if (event.key === 'Enter' || event.key === ' ') {
                event.preventDefault();
                press(bolt, done);
              }
            }}
          >
            <circle
              cx={x}
              cy={y}
              r={BOLT_RADIUS}
              className={done ? 'fill-ink' : 'fill-panel'}
              stroke={isNext ? 'var(--color-petrol)' : 'var(--color-ink-soft)'}
              strokeWidth={isNext ? 6 : 2}
            />
            <text
              x={x}
              y={isNext ? y - 3 : y}
              textAnchor="middle"
              dominantBaseline="central"
              fontSize="18"
              fontWeight="700"
              className={done ? 'fill-white' : 'fill-ink'}
            >
              {place}
            </text>
            {isNext && (
              <text x={x} y={y + 13} textAnchor="middle" dominantBaseline="central" fontSize="10" className="fill-ink">
                next
              </text>
            )}
          </g>
        );
      })}
    </svg>
  );
}
