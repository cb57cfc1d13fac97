import { randomUUID } from 'node:crypto';
import { DEMO_PEOPLE } from '../../fixtures/demo/scenario';
import { hashPassword } from '../features/auth/auth';
import { countUsers, insertUser } from '../features/users/users.repository';
import type { Db } from './database';
import { recordAudit } from '../features/audit/audit.service';

/**
 * Seeds the invented demo scenario into an empty database. Does nothing when any person exists,
 * so it is safe to call at every start.
 */
export async function seedDemo(db: Db, options: { demoPassword: string }): Promise<{ seeded: boolean }> {
  if ((await countUsers(db)) > 0) return { seeded: false };
  const passwordHash = await hashPassword(options.demoPassword);
  await db.transaction().execute(async (tx) => {
    for (const person of DEMO_PEOPLE) {
      const id = randomUUID();
      await insertUser(tx, { id, email: person.email, name: person.name, passwordHash, roles: person.roles });
      await recordAudit(tx, {
        actor: null,
        action: 'user.created',
        targetType: 'user',
        targetId: id,
        summary: `Demo seed added ${person.email} with roles ${person.roles.join(', ')}`,
        after: { email: person.email, name: person.name, roles: person.roles },
      });
    }
  });
  return { seeded: true };
}
