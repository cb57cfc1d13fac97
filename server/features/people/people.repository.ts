import type { Role } from '../../../shared/auth/roles';
import type { Db, Tx } from '../../db/database';

export async function findPersonByEmail(db: Db | Tx, email: string) {
  return db.selectFrom('user').selectAll().where('email', '=', email.trim().toLowerCase()).executeTakeFirst();
}

export async function findPersonById(db: Db | Tx, id: string) {
  return db.selectFrom('user').selectAll().where('id', '=', id).executeTakeFirst();
}

export async function rolesOf(db: Db | Tx, userId: string): Promise<Role[]> {
  const rows = await db.selectFrom('userRole').select('role').where('userId', '=', userId).orderBy('role').execute();
  return rows.map((r) => r.role);
}

export async function listPeopleWithRoles(db: Db | Tx) {
  const users = await db.selectFrom('user').select(['id', 'email', 'name', 'active', 'createdAt']).orderBy('name').execute();
  const roles = await db.selectFrom('userRole').select(['userId', 'role']).execute();
  return users.map((u) => ({
    ...u,
    roles: roles
      .filter((r) => r.userId === u.id)
      .map((r) => r.role)
      .sort(),
  }));
}

/** One person with their roles, or undefined. */
export async function findPersonWithRoles(db: Db | Tx, id: string) {
  const person = await db.selectFrom('user').select(['id', 'email', 'name', 'active', 'createdAt']).where('id', '=', id).executeTakeFirst();
  return person && { ...person, roles: await rolesOf(db, id) };
}

export async function updatePersonColumns(db: Db | Tx, id: string, set: { name?: string; active?: number }): Promise<void> {
  if (Object.keys(set).length) await db.updateTable('user').set(set).where('id', '=', id).execute();
}

/** Signs the person out everywhere. */
export async function deleteSessionsOf(db: Db | Tx, userId: string): Promise<void> {
  await db.deleteFrom('session').where('userId', '=', userId).execute();
}

export async function insertPerson(db: Db | Tx, user: { id: string; email: string; name: string; passwordHash: string; roles: Role[] }) {
  await db
    .insertInto('user')
    .values({ id: user.id, email: user.email, name: user.name, passwordHash: user.passwordHash, createdAt: new Date().toISOString() })
    .execute();
  await replaceRoles(db, user.id, user.roles);
}

export async function replaceRoles(db: Db | Tx, userId: string, roles: Role[]) {
  await db.deleteFrom('userRole').where('userId', '=', userId).execute();
  if (roles.length)
    await db
      .insertInto('userRole')
      .values(roles.map((role) => ({ userId, role })))
      .execute();
}

export async function countPeople(db: Db | Tx): Promise<number> {
  const row = await db
    .selectFrom('user')
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .executeTakeFirstOrThrow();
  return Number(row.n);
}

export async function countActiveAdmins(db: Db | Tx): Promise<number> {
  const row = await db
    .selectFrom('user')
    .innerJoin('userRole', 'userRole.userId', 'user.id')
    .where('userRole.role', '=', 'admin')
    .where('user.active', '=', 1)
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .executeTakeFirstOrThrow();
  return Number(row.n);
}
