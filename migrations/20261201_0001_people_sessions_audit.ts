import { type Kysely, sql } from 'kysely';

/** People, their roles, sign-in sessions (lucia's tables) and the append-only audit trail. */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('user')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('email', 'text', (c) => c.notNull().unique())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('password_hash', 'text', (c) => c.notNull())
    .addColumn('active', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('preferences_json', 'text', (c) => c.notNull().defaultTo('{}'))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();

  await db.schema
    .createTable('user_role')
    .addColumn('user_id', 'text', (c) => c.notNull().references('user.id').onDelete('cascade'))
    .addColumn('role', 'text', (c) => c.notNull().check(sql`role in ('admin', 'modeller', 'reviewer', 'consumer')`))
    .addPrimaryKeyConstraint('user_role_pk', ['user_id', 'role'])
    .execute();

  await db.schema
    .createTable('session')
    .addColumn('id', 'text', (c) => c.primaryKey())
    .addColumn('expires_at', 'integer', (c) => c.notNull())
    .addColumn('user_id', 'text', (c) => c.notNull().references('user.id').onDelete('cascade'))
    .execute();
  await db.schema.createIndex('session_user_idx').on('session').column('user_id').execute();

  await db.schema
    .createTable('audit_event')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('at', 'text', (c) => c.notNull())
    .addColumn('actor_id', 'text')
    .addColumn('actor_email', 'text')
    .addColumn('action', 'text', (c) => c.notNull())
    .addColumn('target_type', 'text', (c) => c.notNull())
    .addColumn('target_id', 'text')
    .addColumn('summary', 'text', (c) => c.notNull())
    .addColumn('before_json', 'text')
    .addColumn('after_json', 'text')
    .execute();
  await db.schema.createIndex('audit_event_target_idx').on('audit_event').columns(['target_type', 'target_id']).execute();
  await db.schema.createIndex('audit_event_action_idx').on('audit_event').column('action').execute();

  // The audit trail is append-only: the database itself refuses updates and deletes.
  await sql`CREATE TRIGGER audit_event_no_update BEFORE UPDATE ON audit_event
    BEGIN SELECT RAISE(ABORT, 'audit_event rows are append-only'); END`.execute(db);
  await sql`CREATE TRIGGER audit_event_no_delete BEFORE DELETE ON audit_event
    BEGIN SELECT RAISE(ABORT, 'audit_event rows are append-only'); END`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('audit_event').execute();
  await db.schema.dropTable('session').execute();
  await db.schema.dropTable('user_role').execute();
  await db.schema.dropTable('user').execute();
}
