import { infiniteQueryOptions, queryOptions, useInfiniteQuery, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { AuditEvent, AuditPage, AuditVocabulary } from '@shared/contracts/audit';

export type { AuditEvent };

/** Filters as the API takes them; dates are ISO dates (YYYY-MM-DD, whole UTC days) or date-times. */
export interface AuditFilter {
  action?: string;
  actor?: string;
  targetType?: string;
  targetId?: string;
  from?: string;
  to?: string;
}

export const AUDIT_FILTER_FIELDS = [
  'action',
  'actor',
  'targetType',
  'targetId',
  'from',
  'to',
] as const satisfies readonly (keyof AuditFilter)[];
export const AUDIT_PAGE_SIZE = 100;

export const auditKeys = {
  all: ['audit'] as const,
  list: (filter: AuditFilter) => [...auditKeys.all, 'list', filter] as const,
  vocabulary: () => [...auditKeys.all, 'vocabulary'] as const,
};

export const auditEventsQueryOptions = (filter: AuditFilter) =>
  infiniteQueryOptions({
    queryKey: auditKeys.list(filter),
    initialPageParam: null as number | null,
    queryFn: ({ pageParam }) => {
      const q = new URLSearchParams({ limit: String(AUDIT_PAGE_SIZE) });
      for (const f of AUDIT_FILTER_FIELDS) if (filter[f]) q.set(f, filter[f]!);
      if (pageParam !== null) q.set('before', String(pageParam));
      return api<AuditPage>(`/audit?${q}`);
    },
    getNextPageParam: (last) => last.nextBefore,
  });

export const auditVocabularyQueryOptions = () =>
  queryOptions({ queryKey: auditKeys.vocabulary(), queryFn: () => api<AuditVocabulary>('/audit/vocabulary') });

export const useAuditEvents = (filter: AuditFilter) => useInfiniteQuery(auditEventsQueryOptions(filter));
export const useAuditVocabulary = () => useQuery(auditVocabularyQueryOptions());
