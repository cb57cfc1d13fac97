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
  // Running the validation suite costs seconds of CPU on the server, so it is kept to admins.
  'validation:read': ['admin'],
  'substance:read': ['admin', 'modeller', 'reviewer', 'consumer'],
  'substance:write': ['modeller'],
  'measurements:browse': ['admin', 'modeller', 'reviewer'],
  // Measurement sets and fits are unpublished work: consumers see them only through a published set's card.
  'measurement-set:read': ['admin', 'modeller', 'reviewer'],
  'measurement-set:upload': ['modeller'],
  'fit:read': ['admin', 'modeller', 'reviewer'],
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

/**
 * The ownership rule for changing someone's work (cancelling a fit, withdrawing a measurement set or uploading
 * a new version of it): its author, while they hold the policy, or an admin. Every such change is audited.
 */
export function mayChangeWorkOf(actor: { id: string; roles: readonly Role[] }, authorId: string, policy: Policy): boolean {
  return actor.roles.includes('admin') || (actor.id === authorId && hasPolicy(actor.roles, policy));
}

/** What each policy lets a person do, in the words a refusal uses ("… does not allow you to review parameter sets"). */
export const POLICY_ACTIONS: Record<Policy, string> = {
  'people:manage': 'manage people and their roles',
  'audit:read': 'read the audit trail',
  'mailbox:read': 'read the mailbox',
  'validation:read': 'run the validation suite',
  'substance:read': 'see substances',
  'substance:write': 'add or change substances',
  'measurements:browse': 'browse measurements',
  'measurement-set:read': 'see measurement sets',
  'measurement-set:upload': 'upload measurement sets',
  'fit:read': 'see fits',
  'fit:run': 'run fits',
  'simulation:read': 'see simulations',
  'simulation:run': 'run simulations',
  'parameterSet:draft': 'draft or submit parameter sets',
  'parameterSet:review': 'review parameter sets',
  'parameterSet:retire': 'retire parameter sets',
  'parameterSet:read': 'see parameter sets',
  'parameterSet:comment': 'comment on parameter sets',
  'catalog:read': 'read the catalog',
  'catalog:export': 'export from the catalog',
};

/** A refusal in plain words: "Your role (Admin) does not allow you to review parameter sets; that needs the Reviewer role." */
export function refusalMessage(roles: readonly Role[], policy: Policy, alsoAllowed: readonly Role[] = []): string {
  const held = roles.map((r) => ROLE_LABELS[r]);
  const needed = [...new Set([...(POLICIES[policy] as readonly Role[]), ...alsoAllowed])].map((r) => ROLE_LABELS[r]);
  const yours =
    held.length === 0
      ? 'You hold no role, which does not'
      : held.length === 1
        ? `Your role (${held[0]}) does not`
        : `Your roles (${held.join(', ')}) do not`;
  const neededText =
    needed.length === 1 ? `the ${needed[0]} role` : `one of the roles ${needed.slice(0, -1).join(', ')} or ${needed[needed.length - 1]}`;
  return `${yours} allow you to ${POLICY_ACTIONS[policy] ?? policy}; that needs ${neededText}.`;
}
