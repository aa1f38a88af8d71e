// What the gear-set charts read, trimmed from three API answers (the analysis, the submitted inspections
// and the profile) so the server can hand it to the islands as props and the islands can fetch the same
// shape again. Pure: the server frontmatter and the islands' query function both call it.

import type { LineFit, TrendProjection, Verdict } from '../analysis';
import type { InspectionView } from '../inspections/views';
import type { LengthFigures, PublishedLimits, TorqueFigures } from '../analysis/published-limits';
import { mmToLength, nmToTorque, type IndicatorResolutionId, type LengthUnit } from '../units';
import { toResolutionId } from './format';

export type TorqueUnitId = 'lbf-in' | 'N-m';

/** One submitted inspection as the charts need it, every figure in the reader's units. */
export interface ChartInspection {
  id: string;
  inspectedAt: string;
  runs: number;
  resolution: IndicatorResolutionId;
  backlash: { mean: number; min: number; max: number; spread: number } | null;
  /** Back-face runout as measured (TIR). */
  runoutTir: number | null;
  /** Runout the once-per-turn part of the lash suggests (TIR), when the tooth counts are known. */
  runoutEstimate: number | null;
  preload: { value: number; bearings: 'new' | 'used' } | null;
  /** The worst verdict of the inspection, or null when nothing was judged. */
  worst: Verdict | null;
}

export interface ChartTrend {
  fit: LineFit;
  limits: { min?: number; max?: number };
  projection: TrendProjection;
}

export interface GearSetChartInput {
  gearSetId: string;
  unit: LengthUnit;
  torqueUnit: TorqueUnitId;
  /** Oldest first (by runs, then date). */
  inspections: ChartInspection[];
  /** The mean is drawn with its fit but never projected; the tightest and loosest points are (the band is theirs). */
  trends: {
    backlashMean: ChartTrend | null;
    backlashMin: ChartTrend | null;
    backlashMax: ChartTrend | null;
    spread: ChartTrend | null;
  };
  life: { totalRuns: number; runsSinceInstall: number; lifeLimitRuns: number | null; runsLeft: number | null };
  limits: {
    backlash: { min: number; max: number };
    maxSpread: number;
    runoutMax: number;
    preloadNew: { min: number; max: number };
    preloadUsed: { min: number; max: number };
  };
  /** Each limit as printed in the reader's unit, where the source prints it there ("0.005", "8"); else absent. */
  limitTexts?: LimitTexts;
}

export interface LimitTexts {
  backlashMin?: string;
  backlashMax?: string;
  maxSpread?: string;
  runoutMax?: string;
  preloadNew?: { min?: string; max?: string };
  preloadUsed?: { min?: string; max?: string };
}

/** The parts of GET /api/gear-sets/:id/analysis the charts read. */
export interface AnalysisAnswer {
  gearSetId: string;
  /** The reader's units the endpoint answered in. */
  unit?: string;
  torqueUnit?: string;
  trends: { measure: string; fit: LineFit; limits: { min?: number; max?: number }; projection: TrendProjection }[];
  life: GearSetChartInput['life'];
}

/** One item of GET /api/inspections: the one inspection shape (src/lib/inspections/views.ts), the parts the charts read. */
export type InspectionAnswer = Pick<
  InspectionView,
  'id' | 'status' | 'inspectedAt' | 'runsAtInspection' | 'resolution' | 'canonical' | 'summary'
>;

/** The parts of GET /api/tolerance-profiles/for-gear-set/:id the charts read (canonical mm, N·m, and as published). */
export interface ProfileAnswer {
  values: {
    backlashMin: number;
    backlashMax: number;
    maxSpread: number;
    runoutMax: number;
    pinionPreloadNew: { min: number; max: number };
    pinionPreloadUsed: { min: number; max: number };
    published?: PublishedLimits;
  };
}

const VERDICT_RANK: Readonly<Record<Verdict, number>> = { 'in-band': 0, 'near-limit': 1, 'out-of-band': 2 };

/**
 * The worst of a list of verdicts.
 * @example worstVerdict([{ verdict: 'in-band' }, { verdict: 'near-limit' }]) // 'near-limit'
 */
export function worstVerdict(verdicts: readonly { verdict: Verdict }[]): Verdict | null {
  let worst: Verdict | null = null;
  for (const { verdict } of verdicts)
    if (worst === null || VERDICT_RANK[verdict] > VERDICT_RANK[worst]) worst = verdict;
  return worst;
}

/** One inspection answer → what the charts read. */
export function inspectionToChartInspection(
  item: InspectionAnswer,
  unit: LengthUnit,
  torqueUnit: TorqueUnitId,
): ChartInspection {
  const b = item.summary.backlash;
  const pinionNm = item.canonical.preload.pinionNm;
  const backFace = item.canonical.runoutMm.backFace;
  return {
    id: item.id,
    inspectedAt: item.inspectedAt,
    runs: item.runsAtInspection,
    resolution: toResolutionId(item.resolution, unit),
    backlash: b ? { mean: b.mean, min: b.min, max: b.max, spread: b.spread } : null,
    runoutTir: backFace === null ? null : mmToLength(backFace, unit),
    runoutEstimate: b?.runoutEstimate ? b.runoutEstimate.tir : null,
    preload:
      pinionNm === null ? null : { value: nmToTorque(pinionNm, torqueUnit), bearings: item.canonical.preload.bearings },
    worst: worstVerdict(item.summary.verdicts),
  };
}

/**
 * The charts' input from the three answers. Drafts are left out: they are not part of the trend.
 * @example toGearSetChartInput(analysis, inspections.items, profile, { lengthUnit: 'in', torqueUnit: 'lbf-in' })
 */
export function toGearSetChartInput(
  analysis: AnalysisAnswer,
  inspections: readonly InspectionAnswer[],
  profile: ProfileAnswer,
  units: { lengthUnit: LengthUnit; torqueUnit: TorqueUnitId },
): GearSetChartInput {
  // The analysis answers in the reader's units as they were at that request; the other two follow it.
  const unit: LengthUnit = analysis.unit === 'mm' || analysis.unit === 'in' ? analysis.unit : units.lengthUnit;
  const torqueUnit: TorqueUnitId =
    analysis.torqueUnit === 'N-m' || analysis.torqueUnit === 'lbf-in' ? analysis.torqueUnit : units.torqueUnit;
  // A limit where the sources print it in the reader's unit is drawn at that figure (0.005 in, never 0.0051).
  const p = profile.values.published;
  const len = (mm: number, figures?: LengthFigures) =>
    figures?.[unit] !== undefined ? Number(figures[unit]) : mmToLength(mm, unit);
  const printedTorque = (nm: number, figures?: TorqueFigures) =>
    figures?.[torqueUnit] !== undefined ? Number(figures[torqueUnit]) : nmToTorque(nm, torqueUnit);
  const torque = (band: { min: number; max: number }, figures?: { min: TorqueFigures; max: TorqueFigures }) => ({
    min: printedTorque(band.min, figures?.min),
    max: printedTorque(band.max, figures?.max),
  });
  const trend = (measure: string): ChartTrend | null => {
    const found = analysis.trends.find((t) => t.measure === measure);
    return found ? { fit: found.fit, limits: found.limits, projection: found.projection } : null;
  };
  const v = profile.values;
  return {
    gearSetId: analysis.gearSetId,
    unit,
    torqueUnit,
    inspections: inspections
      .filter((i) => i.status === 'submitted')
      .map((i) => inspectionToChartInspection(i, unit, torqueUnit))
      .sort((a, b) => a.runs - b.runs || a.inspectedAt.localeCompare(b.inspectedAt)),
    trends: {
      backlashMean: trend('backlash-mean'),
      backlashMin: trend('backlash-min-point'),
      backlashMax: trend('backlash-max-point'),
      spread: trend('spread'),
    },
    life: analysis.life,
    limitTexts: {
      backlashMin: p?.backlashMin[unit],
      backlashMax: p?.backlashMax[unit],
      maxSpread: p?.maxSpread[unit],
      runoutMax: p?.runoutMax[unit],
      preloadNew: { min: p?.pinionPreloadNew.min[torqueUnit], max: p?.pinionPreloadNew.max[torqueUnit] },
      preloadUsed: { min: p?.pinionPreloadUsed.min[torqueUnit], max: p?.pinionPreloadUsed.max[torqueUnit] },
    },
    limits: {
      backlash: { min: len(v.backlashMin, p?.backlashMin), max: len(v.backlashMax, p?.backlashMax) },
      maxSpread: len(v.maxSpread, p?.maxSpread),
      runoutMax: len(v.runoutMax, p?.runoutMax),
      preloadNew: torque(v.pinionPreloadNew, p?.pinionPreloadNew),
      preloadUsed: torque(v.pinionPreloadUsed, p?.pinionPreloadUsed),
    },
  };
}
