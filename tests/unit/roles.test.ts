import { describe, expect, it } from 'vitest';
import { PERMISSIONS, ROLES, roleCan, rolesGrantableBy, type Permission, type Role } from '../../src/lib/roles';

// The role matrix as the product promises it (README "Roles"), written out cell by cell so that a
// change to src/lib/roles.ts that is not also a deliberate change here fails.
const EXPECTED: Record<Permission, Record<Role, boolean>> = {
  'team:read': { owner: true, 'crew-chief': true, technician: true, viewer: true },
  'members:invite': { owner: true, 'crew-chief': true, technician: false, viewer: false },
  'members:manage': { owner: true, 'crew-chief': false, technician: false, viewer: false },
  'team:settings': { owner: true, 'crew-chief': false, technician: false, viewer: false },
  'runs:record': { owner: true, 'crew-chief': true, technician: true, viewer: false },
  'runs:edit': { owner: true, 'crew-chief': true, technician: false, viewer: false },
  'parts:install': { owner: true, 'crew-chief': true, technician: true, viewer: false },
  'parts:edit': { owner: true, 'crew-chief': true, technician: false, viewer: false },
  'inspections:record': { owner: true, 'crew-chief': true, technician: true, viewer: false },
  'inspections:edit-any': { owner: true, 'crew-chief': true, technician: false, viewer: false },
  'specs:edit': { owner: true, 'crew-chief': true, technician: false, viewer: false },
  'reviews:open': { owner: true, 'crew-chief': true, technician: true, viewer: false },
  'reviews:comment': { owner: true, 'crew-chief': true, technician: true, viewer: false },
  'reviews:decide': { owner: true, 'crew-chief': true, technician: false, viewer: false },
  'audit:read': { owner: true, 'crew-chief': true, technician: false, viewer: false },
  'outbox:read': { owner: true, 'crew-chief': false, technician: false, viewer: false },
  'procedures:edit': { owner: true, 'crew-chief': true, technician: false, viewer: false },
  'checklists:record': { owner: true, 'crew-chief': true, technician: true, viewer: false },
  'checklists:sign-off': { owner: true, 'crew-chief': true, technician: false, viewer: false },
};

describe('the role matrix', () => {
  it('lists every permission in the expected table', () => {
    expect(Object.keys(EXPECTED).sort()).toEqual([...PERMISSIONS].sort());
  });

  for (const permission of PERMISSIONS) {
    for (const role of ROLES) {
      const allowed = EXPECTED[permission][role];
      it(`${allowed ? 'lets' : 'does not let'} a ${role} ${permission}`, () => {
        expect(roleCan(role, permission)).toBe(allowed);
      });
    }
  }

  it('lets an owner grant every role and a crew chief all but owner', () => {
    expect(rolesGrantableBy('owner')).toEqual(['owner', 'crew-chief', 'technician', 'viewer']);
    expect(rolesGrantableBy('crew-chief')).toEqual(['crew-chief', 'technician', 'viewer']);
    expect(rolesGrantableBy('technician')).toEqual([]);
    expect(rolesGrantableBy('viewer')).toEqual([]);
  });
});
