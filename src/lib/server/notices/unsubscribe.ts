import { createHmac, timingSafeEqual } from 'node:crypto';
import { NOTICE_KIND_LABELS, type NoticeKind } from '../../notices/compose';
import { resolveAuthSecret } from '../auth-secret';

/**
 * Signed unsubscribe tokens: who, which team, which kind of notice, with an HMAC of the session
 * secret, so the link works without signing in and cannot be forged for someone else.
 */
export interface UnsubscribeClaim {
  userId: string;
  teamId: string;
  kind: NoticeKind;
}

function sign(payload: string): string {
  return createHmac('sha256', `unsubscribe:${resolveAuthSecret()}`).update(payload).digest('base64url');
}

export function makeUnsubscribeToken(claim: UnsubscribeClaim): string {
  const payload = Buffer.from(JSON.stringify([claim.userId, claim.teamId, claim.kind])).toString('base64url');
  return `${payload}.${sign(payload)}`;
}

/** The claim in a token, or null when it is malformed or its signature does not match. */
export function readUnsubscribeToken(token: string): UnsubscribeClaim | null {
  const [payload, signature] = token.split('.');
  if (!payload || !signature) return null;
  const expected = Buffer.from(sign(payload));
  const given = Buffer.from(signature);
  if (expected.length !== given.length || !timingSafeEqual(expected, given)) return null;
  try {
    const [userId, teamId, kind] = JSON.parse(Buffer.from(payload, 'base64url').toString('utf8')) as [
      string,
      string,
      string,
    ];
    if (typeof userId !== 'string' || typeof teamId !== 'string' || !(kind in NOTICE_KIND_LABELS)) return null;
    return { userId, teamId, kind: kind as NoticeKind };
  } catch {
    return null;
  }
}
