import { useId } from 'react';
import { useController, useFormContext, useWatch } from 'react-hook-form';
import { describePattern, type CutMethod } from '../../lib/analysis/contact-pattern';
import type { SheetValues } from '../../lib/inspections/sheet-values';
import { FieldError, SheetSection } from './fields';
import { PatternPicker } from './PatternPicker';

const PLACE_WORDS: Record<string, string> = {
  centred: 'In the usual central region',
  heel: 'Toward the heel',
  toe: 'Toward the toe',
  face: 'Toward the face',
  flank: 'Toward the flank',
  'heel-face': 'Toward the heel and the face',
  'heel-flank': 'Toward the heel and the flank',
  'toe-face': 'Toward the toe and the face',
  'toe-flank': 'Toward the toe and the flank',
};

const CUT_WORDS: Record<CutMethod, string> = {
  'face-milled': 'This set is face-milled.',
  'face-hobbed': 'This set is face-hobbed: follow the gear maker’s pattern chart for it.',
  unknown: 'How this set was cut is not recorded: the guidance reads it as face-milled.',
};

/** The drive and coast contact patterns, each with the usual correction as guidance. */
export function PatternSection({ disabled, cutMethod }: { disabled: boolean; cutMethod: CutMethod }) {
  return (
    <SheetSection id="patterns" title="Contact pattern">
      <p className="notice notice-caution mb-4 text-sm" role="note">
        Keep hands clear of the gear mesh when turning the gears for a pattern check.
      </p>
      <p className="mb-4 text-sm text-ink-soft">
        Drive side: the convex side of the ring-gear tooth; coast side: the concave side. Check the pattern under load
        (about 54–68 N·m / 40–50 lbf·ft of pinion turning resistance, GM 9-1/2 in manual).
      </p>
      <p className="mb-4 text-sm text-ink-soft" data-testid="pattern-cut-method">
        {CUT_WORDS[cutMethod]} Depth corrections are read from the drive side; the coast side is a cross-check.
      </p>
      <div className="grid gap-6 lg:grid-cols-2">
        <PatternSide side="drive" disabled={disabled} cutMethod={cutMethod} />
        <PatternSide side="coast" disabled={disabled} cutMethod={cutMethod} />
      </div>
    </SheetSection>
  );
}

function PatternSide({
  side,
  disabled,
  cutMethod,
}: {
  side: 'drive' | 'coast';
  disabled: boolean;
  cutMethod: CutMethod;
}) {
  const { control } = useFormContext<SheetValues>();
  const { field, fieldState } = useController({ control, name: `patterns.${side}` });
  // The coast pattern is cross-checked against the drive pattern, never given the drive rule.
  const drive = useWatch({ control, name: 'patterns.drive' }) ?? null;
  const value = field.value ?? null;
  const id = useId();
  const guidance = value
    ? describePattern(
        { side, alongTooth: value.along, upTooth: value.up },
        { cutMethod, drive: drive ? { alongTooth: drive.along, upTooth: drive.up } : null },
      )
    : null;
  const title = side === 'drive' ? 'Drive side' : 'Coast side';
  const setPart = (key: 'along' | 'up' | 'length', text: string) => {
    const n = Number(text);
    if (text.trim() === '' || !Number.isFinite(n)) return;
    const share = Math.min(1, Math.max(0, n / 100));
    field.onChange({ along: 0.5, up: 0.5, length: 0.4, ...value, [key]: share });
  };
  const percent = (share: number | undefined) => (share === undefined ? '' : String(Math.round(share * 100)));

  return (
    <fieldset disabled={disabled} className="flex flex-col gap-3" ref={field.ref as never}>
      <legend className="text-lg font-bold">{title}</legend>
      <PatternPicker side={side} value={value} onChange={(v) => field.onChange(v)} disabled={disabled} />
      <div className="grid grid-cols-2 gap-3 sm:grid-cols-3">
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-along`}>Toe → heel, %</label>
          <input
            id={`${id}-along`}
            type="number"
            inputMode="numeric"
            min={0}
            max={100}
            step={1}
            value={percent(value?.along)}
            onChange={(e) => setPart('along', e.target.value)}
            data-enter-next
            data-testid={`pattern-${side}-along`}
          />
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-up`}>Flank → face, %</label>
          <input
            id={`${id}-up`}
            type="number"
            inputMode="numeric"
            min={0}
            max={100}
            step={1}
            value={percent(value?.up)}
            onChange={(e) => setPart('up', e.target.value)}
            data-enter-next
            data-testid={`pattern-${side}-up`}
          />
        </div>
        <div className="col-span-2 flex flex-col gap-1 sm:col-span-1">
          <label htmlFor={`${id}-length`}>
            Length: {value ? `${percent(value.length ?? 0.4)} % of the tooth` : '—'}
          </label>
          <input
            id={`${id}-length`}
            type="range"
            min={5}
            max={100}
            step={5}
            value={percent(value?.length ?? 0.4)}
            onChange={(e) => setPart('length', e.target.value)}
            disabled={disabled || !value}
            className="!min-h-11 !border-0 !p-0 accent-petrol"
            data-testid={`pattern-${side}-length`}
          />
        </div>
      </div>
      {value && (
        <button type="button" className="btn btn-quiet self-start" onClick={() => field.onChange(null)}>
          Clear the {side} pattern
        </button>
      )}
      <FieldError id={`${id}-error`} message={fieldState.error?.message} />
      {guidance && (
        <div className="notice text-sm" data-testid={`pattern-${side}-guidance`}>
          <p className="font-bold">{PLACE_WORDS[guidance.code] ?? guidance.code}</p>
          <p>{guidance.guidance}</p>
          <p className="mt-1 text-ink-soft">
            Guidance only: the axle maker’s procedure and the team’s own figures govern.
          </p>
        </div>
      )}
    </fieldset>
  );
}
