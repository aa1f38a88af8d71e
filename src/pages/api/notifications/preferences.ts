import { z } from 'zod';
import { NOTICE_KIND_LABELS } from '../../../lib/notices/compose';
import { requireMember } from '../../../lib/server/guard';
import { handle, json, readJson } from '../../../lib/server/http';
import { ALL_NOTICE_KINDS, readMutedKinds, saveMutedKinds } from '../../../lib/server/notices/notices';

const preferencesSchema = z.object({
  muted: z
    .array(
      z.enum(ALL_NOTICE_KINDS as [string, ...string[]], { error: `muted: any of ${ALL_NOTICE_KINDS.join(', ')}.` }),
    )
    .max(20),
});

/** The notices the caller gets from the current team: `{ kinds: [{ kind, label, on }] }`. */
export const GET = handle(async ({ locals }) => {
  const { user, team } = requireMember(locals);
  const muted = await readMutedKinds(user.id, team.id);
  return json({
    teamId: team.id,
    kinds: ALL_NOTICE_KINDS.map((kind) => ({ kind, label: NOTICE_KIND_LABELS[kind], on: !muted.includes(kind) })),
    muted,
  });
});

/** `{ muted: [kinds] }` for the current team. */
export const PUT = handle(async ({ locals, request }) => {
  const { user, team } = requireMember(locals);
  const { muted } = await readJson(request, preferencesSchema);
  return json({
    teamId: team.id,
    muted: await saveMutedKinds(user.id, team.id, muted as (typeof ALL_NOTICE_KINDS)[number][]),
  });
});
