import { z } from 'zod';
import { requirePermission } from '../../../lib/server/guard';
import { bodyLimitFor } from '../../../lib/server/body-limits';
import { handle, json, parseWith, readBodyText } from '../../../lib/server/http';
import { importRuns } from '../../../lib/server/register/runs';
import { resolveBaseUrl } from '../../../lib/server/base-url';
import { afterRunsChanged } from '../../../lib/server/notices/after-runs';

const recordsBodySchema = z.object({
  records: z
    .array(z.record(z.string(), z.string({ error: 'Each cell is text, as read from the CSV.' })), {
      error: 'records: a list of rows.',
    })
    .max(20_000, 'At most 20,000 rows at once.'),
  dryRun: z.boolean().optional(),
});

/**
 * Imports runs. Send the file itself as `text/csv` (`?dryRun=1` only checks it), or the parsed rows
 * as JSON `{ records, dryRun? }`. Any bad row: 422 listing each row and field; nothing is written.
 */
export const POST = handle(async ({ locals, request, url }) => {
  const access = requirePermission(locals, 'runs:record');
  const type = (request.headers.get('content-type') ?? '').toLowerCase();
  const text = await readBodyText(request, bodyLimitFor(url.pathname));
  if (type.startsWith('text/csv')) {
    const dryRun = url.searchParams.get('dryRun') === '1';
    const result = await importRuns(access, { csv: text }, dryRun);
    if (!dryRun) await afterRunsChanged(access.team.id, resolveBaseUrl(url));
    return json(result, dryRun ? 200 : 201);
  }
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    return json({ error: { message: 'Send the CSV as text/csv, or JSON { records } that is valid JSON.' } }, 400);
  }
  const body = parseWith(recordsBodySchema, raw);
  const result = await importRuns(access, { records: body.records }, body.dryRun ?? false);
  if (!body.dryRun) await afterRunsChanged(access.team.id, resolveBaseUrl(url));
  return json(result, body.dryRun ? 200 : 201);
});
