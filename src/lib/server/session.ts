import { decode } from '@auth/core/jwt';
import { and, eq, sql } from 'drizzle-orm';
import { getDb, type Database } from '../../db/client';
import { memberships, sessions, teams, users } from '../../db/schema';
import { userToPublic } from './accounts';
import { resolveAuthSecret } from './auth-secret';
import { isSessionLive, touchSession } from './sessions';

export const SESSION_COOKIES = ['__Secure-authjs.session-token', 'authjs.session-token'] as const;

let secret: string | undefined;

interface SessionClaims {
  sub: string;
  sv: number | undefined;
  /** The session's row in `sessions` (absent from cookies made before sessions were kept: refused). */
  sid: string | undefined;
  /** Expiry, seconds since the epoch, as Auth.js sets it. */
  exp: number;
}

// Decoding a cookie costs an HKDF derivation plus AES-CBC and HMAC through WebCrypto, which was most of the
// time of a signed-in API call when it was measured. The same cookie value always decodes to the
// same claims, so the claims of recent cookies are kept until their own expiry. Only decoded, unexpired
// tokens are kept, so a flood of made-up cookies adds nothing. The person, the session version and the role
// are read by `readSessionRow` below, under its own rules (docs/decisions/005-cache-decoded-session-cookies.md).
const DECODED = new Map<string, SessionClaims>();
const MAX_DECODED = 1000;

async function decodeClaims(name: string, value: string): Promise<SessionClaims | null> {
  const key = `${name}=${value}`;
  const cached = DECODED.get(key);
  if (cached && cached.exp * 1000 > Date.now()) return cached;
  if (cached) DECODED.delete(key);
  secret ??= resolveAuthSecret();
  let token: { sub?: string; sv?: number; sid?: string; exp?: number } | null;
  try {
    token = await decode<{ sub?: string; sv?: number; sid?: string; exp?: number }>({
      token: value,
      secret,
      salt: name,
    });
  } catch {
    return null;
  }
  if (!token?.sub) return null;
  const claims = { sub: token.sub, sv: token.sv, sid: token.sid, exp: token.exp ?? 0 };
  if (claims.exp * 1000 > Date.now()) {
    if (DECODED.size >= MAX_DECODED) DECODED.delete(DECODED.keys().next().value as string);
    DECODED.set(key, claims);
  }
  return claims;
}

// One statement for the person and their role in the current team, built once per connection.
const PREPARED = new WeakMap<Database, ReturnType<typeof prepareSessionQuery>>();

function prepareSessionQuery(db: Database) {
  return db
    .select({
      user: users,
      teamId: teams.id,
      teamName: teams.name,
      role: memberships.role,
      requireSecondFactor: teams.requireSecondFactor,
      session: { id: sessions.id, createdAt: sessions.createdAt, lastSeenAt: sessions.lastSeenAt },
    })
    .from(users)
    .leftJoin(sessions, and(eq(sessions.id, sql.placeholder('sid')), eq(sessions.userId, users.id)))
    .leftJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.teamId, users.currentTeamId)))
    .leftJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(users.id, sql.placeholder('id')))
    .prepare();
}

type SessionRow = NonNullable<Awaited<ReturnType<ReturnType<typeof prepareSessionQuery>['get']>>>;

/**
 * The person, their role in the current team and this session's row, read on every request, so a
 * change or a sign-out made through any process holds at once.
 */
async function readSessionRow(userId: string, sessionId: string): Promise<SessionRow | undefined> {
  const db = await getDb();
  let query = PREPARED.get(db);
  if (!query) PREPARED.set(db, (query = prepareSessionQuery(db)));
  return query.get({ id: userId, sid: sessionId });
}

/** The session as the rest of the server sees it: the person and their current team, or nulls. */
export type SessionLocals = Pick<App.Locals, 'user' | 'team'>;

/**
 * Reads the Auth.js session cookie (through `readCookie`) and
 * loads the person and their current team's role, so a removed or demoted member loses access on
 * their very next request, and a session whose version is behind the person's (password changed,
 * signed out everywhere), whose row is gone (signed out on this device) or that sat idle too long is refused.
 */
export async function loadSession(readCookie: (name: string) => string | undefined): Promise<SessionLocals> {
  const none = { user: null, team: null };
  const cookie = SESSION_COOKIES.map((name) => ({ name, value: readCookie(name) })).find((c) => c.value);
  if (!cookie?.value) return none;
  const claims = await decodeClaims(cookie.name, cookie.value);
  if (!claims?.sid) return none;
  const row = await readSessionRow(claims.sub, claims.sid);
  if (!row || claims.sv !== row.user.sessionVersion) return none;
  // Signed out on this device (row deleted), idle too long, or past the 14 days.
  const now = Date.now();
  if (!row.session || !isSessionLive(row.session, now)) return none;
  await touchSession(row.session, now);
  // A team that requires a second factor holds back its owners and crew chiefs until they turn one on.
  const held =
    Boolean(row.requireSecondFactor) && (row.role === 'owner' || row.role === 'crew-chief') && !row.user.totpEnabledAt;
  const team =
    row.teamId && row.teamName && row.role
      ? { id: row.teamId, name: row.teamName, role: row.role, ...(held ? { secondFactorMissing: true } : {}) }
      : null;
  return { user: userToPublic(row.user), team };
}
