/**
 * The role matrix: what each team role may do. Pure data, read by the server-side guard for every
 * page and API route, and by the UI to hide what a role cannot do.
 */

export const ROLES = ['owner', 'crew-chief', 'technician', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  owner: 'Owner',
  'crew-chief': 'Crew chief',
  technician: 'Technician',
  viewer: 'Viewer',
};

export const PERMISSIONS = [
  'team:read',
  'members:invite',
  'members:manage',
  'team:settings',
  'runs:record',
  'runs:edit',
  'parts:install',
  'parts:edit',
  'inspections:record',
  'inspections:edit-any',
  'specs:edit',
  'reviews:open',
  'reviews:comment',
  'reviews:decide',
  'audit:read',
  'outbox:read',
  'procedures:edit',
  'checklists:record',
  'checklists:sign-off',
] as const;
export type Permission = (typeof PERMISSIONS)[number];

const VIEWER: readonly Permission[] = ['team:read'];
const TECHNICIAN: readonly Permission[] = [
  ...VIEWER,
  'runs:record',
  'parts:install',
  'inspections:record',
  'reviews:open',
  'reviews:comment',
  'checklists:record',
];
const CREW_CHIEF: readonly Permission[] = [
  ...TECHNICIAN,
  'members:invite',
  'runs:edit',
  'parts:edit',
  'inspections:edit-any',
  'specs:edit',
  'reviews:decide',
  'audit:read',
  'procedures:edit',
  'checklists:sign-off',
];
const OWNER: readonly Permission[] = PERMISSIONS;

export const ROLE_PERMISSIONS: Record<Role, ReadonlySet<Permission>> = {
  owner: new Set(OWNER),
  'crew-chief': new Set(CREW_CHIEF),
  technician: new Set(TECHNICIAN),
  viewer: new Set(VIEWER),
};

/** Whether `role` may do `permission`. */
export function roleCan(role: Role, permission: Permission): boolean {
  return ROLE_PERMISSIONS[role].has(permission);
}

/**
 * Which roles a person holding `role` may hand out in an invitation or a role change.
 * Owners hand out any role; a crew chief invites up to crew chief; nobody else invites.
 * @example rolesGrantableBy('crew-chief') // ['crew-chief', 'technician', 'viewer']
 */
export function rolesGrantableBy(role: Role): Role[] {
  if (role === 'owner') return [...ROLES];
  if (role === 'crew-chief') return ['crew-chief', 'technician', 'viewer'];
  return [];
}

/** One line per permission, for the README and the members page. */
export const PERMISSION_LABELS: Record<Permission, string> = {
  'team:read': 'See the team board, parts, runs, inspections and reviews',
  'members:invite': 'Invite people',
  'members:manage': 'Change roles and remove members',
  'team:settings': 'Change team settings',
  'runs:record': 'Log runs',
  'runs:edit': 'Edit and delete runs',
  'parts:install': 'Install and remove parts',
  'parts:edit': 'Add, edit and delete cars, assemblies and parts',
  'inspections:record': 'Record inspections and edit own drafts',
  'inspections:edit-any': 'Edit any inspection, submitted ones included',
  'specs:edit': 'Edit tolerance profiles',
  'reviews:open': 'Open a review',
  'reviews:comment': 'Comment on reviews',
  'reviews:decide': 'Decide keep, re-shim or retire',
  'audit:read': 'Read the audit trail',
  'outbox:read': 'See the mail outbox',
  'procedures:edit': 'Write, duplicate and archive procedures',
  'checklists:record': 'Start and fill in checklists at a rebuild',
  'checklists:sign-off': 'Sign off checklists, and change them after sign-off',
};
