import { ROLE_LABELS, roleCan, type Permission, type Role } from '../roles';
import type { PublicUser } from './accounts';
import { HttpError } from './http';

export interface TeamAccess {
  user: PublicUser;
  team: { id: string; name: string; role: Role };
}

/**
 * The one guard for the role matrix. Every API route and page calls one of these; the UI hiding a
 * button is never the only check.
 */
export function requireUser(locals: App.Locals): PublicUser {
  if (!locals.user) throw new HttpError(401, 'Sign in first.');
  return locals.user;
}

/** A signed-in person with a current team (any role). */
export function requireMember(locals: App.Locals): TeamAccess {
  const user = requireUser(locals);
  if (!locals.team) throw new HttpError(403, 'Create a team or accept an invitation first.');
  if (locals.team.secondFactorMissing)
    throw new HttpError(
      403,
      'This team asks its owners and crew chiefs for a second factor: turn it on from your account page first.',
    );
  return { user, team: locals.team };
}

/** A member whose role grants `permission`; 403 names the role and what it cannot do. */
export function requirePermission(locals: App.Locals, permission: Permission): TeamAccess {
  const access = requireMember(locals);
  if (!roleCan(access.team.role, permission)) {
    throw new HttpError(403, `A ${ROLE_LABELS[access.team.role].toLowerCase()} cannot do this (${permission}).`);
  }
  return access;
}

export type PageAccess =
  { ok: true; access: TeamAccess } | { ok: false; redirect: string } | { ok: false; status: 403; message: string };

/**
 * The decision for a page: where to send a visitor who may not see it. Signed out → sign-in (and back);
 * no team → create one; a second factor the team requires → the account page; role lacking → 403 with
 * a message naming the role.
 */
export function checkPageAccess(locals: App.Locals, url: URL, permission: Permission = 'team:read'): PageAccess {
  if (!locals.user) return { ok: false, redirect: `/sign-in?next=${encodeURIComponent(url.pathname + url.search)}` };
  if (!locals.team) return { ok: false, redirect: '/teams/new' };
  if (locals.team.secondFactorMissing) return { ok: false, redirect: '/account?secondFactor=required' };
  if (!roleCan(locals.team.role, permission)) {
    return {
      ok: false,
      status: 403,
      message: `Your role, ${ROLE_LABELS[locals.team.role].toLowerCase()}, cannot open this page.`,
    };
  }
  return { ok: true, access: { user: locals.user, team: locals.team } };
}

/** Thrown by `requirePageAccess`; the middleware (`pageExits`) turns it into the redirect or the refusal page. */
export class PageExit extends Error {
  constructor(readonly exit: Exclude<PageAccess, { ok: true }>) {
    super('redirect' in exit ? `redirect to ${exit.redirect}` : exit.message);
  }
}

/**
 * The guard of every page: the access, or the response ends here (a redirect, or the 403 page naming
 * what the role cannot do), so the page's next line runs only for someone allowed to see it.
 * @example const access = requirePageAccess(Astro.locals, Astro.url, 'audit:read');
 */
export function requirePageAccess(locals: App.Locals, url: URL, permission: Permission = 'team:read'): TeamAccess {
  const decision = checkPageAccess(locals, url, permission);
  if (!decision.ok) throw new PageExit(decision);
  return decision.access;
}
