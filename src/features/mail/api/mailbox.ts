import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Mailbox, MailboxMessage, Outbox, OutboxMessage, OutboxStatus } from '@shared/contracts/mail';

export type { MailboxMessage, Outbox, OutboxMessage, OutboxStatus };

export interface MailboxFilter {
  /** Substring of a recipient address. */
  to?: string;
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
      return api<Mailbox>(`/mailbox${q.size ? `?${q}` : ''}`).then((r) => r.messages);
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
