// Tolerance profiles: each limit as published (published-limits.ts) with its canonical mm / N·m figure beside it,
// the default figures and where each one comes from. Every default is editable per profile; the manufacturer's
// figures and the team's procedures govern.

import {
  FIGURE_PATTERN,
  lengthFiguresToMm,
  numberToFigure,
  torqueFiguresToNm,
  type LengthFigures,
  type PublishedLimits,
  type TorqueFigures,
} from './published-limits';

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
  /**
   * Each limit as published, in each unit it is published in. The canonical figures above follow from it (the mm
   * or N·m figure where printed, else the other converted); a profile stored before limits were kept as published
   * has none, and reads its canonical figures as published in mm and N·m (`publishedLimitsOf`).
   */
  readonly published?: PublishedLimits;
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

/** The fields of a profile that carry a figure (everything but the published figures beside them). */
export type ProfileField = Exclude<keyof ToleranceProfile, 'published'>;

export const DEFAULT_PROFILE_SOURCES: Readonly<Record<ProfileField, SourceNote>> = {
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

/** The default limits as the sources print them, both units where both are printed (TRADE.md, S). */
export const DEFAULT_PUBLISHED: PublishedLimits = {
  backlashMin: { mm: '0.13', in: '0.005' },
  backlashMax: { mm: '0.23', in: '0.009' },
  maxSpread: { mm: '0.05', in: '0.002' },
  runoutMax: { mm: '0.076', in: '0.003' },
  pinionPreloadNew: { min: { 'N-m': '2.7', 'lbf-in': '24' }, max: { 'N-m': '3.6', 'lbf-in': '32' } },
  pinionPreloadUsed: { min: { 'N-m': '1.0', 'lbf-in': '8' }, max: { 'N-m': '1.4', 'lbf-in': '12' } },
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
  published: DEFAULT_PUBLISHED,
  sources: DEFAULT_PROFILE_SOURCES,
};

const lengthOf = (mm: number): LengthFigures => ({ mm: numberToFigure(mm) });
const torqueOf = (nm: number): TorqueFigures => ({ 'N-m': numberToFigure(nm) });

// A printed figure stands for the canonical one only while they agree: a profile whose canonical figure was changed
// without its printed figures (a copy of the defaults with one number edited) is judged by the figure it holds.
const agrees = (canonical: number, fromFigures: number) =>
  Math.abs(canonical - fromFigures) <= 1e-9 * Math.max(Math.abs(canonical), Math.abs(fromFigures));

function lengthFiguresFor(figures: LengthFigures | undefined, canonical: number): LengthFigures {
  return figures && agrees(canonical, lengthFiguresToMm(figures)) ? figures : lengthOf(canonical);
}

function torqueFiguresFor(figures: TorqueFigures | undefined, canonical: number): TorqueFigures {
  return figures && agrees(canonical, torqueFiguresToNm(figures)) ? figures : torqueOf(canonical);
}

/**
 * A profile's limits as published. Where a profile has no printed figure for a limit (one stored before limits
 * were kept as published, or one whose canonical figure was changed alone), its canonical figure is read as
 * printed in mm or N·m: what the team typed.
 * @example publishedLimitsOf({ ...DEFAULT_PROFILE, backlashMin: 0.1 }).backlashMin // { mm: '0.1' }
 */
export function publishedLimitsOf(profile: ToleranceProfile): PublishedLimits {
  const p = profile.published;
  const band = (field: 'pinionPreloadNew' | 'pinionPreloadUsed') => ({
    min: torqueFiguresFor(p?.[field].min, profile[field].min),
    max: torqueFiguresFor(p?.[field].max, profile[field].max),
  });
  return {
    backlashMin: lengthFiguresFor(p?.backlashMin, profile.backlashMin),
    backlashMax: lengthFiguresFor(p?.backlashMax, profile.backlashMax),
    maxSpread: lengthFiguresFor(p?.maxSpread, profile.maxSpread),
    runoutMax: lengthFiguresFor(p?.runoutMax, profile.runoutMax),
    pinionPreloadNew: band('pinionPreloadNew'),
    pinionPreloadUsed: band('pinionPreloadUsed'),
  };
}

/**
 * The profile with its canonical figures set from its published ones, so the two never disagree.
 * @example withCanonicalFigures({ ...p, published: { ...p.published, backlashMin: { in: '0.005' } } }).backlashMin // 0.127
 */
export function withCanonicalFigures<T extends ToleranceProfile>(profile: T): T {
  const published = profile.published;
  if (!published || findFigureIssues(published).length) return profile;
  const band = (b: PublishedLimits['pinionPreloadNew']) => ({
    min: torqueFiguresToNm(b.min),
    max: torqueFiguresToNm(b.max),
  });
  return {
    ...profile,
    backlashMin: lengthFiguresToMm(published.backlashMin),
    backlashMax: lengthFiguresToMm(published.backlashMax),
    maxSpread: lengthFiguresToMm(published.maxSpread),
    runoutMax: lengthFiguresToMm(published.runoutMax),
    pinionPreloadNew: band(published.pinionPreloadNew),
    pinionPreloadUsed: band(published.pinionPreloadUsed),
  };
}

function findFigureIssues(published: PublishedLimits): ProfileIssue[] {
  const issues: ProfileIssue[] = [];
  const check = (figures: Readonly<Record<string, string | undefined>>, field: string) => {
    const units = Object.entries(figures).filter(([, figure]) => figure !== undefined);
    if (units.length === 0) issues.push({ field, message: `${field} needs a figure in at least one unit.` });
    for (const [unit, figure] of units) {
      if (!FIGURE_PATTERN.test(figure as string))
        issues.push({ field: `${field}.${unit}`, message: `${field} in ${unit}: "${figure}" is not a plain figure.` });
    }
  };
  for (const field of ['backlashMin', 'backlashMax', 'maxSpread', 'runoutMax'] as const)
    check(published[field], `published.${field}`);
  for (const field of ['pinionPreloadNew', 'pinionPreloadUsed'] as const) {
    check(published[field].min, `published.${field}.min`);
    check(published[field].max, `published.${field}.max`);
  }
  // Min above max in a unit printed on both sides is a typing slip, whatever the other unit says.
  const pairs = [
    ['backlashMin', published.backlashMin, published.backlashMax],
    ['pinionPreloadNew.min', published.pinionPreloadNew.min, published.pinionPreloadNew.max],
    ['pinionPreloadUsed.min', published.pinionPreloadUsed.min, published.pinionPreloadUsed.max],
  ] as const;
  for (const [field, low, high] of pairs) {
    for (const [unit, figure] of Object.entries(low) as [string, string | undefined][]) {
      const other = (high as Readonly<Record<string, string | undefined>>)[unit];
      if (figure !== undefined && other !== undefined && Number(figure) > Number(other))
        issues.push({
          field: `published.${field}`,
          message: `${field} (${figure} ${unit}) is above its max (${other} ${unit}).`,
        });
    }
  }
  return issues;
}

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
  // The printed figures are checked once the figures they stand beside are sound (one slip, one message).
  if (issues.length === 0 && profile.published) issues.push(...findFigureIssues(profile.published));
  return issues;
}

/** Throws a RangeError naming the first problem when the profile is not usable. */
export function requireValidProfile(profile: ToleranceProfile): ToleranceProfile {
  const [first] = validateProfile(profile);
  if (first) throw new RangeError(`Tolerance profile: ${first.field}: ${first.message}`);
  return profile;
}
