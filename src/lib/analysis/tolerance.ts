// Tolerance profiles: canonical mm and N·m, with the default figures and where each one comes from.
// Every default is editable per profile; the manufacturer's figures and the team's procedures govern.

/** A closed band min..max. */
export interface Band {
  readonly min: number;
  readonly max: number;
}

/** A team's limits for one gear set type. Lengths in mm, torques in N·m. */
export interface ToleranceProfile {
  /** Backlash at the minimum (tightest) point, lower limit. */
  readonly backlashMin: number;
  readonly backlashMax: number;
  /** Largest allowed variation between positions (max − min). */
  readonly maxSpread: number;
  /** Largest allowed ring-gear / case-flange runout (TIR). */
  readonly runoutMax: number;
  readonly pinionPreloadNew: Band;
  readonly pinionPreloadUsed: Band;
  /** Require the hub turning effort to stay the same between medium and full nut torque. */
  readonly hubPreloadCheck: boolean;
  readonly lifeLimitRuns: number;
  /** Share of a band's width (or of a one-sided limit) that counts as "near" the limit. */
  readonly nearShare: number;
}

/** TRADE.md key: S quoted, D derived, M from memory, CP common practice. */
export type SourceKey = 'S' | 'D' | 'M' | 'CP';

/** Where a default comes from, named as TRADE.md names it. */
export interface SourceNote {
  readonly key: SourceKey;
  readonly source: string;
  readonly note?: string;
}

const GM_1996 = 'GM light-truck service manual, 8-5/8 in ring gear axle, 1996';
const GM_2005 = 'GM medium-duty truck service manual, 2005';

export const DEFAULT_PROFILE_SOURCES: Readonly<Record<keyof ToleranceProfile, SourceNote>> = {
  backlashMin: { key: 'S', source: GM_1996, note: '0.13–0.23 mm (0.005–0.009 in) at the minimum point' },
  backlashMax: { key: 'S', source: GM_1996, note: '0.13–0.23 mm (0.005–0.009 in) at the minimum point' },
  maxSpread: { key: 'S', source: `${GM_1996}; ${GM_2005}`, note: 'variation between points within 0.05 mm (0.002 in)' },
  runoutMax: {
    key: 'S',
    source: 'Ford light-truck service manual, 1997',
    note: 'case flange runout 0.076 mm (0.003 in)',
  },
  pinionPreloadNew: { key: 'S', source: 'GM, 7-1/2 in axle', note: 'new bearings 2.7–3.6 N·m (24–32 lbf·in)' },
  pinionPreloadUsed: { key: 'S', source: 'GM, 7-1/2 in axle', note: 'used bearings 1.0–1.4 N·m (8–12 lbf·in)' },
  hubPreloadCheck: {
    key: 'CP',
    source: 'common practice',
    note: 'effort unchanged between medium and full nut torque on a solid spacer',
  },
  lifeLimitRuns: {
    key: 'CP',
    source: 'common practice in top-level drag racing',
    note: 'often replaced after roughly 50 runs',
  },
  nearShare: { key: 'CP', source: 'Lashline default; no published source', note: 'within 10 % of the band of a limit' },
};

/** Default profile with its sources beside the figures. */
export const DEFAULT_PROFILE: ToleranceProfile & { readonly sources: typeof DEFAULT_PROFILE_SOURCES } = {
  backlashMin: 0.13,
  backlashMax: 0.23,
  maxSpread: 0.05,
  runoutMax: 0.076,
  pinionPreloadNew: { min: 2.7, max: 3.6 },
  pinionPreloadUsed: { min: 1.0, max: 1.4 },
  hubPreloadCheck: true,
  lifeLimitRuns: 50,
  nearShare: 0.1,
  sources: DEFAULT_PROFILE_SOURCES,
};

/** One problem with a profile, named by its field path. */
export interface ProfileIssue {
  readonly field: string;
  readonly message: string;
}

function isNonNegative(value: number): boolean {
  return Number.isFinite(value) && value >= 0;
}

/**
 * Lists what is wrong with a profile (empty when it is usable): negative or non-finite figures, min above max.
 * @example validateProfile({ ...DEFAULT_PROFILE, backlashMin: 0.3 }) // [{ field: 'backlashMin', … }]
 */
export function validateProfile(profile: ToleranceProfile): ProfileIssue[] {
  const issues: ProfileIssue[] = [];
  const lengths = ['backlashMin', 'backlashMax', 'maxSpread', 'runoutMax'] as const;
  for (const field of lengths) {
    if (!isNonNegative(profile[field])) issues.push({ field, message: `${field} must be a number of 0 or more.` });
  }
  if (profile.backlashMin > profile.backlashMax) {
    issues.push({
      field: 'backlashMin',
      message: `Backlash min (${profile.backlashMin}) is above max (${profile.backlashMax}).`,
    });
  }
  for (const field of ['pinionPreloadNew', 'pinionPreloadUsed'] as const) {
    const band = profile[field];
    if (!isNonNegative(band.min)) issues.push({ field: `${field}.min`, message: `${field}.min must be 0 or more.` });
    if (!isNonNegative(band.max)) issues.push({ field: `${field}.max`, message: `${field}.max must be 0 or more.` });
    if (band.min > band.max) {
      issues.push({ field: `${field}.min`, message: `${field} min (${band.min}) is above max (${band.max}).` });
    }
  }
  if (!Number.isInteger(profile.lifeLimitRuns) || profile.lifeLimitRuns < 1) {
    issues.push({ field: 'lifeLimitRuns', message: 'lifeLimitRuns must be a whole number of 1 or more.' });
  }
  if (!(profile.nearShare >= 0 && profile.nearShare < 0.5)) {
    issues.push({ field: 'nearShare', message: 'nearShare must be at least 0 and below 0.5.' });
  }
  return issues;
}

/** Throws a RangeError naming the first problem when the profile is not usable. */
export function requireValidProfile(profile: ToleranceProfile): ToleranceProfile {
  const [first] = validateProfile(profile);
  if (first) throw new RangeError(`Tolerance profile: ${first.field}: ${first.message}`);
  return profile;
}
