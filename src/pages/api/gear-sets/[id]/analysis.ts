import { requireMember } from '../../../../lib/server/guard';
import { handle, json } from '../../../../lib/server/http';
import { analyseStoredGearSet } from '../../../../lib/server/inspections/gear-set-analysis';
import { readerUnitsOf } from '../../../../lib/server/inspections/inspections';

/** For a stored set: latest summary, verdicts, change, trend, recommendation — in the reader's units. */
export const GET = handle(async ({ locals, params }) => {
  const access = requireMember(locals);
  return json(await analyseStoredGearSet(access.team.id, params.id ?? '', readerUnitsOf(access)));
});
