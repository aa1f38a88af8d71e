import { describe, expect, it } from 'vitest';
import {
  checkPageAccess,
  PageExit,
  requireMember,
  requirePageAccess,
  requirePermission,
  requireUser,
} from '../../../src/lib/server/guard';
import { HttpError } from '../../../src/lib/server/http';
import { PERMISSIONS, ROLES, type Permission, type Role } from '../../../src/lib/roles';

// The matrix as the README's "Roles" table promises it, written out here rather than read from roleCan(), so
// the guard is checked against the product's promise and not against the code it calls. A new permission needs
// its row here too.
const ALLOWED: Readonly<Record<Permission, readonly Role[]>> = {
  'team:read': ['owner', 'crew-chief', 'technician', 'viewer'],
  'members:invite': ['owner', 'crew-chief'],
  'members:manage': ['owner'],
  'team:settings': ['owner'],
  'runs:record': ['owner', 'crew-chief', 'technician'],
  'runs:edit': ['owner', 'crew-chief'],
  'parts:install': ['owner', 'crew-chief', 'technician'],
  'parts:edit': ['owner', 'crew-chief'],
  'inspections:record': ['owner', 'crew-chief', 'technician'],
  'inspections:edit-any': ['owner', 'crew-chief'],
  'specs:edit': ['owner', 'crew-chief'],
  'reviews:open': ['owner', 'crew-chief', 'technician'],
  'reviews:comment': ['owner', 'crew-chief', 'technician'],
  'reviews:decide': ['owner', 'crew-chief'],
  'audit:read': ['owner', 'crew-chief'],
  'outbox:read': ['owner'],
  'procedures:edit': ['owner', 'crew-chief'],
  'checklists:record': ['owner', 'crew-chief', 'technician'],
  'checklists:sign-off': ['owner', 'crew-chief'],
};

const user = {
  id: 'u1',
  email: 'a@example.test',
  name: 'A',
  lengthUnit: 'in',
  torqueUnit: 'lbf-in',
  currentTeamId: 't1',
  secondFactor: false,
} as const;
const localsFor = (role: Role | null, signedIn = true): App.Locals => ({
  user: signedIn ? { ...user } : null,
  team: role ? { id: 't1', name: 'Team', role } : null,
});

function statusOf(work: () => unknown): number | 'passed' {
  try {
    work();
    return 'passed';
  } catch (error) {
    if (error instanceof HttpError) return error.status;
    throw error;
  }
}

describe('the server-side guard', () => {
  it('answers 401 to a signed-out visitor on every kind of check', () => {
    const locals = localsFor(null, false);
    expect(statusOf(() => requireUser(locals))).toBe(401);
    expect(statusOf(() => requireMember(locals))).toBe(401);
    expect(statusOf(() => requirePermission(locals, 'team:read'))).toBe(401);
  });

  it('answers 403 to a person who has no current team', () => {
    expect(statusOf(() => requireMember(localsFor(null)))).toBe(403);
  });

  it('enforces the whole matrix: 403 exactly where the role lacks the permission', () => {
    for (const role of ROLES) {
      for (const permission of PERMISSIONS) {
        const allowed = ALLOWED[permission];
        expect(allowed, `${permission} needs its row in ALLOWED`).toBeDefined();
        const expected = allowed.includes(role) ? 'passed' : 403;
        expect(
          statusOf(() => requirePermission(localsFor(role), permission)),
          `${role} ${permission}`,
        ).toBe(expected);
      }
    }
  });

  it('names the role in the refusal', () => {
    try {
      requirePermission(localsFor('viewer'), 'runs:record');
      expect.unreachable();
    } catch (error) {
      expect((error as HttpError).message).toContain('viewer');
    }
  });

  it('sends a signed-out page visitor to sign-in and back to the page after', () => {
    const result = checkPageAccess(localsFor(null, false), new URL('http://x.test/team/members?tab=1'));
    expect(result).toEqual({ ok: false, redirect: '/sign-in?next=%2Fteam%2Fmembers%3Ftab%3D1' });
  });

  it('sends a person without a team to make one, and refuses a page the role may not open', () => {
    expect(checkPageAccess(localsFor(null), new URL('http://x.test/'))).toEqual({ ok: false, redirect: '/teams/new' });
    const refused = checkPageAccess(localsFor('viewer'), new URL('http://x.test/audit'), 'audit:read');
    expect(refused).toMatchObject({ ok: false, status: 403 });
  });
});

describe('a team that requires a second factor', () => {
  const held: App.Locals = {
    user: { ...user },
    team: { id: 't1', name: 'Team', role: 'owner', secondFactorMissing: true },
  };

  it('holds back an owner without one from every team route with 403', () => {
    expect(statusOf(() => requireMember(held))).toBe(403);
    expect(statusOf(() => requirePermission(held, 'team:read'))).toBe(403);
  });

  it('sends them to the account page to turn it on', () => {
    expect(checkPageAccess(held, new URL('http://x.test/'))).toEqual({
      ok: false,
      redirect: '/account?secondFactor=required',
    });
  });
});

describe('the page guard', () => {
  const page = new URL('http://x.test/parts?kind=gear-set');

  /** What `requirePageAccess` ends the response with; fails if it lets the request through. */
  function exitOf(work: () => unknown): PageExit['exit'] {
    try {
      work();
    } catch (error) {
      if (error instanceof PageExit) return error.exit;
      throw error;
    }
    throw new Error('expected a PageExit');
  }

  it('returns the access to a role that may open the page', () => {
    expect(requirePageAccess(localsFor('viewer'), page)).toEqual({
      user: { ...user },
      team: { id: 't1', name: 'Team', role: 'viewer' },
    });
    // A crew chief may read the audit trail (README, Roles).
    expect(requirePageAccess(localsFor('crew-chief'), new URL('http://x.test/audit'), 'audit:read').team.role).toBe(
      'crew-chief',
    );
  });

  it('ends a signed-out visit with the sign-in redirect, back to the page after', () => {
    expect(exitOf(() => requirePageAccess(localsFor(null, false), page))).toEqual({
      ok: false,
      redirect: '/sign-in?next=%2Fparts%3Fkind%3Dgear-set',
    });
  });

  it('sends a person without a team to make one', () => {
    expect(exitOf(() => requirePageAccess(localsFor(null), page))).toEqual({ ok: false, redirect: '/teams/new' });
  });

  it('sends a person the team asks for a second factor to the account page', () => {
    const held: App.Locals = {
      user: { ...user },
      team: { id: 't1', name: 'Team', role: 'owner', secondFactorMissing: true },
    };
    expect(exitOf(() => requirePageAccess(held, page))).toEqual({
      ok: false,
      redirect: '/account?secondFactor=required',
    });
  });

  it('refuses a role without the permission with 403 and a message naming the role', () => {
    // A viewer may not read the audit trail (README, Roles).
    const exit = exitOf(() => requirePageAccess(localsFor('viewer'), new URL('http://x.test/audit'), 'audit:read'));
    expect(exit).toMatchObject({ ok: false, status: 403 });
    expect('message' in exit && exit.message).toContain('viewer');
  });
});
