import { requireMember } from '../../../../lib/server/guard';
import { handle, HttpError, json } from '../../../../lib/server/http';
import { readGearSet } from '../../../../lib/server/inspections/read-gear-set';

/** For a stored set: latest summary, verdicts, change, trend, recommendation — in the reader's units. */
export const GET = handle(async ({ locals, params }) => {
  const access = requireMember(locals);
  // The same read the gear set page makes, so the page and its charts' refetch never disagree.
  const gearSet = await readGearSet(access, params.id ?? '');
  if (!gearSet) throw new HttpError(404, 'No such gear set in this team.');
  return json(gearSet.analysis);
});
