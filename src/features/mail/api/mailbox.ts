import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export interface MailboxMessage {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  messageId: string | null;
  sizeBytes: number;
}

export interface MailboxFilter {
  /** Substring of a recipient address. */
  to?: string;
}

export type OutboxStatus = 'queued' | 'sent' | 'failed';

export interface OutboxMessage {
  id: number;
  to: string[];
  subject: string;
  reason: string;
  status: OutboxStatus;
  attempts: number;
  lastError: string | null;
  createdAt: string;
  nextAttemptAt: string | null;
  sentAt: string | null;
  messageId: string | null;
}

export interface Outbox {
  mode: 'local' | 'smtp';
  counts: Record<OutboxStatus, number>;
  messages: OutboxMessage[];
}

export const mailKeys = {
  all: ['mailbox'] as const,
  list: (filter: MailboxFilter) => [...mailKeys.all, 'list', filter] as const,
  outbox: (status?: OutboxStatus) => [...mailKeys.all, 'outbox', status ?? 'any'] as const,
};

export const mailboxQueryOptions = (filter: MailboxFilter) =>
  queryOptions({
    queryKey: mailKeys.list(filter),
    queryFn: () => {
      const q = new URLSearchParams();
      if (filter.to) q.set('to', filter.to);
      return api<{ messages: MailboxMessage[] }>(`/mailbox${q.size ? `?${q}` : ''}`).then((r) => r.messages);
    },
    // New mail arrives from the outbox sender in the background.
    refetchInterval: 10_000,
  });

export const useMailbox = (filter: MailboxFilter) => useQuery(mailboxQueryOptions(filter));

export const outboxQueryOptions = (status?: OutboxStatus) =>
  queryOptions({
    queryKey: mailKeys.outbox(status),
    queryFn: () => api<Outbox>(`/mail/outbox${status ? `?status=${status}` : ''}`),
    refetchInterval: 10_000,
  });

export const useOutbox = (status?: OutboxStatus) => useQuery(outboxQueryOptions(status));
