import { passwordResetSchema } from '../../../lib/account-schemas';
import { handle, json, readJson } from '../../../lib/server/http';
import { resetPassword } from '../../../lib/server/password-reset';

/** `{ token, newPassword }` from the mailed link → 200; every session of the person ends. */
export const POST = handle(async ({ request }) => {
  const { token, newPassword } = await readJson(request, passwordResetSchema);
  await resetPassword(token, newPassword);
  return json({ message: 'Your password is changed. Sign in with the new one.' });
});
