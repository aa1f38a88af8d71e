import { disableSecondFactorSchema } from '../../../../lib/account-security-schemas';
import { requireUser } from '../../../../lib/server/guard';
import { handle, json, readJson } from '../../../../lib/server/http';
import { disableSecondFactor } from '../../../../lib/server/second-factor';

/** `{ password, code }` → the second factor is off and every session ends. */
export const POST = handle(async ({ locals, request }) => {
  const user = requireUser(locals);
  const { password, code } = await readJson(request, disableSecondFactorSchema);
  await disableSecondFactor(user.id, password, code);
  return json({ enabled: false, signedOut: true });
});
