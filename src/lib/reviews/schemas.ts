import { z } from 'zod';

/** Reviews: opening, commenting and deciding, shared by the forms and the endpoints. */
export const openReviewSchema = z.object({
  gearSetId: z.string({ error: 'Choose the gear set.' }).min(1, 'Choose the gear set.').max(64),
});

export const commentSchema = z.object({
  body: z
    .string({ error: 'Write the comment.' })
    .trim()
    .min(1, 'Write the comment.')
    .max(5000, 'A comment has at most 5,000 characters.'),
});

export const DECISIONS = ['keep', 'reshim', 'retire'] as const;
export const DECISION_LABELS = { keep: 'Keep in service', reshim: 'Re-shim and re-inspect', retire: 'Retire' } as const;
/** What each decision means for the set, under its choice on the form. */
export const DECISION_HINTS = {
  keep: 'The set runs on as it is, and is inspected again after the runs below.',
  reshim: 'The set is re-shimmed, then inspected again after the runs below.',
  retire: 'The set comes out of service for good and leaves the board.',
} as const;

export const DEFAULT_RETIREMENT_REASONS = [
  'Spalling or pitting on the teeth',
  'Chipped or cracked tooth',
  'Life limit reached',
  'Pattern could not be corrected',
  'Runout beyond the limit',
  'Heat damage',
  'Other',
] as const;

export const decisionSchema = z
  .object({
    decision: z.enum(DECISIONS, { error: 'decision: keep, reshim or retire.' }),
    reason: z
      .string({ error: 'Give the reason.' })
      .trim()
      .min(1, 'Give the reason.')
      .max(200, 'The reason has at most 200 characters.'),
    notes: z.string().trim().max(5000).optional(),
    reinspectAfterRuns: z
      .number({ error: 'reinspectAfterRuns must be a whole number of runs.' })
      .int('reinspectAfterRuns must be a whole number of runs.')
      .min(1, 'Re-inspect after at least 1 run.')
      .max(1000, 'At most 1,000 runs.')
      .optional(),
  })
  .superRefine((body, ctx) => {
    if (body.decision !== 'retire' && body.reinspectAfterRuns === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['reinspectAfterRuns'],
        message: 'Say after how many runs the set is inspected again.',
      });
    }
  });
