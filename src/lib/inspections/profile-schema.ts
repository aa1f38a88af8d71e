import { z } from 'zod';
import {
  FIGURE_PATTERN,
  lengthFiguresToMm,
  numberToFigure,
  torqueFiguresToNm,
  type LengthFigures,
  type PublishedLimits,
  type TorqueFigures,
} from '../analysis/published-limits';
import { publishedLimitsOf, validateProfile, type ToleranceProfile } from '../analysis/tolerance';

/**
 * A tolerance profile as the team edits it, checked by the engine's own rules: each limit as a canonical figure
 * (mm, N·m), as published (`published`: figures as printed, in each unit printed), or both. A limit given only as
 * published gets its canonical figure from it (a team typing its own limit in inches keeps inches); a canonical
 * figure that no longer agrees with the published figures sent beside it wins, and stands as printed in mm or
 * N·m (a client that read a profile, changed one number and sent it back meant that number).
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
const lengthFigures = (label: string) => z.object({ mm: figure(`${label}.mm`), in: figure(`${label}.in`) }).strict();
const torqueFigures = (label: string) =>
  z.object({ 'N-m': figure(`${label}.N-m`), 'lbf-in': figure(`${label}.lbf-in`) }).strict();
const torqueBandFigures = (label: string) =>
  z.object({ min: torqueFigures(`${label}.min`), max: torqueFigures(`${label}.max`) }).strict();

const publishedSchema = z
  .object({
    backlashMin: lengthFigures('published.backlashMin').optional(),
    backlashMax: lengthFigures('published.backlashMax').optional(),
    maxSpread: lengthFigures('published.maxSpread').optional(),
    runoutMax: lengthFigures('published.runoutMax').optional(),
    pinionPreloadNew: torqueBandFigures('published.pinionPreloadNew').optional(),
    pinionPreloadUsed: torqueBandFigures('published.pinionPreloadUsed').optional(),
  })
  .strict();

type PublishedInput = z.output<typeof publishedSchema>;
const LENGTH_FIELDS = ['backlashMin', 'backlashMax', 'maxSpread', 'runoutMax'] as const;
const TORQUE_FIELDS = ['pinionPreloadNew', 'pinionPreloadUsed'] as const;
const hasFigure = (figures: Readonly<Record<string, string | undefined>> | undefined) =>
  figures !== undefined && Object.values(figures).some((f) => f !== undefined);

/** Every limit given one way or the other: the issues naming those given neither way. */
function findMissingLimits(
  values: {
    [K in (typeof LENGTH_FIELDS)[number]]?: number;
  } & { [K in (typeof TORQUE_FIELDS)[number]]?: { min: number; max: number } } & { published?: PublishedInput },
) {
  const issues: { path: string[]; message: string }[] = [];
  for (const field of LENGTH_FIELDS) {
    if (values[field] === undefined && !hasFigure(values.published?.[field]))
      issues.push({ path: [field], message: `Give ${field} in mm, or published.${field} as printed.` });
  }
  for (const field of TORQUE_FIELDS) {
    const printed = values.published?.[field];
    if (values[field] === undefined && !(hasFigure(printed?.min) && hasFigure(printed?.max)))
      issues.push({ path: [field], message: `Give ${field} in N·m, or published.${field} as printed.` });
  }
  return issues;
}

/** The profile as stored: canonical figures settled, and every limit as published beside them. */
function settleProfile(
  values: Parameters<typeof findMissingLimits>[0] &
    Omit<ToleranceProfile, 'published' | (typeof LENGTH_FIELDS)[number] | (typeof TORQUE_FIELDS)[number]>,
): ToleranceProfile {
  const p = values.published ?? {};
  const mm = (field: (typeof LENGTH_FIELDS)[number]) => values[field] ?? lengthFiguresToMm(p[field] as LengthFigures);
  const nm = (field: (typeof TORQUE_FIELDS)[number]) =>
    values[field] ?? {
      min: torqueFiguresToNm(p[field]?.min as TorqueFigures),
      max: torqueFiguresToNm(p[field]?.max as TorqueFigures),
    };
  const canonical = {
    backlashMin: mm('backlashMin'),
    backlashMax: mm('backlashMax'),
    maxSpread: mm('maxSpread'),
    runoutMax: mm('runoutMax'),
    pinionPreloadNew: nm('pinionPreloadNew'),
    pinionPreloadUsed: nm('pinionPreloadUsed'),
  };
  const length = (field: (typeof LENGTH_FIELDS)[number]): LengthFigures =>
    hasFigure(p[field]) ? (p[field] as LengthFigures) : { mm: numberToFigure(canonical[field]) };
  const torque = (field: (typeof TORQUE_FIELDS)[number], side: 'min' | 'max'): TorqueFigures =>
    hasFigure(p[field]?.[side])
      ? (p[field]?.[side] as TorqueFigures)
      : { 'N-m': numberToFigure(canonical[field][side]) };
  const sent: PublishedLimits = {
    backlashMin: length('backlashMin'),
    backlashMax: length('backlashMax'),
    maxSpread: length('maxSpread'),
    runoutMax: length('runoutMax'),
    pinionPreloadNew: { min: torque('pinionPreloadNew', 'min'), max: torque('pinionPreloadNew', 'max') },
    pinionPreloadUsed: { min: torque('pinionPreloadUsed', 'min'), max: torque('pinionPreloadUsed', 'max') },
  };
  const settled = {
    ...canonical,
    hubPreloadCheck: values.hubPreloadCheck,
    lifeLimitRuns: values.lifeLimitRuns,
    nearShare: values.nearShare,
  };
  // Where a canonical figure and its printed figures disagree, the canonical one stands (as printed in mm / N·m).
  return { ...settled, published: publishedLimitsOf({ ...settled, published: sent }) };
}

export const toleranceValuesSchema = z
  .object({
    backlashMin: length('backlashMin').optional(),
    backlashMax: length('backlashMax').optional(),
    maxSpread: length('maxSpread').optional(),
    runoutMax: length('runoutMax').optional(),
    pinionPreloadNew: band('pinionPreloadNew').optional(),
    pinionPreloadUsed: band('pinionPreloadUsed').optional(),
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
  .superRefine((values, ctx) => {
    for (const issue of findMissingLimits(values)) ctx.addIssue({ code: 'custom', ...issue });
  })
  .transform(settleProfile)
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
