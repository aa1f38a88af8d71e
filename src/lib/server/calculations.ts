import type { APIRoute } from 'astro';
import type { z } from 'zod';
import { analyseBacklash, analyseTrend, tighteningSequence } from '../analysis';
import { backlashRequestSchema, tighteningQuerySchema, trendRequestSchema } from '../analysis/schemas';
import { bodyLimitFor } from './body-limits';
import { requireMember } from './guard';
import { handle, json, parseWith, readJson } from './http';

/**
 * A stateless calculation any member of a team may ask for: its input checked by one schema, nothing
 * read from the team's records, nothing stored. The same description is served two ways — as an Astro
 * endpoint (`calculationEndpoint`, what `astro dev` and every unusual request get) and by the fast lane
 * beside Astro's pipeline (`src/fast-lane.ts`, the built server's hot path) — so the two cannot drift.
 */
export interface Calculation<S extends z.ZodType = z.ZodType> {
  method: 'GET' | 'POST';
  path: string;
  /** POST: the JSON body's schema; GET: the query string's, as an object of strings. */
  schema: S;
  /** POST: the largest body accepted (413 past it). */
  maxBodyBytes: number;
  answer: (input: z.infer<S>) => unknown;
}

function defineCalculation<S extends z.ZodType>(calculation: Calculation<S>): Calculation<S> {
  return calculation;
}

const MAX_BODY_BYTES = bodyLimitFor('/api/analysis/');

/** Every calculation route, by name. */
export const CALCULATIONS = {
  /** `{ unit, readings, profile?, ringTeeth?, pinionTeeth?, pressureAngleDeg? }` → statistics, fit, verdicts. */
  backlash: defineCalculation({
    method: 'POST',
    path: '/api/analysis/backlash',
    schema: backlashRequestSchema,
    maxBodyBytes: MAX_BODY_BYTES,
    answer: analyseBacklash,
  }),
  /** `{ points: [{ runs, value }], limit? }` → the fitted line and where it meets the limit. */
  trend: defineCalculation({
    method: 'POST',
    path: '/api/analysis/trend',
    schema: trendRequestSchema,
    maxBodyBytes: MAX_BODY_BYTES,
    answer: analyseTrend,
  }),
  /** `?bolts=N` (3–36) → `{ bolts, sequence }`, the cross order for bolts numbered clockwise from 1. */
  tighteningSequence: defineCalculation({
    method: 'GET',
    path: '/api/analysis/tightening-sequence',
    schema: tighteningQuerySchema,
    maxBodyBytes: 0,
    answer: ({ bolts }) => tighteningSequence(bolts),
  }),
} as const;

/** Reads a calculation's input from a query string (GET) — the one place both transports parse it. */
export function readCalculationQuery<S extends z.ZodType>(
  calculation: Calculation<S>,
  params: URLSearchParams,
): z.infer<S> {
  return parseWith(calculation.schema, Object.fromEntries(params));
}

/** The Astro endpoint for a calculation: any member, input checked, the answer as JSON. */
export function calculationEndpoint<S extends z.ZodType>(calculation: Calculation<S>): APIRoute {
  return handle(async ({ request, url, locals }) => {
    requireMember(locals);
    const input =
      calculation.method === 'POST'
        ? await readJson(request, calculation.schema, calculation.maxBodyBytes)
        : readCalculationQuery(calculation, url.searchParams);
    return json(calculation.answer(input));
  });
}
