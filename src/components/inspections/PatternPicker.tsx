import { useId, type KeyboardEvent, type PointerEvent } from 'react';

/**
 * Where the contact pattern sits on a ring-gear tooth, drawn here: toe (the end nearest the centre)
 * on the left, heel on the right; flank (root) at the bottom, face (top) at the top. Tap or click to
 * place it; arrow keys move it (Shift for fine steps); Delete clears it. The typed numbers beside it
 * do the same for anyone who prefers them.
 */
export interface PatternValue {
  along: number;
  up: number;
  length?: number;
}

export const PATTERN_STEP = 0.05;
export const PATTERN_FINE_STEP = 0.01;

const W = 320;
const H = 180;
const X0 = 24;
const X1 = W - 24;
const Y0 = H - 26; // flank
const Y1 = 30; // face

const clamp = (n: number) => Math.min(1, Math.max(0, Math.round(n * 100) / 100));

/**
 * Moves a pattern by one key press; returns null for a key that does not move it.
 * @example movePattern(null, 'ArrowRight', false) // { along: 0.5, up: 0.5 } (a first press places it in the middle)
 */
export function movePattern(value: PatternValue | null, key: string, fine: boolean): PatternValue | null | 'clear' {
  if (key === 'Delete' || key === 'Backspace') return 'clear';
  const moves: Record<string, [number, number]> = {
    ArrowLeft: [-1, 0],
    ArrowRight: [1, 0],
    ArrowUp: [0, 1],
    ArrowDown: [0, -1],
  };
  const move = moves[key];
  if (!move) return null;
  if (!value) return { along: 0.5, up: 0.5, length: 0.4 };
  const step = fine ? PATTERN_FINE_STEP : PATTERN_STEP;
  return { ...value, along: clamp(value.along + move[0] * step), up: clamp(value.up + move[1] * step) };
}

/** Words for a position, for the live region and the label. */
export function patternToWords(value: PatternValue | null): string {
  if (!value) return 'not placed';
  return `${Math.round(value.along * 100)} % from toe to heel, ${Math.round(value.up * 100)} % from flank to face`;
}

export function PatternPicker({
  side,
  value,
  onChange,
  disabled,
}: {
  side: 'drive' | 'coast';
  value: PatternValue | null;
  onChange: (value: PatternValue | null) => void;
  disabled?: boolean;
}) {
  const id = useId();
  const place = (event: PointerEvent<SVGSVGElement>) => {
    if (disabled) return;
    const box = event.currentTarget.getBoundingClientRect();
    const x = ((event.clientX - box.left) / box.width) * W;
    const y = ((event.clientY - box.top) / box.height) * H;
    onChange({ along: clamp((x - X0) / (X1 - X0)), up: clamp((Y0 - y) / (Y0 - Y1)), length: value?.length ?? 0.4 });
    event.currentTarget.focus();
  };
  const onKey = (event: KeyboardEvent<SVGSVGElement>) => {
    if (disabled) return;
    const next = movePattern(value, event.key, event.shiftKey);
    if (next === null) return;
    event.preventDefault();
    onChange(next === 'clear' ? null : next);
  };
  const cx = value ? X0 + value.along * (X1 - X0) : 0;
  const cy = value ? Y0 - value.up * (Y0 - Y1) : 0;
  const rx = ((value?.length ?? 0.4) * (X1 - X0)) / 2;
  const label = `${side === 'drive' ? 'Drive' : 'Coast'}-side pattern on the tooth`;
  return (
    <div>
      <svg
        viewBox={`0 0 ${W} ${H}`}
        className="w-full max-w-[26rem] cursor-crosshair touch-none rounded-md border-2 border-ink-soft bg-panel focus-visible:outline-[3px] focus-visible:outline-amber"
        role="application"
        aria-roledescription="pattern picker"
        aria-label={`${label}: ${patternToWords(value)}. Arrow keys move it, Shift for small steps, Delete clears.`}
        aria-describedby={`${id}-words`}
        tabIndex={disabled ? -1 : 0}
        onPointerDown={place}
        onKeyDown={onKey}
        data-testid={`pattern-${side}`}
      >
        {/* A bevel tooth: narrower at the toe. */}
        <path
          d={`M${X0} ${Y1 + 18} L${X1} ${Y1} L${X1} ${Y0} L${X0} ${Y0 - 14} Z`}
          fill="#f4f1ea"
          stroke="#3d444d"
          strokeWidth="2"
        />
        <rect
          x={X0 + 0.3 * (X1 - X0)}
          y={Y0 - 0.7 * (Y0 - Y1)}
          width={0.4 * (X1 - X0)}
          height={0.4 * (Y0 - Y1)}
          fill="none"
          stroke="#0d4a5c"
          strokeWidth="1.5"
          strokeDasharray="5 4"
        />
        <text x={X0} y={H - 6} fontSize="13" fontWeight="700" fill="#15181c">
          TOE
        </text>
        <text x={X1} y={H - 6} fontSize="13" fontWeight="700" fill="#15181c" textAnchor="end">
          HEEL
        </text>
        <text x={W / 2} y={18} fontSize="13" fontWeight="700" fill="#15181c" textAnchor="middle">
          FACE (top)
        </text>
        <text x={W / 2} y={H - 6} fontSize="13" fontWeight="700" fill="#15181c" textAnchor="middle">
          FLANK (root)
        </text>
        {value && (
          <g data-testid={`pattern-${side}-mark`}>
            <ellipse
              cx={cx}
              cy={cy}
              rx={rx}
              ry={0.16 * (Y0 - Y1)}
              fill="#0d4a5c"
              fillOpacity="0.35"
              stroke="#0d4a5c"
              strokeWidth="2.5"
            />
            <path d={`M${cx - 7} ${cy} H${cx + 7} M${cx} ${cy - 7} V${cy + 7}`} stroke="#15181c" strokeWidth="2.5" />
          </g>
        )}
      </svg>
      <p id={`${id}-words`} className="mt-1 text-sm" aria-live="polite" data-testid={`pattern-${side}-words`}>
        {value
          ? `Placed ${patternToWords(value)}.`
          : 'Not placed yet: tap the tooth where the pattern sits, or focus it and press an arrow key.'}{' '}
        Dashed box: the usual central region.
      </p>
    </div>
  );
}
