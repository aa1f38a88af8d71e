import type { JudgedMeasure } from '../analysis/judge-inspection';
import {
  lengthFiguresToMm,
  lengthFiguresToText,
  torqueFiguresToNm,
  torqueFiguresToText,
  type LengthFigures,
  type PublishedLimits,
  type PublishedTorqueUnit,
  type TorqueFigures,
} from '../analysis/published-limits';
import {
  formatLength,
  lengthToMm,
  mmToLength,
  nmToTorque,
  torqueToNm,
  torqueUnitToLabel,
  type IndicatorResolution,
  type LengthUnit,
} from '../units';

/**
 * Verdicts judged in the entry unit, shown in the reader's: figures converted, the limit as published in the
 * reader's unit where it is printed there (0.005 in, never 0.0051) and otherwise to the graduation, and a line
 * saying what the verdict was judged at. Pure.
 */
export interface ReaderVerdict extends JudgedMeasure {
  /** The limit as the reader sees it, without the unit: "0.005", "8". */
  readonly limitText: string;
  /** What the verdict was judged at, e.g. "judged at the 0.001 in graduation". */
  readonly judgedAt: string;
}

export interface VerdictUnits {
  readonly entry: { readonly unit: LengthUnit; readonly torqueUnit: PublishedTorqueUnit };
  readonly reader: { readonly unit: LengthUnit; readonly torqueUnit: PublishedTorqueUnit };
  readonly resolution: IndicatorResolution;
}

const LENGTH_FIELDS = {
  'backlash-min-point': ['backlashMin', 'backlashMax'],
  'backlash-max-point': ['backlashMin', 'backlashMax'],
  spread: ['maxSpread', 'maxSpread'],
  runout: ['runoutMax', 'runoutMax'],
  'runout-measured': ['runoutMax', 'runoutMax'],
} as const;

/** The printed figures of the limit a verdict was judged against. */
function limitFigures(
  v: JudgedMeasure,
  published: PublishedLimits,
): { kind: 'length'; figures: LengthFigures } | { kind: 'torque'; figures: TorqueFigures } | null {
  if (v.measure in LENGTH_FIELDS) {
    const [low, high] = LENGTH_FIELDS[v.measure as keyof typeof LENGTH_FIELDS];
    return { kind: 'length', figures: published[v.limit === 'min' ? low : high] };
  }
  if (v.measure === 'pinion-preload-new' || v.measure === 'pinion-preload-used') {
    const band = v.measure === 'pinion-preload-new' ? published.pinionPreloadNew : published.pinionPreloadUsed;
    return { kind: 'torque', figures: band[v.limit] };
  }
  return null;
}

/**
 * The "judged at" line beside a verdict.
 * @example judgedAtText({ unit: 'in', asPublished: true, … }, units) // 'judged at the 0.001 in graduation'
 */
export function judgedAtText(v: JudgedMeasure, units: VerdictUnits): string {
  const { entry, resolution } = units;
  if (v.unit === entry.unit) {
    const other = entry.unit === 'in' ? 'mm' : 'in';
    return v.asPublished
      ? `judged at the ${resolution.label} graduation`
      : `judged at the ${resolution.label} graduation, within half a graduation of the limit printed in ${other}`;
  }
  if (v.unit === entry.torqueUnit) {
    const label = torqueUnitToLabel(entry.torqueUnit);
    const other = torqueUnitToLabel(entry.torqueUnit === 'N-m' ? 'lbf-in' : 'N-m');
    return v.asPublished
      ? `judged in ${label} against the figure as printed`
      : `judged in ${label}, within half the last printed digit of the ${other} figure`;
  }
  return '';
}

/**
 * Shows verdicts judged in the entry unit in the reader's unit.
 * @example verdictsForReader(judged, published, units)[0].limitText // '0.005'
 */
export function verdictsForReader(
  judged: readonly JudgedMeasure[],
  published: PublishedLimits,
  units: VerdictUnits,
): ReaderVerdict[] {
  const { entry, reader, resolution } = units;
  const length = (x: number) => mmToLength(lengthToMm(x, entry.unit), reader.unit);
  const torque = (x: number) => nmToTorque(torqueToNm(x, entry.torqueUnit), reader.torqueUnit);
  return judged.map((v) => {
    const judgedAt = judgedAtText(v, units);
    const limit = limitFigures(v, published);
    if (limit?.kind === 'length') {
      const printed = limit.figures[reader.unit];
      return {
        ...v,
        value: length(v.value),
        margin: length(v.margin),
        limitValue: printed !== undefined ? Number(printed) : mmToLength(lengthFiguresToMm(limit.figures), reader.unit),
        limitText: lengthFiguresToText(limit.figures, reader.unit, (mm) => formatLength(mm, reader.unit, resolution)),
        unit: reader.unit,
        judgedAt,
      };
    }
    if (limit?.kind === 'torque') {
      const printed = limit.figures[reader.torqueUnit];
      return {
        ...v,
        value: torque(v.value),
        margin: torque(v.margin),
        limitValue:
          printed !== undefined ? Number(printed) : nmToTorque(torqueFiguresToNm(limit.figures), reader.torqueUnit),
        limitText: torqueFiguresToText(limit.figures, reader.torqueUnit),
        unit: reader.torqueUnit,
        judgedAt,
      };
    }
    return { ...v, limitText: v.unit === 'check' ? 'unchanged' : String(v.limitValue), judgedAt };
  });
}
