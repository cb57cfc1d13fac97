/**
 * Roles and named policies, shared by the server (which enforces them) and the client (which hides
 * what a role cannot do). A user may hold several roles.
 */
export const ROLES = ['admin', 'modeller', 'reviewer', 'consumer'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  modeller: 'Modeller',
  reviewer: 'Reviewer',
  consumer: 'Consumer',
};

export const ROLE_DESCRIPTIONS: Record<Role, string> = {
  admin: 'Manages people and roles; reads the audit trail and the mailbox.',
  modeller: 'Uploads measurements, runs fits and simulations, drafts parameter sets.',
  reviewer: 'Approves parameter sets or sends them back (never their own).',
  consumer: 'Reads the catalog and exports approved parameter sets.',
};

/** Each policy names the roles that grant it. Four-eyes checks on top of roles live with their feature. */
export const POLICIES = {
  'people:manage': ['admin'],
  'audit:read': ['admin'],
  'mailbox:read': ['admin'],
  'substance:read': ['admin', 'modeller', 'reviewer', 'consumer'],
  'substance:write': ['modeller'],
  'measurements:browse': ['admin', 'modeller', 'reviewer'],
  'dataset:read': ['admin', 'modeller', 'reviewer', 'consumer'],
  'dataset:upload': ['modeller'],
  'fit:read': ['admin', 'modeller', 'reviewer', 'consumer'],
  'fit:run': ['modeller'],
  'simulation:read': ['admin', 'modeller', 'reviewer'],
  'simulation:run': ['modeller'],
  'parameterSet:draft': ['modeller'],
  'parameterSet:review': ['reviewer'],
  'parameterSet:retire': ['reviewer', 'admin'],
  'parameterSet:read': ['admin', 'modeller', 'reviewer', 'consumer'],
  'parameterSet:comment': ['admin', 'modeller', 'reviewer'],
  'catalog:read': ['admin', 'modeller', 'reviewer', 'consumer'],
  'catalog:export': ['admin', 'modeller', 'reviewer', 'consumer'],
} as const satisfies Record<string, readonly Role[]>;

export type Policy = keyof typeof POLICIES;

export function hasPolicy(roles: readonly Role[], policy: Policy): boolean {
  const allowed: readonly Role[] = POLICIES[policy];
  return roles.some((r) => allowed.includes(r));
}
