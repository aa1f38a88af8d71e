import { z } from 'zod';
import { requireMember } from '../../../../lib/server/guard';
import { handle, json, parseWith } from '../../../../lib/server/http';
import { getPart } from '../../../../lib/server/register/parts';
import { countRunsForPart } from '../../../../lib/server/register/run-counts';

const querySchema = z.object({ at: z.iso.datetime({ offset: true, error: 'at: an ISO date-time.' }).optional() });

/** Runs charged to the set up to `?at=` (default now): what "runs at inspection" is prefilled with. */
export const GET = handle(async ({ locals, params, url }) => {
  const { team } = requireMember(locals);
  const { at } = parseWith(querySchema, { at: url.searchParams.get('at') ?? undefined });
  await getPart(team.id, params.id ?? '');
  return json(await countRunsForPart(team.id, params.id ?? '', at ? Date.parse(at) : undefined));
});
