import type { Generated } from 'kysely';

export type OutboxStatus = 'queued' | 'sent' | 'failed';

/** One message the app wants to send; written inside the transaction of the change that caused it. */
export interface MailOutboxTable {
  id: Generated<number>;
  toJson: string;
  subject: string;
  text: string;
  html: string;
  link: string | null;
  reason: string;
  status: OutboxStatus;
  attempts: Generated<number>;
  lastError: string | null;
  nextAttemptAt: string;
  createdAt: string;
  sentAt: string | null;
  messageId: string | null;
}

/** One message received by the local fake SMTP service. */
export interface MailboxMessageTable {
  id: Generated<number>;
  receivedAt: string;
  from: string;
  toJson: string;
  subject: string;
  text: string;
  html: string | null;
  messageId: string | null;
  rawSizeBytes: number;
}
