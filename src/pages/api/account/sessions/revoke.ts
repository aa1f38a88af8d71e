import { signOutEverywhere } from '../../../../lib/server/account-security';
import { requireUser } from '../../../../lib/server/guard';
import { handle, json } from '../../../../lib/server/http';

/** Signs the person out everywhere, this session too. */
export const POST = handle(async ({ locals }) => {
  await signOutEverywhere(requireUser(locals).id);
  return json({ signedOut: true });
});
