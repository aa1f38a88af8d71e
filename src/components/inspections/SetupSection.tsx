import { useId, useState } from 'react';
import { useFormContext, useWatch } from 'react-hook-form';
import { gearSetOptionLabel, pickableGearSets } from '../../lib/inspections/gear-set-picker';
import { needsRunsReason, type SheetValues } from '../../lib/inspections/sheet-values';
import { INDICATOR_RESOLUTIONS } from '../../lib/units';
import { EntryField, FieldError, SelectField, SheetSection } from './fields';
import type { SheetContext, SheetProps } from './sheet-context';
import { WhenField } from './WhenField';

interface SetupProps {
  props: SheetProps;
  context: SheetContext;
  countedRuns: number | null;
  gearSetLocked: boolean;
  disabled: boolean;
}

/** Which set, where, when, by whom, and how the readings are typed. */
export function SetupSection({ props, context, countedRuns, gearSetLocked, disabled }: SetupProps) {
  const { control, register, formState, getFieldState } = useFormContext<SheetValues>();
  const [runs] = useWatch({ control, name: ['runsAtInspection'] });
  const reasonId = useId();
  const set = context.gearSet;
  const [query, setQuery] = useState('');
  const searchId = useId();
  const chosenId = useWatch({ control, name: 'gearSetId' }) || null;
  const offered = pickableGearSets(props.gearSets, query, chosenId);
  const showReason = needsRunsReason(runs, countedRuns);
  const reasonError = getFieldState('runsChangeReason', formState).error?.message;
  const choice = (name: 'unit' | 'torqueUnit', value: string, label: string) => (
    <label className="choice">
      <input type="radio" value={value} {...register(name)} className="sr-only" data-enter-next />
      {label}
    </label>
  );

  return (
    <SheetSection id="setup" title="Set-up">
      <fieldset disabled={disabled} className="grid gap-4 md:grid-cols-2">
        <legend className="sr-only">Which gear set, when and how</legend>
        <div className="flex flex-col gap-2">
          {!gearSetLocked && props.gearSets.length > 8 && (
            <div className="flex flex-col gap-1">
              <label htmlFor={searchId}>Find a gear set by serial</label>
              <input
                id={searchId}
                type="search"
                value={query}
                onChange={(e) => setQuery(e.target.value)}
                autoComplete="off"
                aria-describedby={`${searchId}-count`}
                data-testid="gear-set-search"
              />
              <p id={`${searchId}-count`} className="text-sm text-ink-soft" aria-live="polite">
                {`${offered.length} of ${props.gearSets.length} sets`}
              </p>
            </div>
          )}
          <SelectField
            name="gearSetId"
            label="Gear set"
            disabled={gearSetLocked}
            hint={gearSetLocked ? 'Fixed once the draft is on Lashline.' : 'Retired and scrapped sets are not offered.'}
            options={[
              { value: '', label: 'Choose a gear set…' },
              ...offered.map((g) => ({ value: g.id, label: gearSetOptionLabel(g) })),
            ]}
          />
        </div>
        <SelectField
          name="assemblyId"
          label="Rear-end assembly"
          nullable
          hint={set?.location ? `The set is in ${set.location.label}.` : 'The set is not in an assembly now.'}
          options={[
            { value: '', label: 'Not in an assembly' },
            ...props.assemblies.map((a) => ({ value: a.id, label: `${a.serial} ${a.name}` })),
          ]}
        />
        <WhenField />
        <EntryField
          name="runsAtInspection"
          label="Runs at inspection"
          kind="whole"
          testId="runs"
          hint={
            props.mode === 'edit'
              ? `Recorded as ${countedRuns ?? '—'}; a different figure needs a reason.`
              : countedRuns === null
                ? 'Lashline will count the set’s runs once it has the set and a connection.'
                : `Lashline counts ${countedRuns} run${countedRuns === 1 ? '' : 's'} on this set up to this time${set ? ` (${set.runsSinceInstall} since its install)` : ''}.`
          }
        />
        {showReason && (
          <div className="flex flex-col gap-1 md:col-span-2">
            <label htmlFor={reasonId}>
              {props.mode === 'edit'
                ? `Why does the runs figure change from the recorded ${countedRuns}?`
                : `Why does the runs figure differ from Lashline’s count of ${countedRuns}?`}
            </label>
            <textarea
              id={reasonId}
              rows={2}
              {...register('runsChangeReason')}
              aria-invalid={reasonError ? 'true' : undefined}
              aria-describedby={reasonError ? `${reasonId}-error` : undefined}
            />
            <FieldError id={`${reasonId}-error`} message={reasonError} />
          </div>
        )}
        <SelectField
          name="technicianId"
          label="Technician"
          nullable
          options={props.members.map((m) => ({
            value: m.id,
            label: m.id === props.user.id ? `${m.name} (you)` : m.name,
          }))}
        />
        <SelectField
          name="resolution"
          label="Indicator resolution"
          options={INDICATOR_RESOLUTIONS.map((r) => ({ value: r.id, label: `${r.label} per graduation` }))}
          hint="Figures never show more digits than this."
        />
        <fieldset className="flex flex-col gap-1">
          <legend className="font-semibold">Entry unit for lengths</legend>
          <div className="flex gap-2">
            {choice('unit', 'in', 'Inches (in)')}
            {choice('unit', 'mm', 'Millimetres (mm)')}
          </div>
        </fieldset>
        <fieldset className="flex flex-col gap-1">
          <legend className="font-semibold">Torque unit</legend>
          <div className="flex gap-2">
            {choice('torqueUnit', 'lbf-in', 'lbf·in')}
            {choice('torqueUnit', 'N-m', 'N·m')}
          </div>
        </fieldset>
      </fieldset>
    </SheetSection>
  );
}
