import { sql } from 'drizzle-orm';
import { getDb } from '../../../db/client';

export interface RunCounts {
  totalRuns: number;
  runsSinceInstall: number;
}

// Far beyond any timestamp in milliseconds: an installation not yet ended runs until then.
const OPEN_END = 9e15;

/**
 * Runs charged to each part of a team, derived from the installation history and the run log (no
 * stored counters). A part is charged with a run when, at the run's time, it sat in the run's car —
 * directly, or in an assembly that sat in that car. An installation covers [install, next remove).
 * `runsSinceInstall` counts only the part's current installation (0 when it is not installed).
 * `asOf` (ms) counts only runs before that moment; `partIds` counts only those parts (a page about one
 * part need not count the whole team's).
 */
export async function countRunsForParts(
  teamId: string,
  asOf?: number,
  partIds?: readonly string[],
): Promise<Map<string, RunCounts>> {
  const db = await getDb();
  const before = asOf ?? OPEN_END;
  const onlyParts = partIds
    ? sql`AND (subject_type = 'assembly' OR subject_id IN (${
        partIds.length
          ? sql.join(
              partIds.map((id) => sql`${id}`),
              sql`, `,
            )
          : sql`NULL`
      }))`
    : sql``;
  const rows = await db.all<{ part_id: string; total_runs: number; since_install: number }>(sql`
    WITH ev AS (
      SELECT subject_type, subject_id, target_type, target_id, action, at, seq,
             LEAD(at) OVER (PARTITION BY subject_type, subject_id ORDER BY seq) AS next_at
      FROM installation_events WHERE team_id = ${teamId} ${onlyParts}
    ),
    stints AS (SELECT * FROM ev WHERE action = 'install'),
    part_car AS (
      SELECT s.subject_id AS part_id, s.target_id AS car_id, s.at AS from_at,
             COALESCE(s.next_at, ${OPEN_END}) AS to_at, s.seq AS stint_seq
      FROM stints s WHERE s.subject_type = 'part' AND s.target_type = 'car'
      UNION ALL
      SELECT p.subject_id, a.target_id, MAX(p.at, a.at),
             MIN(COALESCE(p.next_at, ${OPEN_END}), COALESCE(a.next_at, ${OPEN_END})), p.seq
      FROM stints p
      JOIN stints a ON a.subject_type = 'assembly' AND a.subject_id = p.target_id AND a.target_type = 'car'
      WHERE p.subject_type = 'part' AND p.target_type = 'assembly'
        AND a.at < COALESCE(p.next_at, ${OPEN_END}) AND COALESCE(a.next_at, ${OPEN_END}) > p.at
    ),
    current_stint AS (SELECT subject_id AS part_id, seq FROM stints WHERE subject_type = 'part' AND next_at IS NULL)
    SELECT pc.part_id AS part_id,
           COUNT(*) AS total_runs,
           COALESCE(SUM(CASE WHEN pc.stint_seq = cs.seq THEN 1 ELSE 0 END), 0) AS since_install
    FROM part_car pc
    -- The team's own runs only: a run can never be charged to another team's part through a car id.
    JOIN runs r ON r.team_id = ${teamId} AND r.car_id = pc.car_id AND r.at >= pc.from_at AND r.at < pc.to_at AND r.at < ${before}
    LEFT JOIN current_stint cs ON cs.part_id = pc.part_id
    GROUP BY pc.part_id
  `);
  const counts = new Map<string, RunCounts>();
  for (const row of rows)
    counts.set(row.part_id, { totalRuns: Number(row.total_runs), runsSinceInstall: Number(row.since_install) });
  return counts;
}

/** The counts of one part (zeros when it has never run). */
export async function countRunsForPart(teamId: string, partId: string, asOf?: number): Promise<RunCounts> {
  return (await countRunsForParts(teamId, asOf)).get(partId) ?? { totalRuns: 0, runsSinceInstall: 0 };
}
