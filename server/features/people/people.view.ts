import type { PersonView } from '../../../shared/contracts/person';
import type { Role } from '../../../shared/auth/roles';

/** A person's row with their roles (people.repository.ts listPeopleWithRoles); the row keeps `active` as 0/1. */
export type PersonWithRoles = { id: string; email: string; name: string; active: number; createdAt: string; roles: Role[] };

export const toPersonView = (u: PersonWithRoles): PersonView => ({
  id: u.id,
  email: u.email,
  name: u.name,
  active: u.active === 1,
  createdAt: u.createdAt,
  roles: u.roles,
});
