import { archiveSchema, importTeamArchive } from '../../../lib/server/exports/team-import';
import { requireUser } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';

/** Reads a team archive back as a new team owned by the caller (422 naming table, row and field; nothing written). */
export const POST = handle(async ({ locals, request }) => {
  const user = requireUser(locals);
  const archive = await readJson(request, archiveSchema);
  return json(await importTeamArchive(user, archive), 201);
});
