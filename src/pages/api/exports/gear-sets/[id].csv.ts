import { download } from '../../../../lib/server/download';
import { exportGearSetHistoryCsv } from '../../../../lib/server/exports/exports';
import { requireMember } from '../../../../lib/server/guard';
import { handle } from '../../../../lib/server/http';

/** A gear set's whole history as CSV. */
export const GET = handle(async ({ locals, params }) => {
  const { team } = requireMember(locals);
  const { filename, csv } = await exportGearSetHistoryCsv(team.id, params.id ?? '');
  return download(csv, filename, 'text/csv');
});
