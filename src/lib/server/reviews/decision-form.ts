import type { z } from 'zod';
import { decisionSchema } from '../../reviews/schemas';

export type DecisionFormResult =
  | { ok: true; decision: z.infer<typeof decisionSchema>; values: Record<string, string>; confirmed: boolean }
  | { ok: false; values: Record<string, string>; fields: Record<string, string> };

const TEXT_FIELDS = ['decision', 'reason', 'notes', 'reinspectAfterRuns'] as const;

/**
 * Reads a decision form of the review page (deciding, or correcting a decision): text fields, any of them
 * missing, checked with the API's schema, which takes the runs as a number. What was typed comes back
 * either way, so a refused form keeps it; `confirmed` is the second press of "check, then record".
 */
export async function readDecisionForm(request: Request): Promise<DecisionFormResult> {
  const form = await request.formData();
  const values: Record<string, string> = {};
  for (const name of TEXT_FIELDS) {
    const value = form.get(name);
    if (typeof value === 'string') values[name] = value;
  }
  const runs = values.reinspectAfterRuns?.trim();
  const parsed = decisionSchema.safeParse({
    decision: values.decision,
    reason: values.reason,
    notes: values.notes || undefined,
    reinspectAfterRuns: runs ? Number(runs) : undefined,
  });
  if (!parsed.success) {
    const fields = Object.fromEntries(parsed.error.issues.map((i) => [i.path.join('.'), i.message]));
    if (fields.decision) fields.decision = 'Choose one of the three decisions.';
    return { ok: false, values, fields };
  }
  return { ok: true, decision: parsed.data, values, confirmed: form.get('confirm') === 'yes' };
}
