import { signUpSchema } from '../../../lib/account-schemas';
import { createAccount, userToPublic } from '../../../lib/server/accounts';
import { resolveBaseUrl } from '../../../lib/server/base-url';
import { handle, json, readJson } from '../../../lib/server/http';

/**
 * Sign-up for scripts and tests: `{ email, password, name }` → 201 with the person, whose address is
 * mailed a verification link; 202 when the address has an account a team import made (its owner is
 * mailed a link to choose the password instead).
 */
export const POST = handle(async ({ request, url, clientAddress }) => {
  const input = await readJson(request, signUpSchema);
  const outcome = await createAccount(input, { baseUrl: resolveBaseUrl(url), clientAddress });
  if (outcome.kind === 'claim-mailed')
    return json({ message: 'This address already has an account; a link to choose its password is in its mail.' }, 202);
  return json(userToPublic(outcome.user), 201);
});
