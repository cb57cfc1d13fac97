import type { Insertable } from 'kysely';
import type { Db, Tx } from '../../db/database';
import type { ApiTokenTable } from './tokens.table';

/** The columns a token view is built from (tokens.view.ts). */
export const TOKEN_COLUMNS = ['id', 'name', 'prefix', 'createdAt', 'lastUsedAt', 'revokedAt'] as const;

/** How many tokens the person holds that are not revoked. */
export async function countActiveTokens(db: Db | Tx, userId: string): Promise<number> {
  const row = await db
    .selectFrom('apiToken')
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .where('userId', '=', userId)
    .where('revokedAt', 'is', null)
    .executeTakeFirstOrThrow();
  return Number(row.n);
}

export async function insertToken(db: Db | Tx, values: Insertable<ApiTokenTable>) {
  return db.insertInto('apiToken').values(values).returning(TOKEN_COLUMNS).executeTakeFirstOrThrow();
}

/** The person's own tokens, newest first. */
export async function tokensOf(db: Db | Tx, userId: string) {
  return db.selectFrom('apiToken').select(TOKEN_COLUMNS).where('userId', '=', userId).orderBy('id', 'desc').execute();
}

/** One token with its owner's id, or undefined. */
export async function findToken(db: Db | Tx, id: number) {
  return db
    .selectFrom('apiToken')
    .select([...TOKEN_COLUMNS, 'userId'])
    .where('id', '=', id)
    .executeTakeFirst();
}

export async function setTokenRevoked(db: Db | Tx, id: number, revokedAt: string): Promise<void> {
  await db.updateTable('apiToken').set({ revokedAt }).where('id', '=', id).execute();
}

/** The token with this hash and its owner, or undefined. */
export async function findTokenByHash(db: Db | Tx, hash: string) {
  return db
    .selectFrom('apiToken')
    .innerJoin('user', 'user.id', 'apiToken.userId')
    .select(['apiToken.id', 'apiToken.revokedAt', 'apiToken.lastUsedAt', 'user.id as userId', 'user.email', 'user.name', 'user.active'])
    .where('apiToken.tokenHash', '=', hash)
    .executeTakeFirst();
}

/** Notes a use of a token that is not revoked. */
export async function setTokenLastUsed(db: Db | Tx, id: number, lastUsedAt: string): Promise<void> {
  await db.updateTable('apiToken').set({ lastUsedAt }).where('id', '=', id).where('revokedAt', 'is', null).execute();
}
