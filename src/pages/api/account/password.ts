import { passwordChangeSchema } from '../../../lib/account-schemas';
import { changePassword } from '../../../lib/server/accounts';
import { requireUser } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';

/** Changes the password; every session of the person ends, this one included. */
export const POST = handle(async ({ request, locals }) => {
  const user = requireUser(locals);
  const { currentPassword, newPassword } = await readJson(request, passwordChangeSchema);
  await changePassword(user.id, currentPassword, newPassword);
  return json({ changed: true, signedOut: true });
});
