import { z } from 'zod';
import { toPage } from '../../../lib/paging';
import { listAuditTrail } from '../../../lib/server/audit-trail';
import { requirePermission } from '../../../lib/server/guard';
import { handle, json, parseWith } from '../../../lib/server/http';
import { readListQuery } from '../../../lib/server/list-query';

const filterSchema = z.object({ recordType: z.string().max(40).optional(), recordId: z.string().max(80).optional() });

/** Who changed what and when (owners and crew chiefs); `?recordType=&recordId=` narrows it. */
export const GET = handle(async ({ locals, url }) => {
  const { team } = requirePermission(locals, 'audit:read');
  const query = readListQuery(url);
  const filter = parseWith(filterSchema, {
    recordType: url.searchParams.get('recordType') ?? undefined,
    recordId: url.searchParams.get('recordId') ?? undefined,
  });
  return json(toPage(await listAuditTrail(team.id, { ...filter, ...query }), query.offset, query.limit));
});
