import { accountSettingsSchema } from '../../../lib/account-schemas';
import { updateAccountSettings, userToPublic } from '../../../lib/server/accounts';
import { requireUser } from '../../../lib/server/guard';
import { countRecoveryCodesLeft } from '../../../lib/server/recovery-codes';
import { handle, json, readJson } from '../../../lib/server/http';

/**
 * The signed-in person, with their current team and role; with a second factor on, how many recovery
 * codes are left (0 asks for new ones: POST /api/account/second-factor/recovery-codes).
 */
export const GET = handle(async ({ locals }) => {
  const user = requireUser(locals);
  const recoveryCodesLeft = user.secondFactor ? await countRecoveryCodesLeft(user.id) : null;
  return json({ ...user, recoveryCodesLeft, team: locals.team });
});

/** Name and units (`lengthUnit`: in | mm, `torqueUnit`: lbf-in | N-m). */
export const PATCH = handle(async ({ request, locals }) => {
  const user = requireUser(locals);
  const changes = await readJson(request, accountSettingsSchema);
  return json(userToPublic(await updateAccountSettings(user.id, changes)));
});
