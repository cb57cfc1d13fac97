import type { Db, Tx } from '../../db/database';

/** The person's stored preferences column, or undefined for an unknown person. */
export async function preferencesRowOf(db: Db | Tx, userId: string) {
  return db.selectFrom('user').select('preferencesJson').where('id', '=', userId).executeTakeFirst();
}

export async function setPreferencesJson(db: Db | Tx, userId: string, preferencesJson: string): Promise<void> {
  await db.updateTable('user').set({ preferencesJson }).where('id', '=', userId).execute();
}
