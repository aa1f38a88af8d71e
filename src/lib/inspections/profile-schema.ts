import { z } from 'zod';
import { validateProfile } from '../analysis/tolerance';

/** A tolerance profile as the team edits it: canonical mm and N·m, checked by the engine's own rules. */
const length = (label: string) =>
  z
    .number({ error: `${label} must be a number of millimetres.` })
    .min(0, `${label} is 0 or more.`)
    .max(2.5, `${label}: at most 2.5 mm.`);
const torque = (label: string) =>
  z
    .number({ error: `${label} must be a number of N·m.` })
    .min(0, `${label} is 0 or more.`)
    .max(20, `${label}: at most 20 N·m.`);
const band = (label: string) => z.object({ min: torque(`${label} min`), max: torque(`${label} max`) });

export const toleranceValuesSchema = z
  .object({
    backlashMin: length('backlashMin'),
    backlashMax: length('backlashMax'),
    maxSpread: length('maxSpread'),
    runoutMax: length('runoutMax'),
    pinionPreloadNew: band('pinionPreloadNew'),
    pinionPreloadUsed: band('pinionPreloadUsed'),
    hubPreloadCheck: z.boolean({ error: 'hubPreloadCheck: true or false.' }),
    lifeLimitRuns: z
      .number({ error: 'lifeLimitRuns must be a whole number.' })
      .int('lifeLimitRuns must be a whole number.')
      .min(1)
      .max(100_000),
    nearShare: z.number({ error: 'nearShare must be a number.' }).min(0).max(0.49),
  })
  .strict()
  .superRefine((values, ctx) => {
    for (const issue of validateProfile(values))
      ctx.addIssue({ code: 'custom', path: issue.field.split('.'), message: issue.message });
  });

export const profileCreateSchema = z.object({
  name: z.string({ error: 'Enter the profile name.' }).trim().min(1, 'Enter the profile name.').max(80),
  values: toleranceValuesSchema,
});

export const profileUpdateSchema = z.object({
  name: profileCreateSchema.shape.name.optional(),
  values: toleranceValuesSchema,
});
