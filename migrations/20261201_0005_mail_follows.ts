import { type Kysely, sql } from 'kysely';

/**
 * E-mail and follows. mail_outbox holds every message the app wants to send, written in the same
 * transaction as the change that caused it; a sender loop delivers it over SMTP with retries.
 * mailbox_message is what the local fake SMTP service received (only used without SMTP_URL).
 * substance_follow lists who wants mail about a substance.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('mail_outbox')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('to_json', 'text', (c) => c.notNull())
    .addColumn('subject', 'text', (c) => c.notNull())
    .addColumn('text', 'text', (c) => c.notNull())
    .addColumn('html', 'text', (c) => c.notNull())
    .addColumn('link', 'text')
    .addColumn('reason', 'text', (c) => c.notNull())
    .addColumn('status', 'text', (c) => c.notNull().check(sql`status in ('queued', 'sent', 'failed')`))
    .addColumn('attempts', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('last_error', 'text')
    .addColumn('next_attempt_at', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('sent_at', 'text')
    .addColumn('message_id', 'text')
    .execute();
  await db.schema.createIndex('mail_outbox_due_idx').on('mail_outbox').columns(['status', 'next_attempt_at']).execute();

  await db.schema
    .createTable('mailbox_message')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('received_at', 'text', (c) => c.notNull())
    .addColumn('from', 'text', (c) => c.notNull())
    .addColumn('to_json', 'text', (c) => c.notNull())
    .addColumn('subject', 'text', (c) => c.notNull())
    .addColumn('text', 'text', (c) => c.notNull())
    .addColumn('html', 'text')
    .addColumn('message_id', 'text')
    .addColumn('raw_size_bytes', 'integer', (c) => c.notNull())
    .execute();

  await db.schema
    .createTable('substance_follow')
    .addColumn('user_id', 'text', (c) => c.notNull().references('user.id').onDelete('cascade'))
    .addColumn('substance_id', 'integer', (c) => c.notNull().references('substance.id'))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addPrimaryKeyConstraint('substance_follow_pk', ['user_id', 'substance_id'])
    .execute();
  await db.schema.createIndex('substance_follow_substance_idx').on('substance_follow').column('substance_id').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('substance_follow').execute();
  await db.schema.dropTable('mailbox_message').execute();
  await db.schema.dropTable('mail_outbox').execute();
}
