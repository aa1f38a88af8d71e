import { useId } from 'react';
import { useController, useFormContext } from 'react-hook-form';
import { CONDITION_AREAS, SEVERITIES, TOOTH_FINDINGS, type Severity } from '../../lib/inspections/schemas';
import type { SheetValues } from '../../lib/inspections/sheet-values';
import { SheetSection } from './fields';

export const FINDING_LABELS: Record<(typeof TOOTH_FINDINGS)[number], string> = {
  pitting: 'Pitting',
  spalling: 'Spalling',
  scoring: 'Scoring',
  chipped: 'Chipped teeth',
  cracked: 'Cracked teeth',
  'heat-discolouration': 'Heat discolouration',
};
export const AREA_LABELS: Record<(typeof CONDITION_AREAS)[number], string> = {
  splines: 'Splines',
  bearings: 'Bearings',
  seals: 'Seals',
};
export const SEVERITY_LABELS: Record<Severity, string> = {
  none: 'None',
  light: 'Light',
  moderate: 'Moderate',
  severe: 'Severe',
};

/** Tooth findings with a severity each, the splines, bearings and seals, and free notes. */
export function ConditionSection({ disabled }: { disabled: boolean }) {
  const { control, register } = useFormContext<SheetValues>();
  const teeth = useController({ control, name: 'condition.teeth' });
  const found = (teeth.field.value ?? []) as { finding: string; severity: Severity }[];
  const id = useId();
  const severityOf = (finding: string): Severity => found.find((f) => f.finding === finding)?.severity ?? 'none';
  const setSeverity = (finding: (typeof TOOTH_FINDINGS)[number], severity: Severity) => {
    const others = found.filter((f) => f.finding !== finding);
    const next = severity === 'none' ? others : [...others, { finding, severity }];
    // Keep the list in the sheet's order so the record reads the same every time.
    teeth.field.onChange(TOOTH_FINDINGS.flatMap((f) => next.filter((n) => n.finding === f)));
  };

  return (
    <SheetSection id="condition" title="Condition">
      <fieldset disabled={disabled} className="flex flex-col gap-5">
        <legend className="sr-only">Condition of the teeth and the parts around them</legend>
        <div>
          <h3 className="mb-2 font-bold">Teeth</h3>
          <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
            {TOOTH_FINDINGS.map((finding) => (
              <div key={finding} className="flex flex-col gap-1">
                <label htmlFor={`${id}-${finding}`}>{FINDING_LABELS[finding]}</label>
                <select
                  id={`${id}-${finding}`}
                  value={severityOf(finding)}
                  onChange={(e) => setSeverity(finding, e.target.value as Severity)}
                  data-enter-next
                  data-testid={`finding-${finding}`}
                >
                  {SEVERITIES.map((s) => (
                    <option key={s} value={s}>
                      {SEVERITY_LABELS[s]}
                    </option>
                  ))}
                </select>
              </div>
            ))}
          </div>
        </div>
        <div>
          <h3 className="mb-2 font-bold">Around the gears</h3>
          <div className="grid gap-3 sm:grid-cols-3">
            {CONDITION_AREAS.map((area) => (
              <div key={area} className="flex flex-col gap-1">
                <label htmlFor={`${id}-${area}`}>{AREA_LABELS[area]}</label>
                <select
                  id={`${id}-${area}`}
                  {...register(`condition.${area}`)}
                  data-enter-next
                  data-testid={`area-${area}`}
                >
                  {SEVERITIES.map((s) => (
                    <option key={s} value={s}>
                      {s === 'none' ? 'No wear or damage' : SEVERITY_LABELS[s]}
                    </option>
                  ))}
                </select>
              </div>
            ))}
          </div>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-notes`}>Notes</label>
          <textarea id={`${id}-notes`} rows={4} maxLength={5000} {...register('notes')} data-testid="notes" />
        </div>
      </fieldset>
    </SheetSection>
  );
}
