import type { Selectable } from 'kysely';
import { recipientsStored, type MailboxMessage, type OutboxMessage } from '../../../shared/contracts/mail';
import type { MailboxMessageTable, MailOutboxTable } from './mail.table';

/** One message the local mail service received, as GET /api/mailbox shows it. */
export function toMailboxMessageView(m: Selectable<MailboxMessageTable>): MailboxMessage {
  return {
    id: m.id,
    receivedAt: m.receivedAt,
    from: m.from,
    to: recipientsStored.parse(JSON.parse(m.toJson)),
    subject: m.subject,
    text: m.text,
    html: m.html,
    messageId: m.messageId,
    sizeBytes: m.rawSizeBytes,
  };
}

/** One outbox row as GET /api/mail/outbox shows it (the body stays out: the mailbox shows what arrived). */
export function toOutboxMessageView(m: Selectable<MailOutboxTable>): OutboxMessage {
  return {
    id: m.id,
    to: recipientsStored.parse(JSON.parse(m.toJson)),
    subject: m.subject,
    reason: m.reason,
    status: m.status,
    attempts: m.attempts,
    lastError: m.lastError,
    createdAt: m.createdAt,
    nextAttemptAt: m.status === 'queued' ? m.nextAttemptAt : null,
    sentAt: m.sentAt,
    messageId: m.messageId,
  };
}
