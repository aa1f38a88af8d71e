import { findUserById } from '../../../../lib/server/accounts';
import { requireSecondFactorRole } from '../../../../lib/server/account-security';
import { handle, HttpError, json } from '../../../../lib/server/http';
import { beginSecondFactor } from '../../../../lib/server/second-factor';

/** Starts turning on the second factor: the secret and otpauth:// address for an authenticator app. */
export const POST = handle(async ({ locals }) => {
  const user = await findUserById(requireSecondFactorRole(locals).id);
  if (!user) throw new HttpError(401, 'Sign in first.');
  if (user.totpEnabledAt)
    throw new HttpError(409, 'The second factor is already on; turn it off first to change the app.');
  return json(await beginSecondFactor(user), 201);
});
