import { addressConfirmationSchema } from '../../../lib/account-schemas';
import { confirmAddress } from '../../../lib/server/address-verification';
import { handle, json, readJson } from '../../../lib/server/http';

/** `{ token }` from the mailed link → 200 with the address it proved. */
export const POST = handle(async ({ request }) => {
  const { token } = await readJson(request, addressConfirmationSchema);
  return json(await confirmAddress(token));
});
