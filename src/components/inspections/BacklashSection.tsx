import { useContext } from 'react';
import { useFormContext, useWatch } from 'react-hook-form';
import { computeLiveFigures, showSheetVerdicts } from '../../lib/inspections/live-figures';
import { resizeReadings, type SheetValues } from '../../lib/inspections/sheet-values';
import { formatLength, lengthToMm, type IndicatorResolutionId } from '../../lib/units';
import { EntryField, EntryTextsContext, SheetSection } from './fields';
import type { SheetContext } from './sheet-context';
import { PolarPreview } from './PolarPreview';
import { VerdictList } from './VerdictList';

const POSITION_CHOICES = Array.from({ length: 22 }, (_, i) => i + 3);

/** The backlash readings around the ring gear, with the live figures and the polar preview. */
export function BacklashSection({ context, disabled }: { context: SheetContext; disabled: boolean }) {
  const { control, setValue, getValues } = useFormContext<SheetValues>();
  const [readings, unit, resolution, torqueUnit] = useWatch({
    control,
    name: ['readings', 'unit', 'resolution', 'torqueUnit'],
  });
  const profile = context.profile?.values ?? null;
  const set = context.gearSet;
  const figures = computeLiveFigures(
    readings,
    unit,
    profile,
    {
      ringTeeth: set?.ringTeeth,
      pinionTeeth: set?.pinionTeeth,
      pressureAngleDeg: set?.pressureAngleDeg,
      spiralAngleDeg: set?.spiralAngleDeg,
      runoutK: set?.runoutK,
    },
    resolution,
  );
  const basis = { unit, torqueUnit: torqueUnit ?? 'lbf-in', resolution };
  const shownVerdicts = profile ? showSheetVerdicts(figures.verdicts, profile, basis) : [];
  const format = (value: number) => formatLength(lengthToMm(value, unit), unit, resolution as IndicatorResolutionId);
  const count = readings.length;

  const texts = useContext(EntryTextsContext);
  const changeCount = (next: number) => {
    // Forget what was typed at positions that go away, so they come back empty.
    for (let i = next; i < count; i++) texts.set(`readings.${i}`, '');
    setValue('readings', resizeReadings(getValues('readings'), next), { shouldDirty: true });
  };

  const soFar = figures.complete ? '' : ` (so far, ${figures.readCount} of ${count} read)`;
  const rows: [string, number | null][] = [
    ['Mean', figures.mean],
    ['Minimum (tightest)', figures.min],
    ['Maximum (loosest)', figures.max],
    ['Spread (max − min)', figures.spread],
  ];

  return (
    <SheetSection id="backlash" title="Backlash">
      <p className="mb-3 text-sm text-ink-soft">
        Indicator stem at the heel end of a ring-gear tooth, in line with rotation; hold the pinion and rock the ring
        gear. A number too large for a reading is read as thousandths of an inch (8.5 is 0.0085 in) or hundredths of a
        millimetre (13 is 0.13 mm); the value as read shows under each field.
      </p>
      <div className="mb-4 flex max-w-xs flex-col gap-1">
        <label htmlFor="positions-count">Positions around the ring gear</label>
        <p className="text-sm text-ink-soft">
          Position 1 is the marked tooth; the rest follow in the order of rotation.
        </p>
        <select
          id="positions-count"
          value={count}
          onChange={(e) => changeCount(Number(e.target.value))}
          disabled={disabled}
          data-enter-next
        >
          {POSITION_CHOICES.map((n) => (
            <option key={n} value={n}>
              {n} positions, {Math.round((360 / n) * 10) / 10}° apart
            </option>
          ))}
        </select>
      </div>
      <div className="grid gap-5 lg:grid-cols-[1fr_auto]">
        <fieldset className="grid grid-cols-2 content-start gap-3" disabled={disabled}>
          <legend className="sr-only">Readings, position 1 at the marked tooth</legend>
          {readings.map((_, i) => (
            <EntryField
              key={i}
              name={`readings.${i}`}
              label={`Position ${i + 1} · ${Math.round(((360 * i) / count) * 10) / 10}°`}
              kind="indicator"
              unitLabel={unit}
              large
              testId={`reading-${i + 1}`}
            />
          ))}
        </fieldset>
        <PolarPreview readings={readings} format={format} unit={unit} />
      </div>
      <div className="mt-5 grid gap-4 md:grid-cols-2" aria-live="polite" data-testid="live-figures">
        <div>
          <h3 className="mb-1 font-bold">Figures{soFar}</h3>
          {figures.readCount === 0 ? (
            <p className="text-ink-soft">Type a reading to see the mean, spread and verdicts.</p>
          ) : (
            <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-0.5 tabular-nums">
              {rows.map(([label, value]) => (
                <div key={label} className="contents">
                  <dt>{label}</dt>
                  <dd className="font-semibold" data-testid={`figure-${label.split(' ')[0]!.toLowerCase()}`}>
                    {value === null ? '—' : `${format(value)} ${unit}`}
                  </dd>
                </div>
              ))}
              {figures.harmonic && (
                <>
                  <dt>Once-per-turn part</dt>
                  <dd className="font-semibold">
                    ±{format(figures.harmonic.amplitude)} {unit}
                    {figures.harmonic.tightestAngleDeg !== null &&
                      `, tight at ${Math.round(figures.harmonic.tightestAngleDeg)}°`}
                  </dd>
                </>
              )}
              {figures.runoutEstimate && (
                <>
                  <dt>Runout it suggests</dt>
                  <dd className="font-semibold">
                    {format(figures.runoutEstimate.tir)} {unit} TIR ({figures.runoutEstimate.kText})
                  </dd>
                </>
              )}
            </dl>
          )}
        </div>
        <div>
          <h3 className="mb-1 font-bold">
            Against {context.profile ? `“${context.profile.name}” v${context.profile.version}` : 'the bands'}
          </h3>
          {!context.profile && (
            <p className="text-ink-soft">
              The set’s tolerance profile has not loaded (no connection yet); the figures are shown without verdicts.
            </p>
          )}
          {context.profile && figures.verdicts.length === 0 && (
            <p className="text-ink-soft">Verdicts appear with the first reading.</p>
          )}
          {context.profile && (
            <VerdictList
              verdicts={shownVerdicts}
              format={(v) => `${format(v)} ${unit}`}
              profile={context.profile}
              provisional={!figures.complete}
            />
          )}
        </div>
      </div>
    </SheetSection>
  );
}
