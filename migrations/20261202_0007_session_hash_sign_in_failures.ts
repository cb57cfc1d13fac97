import { createHash } from 'node:crypto';
import type { Kysely } from 'kysely';

/**
 * Secrets at rest and the sign-in limiter:
 * - session.id now holds the SHA-256 (hex) of the session token; the cookie keeps the token. Existing rows are
 *   hashed in place, so people stay signed in.
 * - sign_in_failure keeps failed sign-ins (key = client address + normalised e-mail, time in ms) so the limit
 *   survives a restart.
 */
export async function up(db: Kysely<any>): Promise<void> {
  const sessions = await db.selectFrom('session').select('id').execute();
  for (const { id } of sessions as Array<{ id: string }>) {
    const hashed = createHash('sha256').update(id).digest('hex');
    await db.updateTable('session').set({ id: hashed }).where('id', '=', id).execute();
  }

  await db.schema
    .createTable('sign_in_failure')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('key', 'text', (c) => c.notNull())
    .addColumn('at_ms', 'integer', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('sign_in_failure_key_idx').on('sign_in_failure').columns(['key', 'at_ms']).execute();
  await db.schema.createIndex('sign_in_failure_at_idx').on('sign_in_failure').column('at_ms').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('sign_in_failure').execute();
  // Hashed session ids cannot be turned back into tokens: every session ends.
  await db.deleteFrom('session').execute();
}
