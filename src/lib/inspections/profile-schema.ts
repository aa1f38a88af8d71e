import { z } from 'zod';
import { FIGURE_PATTERN } from '../analysis/published-limits';
import { validateProfile, withCanonicalFigures } from '../analysis/tolerance';

/**
 * A tolerance profile as the team edits it: canonical mm and N·m, checked by the engine's own rules, with each
 * limit as published beside them when the team gives it (`published`: figures as printed, in each unit printed).
 * With `published`, the canonical figures are set from it; without it, the canonical figures are the team's own,
 * read as printed in mm and N·m.
 */
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

const figure = (label: string) =>
  z
    .string({ error: `${label} must be a figure as printed, e.g. "0.005".` })
    .regex(FIGURE_PATTERN, `${label} must be a figure as printed, e.g. "0.005".`)
    .max(12, `${label}: at most 12 characters.`)
    .optional();
const lengthFigures = (label: string) =>
  z.object({ mm: figure(`${label}.mm`), in: figure(`${label}.in`) }).strict();
const torqueFigures = (label: string) =>
  z.object({ 'N-m': figure(`${label}.N-m`), 'lbf-in': figure(`${label}.lbf-in`) }).strict();
const torqueBandFigures = (label: string) =>
  z.object({ min: torqueFigures(`${label}.min`), max: torqueFigures(`${label}.max`) }).strict();

const publishedSchema = z
  .object({
    backlashMin: lengthFigures('published.backlashMin'),
    backlashMax: lengthFigures('published.backlashMax'),
    maxSpread: lengthFigures('published.maxSpread'),
    runoutMax: lengthFigures('published.runoutMax'),
    pinionPreloadNew: torqueBandFigures('published.pinionPreloadNew'),
    pinionPreloadUsed: torqueBandFigures('published.pinionPreloadUsed'),
  })
  .strict();

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
    published: publishedSchema.optional(),
  })
  .strict()
  .transform((values) => withCanonicalFigures(values))
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
