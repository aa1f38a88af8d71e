import { tighteningSequence } from '../../../lib/analysis';
import { MAKER_FIGURES_NOTICE } from '../../../lib/procedures/cautions';
import { tighteningQuerySchema } from '../../../lib/analysis/schemas';
import { requireMember } from '../../../lib/server/guard';
import { handle, json, parseWith } from '../../../lib/server/http';

/**
 * `?bolts=N` (3–36) → `{ bolts, sequence, caution }`, the cross order for bolts numbered clockwise from 1, with
 * the line that the part maker's sequence, figures and passes govern.
 */
export const GET = handle(({ locals, url }) => {
  requireMember(locals);
  const { bolts } = parseWith(tighteningQuerySchema, Object.fromEntries(url.searchParams));
  return json({ ...tighteningSequence(bolts), caution: MAKER_FIGURES_NOTICE });
});
