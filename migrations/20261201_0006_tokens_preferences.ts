import { type Kysely, sql } from 'kysely';

/**
 * Personal read-only API tokens. Only the SHA-256 hash of the secret is stored (the secret is shown once
 * at creation); the prefix is its first characters, for telling tokens apart on screen. A revoked token
 * keeps its row (revoked_at set) so the audit trail can still name it. Per-user display preferences live
 * in user.preferences_json, which exists since the first migration.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('api_token')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('user_id', 'text', (c) => c.notNull().references('user.id'))
    .addColumn('name', 'text', (c) => c.notNull().check(sql`length(name) between 1 and 80`))
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('prefix', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('last_used_at', 'text')
    .addColumn('revoked_at', 'text')
    .execute();
  await db.schema.createIndex('api_token_user_idx').on('api_token').columns(['user_id', 'id']).execute();
  // A token's identity never changes; only its use and revocation are recorded, and a revocation is final.
  await sql`CREATE TRIGGER api_token_frozen BEFORE UPDATE OF id, user_id, name, token_hash, prefix, created_at ON api_token
    BEGIN SELECT RAISE(ABORT, 'api_token identity is frozen'); END`.execute(db);
  await sql`CREATE TRIGGER api_token_revocation_final BEFORE UPDATE OF revoked_at ON api_token WHEN OLD.revoked_at IS NOT NULL
    BEGIN SELECT RAISE(ABORT, 'a revoked api_token stays revoked'); END`.execute(db);
  await sql`CREATE TRIGGER api_token_no_delete BEFORE DELETE ON api_token BEGIN SELECT RAISE(ABORT, 'api_token rows are never deleted'); END`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('api_token').execute();
}
