import { signUpSchema } from '../../../lib/account-schemas';
import { createAccount, userToPublic } from '../../../lib/server/accounts';
import { handle, json, readJson } from '../../../lib/server/http';

/** Sign-up for scripts and tests: `{ email, password, name }` → 201 with the person. */
export const POST = handle(async ({ request }) => {
  const input = await readJson(request, signUpSchema);
  const user = await createAccount(input);
  return json(userToPublic(user), 201);
});
