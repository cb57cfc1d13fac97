import type { Kysely } from 'kysely';

/**
 * Jobs handed to a queue driver:
 * - queue_ref names the current execution of a job in the driver (a BullMQ job id with REDIS_URL, a local one
 *   otherwise); it changes on every retry, so late news about an earlier execution is ignored.
 * - ran_on says where the job ran (worker process name: host and process id).
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('job').addColumn('queue_ref', 'text').execute();
  await db.schema.alterTable('job').addColumn('ran_on', 'text').execute();
  await db.schema.createIndex('job_queue_ref_idx').on('job').column('queue_ref').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropIndex('job_queue_ref_idx').execute();
  await db.schema.alterTable('job').dropColumn('ran_on').execute();
  await db.schema.alterTable('job').dropColumn('queue_ref').execute();
}
