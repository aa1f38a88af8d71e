import { mailLinkRequestSchema } from '../../../lib/account-schemas';
import { requestVerificationMail, VERIFICATION_REQUESTED_MESSAGE } from '../../../lib/server/address-verification';
import { resolveBaseUrl } from '../../../lib/server/base-url';
import { handle, json, readJson } from '../../../lib/server/http';

/** `{ email }` → 202: the verification link again, when that address waits for one; 429 past the limit. */
export const POST = handle(async ({ request, url, clientAddress }) => {
  const { email } = await readJson(request, mailLinkRequestSchema);
  await requestVerificationMail({ email, clientAddress, baseUrl: resolveBaseUrl(url) });
  return json({ message: VERIFICATION_REQUESTED_MESSAGE }, 202);
});
