import { toCsv } from './csv';

/**
 * The early-retirement summary: each set retired in a period, its runs at retirement against its
 * life limit, the reason, and the share of sets retired before their limit.
 */
export interface RetiredSet {
  gearSetId: string;
  serial: string;
  retiredAt: string;
  runsAtRetirement: number;
  lifeLimitRuns: number | null;
  reason: string;
  notes: string | null;
}

export interface RetirementSummary {
  from: string;
  to: string;
  retired: (RetiredSet & { early: boolean; shareOfLife: number | null })[];
  count: number;
  earlyCount: number;
  earlyShare: number | null;
  reasons: { reason: string; count: number }[];
}

/** Summarises the sets retired in [from, to). A set without a life limit never counts as early. */
export function summariseRetirements(sets: RetiredSet[], from: string, to: string): RetirementSummary {
  const inPeriod = sets
    .filter((s) => s.retiredAt >= from && s.retiredAt < to)
    .sort((a, b) => a.retiredAt.localeCompare(b.retiredAt));
  const retired = inPeriod.map((s) => ({
    ...s,
    early: s.lifeLimitRuns !== null && s.runsAtRetirement < s.lifeLimitRuns,
    shareOfLife: s.lifeLimitRuns ? s.runsAtRetirement / s.lifeLimitRuns : null,
  }));
  const earlyCount = retired.filter((s) => s.early).length;
  const reasons = new Map<string, number>();
  for (const s of retired) reasons.set(s.reason, (reasons.get(s.reason) ?? 0) + 1);
  return {
    from,
    to,
    retired,
    count: retired.length,
    earlyCount,
    earlyShare: retired.length ? earlyCount / retired.length : null,
    reasons: [...reasons].map(([reason, count]) => ({ reason, count })).sort((a, b) => b.count - a.count),
  };
}

export function retirementsToCsv(summary: RetirementSummary): string {
  const fields = [
    'gear_set',
    'retired_at',
    'runs_at_retirement',
    'life_limit_runs',
    'share_of_life',
    'early',
    'reason',
    'notes',
  ];
  const data = summary.retired.map((s) => [
    s.serial,
    s.retiredAt,
    s.runsAtRetirement,
    s.lifeLimitRuns ?? '',
    s.shareOfLife === null ? '' : Number(s.shareOfLife.toFixed(3)),
    s.early ? 'yes' : 'no',
    s.reason,
    s.notes ?? '',
  ]);
  return toCsv({ fields, data });
}
