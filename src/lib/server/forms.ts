import type { z } from 'zod';
import { zodIssuesToFields } from '../validation';

export type FormResult<T> =
  { ok: true; data: T } | { ok: false; fields: Record<string, string>; values: Record<string, string> };

/** Reads a posted HTML form and validates it with the same schema the JSON endpoint uses. */
export async function readForm<S extends z.ZodType>(request: Request, schema: S): Promise<FormResult<z.infer<S>>> {
  const form = await request.formData();
  const values: Record<string, string> = {};
  for (const [key, value] of form.entries()) if (typeof value === 'string') values[key] = value;
  const parsed = schema.safeParse(values);
  if (parsed.success) return { ok: true, data: parsed.data };
  return { ok: false, fields: zodIssuesToFields(parsed.error), values };
}
