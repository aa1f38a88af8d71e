import { profileCreateSchema } from '../../../lib/inspections/profile-schema';
import { requireMember, requirePermission } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';
import { createProfile, listProfiles } from '../../../lib/server/inspections/profiles';

/** The team's tolerance profiles (newest version of each), with the source of every default. */
export const GET = handle(async ({ locals }) => {
  const { team } = requireMember(locals);
  return json({ items: await listProfiles(team.id), nextCursor: null });
});

/** `{ name, values }` in mm and N·m → 201 (crew chief or owner). */
export const POST = handle(async ({ locals, request }) => {
  const access = requirePermission(locals, 'specs:edit');
  return json(await createProfile(access, await readJson(request, profileCreateSchema)), 201);
});
