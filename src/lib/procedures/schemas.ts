import { z } from 'zod';
import { MAX_BOLTS, MIN_BOLTS } from '../analysis/tightening-sequence';
import { LENGTH_UNITS, TORQUE_UNITS, torqueToNm } from '../units';
import { COMPOUND_KINDS, STEP_RECORDS } from './model';

/**
 * Procedures and checklists: one schema per thing, shared by the editor, the checklist runner and the
 * endpoints. Torque limits are checked in N·m, so "at most 2,000 N·m" holds whichever unit was typed.
 */

/** The largest torque figure accepted, in N·m (well above any fastener on a rear end). */
export const MAX_TORQUE_NM = 2000;
/** The most fasteners in a group without a tightening order (a bolt circle has at most 36). */
export const MAX_FASTENERS = 200;

const finite = (label: string) =>
  z.number({ error: `${label} must be a number.` }).refine(Number.isFinite, `${label} must be a finite number.`);
const text = (label: string, max: number) =>
  z
    .string({ error: `${label} must be text.` })
    .trim()
    .max(max, `${label}: at most ${max} characters.`);
const required = (label: string, max: number) => text(label, max).min(1, `${label}: required.`);
const optionalText = (label: string, max: number) =>
  text(label, max)
    .optional()
    .transform((value) => (value ? value : undefined));
const localId = z
  .string({ error: 'id must be text.' })
  .regex(/^[A-Za-z0-9_-]{1,64}$/, 'id: 1 to 64 letters, digits, - or _.')
  .optional();

export const torqueUnitSchema = z.enum(TORQUE_UNITS as [string, ...string[]], {
  error: 'unit: lbf-ft, lbf-in or N-m.',
}) as z.ZodType<(typeof TORQUE_UNITS)[number]>;

/** A torque figure: above 0 and at most 2,000 N·m, in any unit. */
export const torqueSchema = z
  .object({ value: finite('value'), unit: torqueUnitSchema })
  .strict()
  .superRefine((torque, context) => {
    const nm = torqueToNm(torque.value, torque.unit);
    if (!(nm > 0) || nm > MAX_TORQUE_NM)
      context.addIssue({
        code: 'custom',
        path: ['value'],
        message: `value: above 0 and at most ${MAX_TORQUE_NM.toLocaleString('en-US')} N·m (in any unit).`,
      });
  });

/** Passes as rising percentages of the figure, ending at 100 (e.g. 30, 70, 100). */
export const passesSchema = z
  .array(finite('Each pass'), { error: 'passesPercent: a list of percentages.' })
  .min(1, 'passesPercent: at least one pass.')
  .max(10, 'passesPercent: at most 10 passes.')
  .superRefine((passes, context) => {
    const rising = passes.every((pass, i) => pass > 0 && (i === 0 || pass > passes[i - 1]!));
    if (!rising || passes[passes.length - 1] !== 100)
      context.addIssue({ code: 'custom', message: 'passesPercent: rising percentages above 0, ending at 100.' });
  });

export const compoundSchema = z
  .object({
    kind: z.enum(COMPOUND_KINDS, { error: 'kind: thread-locker, sealant, lubricant or other.' }),
    note: optionalText('note', 300),
  })
  .strict();

export const fastenersSchema = z
  .object({
    count: z
      .number({ error: 'count must be a number.' })
      .int('count: a whole number.')
      .min(1, 'count: at least 1.')
      .max(MAX_FASTENERS, `count: at most ${MAX_FASTENERS}.`),
    description: optionalText('description', 200),
    torque: torqueSchema.optional(),
    torqueSource: optionalText('torqueSource', 200),
    passesPercent: passesSchema.optional(),
    sequence: z.boolean({ error: 'sequence: true or false.' }).optional(),
    compound: compoundSchema.optional(),
  })
  .strict()
  .superRefine((group, context) => {
    if (group.torque && !group.torqueSource)
      context.addIssue({
        code: 'custom',
        path: ['torqueSource'],
        message: 'torqueSource: say where the figure comes from (e.g. "part maker\'s sheet").',
      });
    if (group.sequence && (group.count < MIN_BOLTS || group.count > MAX_BOLTS))
      context.addIssue({
        code: 'custom',
        path: ['count'],
        message: `count: a tightening order needs ${MIN_BOLTS} to ${MAX_BOLTS} bolts.`,
      });
  })
  .transform((group) => ({ ...group, passesPercent: group.passesPercent ?? [100], sequence: group.sequence ?? false }));

export const stepSchema = z
  .object({
    id: localId,
    title: required('title', 200),
    instructions: optionalText('instructions', 10_000),
    caution: optionalText('caution', 1000),
    fasteners: fastenersSchema.optional(),
    records: z.enum(STEP_RECORDS, { error: 'records: turning-torque, backlash, runout or note.' }).optional(),
  })
  .strict();

export const sectionSchema = z
  .object({
    id: localId,
    title: required('title', 200),
    steps: z.array(stepSchema, { error: 'steps: a list.' }).min(1, 'steps: at least one.').max(200),
  })
  .strict();

/** The body of POST /api/procedures and PUT /api/procedures/:id (a PUT makes a new version). */
export const procedureSchema = z
  .object({
    name: required('name', 120),
    purpose: optionalText('purpose', 300),
    appliesTo: optionalText('appliesTo', 300),
    notes: optionalText('notes', 5000),
    sections: z.array(sectionSchema, { error: 'sections: a list.' }).min(1, 'sections: at least one.').max(50),
  })
  .strict()
  .superRefine((procedure, context) => {
    const seen = new Set<string>();
    procedure.sections.forEach((section, s) => {
      const ids: [string | undefined, (string | number)[]][] = [
        [section.id, ['sections', s, 'id']],
        ...section.steps.map((step, i): [string | undefined, (string | number)[]] => [
          step.id,
          ['sections', s, 'steps', i, 'id'],
        ]),
      ];
      for (const [id, path] of ids) {
        if (id === undefined) continue;
        if (seen.has(id)) context.addIssue({ code: 'custom', path, message: 'id: used twice in this procedure.' });
        seen.add(id);
      }
    });
  });
export type ProcedureInput = z.infer<typeof procedureSchema>;

export const archiveSchema = z.object({ archived: z.boolean({ error: 'archived: true or false.' }) }).strict();

/** The body of POST /api/checklists: a procedure and the assembly or the gear set (or both). */
export const checklistStartSchema = z
  .object({
    procedureId: required('procedureId', 64),
    assemblyId: optionalText('assemblyId', 64),
    gearSetId: optionalText('gearSetId', 64),
  })
  .strict()
  .refine((body) => body.assemblyId || body.gearSetId, {
    path: ['assemblyId'],
    message: 'assemblyId: name the assembly or the gear set (gearSetId), or both.',
  });

export const appliedTorqueSchema = z
  .object({
    pass: z.number({ error: 'pass must be a number.' }).int('pass: a whole number.').min(1, 'pass: 1 or more.'),
    value: finite('value'),
    unit: torqueUnitSchema,
  })
  .strict()
  .superRefine((applied, context) => {
    const nm = torqueToNm(applied.value, applied.unit);
    if (!(nm > 0) || nm > MAX_TORQUE_NM)
      context.addIssue({
        code: 'custom',
        path: ['value'],
        message: `value: above 0 and at most ${MAX_TORQUE_NM.toLocaleString('en-US')} N·m (in any unit).`,
      });
  });

const VALUE_UNITS = [...LENGTH_UNITS, ...TORQUE_UNITS] as [string, ...string[]];

/** The body of PATCH /api/checklists/:id/steps/:stepId: one step's state as the technician left it. */
export const stepChangeSchema = z
  .object({
    status: z.enum(['done', 'skipped'], { error: 'status: done or skipped.' }),
    reason: optionalText('reason', 500),
    torqueApplied: z.array(appliedTorqueSchema, { error: 'torqueApplied: a list.' }).max(10).optional(),
    boltsInOrder: z
      .array(z.number({ error: 'Each bolt must be a number.' }).int('Each bolt: a whole number.'), {
        error: 'boltsInOrder: a list of bolt numbers.',
      })
      .max(36, 'boltsInOrder: at most 36 bolts.')
      .optional(),
    value: finite('value').min(0, 'value: 0 or more.').max(MAX_TORQUE_NM, 'value: too large.').optional(),
    valueUnit: z.enum(VALUE_UNITS, { error: 'valueUnit: in, mm, N-m, lbf-in or lbf-ft.' }).optional(),
    note: optionalText('note', 2000),
    /** When the change was made on the device; the later of two changes to one step wins. */
    at: z.iso.datetime({ offset: true, error: 'at: an ISO 8601 date and time.' }).optional(),
  })
  .strict()
  .superRefine((change, context) => {
    if (change.status === 'skipped' && !change.reason)
      context.addIssue({ code: 'custom', path: ['reason'], message: 'reason: say why the step was skipped.' });
    const passes = change.torqueApplied?.map((t) => t.pass) ?? [];
    if (new Set(passes).size !== passes.length)
      context.addIssue({ code: 'custom', path: ['torqueApplied'], message: 'torqueApplied: one value per pass.' });
    if (change.value !== undefined && !change.valueUnit)
      context.addIssue({ code: 'custom', path: ['valueUnit'], message: 'valueUnit: the unit of value.' });
  });
export type StepChange = z.infer<typeof stepChangeSchema>;
/** A step change as a client sends it. */
export type StepChangeInput = z.input<typeof stepChangeSchema>;

export const signOffSchema = z.object({ note: optionalText('note', 1000) }).strict();
