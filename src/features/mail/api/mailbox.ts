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

export const mailKeys = {
  all: ['mailbox'] as const,
  list: (filter: MailboxFilter) => [...mailKeys.all, 'list', filter] as const,
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
