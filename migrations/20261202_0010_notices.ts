import { type Kysely, sql } from 'kysely';

/**
 * In-app notices: short messages to one person (e.g. "Fit #3 of norrane finished"), with a link and the
 * time they were read. Only read_at ever changes.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('notice')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('user_id', 'text', (c) => c.notNull().references('user.id'))
    .addColumn('text', 'text', (c) => c.notNull().check(sql`length(text) between 1 and 1000`))
    .addColumn('link', 'text')
    .addColumn('reason', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('read_at', 'text')
    .execute();
  await db.schema.createIndex('notice_user_idx').on('notice').columns(['user_id', 'id']).execute();
  await sql`CREATE TRIGGER notice_frozen BEFORE UPDATE OF id, user_id, text, link, reason, created_at ON notice
    BEGIN SELECT RAISE(ABORT, 'a notice never changes, it is only marked read'); END`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('notice').execute();
}
