import { inspectionToTitle } from '../../lib/charts/comparison';
import type { PolarSeriesInput } from '../../lib/charts/polar';
import { toResolutionId } from '../../lib/charts/format';
import { mmToLength, type LengthUnit } from '../../lib/units';

/** What a polar series reads from an inspection answer (readings stored in mm, shown in the reader's unit). */
export interface PolarSource {
  id: string;
  inspectedAt: string;
  runsAtInspection: number;
  resolution: string;
  canonical: { backlashMm: (number | null)[] };
}

/** One inspection as a polar series in the reader's unit. */
export function inspectionToPolarSeries(
  view: PolarSource,
  unit: LengthUnit,
  name = inspectionToTitle(view),
): PolarSeriesInput {
  return {
    key: view.id,
    name,
    readings: view.canonical.backlashMm.map((mm) => (mm === null ? null : mmToLength(mm, unit))),
    resolution: toResolutionId(view.resolution, unit),
  };
}
