import { decode } from '@auth/core/jwt';
import type { AstroCookies } from 'astro';
import { and, eq } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { memberships, teams, users } from '../../db/schema';
import { userToPublic } from './accounts';
import { resolveAuthSecret } from './auth-secret';

export const SESSION_COOKIES = ['__Secure-authjs.session-token', 'authjs.session-token'] as const;

let secret: string | undefined;

/**
 * Reads the Auth.js session cookie and loads the person and their current team's role from the
 * database, so a removed or demoted member loses access on their very next request, and a session
 * whose version is behind the person's (password changed, signed out everywhere) is refused.
 */
export async function loadSession(cookies: AstroCookies): Promise<Pick<App.Locals, 'user' | 'team'>> {
  const none = { user: null, team: null };
  const cookie = SESSION_COOKIES.map((name) => ({ name, value: cookies.get(name)?.value })).find((c) => c.value);
  if (!cookie?.value) return none;
  secret ??= resolveAuthSecret();
  let token: { sub?: string; sv?: number } | null;
  try {
    token = (await decode({ token: cookie.value, secret, salt: cookie.name })) as typeof token;
  } catch {
    return none;
  }
  if (!token?.sub) return none;
  const db = await getDb();
  const user = await db.select().from(users).where(eq(users.id, token.sub)).get();
  if (!user || token.sv !== user.sessionVersion) return none;
  if (!user.currentTeamId) return { user: userToPublic(user), team: null };
  const team = await db
    .select({ id: teams.id, name: teams.name, role: memberships.role })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(and(eq(memberships.teamId, user.currentTeamId), eq(memberships.userId, user.id)))
    .get();
  return { user: userToPublic(user), team: team ?? null };
}
