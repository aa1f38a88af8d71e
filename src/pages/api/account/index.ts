import { accountSettingsSchema } from '../../../lib/account-schemas';
import { updateAccountSettings, userToPublic } from '../../../lib/server/accounts';
import { requireUser } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';

/** The signed-in person, with their current team and role. */
export const GET = handle(({ locals }) => {
  const user = requireUser(locals);
  return json({ ...user, team: locals.team });
});

/** Name and units (`lengthUnit`: in | mm, `torqueUnit`: lbf-in | N-m). */
export const PATCH = handle(async ({ request, locals }) => {
  const user = requireUser(locals);
  const changes = await readJson(request, accountSettingsSchema);
  return json(userToPublic(await updateAccountSettings(user.id, changes)));
});
