import { download } from '../../../lib/server/download';
import { exportTeamArchive } from '../../../lib/server/exports/team-archive';
import { requirePermission } from '../../../lib/server/guard';
import { handle } from '../../../lib/server/http';

/** The whole current team as one JSON archive (owners): for backup and for leaving. */
export const GET = handle(async ({ locals }) => {
  const { team } = requirePermission(locals, 'team:settings');
  return download(
    await exportTeamArchive(team.id),
    `lashline-team-${team.name}-${new Date().toISOString().slice(0, 10)}.json`,
    'application/json',
  );
});
