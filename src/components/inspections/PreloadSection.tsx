import { useController, useFormContext, useWatch } from 'react-hook-form';
import { judgePreload, showSheetVerdicts } from '../../lib/inspections/live-figures';
import { torqueBandToText } from '../../lib/analysis/published-limits';
import { publishedLimitsOf } from '../../lib/analysis/tolerance';
import type { SheetValues } from '../../lib/inspections/sheet-values';
import { bandToSourceText, formatTorque } from '../../lib/inspections/verdict-text';
import { torqueUnitToLabel } from '../../lib/units';
import { EntryField, SheetSection } from './fields';
import type { SheetContext } from './sheet-context';
import { VerdictList } from './VerdictList';

/** Bearing preload: the pinion turning torque against its band, and the hub check on each side. */
export function PreloadSection({ context, disabled }: { context: SheetContext; disabled: boolean }) {
  const { control, register } = useFormContext<SheetValues>();
  const [torqueUnit, bearings, pinionTorque, lengthUnit, resolution] = useWatch({
    control,
    name: ['torqueUnit', 'preload.bearings', 'preload.pinionTorque', 'unit', 'resolution'],
  });
  const unit = torqueUnit ?? 'lbf-in';
  const kind = bearings ?? 'used';
  const profile = context.profile;
  const field = kind === 'new' ? 'pinionPreloadNew' : 'pinionPreloadUsed';
  const band = profile ? torqueBandToText(publishedLimitsOf(profile.values)[field], unit) : null;
  const basis = { unit: lengthUnit, torqueUnit: unit, resolution };
  const judged =
    profile && typeof pinionTorque === 'number' ? judgePreload(pinionTorque, kind, basis, profile.values) : undefined;
  const verdicts = profile && judged ? showSheetVerdicts([judged], profile.values, basis) : [];

  return (
    <SheetSection id="preload" title="Bearing preload">
      <fieldset disabled={disabled} className="grid gap-4 md:grid-cols-2">
        <legend className="sr-only">Pinion bearing preload</legend>
        <fieldset className="flex flex-col gap-1">
          <legend className="font-semibold">Pinion bearings</legend>
          <div className="flex gap-2">
            {(['new', 'used'] as const).map((b) => (
              <label key={b} className="choice">
                <input type="radio" value={b} {...register('preload.bearings')} className="sr-only" data-enter-next />
                {b === 'new' ? 'New' : 'Used'}
              </label>
            ))}
          </div>
          {band && profile && (
            <p className="text-sm" data-testid="preload-band">
              Band for {kind} bearings: <strong>{band}</strong>.{' '}
              {bandToSourceText(profile.values, field, profile.sources, profile.name)}.
            </p>
          )}
        </fieldset>
        <EntryField
          name="preload.pinionTorque"
          label="Pinion turning torque"
          kind="decimal"
          unitLabel={torqueUnitToLabel(unit)}
          testId="pinion-torque"
          hint="Turning the pinion with an inch-pound dial wrench, seal in or out as the team’s procedure says."
        />
      </fieldset>
      {profile && verdicts.length > 0 && (
        <div className="mt-3" aria-live="polite">
          <VerdictList verdicts={verdicts} format={(v) => formatTorque(v, unit)} profile={profile} />
        </div>
      )}
      <h3 className="mt-5 mb-1 font-bold">Hub check (solid spacer)</h3>
      <p className="mb-3 text-sm text-ink-soft">
        Tighten the hub nut the rest of the way to the hub maker’s torque, by the hub maker’s procedure, and compare the
        hub’s turning effort before and after. With a spacer of the right length it stays as it was; an effort that
        rises points to a spacer that is short (common practice). The figures and the procedure are the hub maker’s.
      </p>
      <fieldset disabled={disabled} className="grid gap-4 md:grid-cols-2">
        <legend className="sr-only">Hub check on each side</legend>
        <HubCheck side="Left" name="preload.hubLeft" unitLabel={torqueUnitToLabel(unit)} />
        <HubCheck side="Right" name="preload.hubRight" unitLabel={torqueUnitToLabel(unit)} />
      </fieldset>
    </SheetSection>
  );
}

function HubCheck({
  side,
  name,
  unitLabel,
}: {
  side: string;
  name: 'preload.hubLeft' | 'preload.hubRight';
  unitLabel: string;
}) {
  const { control } = useFormContext<SheetValues>();
  const { field } = useController({ control, name: `${name}.unchanged` });
  const options: [boolean | null, string][] = [
    [true, 'Unchanged'],
    [false, 'Changed'],
    [null, 'Not checked'],
  ];
  return (
    <div className="flex flex-col gap-3 rounded-md border border-rule p-3">
      <fieldset className="flex flex-col gap-1">
        <legend className="font-semibold">{side} hub: effort unchanged?</legend>
        <div className="flex flex-wrap gap-2">
          {options.map(([value, label]) => (
            <label key={label} className="choice">
              <input
                type="radio"
                name={`${name}.unchanged`}
                className="sr-only"
                checked={field.value === value}
                onChange={() => field.onChange(value)}
                data-enter-next
              />
              {label}
            </label>
          ))}
        </div>
      </fieldset>
      <EntryField
        name={`${name}.torque`}
        label={`${side} hub turning torque, if measured`}
        kind="decimal"
        unitLabel={unitLabel}
        empty={undefined}
        testId={`hub-${side.toLowerCase()}-torque`}
      />
    </div>
  );
}
