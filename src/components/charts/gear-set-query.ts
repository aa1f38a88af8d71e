import { QueryClient } from '@tanstack/react-query';
import {
  toGearSetChartInput,
  type AnalysisAnswer,
  type GearSetChartInput,
  type InspectionAnswer,
  type ProfileAnswer,
  type TorqueUnitId,
} from '../../lib/charts/gear-set-input';
import type { LengthUnit } from '../../lib/units';
import { getJson, type Page } from '../shared/api';

/**
 * The gear-set page's charts share one query, so its islands share one QueryClient: a module is
 * loaded once per page, whichever island hydrates first makes it.
 */
let client: QueryClient | null = null;

export function getChartQueryClient(): QueryClient {
  client ??= new QueryClient({
    defaultOptions: { queries: { staleTime: 60_000, retry: 2, refetchOnWindowFocus: true } },
  });
  return client;
}

export const gearSetChartKey = (gearSetId: string) => ['gear-set-charts', gearSetId] as const;

/** The three answers the charts read, trimmed to what they draw (the same function the server ran). */
export async function fetchGearSetChartInput(
  gearSetId: string,
  units: { lengthUnit: LengthUnit; torqueUnit: TorqueUnitId },
): Promise<GearSetChartInput> {
  const id = encodeURIComponent(gearSetId);
  const [analysis, inspections, profile] = await Promise.all([
    getJson<AnalysisAnswer>(`/api/gear-sets/${id}/analysis`),
    getJson<Page<InspectionAnswer>>(`/api/inspections?gearSetId=${id}&status=submitted&limit=500`),
    getJson<ProfileAnswer>(`/api/tolerance-profiles/for-gear-set/${id}`),
  ]);
  return toGearSetChartInput(analysis, inspections.items, profile, units);
}
