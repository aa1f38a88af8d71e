import { z } from 'zod';
import {
  INDICATOR_RESOLUTIONS,
  lengthLimitToText,
  lengthToMm,
  nmToTorque,
  torqueToNm,
  torqueUnitToLabel,
  type LengthUnit,
  type TorqueUnit,
} from '../units';

/**
 * The inspection sheet: one schema for the form in the browser and for the endpoints. Values come
 * in the entry unit (`unit` for lengths, `torqueUnit` for torques); limits are checked on the
 * canonical value, so "at most 2.5 mm" holds whichever unit was typed.
 */

export const RESOLUTION_IDS = INDICATOR_RESOLUTIONS.map((r) => r.id) as [string, ...string[]];
export const SEVERITIES = ['none', 'light', 'moderate', 'severe'] as const;
export type Severity = (typeof SEVERITIES)[number];
export const TOOTH_FINDINGS = ['pitting', 'spalling', 'scoring', 'chipped', 'cracked', 'heat-discolouration'] as const;
export const CONDITION_AREAS = ['splines', 'bearings', 'seals'] as const;

const RESOLUTION_HINT = `Give one of ${RESOLUTION_IDS.join(', ')}, or one graduation as a number in the inspection's unit (0.0005 with unit "in").`;
const INSPECTED_AT_HINT = 'Give a date (2026-05-03) or an ISO date-time, e.g. 2026-05-03T14:20:00Z.';

/**
 * The resolution id of a graduation typed as a number in the inspection's unit, or undefined for none.
 * @example numberToResolutionId(0.0005, 'in') // '0.0005in'
 */
export function numberToResolutionId(step: number, unit: LengthUnit): string | undefined {
  return INDICATOR_RESOLUTIONS.find((r) => r.unit === unit && Math.abs(r.step - step) <= 1e-9 * r.step)?.id;
}

/**
 * A plain date is that day at noon. Teams have no time zone yet, so noon UTC until they do (issue 16): a date
 * typed anywhere from UTC−11 to UTC+11 stays on its own day. A date-time is left as it is.
 * @example plainDateToNoon('2026-05-03') // '2026-05-03T12:00:00Z'
 */
export function plainDateToNoon(text: string): string {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(text)) return text;
  const noon = `${text}T12:00:00Z`;
  // 2026-02-30 is no day: leave it for the date-time check to refuse.
  return new Date(noon).toISOString().slice(0, 10) === text ? noon : text;
}

/** Field limits in canonical units. */
export const LIMITS = {
  backlashMm: 2.5,
  runoutMm: 2.5,
  shimMm: 5,
  depthChangeMm: 5,
  torqueNm: 20,
  runs: 100_000,
} as const;

const number = (label: string) =>
  z.number({ error: `${label} must be a number.` }).refine(Number.isFinite, `${label} must be a finite number.`);
const fraction = (label: string) =>
  number(label)
    .min(0, `${label}: 0 (toe or flank) to 1 (heel or face).`)
    .max(1, `${label}: 0 (toe or flank) to 1 (heel or face).`);

const patternSchema = z
  .object({
    along: fraction('Along the tooth'),
    up: fraction('Up the tooth'),
    length: fraction('Pattern length').optional(),
  })
  .nullable()
  .optional();

const hubSideSchema = z
  .object({
    unchanged: z.boolean({ error: 'Say whether the turning effort stayed the same.' }).nullable(),
    torque: number('Hub turning torque').min(0, 'Hub turning torque is 0 or more.').optional(),
  })
  .optional();

const text = (max: number, label: string) =>
  z
    .string({ error: `${label} must be text.` })
    .trim()
    .max(max, `${label}: at most ${max} characters.`)
    .optional();

const fields = {
  gearSetId: z.string({ error: 'Choose the gear set.' }).min(1, 'Choose the gear set.').max(64),
  assemblyId: z.string().min(1).max(64).nullable().optional(),
  inspectedAt: z
    .string({ error: INSPECTED_AT_HINT })
    .transform(plainDateToNoon)
    .pipe(z.iso.datetime({ offset: true, error: INSPECTED_AT_HINT })),
  runsAtInspection: z
    .number({ error: 'Runs at inspection must be a whole number.' })
    .int('Runs at inspection must be a whole number.')
    .min(0, 'Runs at inspection is 0 or more.')
    .max(LIMITS.runs, `Runs at inspection: at most ${LIMITS.runs.toLocaleString('en')}.`),
  runsChangeReason: text(500, 'The reason'),
  technicianId: z.string().min(1).max(64).nullable().optional(),
  unit: z.enum(['in', 'mm'], { error: 'Give "in" or "mm".' }),
  // An id ("0.0005in") or one graduation as a number in the inspection's unit (0.0005 with unit "in").
  resolution: z.union([z.enum(RESOLUTION_IDS), z.number()], { error: RESOLUTION_HINT }),
  torqueUnit: z.enum(['lbf-in', 'N-m'], { error: 'Give "lbf-in" or "N-m".' }).default('lbf-in'),
  readings: z
    .array(number('Each reading').min(0, 'Each reading is 0 or more.').nullable(), {
      error: 'readings: a list of backlash readings.',
    })
    .min(3, 'Take at least 3 readings around the ring gear.')
    .max(24, 'At most 24 readings.'),
  runout: z
    .object({
      backFace: number('Back-face runout').min(0, 'Runout is 0 or more.').nullable().optional(),
      radial: number('Radial runout').min(0, 'Runout is 0 or more.').nullable().optional(),
    })
    .optional(),
  pinion: z
    .object({
      shims: z
        .array(number('Each shim').min(0, 'A shim is 0 or more thick.'))
        .max(12, 'At most 12 shims in the stack.')
        .default([]),
      depthChange: number('The depth change').nullable().optional(),
      marking: text(20, 'The pinion marking'),
    })
    .optional(),
  carrierShims: z
    .object({
      left: number('Left carrier shim').min(0).nullable().optional(),
      right: number('Right carrier shim').min(0).nullable().optional(),
    })
    .optional(),
  preload: z
    .object({
      pinionTorque: number('Pinion turning torque').min(0, 'Torque is 0 or more.').nullable().optional(),
      bearings: z.enum(['new', 'used'], { error: 'Give "new" or "used".' }).default('used'),
      hubLeft: hubSideSchema,
      hubRight: hubSideSchema,
    })
    .optional(),
  patterns: z.object({ drive: patternSchema, coast: patternSchema }).optional(),
  condition: z
    .object({
      teeth: z
        .array(
          z.object({
            finding: z.enum(TOOTH_FINDINGS, { error: 'Choose a tooth finding.' }),
            severity: z.enum(SEVERITIES, { error: 'Choose a severity.' }),
          }),
        )
        .max(12)
        .default([]),
      splines: z.enum(SEVERITIES).default('none'),
      bearings: z.enum(SEVERITIES).default('none'),
      seals: z.enum(SEVERITIES).default('none'),
    })
    .optional(),
  notes: text(5000, 'Notes'),
};

type Issue = { path: (string | number)[]; message: string };

/** Every length and torque within its limit once converted to canonical units. */
export function findLimitIssues(body: {
  unit: LengthUnit;
  torqueUnit: TorqueUnit;
  readings?: (number | null)[];
  runout?: { backFace?: number | null; radial?: number | null };
  pinion?: { shims?: number[]; depthChange?: number | null };
  carrierShims?: { left?: number | null; right?: number | null };
  preload?: { pinionTorque?: number | null; hubLeft?: { torque?: number }; hubRight?: { torque?: number } };
}): Issue[] {
  const issues: Issue[] = [];
  // Worded in the entry unit: the technician typed inches, so the limit is said in inches.
  const label = (mm: number) => lengthLimitToText(mm, body.unit);
  const length = (
    value: number | null | undefined,
    maxMm: number,
    path: (string | number)[],
    name: string,
    signed = false,
  ) => {
    if (value === null || value === undefined) return;
    const mm = Math.abs(lengthToMm(value, body.unit));
    if (mm > maxMm) issues.push({ path, message: `${name}: at most ${signed ? '±' : ''}${label(maxMm)}.` });
  };
  const torque = (value: number | null | undefined, path: (string | number)[], name: string) => {
    if (value === null || value === undefined) return;
    if (torqueToNm(value, body.torqueUnit) > LIMITS.torqueNm)
      issues.push({
        path,
        message: `${name}: at most ${Number(nmToTorque(LIMITS.torqueNm, body.torqueUnit).toFixed(1))} ${torqueUnitToLabel(body.torqueUnit)}.`,
      });
  };
  body.readings?.forEach((value, i) => length(value, LIMITS.backlashMm, ['readings', i], `Reading ${i + 1}`));
  length(body.runout?.backFace, LIMITS.runoutMm, ['runout', 'backFace'], 'Back-face runout');
  length(body.runout?.radial, LIMITS.runoutMm, ['runout', 'radial'], 'Radial runout');
  body.pinion?.shims?.forEach((value, i) => length(value, LIMITS.shimMm, ['pinion', 'shims', i], `Shim ${i + 1}`));
  length(body.pinion?.depthChange, LIMITS.depthChangeMm, ['pinion', 'depthChange'], 'Depth change', true);
  length(body.carrierShims?.left, LIMITS.shimMm, ['carrierShims', 'left'], 'Left carrier shim');
  length(body.carrierShims?.right, LIMITS.shimMm, ['carrierShims', 'right'], 'Right carrier shim');
  torque(body.preload?.pinionTorque, ['preload', 'pinionTorque'], 'Pinion turning torque');
  torque(body.preload?.hubLeft?.torque, ['preload', 'hubLeft', 'torque'], 'Left hub torque');
  torque(body.preload?.hubRight?.torque, ['preload', 'hubRight', 'torque'], 'Right hub torque');
  return issues;
}

const withLimits = <T extends z.ZodType<Parameters<typeof findLimitIssues>[0] & { resolution: string | number }>>(
  schema: T,
) =>
  schema
    .superRefine((body, ctx) => {
      if (typeof body.resolution === 'number' && !numberToResolutionId(body.resolution, body.unit))
        ctx.addIssue({ code: 'custom', path: ['resolution'], message: RESOLUTION_HINT });
      for (const issue of findLimitIssues(body))
        ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
    })
    .transform((body) => ({
      ...body,
      resolution:
        typeof body.resolution === 'number'
          ? (numberToResolutionId(body.resolution, body.unit) as string)
          : body.resolution,
    }));

/** A draft as created or replaced: positions not read yet may be null. */
export const inspectionDraftSchema = withLimits(z.object(fields).strict());
export type InspectionDraftInput = z.input<typeof inspectionDraftSchema>;
export type InspectionDraft = z.output<typeof inspectionDraftSchema>;

/** An update: any subset of the fields (the gear set stays). */
export const inspectionPatchSchema = z.object(fields).omit({ gearSetId: true }).partial().strict();

/** What a submitted inspection must have: every position read. */
export function findMissingForSubmit(draft: Pick<InspectionDraft, 'readings'>): Issue[] {
  return draft.readings.flatMap((value, i) =>
    value === null ? [{ path: ['readings', i], message: `Position ${i + 1} has no reading yet.` }] : [],
  );
}
