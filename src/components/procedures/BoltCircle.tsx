import { boltPosition, sequenceToPlaces } from '../../lib/procedures/diagram';

interface Props {
  stepNumber: string;
  sequence: readonly number[];
  tapped: readonly number[];
  disabled: boolean;
  onTap: (bolt: number) => void;
}

/** Room per bolt round the circle, so each target stays at least 48 px and apart for a gloved finger. */
const TARGET = 52;

/**
 * The bolt circle as big buttons at their clockwise positions, each labelled with its place in the
 * order. Tightened bolts are filled and ticked; the next one in the order has a thick ring and the word
 * "next", so nothing rests on colour alone. Tapping a bolt out of order is allowed and kept as tapped.
 */
export function BoltCircle({ stepNumber, sequence, tapped, disabled, onTap }: Props) {
  const count = sequence.length;
  const places = sequenceToPlaces(sequence);
  const radius = Math.max(110, (count * TARGET) / (2 * Math.PI));
  const size = 2 * (radius + TARGET);
  const next = sequence.find((bolt) => !tapped.includes(bolt));
  return (
    <div
      className="relative mx-auto"
      style={{ width: size, height: size }}
      role="group"
      aria-label={`Bolts of step ${stepNumber}, bolt 1 at the top, clockwise`}
    >
      <svg width={size} height={size} className="absolute inset-0" aria-hidden="true">
        <circle cx={size / 2} cy={size / 2} r={radius} fill="none" stroke="currentColor" strokeDasharray="4 6" />
      </svg>
      {places.map((place, i) => {
        const bolt = i + 1;
        const { x, y } = boltPosition(bolt, count, radius, size / 2, size / 2);
        const done = tapped.includes(bolt);
        const isNext = bolt === next;
        return (
          <button
            key={bolt}
            type="button"
            disabled={disabled || done}
            onClick={() => onTap(bolt)}
            data-testid={`bolt-${bolt}`}
            data-next={isNext ? 'true' : undefined}
            data-tightened={done ? 'true' : undefined}
            aria-label={`Bolt ${bolt}, number ${place} in the order${done ? ', tightened' : isNext ? ', next' : ''}`}
            className={`absolute flex h-12 w-12 -translate-x-1/2 -translate-y-1/2 flex-col items-center justify-center rounded-full text-lg font-bold ${
              done ? 'bg-ink text-white' : 'bg-panel text-ink'
            } ${isNext ? 'border-[5px] border-petrol' : 'border-2 border-ink-soft'}`}
            style={{ left: x, top: y }}
          >
            {place}
            {isNext && <span className="text-[10px] leading-none">next</span>}
          </button>
        );
      })}
    </div>
  );
}
