import { passwordAndCodeSchema } from '../../../../lib/account-security-schemas';
import { requireUser } from '../../../../lib/server/guard';
import { handle, json, readJson } from '../../../../lib/server/http';
import { remakeRecoveryCodes } from '../../../../lib/server/second-factor';

/** `{ password, code }` → ten new recovery codes in place of the old ones, shown this once. */
export const POST = handle(async ({ locals, request }) => {
  const user = requireUser(locals);
  const { password, code } = await readJson(request, passwordAndCodeSchema);
  return json({ recoveryCodes: await remakeRecoveryCodes(user.id, password, code) });
});
