import { and, desc, eq, or } from 'drizzle-orm';
import { getDb } from '../../../db/client';
import { installationEvents } from '../../../db/schema';
import { installationSchema } from '../../../lib/register/schemas';
import { requireMember, requirePermission } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';
import { readListQuery } from '../../../lib/server/list-query';
import { toPage } from '../../../lib/paging';
import { recordInstallation } from '../../../lib/server/register/installations';

/** The installation history, newest first; `?subjectId=` or `?targetId=` narrows it to one part, assembly or car. */
export const GET = handle(async ({ locals, url }) => {
  const { team } = requireMember(locals);
  const query = readListQuery(url);
  const id = url.searchParams.get('subjectId') ?? url.searchParams.get('targetId');
  const db = await getDb();
  const rows = await db
    .select()
    .from(installationEvents)
    .where(
      and(
        eq(installationEvents.teamId, team.id),
        id ? or(eq(installationEvents.subjectId, id), eq(installationEvents.targetId, id)) : undefined,
      ),
    )
    .orderBy(desc(installationEvents.seq))
    .limit(query.limit + 1)
    .offset(query.offset);
  const items = rows.map(({ seq: _seq, teamId: _team, createdAt, at, ...rest }) => ({
    ...rest,
    at: at.toISOString(),
    createdAt: createdAt.toISOString(),
  }));
  return json(toPage(items, query.offset, query.limit));
});

/** `{ action: install|remove, partId | assemblyId, assemblyId | carId, at? }` → 201; 409 names where it is now. */
export const POST = handle(async ({ locals, request }) => {
  const access = requirePermission(locals, 'parts:install');
  return json(await recordInstallation(access, await readJson(request, installationSchema)), 201);
});
