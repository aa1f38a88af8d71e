import { archiveSchema, importTeamArchive } from '../../../lib/server/exports/team-archive';
import { requireUser } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';

const MAX_ARCHIVE_BYTES = 64 * 1024 * 1024;

/** Reads a team archive back as a new team owned by the caller. */
export const POST = handle(async ({ locals, request }) => {
  const user = requireUser(locals);
  const archive = await readJson(request, archiveSchema, MAX_ARCHIVE_BYTES);
  return json(await importTeamArchive(user, archive), 201);
});
