import { QueryClientProvider, useQuery } from '@tanstack/react-query';
import { shapeBacklashTrend } from '../../lib/charts/backlash-trend';
import type { GearSetChartInput } from '../../lib/charts/gear-set-input';
import { shapePreloadTrend, shapeRunoutTrend, shapeSpreadTrend } from '../../lib/charts/measure-trends';
import { ChartFigure } from './ChartFigure';
import { fetchGearSetChartInput, gearSetChartKey, getChartQueryClient } from './gear-set-query';

/**
 * The gear-set page's charts, as two islands (the big backlash trend, and the three smaller ones) that
 * share one query. The server renders them with the figures it read; the island keeps them fresh
 * (refetched when stale and the tab comes back into view).
 */
export interface GearSetTrendsProps {
  initial: GearSetChartInput;
  /** When the server read `initial` (ms since 1970), so the first refetch waits until it is stale. */
  renderedAt: number;
  part: 'backlash' | 'measures';
  /** Where to record an inspection, for the empty state (null when the role may not). */
  recordHref: string | null;
  /** Fixed chart width for tests. */
  width?: number;
}

export default function GearSetTrends(props: GearSetTrendsProps) {
  return (
    <QueryClientProvider client={getChartQueryClient()}>
      <Trends {...props} />
    </QueryClientProvider>
  );
}

function Trends({ initial, renderedAt, part, recordHref, width }: GearSetTrendsProps) {
  const units = { lengthUnit: initial.unit, torqueUnit: initial.torqueUnit };
  const query = useQuery({
    queryKey: gearSetChartKey(initial.gearSetId),
    queryFn: () => fetchGearSetChartInput(initial.gearSetId, units),
    initialData: initial,
    initialDataUpdatedAt: renderedAt,
  });
  const input = query.data;
  const action = recordHref ? { href: recordHref, label: 'Record an inspection' } : null;
  const stale = query.isError ? <p className="notice notice-caution mb-2 text-sm">{query.error.message}</p> : null;
  if (part === 'backlash') {
    return (
      <div>
        {stale}
        <ChartFigure shape={shapeBacklashTrend(input)} height={360} width={width} level={2} action={action} />
      </div>
    );
  }
  return (
    <div>
      {stale}
      <div className="grid gap-8">
        <ChartFigure shape={shapeSpreadTrend(input)} height={240} width={width} />
        <ChartFigure shape={shapePreloadTrend(input)} height={240} width={width} />
        <ChartFigure shape={shapeRunoutTrend(input)} height={240} width={width} />
      </div>
    </div>
  );
}
