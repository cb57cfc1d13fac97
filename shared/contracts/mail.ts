/**
 * Contract of the mail views: GET /api/mailbox (what the local fake mail service received) and GET /api/mail/outbox
 * (what the app tried to send and how it went). The stored to_json column (the recipients) is parsed with `recipientsStored`.
 * Built in server/features/mail/mail.view.ts.
 */
import { z } from 'zod';

export const OUTBOX_STATUSES = ['queued', 'sent', 'failed'] as const;
export const outboxStatusSchema = z.enum(OUTBOX_STATUSES);
export type OutboxStatus = z.infer<typeof outboxStatusSchema>;

/** mail_outbox.to_json and mailbox_message.to_json: the recipients' addresses. */
export const recipientsStored = z.array(z.string());

export const mailboxMessageView = z.strictObject({
  id: z.number().int(),
  receivedAt: z.string(),
  from: z.string(),
  to: recipientsStored,
  subject: z.string(),
  text: z.string(),
  html: z.string().nullable(),
  messageId: z.string().nullable(),
  sizeBytes: z.number().int(),
});
export type MailboxMessage = z.infer<typeof mailboxMessageView>;
export const mailboxView = z.strictObject({ messages: z.array(mailboxMessageView) });
export type Mailbox = z.infer<typeof mailboxView>;

export const outboxMessageView = z.strictObject({
  id: z.number().int(),
  to: recipientsStored,
  subject: z.string(),
  reason: z.string(),
  status: outboxStatusSchema,
  attempts: z.number().int(),
  lastError: z.string().nullable(),
  createdAt: z.string(),
  /** When the next attempt is due; null once the message was sent or given up. */
  nextAttemptAt: z.string().nullable(),
  sentAt: z.string().nullable(),
  messageId: z.string().nullable(),
});
export type OutboxMessage = z.infer<typeof outboxMessageView>;

export const outboxCountsView = z.strictObject({ queued: z.number().int(), sent: z.number().int(), failed: z.number().int() });
export type OutboxCounts = z.infer<typeof outboxCountsView>;

export const outboxView = z.strictObject({
  mode: z.enum(['local', 'smtp']),
  counts: outboxCountsView,
  messages: z.array(outboxMessageView),
});
export type Outbox = z.infer<typeof outboxView>;
