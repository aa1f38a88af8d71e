import { z } from 'zod';
import type { PartKind } from './kinds';
import { DEFAULT_RETIREMENT_REASONS } from '../reviews/schemas';

/**
 * Team-wide defaults. Life limits: no published intervals exist (TRADE.md "Life in runs"); the two
 * given are common practice in top-level drag racing, and every team sets its own.
 */
export interface LifeLimitDefault {
  runs: number | null;
  source: string;
}

export const DEFAULT_LIFE_LIMITS: Record<PartKind, LifeLimitDefault> = {
  'gear-set': {
    runs: 50,
    source: 'Common practice (CP): ring-and-pinion sets are often replaced after roughly 50 runs.',
  },
  spindle: {
    runs: 100,
    source: 'Common practice (CP): aluminium spindles are checked for oval bores at about twice a gear set’s runs.',
  },
  axle: { runs: null, source: 'No common figure: set the team’s own.' },
  'drive-hub': { runs: null, source: 'No common figure: set the team’s own.' },
  hub: { runs: null, source: 'No common figure: set the team’s own.' },
  bearing: { runs: null, source: 'No common figure: set the team’s own.' },
  other: { runs: null, source: 'No common figure: set the team’s own.' },
};

const lifeLimitSchema = z.number().int().min(1, 'A life limit is at least 1 run.').max(100_000).nullable();

export const teamSettingsSchema = z.object({
  lifeLimitRuns: z
    .object({
      'gear-set': lifeLimitSchema,
      spindle: lifeLimitSchema,
      axle: lifeLimitSchema,
      'drive-hub': lifeLimitSchema,
      hub: lifeLimitSchema,
      bearing: lifeLimitSchema,
      other: lifeLimitSchema,
    })
    .partial(),
  /** A measure within this share of its band from a limit is "near a limit". */
  nearShare: z.number().min(0).max(0.5),
  /** Runs until the next planned teardown: a limit projected inside it is flagged. */
  serviceIntervalRuns: z.number().int().min(1).max(10_000),
  /** How many ring-gear positions a new inspection asks for. */
  backlashPositions: z.number().int().min(3).max(24),
  /** The reasons offered when a set is retired; free text is always allowed too. */
  retirementReasons: z.array(z.string().trim().min(1).max(200)).max(40),
});

export type TeamSettings = z.infer<typeof teamSettingsSchema>;

export const DEFAULT_TEAM_SETTINGS: TeamSettings = {
  lifeLimitRuns: {},
  nearShare: 0.1,
  serviceIntervalRuns: 8,
  backlashPositions: 4,
  retirementReasons: [...DEFAULT_RETIREMENT_REASONS],
};

/** The stored settings over the defaults; unknown or bad stored values fall back to the default. */
export function resolveTeamSettings(stored: unknown): TeamSettings {
  const parsed = teamSettingsSchema.partial().safeParse(stored ?? {});
  return { ...DEFAULT_TEAM_SETTINGS, ...(parsed.success ? parsed.data : {}) };
}

/** The life limit a new part of `kind` gets when none is given. */
export function defaultLifeLimit(settings: TeamSettings, kind: PartKind): number | null {
  const own = settings.lifeLimitRuns[kind];
  return own === undefined ? DEFAULT_LIFE_LIMITS[kind].runs : own;
}
