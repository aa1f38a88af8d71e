// Request schemas shared by the forms and the /api/analysis endpoints. Objects are strict, so a misspelt
// optional field ("pressureAngle") is an error instead of a silent default.

import { z } from 'zod';
import { MAX_POSITIONS, MIN_POSITIONS } from './harmonic-fit';
import { MAX_BOLTS, MIN_BOLTS } from './tightening-sequence';
import { MM_PER_INCH } from '../units';

/** Largest plausible backlash or runout reading: 2.5 mm (about 0.098 in). */
export const MAX_READING_MM = 2.5;
const MAX_READING: Readonly<Record<'in' | 'mm', number>> = { mm: MAX_READING_MM, in: MAX_READING_MM / MM_PER_INCH };

const lengthValue = (what: string) =>
  z.number({ error: `${what} must be a number.` }).min(0, { error: `${what} must be 0 or more.` });

const teeth = (what: string) =>
  z
    .number({ error: `${what} must be a number.` })
    .int({ error: `${what} must be a whole number.` })
    .min(1, { error: `${what} must be 1 or more.` })
    .max(1000, { error: `${what} must be 1000 or fewer.` });

export const backlashRequestSchema = z
  .strictObject(
    {
      unit: z.enum(['in', 'mm'], { error: 'unit must be "in" or "mm".' }),
      readings: z
        .array(lengthValue('Each reading'), { error: 'readings must be a list of numbers.' })
        .min(MIN_POSITIONS, { error: `Give at least ${MIN_POSITIONS} readings, evenly spaced around the ring gear.` })
        .max(MAX_POSITIONS, { error: `Give at most ${MAX_POSITIONS} readings.` }),
      profile: z
        .strictObject(
          { min: lengthValue('Backlash min'), max: lengthValue('Backlash max'), maxSpread: lengthValue('Max spread') },
          { error: 'profile must be { min, max, maxSpread } in the readings unit.' },
        )
        .optional(),
      ringTeeth: teeth('ringTeeth').optional(),
      pinionTeeth: teeth('pinionTeeth').optional(),
      pressureAngleDeg: z
        .number({ error: 'pressureAngleDeg must be a number.' })
        .min(10, { error: 'pressureAngleDeg must be 10° or more.' })
        .max(30, { error: 'pressureAngleDeg must be 30° or less.' })
        .optional(),
    },
    { error: 'The body must be a JSON object with unit and readings.' },
  )
  .superRefine((body, ctx) => {
    const largest = MAX_READING[body.unit];
    body.readings.forEach((reading, index) => {
      if (reading > largest) {
        const shown = body.unit === 'in' ? largest.toFixed(4) : String(largest);
        const message = `Reading ${index + 1} (${reading} ${body.unit}) is above ${shown} ${body.unit}; check the unit.`;
        ctx.addIssue({ code: 'custom', path: ['readings', index], message });
      }
    });
    if (body.profile && body.profile.min > body.profile.max) {
      const message = `Backlash min (${body.profile.min}) is above max (${body.profile.max}).`;
      ctx.addIssue({ code: 'custom', path: ['profile', 'min'], message });
    }
    if ((body.ringTeeth === undefined) !== (body.pinionTeeth === undefined)) {
      const missing = body.ringTeeth === undefined ? 'ringTeeth' : 'pinionTeeth';
      ctx.addIssue({
        code: 'custom',
        path: [missing],
        message: `Give both tooth counts or neither; ${missing} is missing.`,
      });
    }
  });

export type BacklashRequest = z.output<typeof backlashRequestSchema>;

const limitBand = z.strictObject({
  min: z.number({ error: 'limit.min must be a number.' }).optional(),
  max: z.number({ error: 'limit.max must be a number.' }).optional(),
});

export const trendRequestSchema = z
  .strictObject(
    {
      points: z
        .array(
          z.strictObject(
            {
              runs: z
                .number({ error: 'runs must be a number.' })
                .int({ error: 'runs must be a whole number.' })
                .min(0, { error: 'runs must be 0 or more.' }),
              value: z.number({ error: 'value must be a number.' }),
            },
            { error: 'Each point must be { runs, value }.' },
          ),
          { error: 'points must be a list of { runs, value }.' },
        )
        .min(1, { error: 'Give at least one point.' })
        .max(1000, { error: 'Give at most 1000 points.' }),
      limit: z.union([z.number(), limitBand], { error: 'limit must be a number or { min, max }.' }).optional(),
    },
    { error: 'The body must be a JSON object with points.' },
  )
  .superRefine((body, ctx) => {
    const { limit } = body;
    if (limit === undefined || typeof limit === 'number') return;
    if (limit.min === undefined && limit.max === undefined) {
      ctx.addIssue({ code: 'custom', path: ['limit'], message: 'limit needs a min, a max or both.' });
    } else if (limit.min !== undefined && limit.max !== undefined && limit.min > limit.max) {
      ctx.addIssue({
        code: 'custom',
        path: ['limit', 'min'],
        message: `limit.min (${limit.min}) is above limit.max (${limit.max}).`,
      });
    }
  });

export type TrendRequest = z.output<typeof trendRequestSchema>;

// Query strings carry other parameters too (cache busters), so this one is not strict.
export const tighteningQuerySchema = z.object({
  bolts: z.coerce
    .number({ error: 'bolts must be a number.' })
    .int({ error: 'bolts must be a whole number.' })
    .min(MIN_BOLTS, { error: `bolts must be ${MIN_BOLTS} or more.` })
    .max(MAX_BOLTS, { error: `bolts must be ${MAX_BOLTS} or fewer.` }),
});

export type TighteningQuery = z.output<typeof tighteningQuerySchema>;

export { zodIssuesToFields, zodIssuesToMessage } from '../validation';
