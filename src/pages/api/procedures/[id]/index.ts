import { z } from 'zod';
import { procedureSchema } from '../../../../lib/procedures/schemas';
import { requireMember, requirePermission } from '../../../../lib/server/guard';
import { handle, json, parseWith, readJson } from '../../../../lib/server/http';
import { getProcedure, updateProcedure } from '../../../../lib/server/procedures/procedures';

const versionQuery = z.object({
  version: z.coerce
    .number({ error: 'version: a version number.' })
    .int('version: a whole number.')
    .min(1, 'version: 1 or more.')
    .optional(),
});

/** The current version, or `?version=N` (any member). */
export const GET = handle(async ({ locals, params, url }) => {
  const { team } = requireMember(locals);
  const { version } = parseWith(versionQuery, { version: url.searchParams.get('version') ?? undefined });
  return json(await getProcedure(team.id, params.id ?? '', version));
});

/** Saves the procedure as a new version (crew chief or owner); checklists keep the version they followed. */
export const PUT = handle(async ({ locals, params, request }) => {
  const access = requirePermission(locals, 'procedures:edit');
  const input = await readJson(request, procedureSchema);
  return json(await updateProcedure(access, params.id ?? '', input));
});
