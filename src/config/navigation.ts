import type { Policy } from '@shared/auth/roles';

export interface NavItem {
  to: string;
  label: string;
  policy?: Policy;
}

/** The main navigation; each role sees the items its policies allow. */
export const NAV_ITEMS: NavItem[] = [
  { to: '/', label: 'Workbench' },
  { to: '/substances', label: 'Substances', policy: 'measurements:browse' },
  { to: '/catalog', label: 'Catalog', policy: 'catalog:read' },
  { to: '/mixtures', label: 'Mixtures', policy: 'catalog:read' },
  { to: '/simulations', label: 'Simulations', policy: 'simulation:read' },
  { to: '/review', label: 'Review desk', policy: 'parameterSet:review' },
  { to: '/people', label: 'People', policy: 'people:manage' },
  { to: '/audit', label: 'Audit trail', policy: 'audit:read' },
  { to: '/mailbox', label: 'Mailbox', policy: 'mailbox:read' },
  { to: '/validation-suite', label: 'Validation suite', policy: 'validation:read' },
];
