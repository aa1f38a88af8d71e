import { download } from '../../../../lib/server/download';
import { exportInspectionCsv } from '../../../../lib/server/exports/exports';
import { requireMember } from '../../../../lib/server/guard';
import { handle } from '../../../../lib/server/http';

/** An inspection as CSV, one row per reading with its units. */
export const GET = handle(async ({ locals, params }) => {
  const { team } = requireMember(locals);
  const { filename, csv } = await exportInspectionCsv(team.id, params.id ?? '');
  return download(csv, filename, 'text/csv');
});
