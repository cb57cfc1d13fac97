import { type Kysely, sql } from 'kysely';

/**
 * The job runner's table (every long computation: fits, simulations) and fits as records.
 * A fit row is frozen at creation (trigger); its progress and result live on its job.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('job')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('kind', 'text', (c) => c.notNull())
    .addColumn('status', 'text', (c) => c.notNull().check(sql`status in ('queued', 'running', 'succeeded', 'failed', 'cancelled')`))
    .addColumn('progress', 'real', (c) => c.notNull().defaultTo(0))
    .addColumn('stage', 'text')
    .addColumn('input_json', 'text', (c) => c.notNull())
    .addColumn('result_json', 'text')
    .addColumn('error', 'text')
    .addColumn('retryable', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('attempts', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('seed', 'integer', (c) => c.notNull())
    .addColumn('cache_key', 'text')
    .addColumn('created_by', 'text', (c) => c.references('user.id'))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('started_at', 'text')
    .addColumn('finished_at', 'text')
    .addColumn('updated_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('job_status_idx').on('job').columns(['status', 'id']).execute();
  await db.schema.createIndex('job_cache_idx').on('job').columns(['kind', 'cache_key']).execute();

  await db.schema
    .createTable('fit')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('substance_id', 'integer', (c) => c.notNull().references('substance.id'))
    .addColumn('number', 'integer', (c) => c.notNull())
    .addColumn('job_id', 'integer', (c) => c.notNull().references('job.id'))
    .addColumn('model', 'text', (c) => c.notNull())
    .addColumn('datasets_json', 'text', (c) => c.notNull())
    .addColumn('options_json', 'text', (c) => c.notNull())
    .addColumn('code_version', 'text', (c) => c.notNull())
    .addColumn('created_by', 'text', (c) => c.notNull().references('user.id'))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addUniqueConstraint('fit_number_unique', ['substance_id', 'number'])
    .execute();
  await sql`CREATE TRIGGER fit_no_update BEFORE UPDATE ON fit BEGIN SELECT RAISE(ABORT, 'fit rows are immutable; run a new fit'); END`.execute(
    db,
  );
  await sql`CREATE TRIGGER fit_no_delete BEFORE DELETE ON fit BEGIN SELECT RAISE(ABORT, 'fit rows are immutable; run a new fit'); END`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('fit').execute();
  await db.schema.dropTable('job').execute();
}
