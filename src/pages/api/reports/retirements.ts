import { z } from 'zod';
import { retirementsToCsv } from '../../../lib/exports/retirements';
import { download } from '../../../lib/server/download';
import { summariseTeamRetirements } from '../../../lib/server/exports/exports';
import { requireMember } from '../../../lib/server/guard';
import { handle, json, parseWith } from '../../../lib/server/http';

const querySchema = z.object({
  from: z.iso.date({ error: 'from: a date such as 2026-01-01.' }).default('1970-01-01'),
  to: z.iso.date({ error: 'to: a date such as 2026-12-31.' }).default('9999-12-31'),
  format: z.enum(['json', 'csv'], { error: 'format: json or csv.' }).default('json'),
});

/** Sets retired in a period (`?from=&to=`, dates, `to` exclusive), with the share retired early; `format=csv` downloads it. */
export const GET = handle(async ({ locals, url }) => {
  const { team } = requireMember(locals);
  const query = parseWith(querySchema, Object.fromEntries(url.searchParams));
  const summary = await summariseTeamRetirements(team.id, query.from, query.to);
  if (query.format === 'csv')
    return download(retirementsToCsv(summary), `lashline-retirements-${query.from}-${query.to}.csv`, 'text/csv');
  return json(summary);
});
