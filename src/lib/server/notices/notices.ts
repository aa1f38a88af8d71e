import { and, eq, inArray, isNotNull } from 'drizzle-orm';
import type { Transaction } from '../../../db/client';
import { getDb, write } from '../../../db/client';
import { memberships, noticePreferences, teams, users } from '../../../db/schema';
import { composeNotice, NOTICE_KIND_LABELS, type NoticeContent, type NoticeKind } from '../../notices/compose';
import { queueMessage } from '../outbox';
import { makeUnsubscribeToken } from './unsubscribe';

export const ALL_NOTICE_KINDS = Object.keys(NOTICE_KIND_LABELS) as NoticeKind[];

/**
 * Queues one notice per recipient inside the caller's transaction (the outbox sends it later):
 * the whole team, or the named people, less anyone who muted that kind for this team and anyone whose
 * address is not verified.
 */
export async function queueNotice(
  tx: Transaction,
  notice: Omit<NoticeContent, 'teamName'> & { teamId: string; baseUrl: string; to: 'team' | string[]; except?: string },
): Promise<number> {
  const team = await tx.select({ name: teams.name }).from(teams).where(eq(teams.id, notice.teamId)).get();
  if (!team) return 0;
  const members = await tx
    .select({ id: users.id, email: users.email, muted: noticePreferences.muted })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .leftJoin(
      noticePreferences,
      and(eq(noticePreferences.userId, users.id), eq(noticePreferences.teamId, memberships.teamId)),
    )
    .where(
      and(
        // Only to addresses their people have proved: an unverified address may belong to someone else.
        isNotNull(users.emailVerifiedAt),
        notice.to === 'team'
          ? eq(memberships.teamId, notice.teamId)
          : and(
              eq(memberships.teamId, notice.teamId),
              inArray(memberships.userId, notice.to.length ? notice.to : ['']),
            ),
      ),
    );
  let queued = 0;
  for (const member of members) {
    if (member.id === notice.except) continue;
    if ((member.muted ?? []).includes(notice.kind)) continue;
    const token = makeUnsubscribeToken({ userId: member.id, teamId: notice.teamId, kind: notice.kind });
    const message = composeNotice({ ...notice, teamName: team.name }, `${notice.baseUrl}/unsubscribe?token=${token}`);
    await queueMessage(tx, { teamId: notice.teamId, to: member.email, subject: message.subject, text: message.text });
    queued += 1;
  }
  return queued;
}

/** The kinds a person has muted for a team. */
export async function readMutedKinds(userId: string, teamId: string): Promise<NoticeKind[]> {
  const db = await getDb();
  const row = await db
    .select({ muted: noticePreferences.muted })
    .from(noticePreferences)
    .where(and(eq(noticePreferences.userId, userId), eq(noticePreferences.teamId, teamId)))
    .get();
  return row?.muted ?? [];
}

/** Saves which kinds a person has muted for a team. */
export async function saveMutedKinds(userId: string, teamId: string, muted: NoticeKind[]): Promise<NoticeKind[]> {
  const unique = [...new Set(muted)].filter((kind) => ALL_NOTICE_KINDS.includes(kind));
  await write((tx) =>
    tx
      .insert(noticePreferences)
      .values({ userId, teamId, muted: unique })
      .onConflictDoUpdate({
        target: [noticePreferences.userId, noticePreferences.teamId],
        set: { muted: unique, updatedAt: new Date() },
      }),
  );
  return unique;
}
