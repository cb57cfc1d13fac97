/**
 * Contract of a person (one entry of people administration): the answers of /api/people (list, create, update;
 * /api/users is the old path of the same routes). Built in server/features/people/people.view.ts.
 */
import { z } from 'zod';
import { ROLES } from '../auth/roles';

export const personView = z.strictObject({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  active: z.boolean(),
  createdAt: z.string(),
  roles: z.array(z.enum(ROLES)),
});
export type PersonView = z.infer<typeof personView>;

export const peopleListView = z.strictObject({ people: z.array(personView) });
export type PeopleList = z.infer<typeof peopleListView>;
