import type { z } from 'zod';

/**
 * Maps each issue to its dotted field path (first message per field); unknown keys are named one
 * by one. Issues about the body as a whole go under `rootKey`. Used by every form and endpoint.
 * @example zodIssuesToFields(error) // { 'readings.2': 'Each reading must be 0 or more.' }
 */
export function zodIssuesToFields(error: z.ZodError, rootKey = ''): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const base = issue.path.map(String).join('.');
    const keys =
      issue.code === 'unrecognized_keys' ? issue.keys.map((key) => (base ? `${base}.${key}` : key)) : [base || rootKey];
    const message = issue.code === 'unrecognized_keys' ? 'This field is not expected.' : issue.message;
    for (const key of keys) fields[key] ??= message;
  }
  return fields;
}

/**
 * One sentence naming the first field at fault and how many others there are.
 * @example zodIssuesToMessage(error) // 'readings.2: Each reading must be 0 or more. (1 more field to fix)'
 */
export function zodIssuesToMessage(error: z.ZodError, rootKey = ''): string {
  const entries = Object.entries(zodIssuesToFields(error, rootKey));
  const first = entries[0];
  if (!first) return 'The request is not valid.';
  const more = entries.length - 1;
  const tail = more === 0 ? '' : ` (${more} more field${more === 1 ? '' : 's'} to fix)`;
  return `${first[0] ? `${first[0]}: ` : ''}${first[1]}${tail}`;
}
