import { tighteningSequence } from '../../../lib/analysis';
import { tighteningQuerySchema } from '../../../lib/analysis/schemas';
import { requireMember } from '../../../lib/server/guard';
import { handle, json, parseWith } from '../../../lib/server/http';

/** `?bolts=N` (3–36) → `{ bolts, sequence }`, the cross order for bolts numbered clockwise from 1. */
export const GET = handle(({ locals, url }) => {
  requireMember(locals);
  const { bolts } = parseWith(tighteningQuerySchema, Object.fromEntries(url.searchParams));
  return json(tighteningSequence(bolts));
});
