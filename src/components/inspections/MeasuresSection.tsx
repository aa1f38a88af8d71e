import { useId, useState } from 'react';
import { useController, useFormContext, useWatch } from 'react-hook-form';
import { judgeMeasuredRunout, showSheetVerdicts } from '../../lib/inspections/live-figures';
import { parseLengthText } from '../../lib/inspections/entry-text';
import type { SheetValues } from '../../lib/inspections/sheet-values';
import { formatLength, lengthToMm, type IndicatorResolutionId, type LengthUnit } from '../../lib/units';
import { EntryField, FieldError, SheetSection } from './fields';
import type { SheetContext } from './sheet-context';
import { VerdictList } from './VerdictList';

/** Ring-gear runout, the pinion depth shim stack and the carrier shims. */
export function MeasuresSection({
  context,
  disabled,
  shimRows,
  onShimRows,
}: {
  context: SheetContext;
  disabled: boolean;
  shimRows: string[];
  onShimRows: (rows: string[]) => void;
}) {
  const { control } = useFormContext<SheetValues>();
  const [unit, resolution, backFace, torqueUnit] = useWatch({
    control,
    name: ['unit', 'resolution', 'runout.backFace', 'torqueUnit'],
  });
  const format = (v: number) =>
    `${formatLength(lengthToMm(v, unit), unit, resolution as IndicatorResolutionId)} ${unit}`;
  const profile = context.profile;
  const basis = { unit, torqueUnit: torqueUnit ?? 'lbf-in', resolution };
  const judged =
    profile && typeof backFace === 'number' ? judgeMeasuredRunout(backFace, basis, profile.values) : undefined;
  const runoutVerdict = profile && judged ? showSheetVerdicts([judged], profile.values, basis) : [];

  return (
    <>
      <SheetSection id="runout" title="Ring-gear runout">
        <fieldset disabled={disabled} className="grid gap-4 md:grid-cols-2">
          <legend className="sr-only">Runout</legend>
          <EntryField
            name="runout.backFace"
            label="Back-face runout (TIR)"
            kind="indicator"
            unitLabel={unit}
            testId="runout-back-face"
            hint="Total indicated runout of the ring-gear back face over one turn."
          />
          <EntryField
            name="runout.radial"
            label="Radial runout (optional)"
            kind="indicator"
            unitLabel={unit}
            testId="runout-radial"
          />
        </fieldset>
        {profile && runoutVerdict.length > 0 && (
          <div className="mt-3" aria-live="polite">
            <VerdictList verdicts={runoutVerdict} format={format} profile={profile} />
          </div>
        )}
      </SheetSection>

      <SheetSection id="pinion" title="Pinion depth">
        <fieldset disabled={disabled} className="flex flex-col gap-4">
          <legend className="sr-only">Pinion depth shims</legend>
          <ShimStack rows={shimRows} onRows={onShimRows} unit={unit} resolution={resolution} format={format} />
          <div className="grid gap-4 md:grid-cols-2">
            <EntryField
              name="pinion.depthChange"
              label="Depth change since the previous set-up"
              kind="signed-length"
              unitLabel={unit}
              testId="depth-change"
              hint="Signed, toward the ring-gear centreline: + moves the pinion closer, − moves it away. Which way a shim moves it depends on where the shim sits."
            />
            <MarkingField />
          </div>
        </fieldset>
      </SheetSection>

      <SheetSection id="carrier" title="Carrier shims">
        <fieldset disabled={disabled} className="grid gap-4 md:grid-cols-2">
          <legend className="sr-only">Carrier shims (optional)</legend>
          <EntryField
            name="carrierShims.left"
            label="Left carrier shim (optional)"
            kind="length"
            unitLabel={unit}
            testId="carrier-left"
          />
          <EntryField
            name="carrierShims.right"
            label="Right carrier shim (optional)"
            kind="length"
            unitLabel={unit}
            testId="carrier-right"
          />
        </fieldset>
        <p className="mt-2 text-sm text-ink-soft">
          Moving 0.05 mm (0.002 in) of shim from one side to the other changes backlash by about 0.03 mm (0.001 in) (GM
          1996).
        </p>
      </SheetSection>
    </>
  );
}

function MarkingField() {
  const { register } = useFormContext<SheetValues>();
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id}>Pinion marking (optional)</label>
      <p className="text-sm text-ink-soft">As etched on the pinion, e.g. +2 or a depth code.</p>
      <input
        id={id}
        type="text"
        maxLength={20}
        autoComplete="off"
        {...register('pinion.marking')}
        data-enter-next
        data-testid="pinion-marking"
      />
    </div>
  );
}

/** The shim stack as rows; the form holds the thicknesses that read as numbers. */
function ShimStack({
  rows,
  onRows,
  unit,
  resolution,
  format,
}: {
  rows: string[];
  onRows: (rows: string[]) => void;
  unit: LengthUnit;
  resolution: string;
  format: (v: number) => string;
}) {
  const { control } = useFormContext<SheetValues>();
  const { field, fieldState } = useController({ control, name: 'pinion.shims' });
  const [focusLast, setFocusLast] = useState(false);
  const read = (text: string) => parseLengthText(text, unit, resolution, 'shim');
  const parsed = rows.map(read);
  const shims = field.value ?? [];
  const total = shims.reduce((a, b) => a + b, 0);

  const update = (next: string[]) => {
    onRows(next);
    field.onChange(next.map((t) => read(t).value).filter((v): v is number => v !== null));
  };

  return (
    <div>
      <h3 className="mb-1 font-bold">Shim stack</h3>
      {rows.length === 0 && <p className="mb-2 text-ink-soft">No shims recorded.</p>}
      <ol className="mb-2 flex flex-col gap-2">
        {rows.map((text, i) => {
          const id = `shim-${i}`;
          const error =
            parsed[i]?.error ??
            (fieldState.error as unknown as Record<number, { message?: string }> | undefined)?.[i]?.message;
          const note = parsed[i]?.note;
          return (
            <li key={i} className="flex flex-wrap items-end gap-2">
              <div className="flex flex-col gap-1">
                <label htmlFor={id}>Shim {i + 1} thickness</label>
                <div className="flex items-center gap-2">
                  <input
                    id={id}
                    type="text"
                    inputMode="decimal"
                    autoComplete="off"
                    className="max-w-[11rem] tabular-nums"
                    value={text}
                    // eslint-disable-next-line jsx-a11y/no-autofocus -- only the shim row just added by "Add a shim", so typing goes on in it
                    autoFocus={focusLast && i === rows.length - 1}
                    onChange={(e) => update(rows.map((r, j) => (j === i ? e.target.value : r)))}
                    aria-invalid={error ? 'true' : undefined}
                    aria-describedby={error ? `${id}-error` : undefined}
                    data-testid={id}
                    data-enter-next
                  />
                  <span className="font-semibold text-ink-soft">{unit}</span>
                </div>
              </div>
              <button
                type="button"
                className="btn btn-quiet"
                onClick={() => update(rows.filter((_, j) => j !== i))}
                aria-label={`Remove shim ${i + 1}`}
              >
                Remove
              </button>
              {note && !error && (
                <p className="w-full text-sm text-ink-soft" data-testid={`${id}-note`}>
                  {note}
                </p>
              )}
              <FieldError id={`${id}-error`} message={error} />
            </li>
          );
        })}
      </ol>
      <div className="flex flex-wrap items-center gap-4">
        <button
          type="button"
          className="btn btn-quiet"
          disabled={rows.length >= 12}
          onClick={() => {
            setFocusLast(true);
            update([...rows, '']);
          }}
        >
          Add a shim
        </button>
        <p aria-live="polite" data-testid="shim-total">
          Total: <strong className="tabular-nums">{shims.length ? format(total) : '—'}</strong> ({shims.length} shim
          {shims.length === 1 ? '' : 's'})
        </p>
      </div>
    </div>
  );
}
