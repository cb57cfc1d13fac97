/** The signed-in user's query: the session check, useCan and several features read it, so it lives here, not in a feature. */
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Me } from '@shared/schemas/people';
import { api, isApiError } from '@/lib/api-client';

export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
};

/** The signed-in user, or null when nobody is signed in. */
export const meQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: async (): Promise<Me | null> => {
      try {
        return await api<Me>('/me');
      } catch (e) {
        if (isApiError(e, 401)) return null;
        throw e;
      }
    },
    staleTime: 60_000,
  });

export const useMe = () => useQuery(meQueryOptions());
