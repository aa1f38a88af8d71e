import { codeSchema } from '../../../../lib/account-security-schemas';
import { requireSecondFactorRole } from '../../../../lib/server/account-security';
import { handle, json, readJson } from '../../../../lib/server/http';
import { confirmSecondFactor } from '../../../../lib/server/second-factor';

/** `{ code }` from the app → the second factor is on; answers the recovery codes, shown this once. */
export const POST = handle(async ({ locals, request }) => {
  const user = requireSecondFactorRole(locals);
  const { code } = await readJson(request, codeSchema);
  return json({ enabled: true, recoveryCodes: await confirmSecondFactor(user.id, code) });
});
