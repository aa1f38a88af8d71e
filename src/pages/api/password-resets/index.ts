import { mailLinkRequestSchema } from '../../../lib/account-schemas';
import { resolveBaseUrl } from '../../../lib/server/base-url';
import { handle, json, readJson } from '../../../lib/server/http';
import { requestPasswordReset, RESET_REQUESTED_MESSAGE } from '../../../lib/server/password-reset';

/** `{ email }` → 202 whether or not the address has an account; 429 with Retry-After past the limit. */
export const POST = handle(async ({ request, url, clientAddress }) => {
  const { email } = await readJson(request, mailLinkRequestSchema);
  await requestPasswordReset({ email, clientAddress, baseUrl: resolveBaseUrl(url) });
  return json({ message: RESET_REQUESTED_MESSAGE }, 202);
});
