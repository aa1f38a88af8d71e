import { profileUpdateSchema } from '../../../lib/inspections/profile-schema';
import { requireMember, requirePermission } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';
import { getProfile, listProfileVersions, updateProfile } from '../../../lib/server/inspections/profiles';

/** The newest version, and with `?versions=1` every version. */
export const GET = handle(async ({ locals, params, url }) => {
  const { team } = requireMember(locals);
  if (url.searchParams.get('versions') === '1')
    return json({ items: await listProfileVersions(team.id, params.id ?? ''), nextCursor: null });
  return json(await getProfile(team.id, params.id ?? ''));
});

/** Saves a new version; inspections already submitted keep theirs. */
export const PUT = handle(async ({ locals, params, request }) => {
  const access = requirePermission(locals, 'specs:edit');
  return json(await updateProfile(access, params.id ?? '', await readJson(request, profileUpdateSchema)));
});
