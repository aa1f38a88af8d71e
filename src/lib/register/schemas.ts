import { z } from 'zod';
import { PART_KINDS, PART_STATUSES } from './kinds';

/**
 * One schema per thing in the register, shared by the forms, the CSV import and the endpoints.
 */

const optionalText = (max: number, label: string) =>
  z
    .string({ error: `${label} must be text.` })
    .trim()
    .max(max, `${label}: at most ${max} characters.`)
    .transform((value) => (value === '' ? null : value))
    .nullable()
    .optional();

const requiredText = (max: number, label: string) =>
  z
    .string({ error: `Enter the ${label}.` })
    .trim()
    .min(1, `Enter the ${label}.`)
    .max(max, `The ${label} has at most ${max} characters.`);

export const idSchema = (label: string) =>
  z
    .string({ error: `Choose the ${label}.` })
    .min(1, `Choose the ${label}.`)
    .max(64);

export const carCreateSchema = z.object({
  name: requiredText(60, 'car number or name'),
  carClass: optionalText(60, 'Class'),
  notes: optionalText(2000, 'Notes'),
});
export const carUpdateSchema = carCreateSchema.partial();

export const assemblyCreateSchema = z.object({
  serial: requiredText(60, 'serial'),
  name: requiredText(80, 'name'),
  housing: optionalText(120, 'Housing'),
  notes: optionalText(2000, 'Notes'),
});
export const assemblyUpdateSchema = assemblyCreateSchema.partial();

const teeth = (label: string) =>
  z
    .number({ error: `${label} must be a whole number.` })
    .int(`${label} must be a whole number.`)
    .min(3, `${label}: at least 3.`)
    .max(200, `${label}: at most 200.`);

const partFields = {
  kind: z.enum(PART_KINDS, { error: `Choose one of: ${PART_KINDS.join(', ')}.` }),
  serial: requiredText(60, 'serial'),
  status: z.enum(PART_STATUSES, { error: `Choose one of: ${PART_STATUSES.join(', ')}.` }).optional(),
  lifeLimitRuns: z
    .number({ error: 'The life limit must be a whole number of runs.' })
    .int('The life limit must be a whole number of runs.')
    .min(1, 'A life limit is at least 1 run.')
    .max(100_000, 'A life limit is at most 100,000 runs.')
    .nullable()
    .optional(),
  maker: optionalText(80, 'Maker'),
  model: optionalText(80, 'Model'),
  material: optionalText(80, 'Material'),
  notes: optionalText(2000, 'Notes'),
  ringTeeth: teeth('Ring teeth').optional(),
  pinionTeeth: teeth('Pinion teeth').optional(),
  pressureAngleDeg: z
    .number({ error: 'The pressure angle must be a number of degrees.' })
    .min(10, 'Pressure angle: at least 10°.')
    .max(30, 'Pressure angle: at most 30°.')
    .optional(),
  // Gear sets: how the teeth were cut (contact-pattern guidance) and the runout factor k, as a spiral angle or a
  // typed k (null clears it: k from the tooth counts and pressure angle alone).
  cutMethod: z
    .enum(['face-milled', 'face-hobbed', 'unknown'], { error: 'cutMethod: face-milled, face-hobbed or unknown.' })
    .optional(),
  spiralAngleDeg: z
    .number({ error: 'The spiral angle must be a number of degrees.' })
    .min(0, 'Spiral angle: at least 0°.')
    .max(60, 'Spiral angle: at most 60°.')
    .nullable()
    .optional(),
  runoutK: z
    .number({ error: 'runoutK must be a number.' })
    .gt(0, 'runoutK must be more than 0.')
    .max(5, 'runoutK: at most 5.')
    .nullable()
    .optional(),
};

/** A gear set needs both tooth counts, the ring gear having more teeth than the pinion. */
function checkGearTeeth(part: { kind?: string; ringTeeth?: number; pinionTeeth?: number }, ctx: z.RefinementCtx): void {
  if (part.kind !== 'gear-set') return;
  if (part.ringTeeth === undefined)
    ctx.addIssue({ code: 'custom', path: ['ringTeeth'], message: 'A gear set needs its ring-gear tooth count.' });
  if (part.pinionTeeth === undefined)
    ctx.addIssue({ code: 'custom', path: ['pinionTeeth'], message: 'A gear set needs its pinion tooth count.' });
  if (part.ringTeeth !== undefined && part.pinionTeeth !== undefined && part.ringTeeth <= part.pinionTeeth) {
    ctx.addIssue({ code: 'custom', path: ['ringTeeth'], message: 'The ring gear has more teeth than the pinion.' });
  }
}

/** The runout factor is set one way: a spiral angle or a typed k, not both. */
function checkRunoutFactor(
  part: { spiralAngleDeg?: number | null; runoutK?: number | null },
  ctx: z.RefinementCtx,
): void {
  if (typeof part.spiralAngleDeg === 'number' && typeof part.runoutK === 'number')
    ctx.addIssue({ code: 'custom', path: ['runoutK'], message: 'Give a spiral angle or a typed k, not both.' });
}

export const partCreateSchema = z.object(partFields).superRefine(checkGearTeeth).superRefine(checkRunoutFactor);
export const partUpdateSchema = z.object(partFields).omit({ kind: true }).partial().superRefine(checkRunoutFactor);

export const installationSchema = z
  .object({
    action: z.enum(['install', 'remove'], { error: 'Choose install or remove.' }),
    partId: idSchema('part').optional(),
    assemblyId: idSchema('assembly').optional(),
    carId: idSchema('car').optional(),
    at: z.iso
      .datetime({ offset: true, error: 'Give the time as an ISO date-time, e.g. 2026-05-03T14:20:00Z.' })
      .optional(),
    notes: optionalText(500, 'Notes'),
  })
  .superRefine((body, ctx) => {
    if (!body.partId && !body.assemblyId)
      ctx.addIssue({
        code: 'custom',
        path: ['partId'],
        message: 'Name the part (partId) or the assembly (assemblyId) to move.',
      });
    if (body.action === 'install' && body.partId && !body.assemblyId && !body.carId) {
      ctx.addIssue({ code: 'custom', path: ['assemblyId'], message: 'Say where the part goes: assemblyId or carId.' });
    }
    if (body.action === 'install' && !body.partId && body.assemblyId && !body.carId) {
      ctx.addIssue({ code: 'custom', path: ['carId'], message: 'Say which car the assembly goes into.' });
    }
  });

const optionalMeasure = (label: string, max: number) =>
  z
    .number({ error: `${label} must be a number.` })
    .positive(`${label} must be more than 0.`)
    .max(max, `${label}: at most ${max}.`)
    .nullable()
    .optional();

/** The fields of a run, as the log form, the CSV import and the API all take them. */
export const runFieldsSchema = z.object({
  at: z.iso.datetime({ offset: true, error: 'Give the time as an ISO date-time, e.g. 2026-05-03T14:20:00Z.' }),
  event: optionalText(120, 'Event'),
  round: optionalText(60, 'Round'),
  lane: optionalText(20, 'Lane'),
  notes: optionalText(2000, 'Notes'),
  elapsedSeconds: optionalMeasure('Elapsed time', 600),
  speedMph: optionalMeasure('Speed', 400),
});

export const runCreateSchema = runFieldsSchema.extend({ carId: idSchema('car') });
export type RunInput = z.infer<typeof runCreateSchema>;
export const runUpdateSchema = runCreateSchema.partial();

/** A run may be logged up to a day ahead (time zones, clocks); further is a typing slip. */
export const MAX_RUN_LEAD_MS = 24 * 60 * 60 * 1000;

/** The message for a run time too far ahead of `now`, or null when it is fine. */
export function checkRunTime(at: string, now: Date): string | null {
  return Date.parse(at) - now.getTime() > MAX_RUN_LEAD_MS
    ? 'The run is more than a day in the future; check the date.'
    : null;
}

export const listQuerySchema = z.object({
  limit: z.coerce
    .number({ error: 'limit must be a number.' })
    .int()
    .min(1, 'limit: at least 1.')
    .max(500, 'limit: at most 500.')
    .default(50),
  cursor: z.string().max(200).optional(),
});
