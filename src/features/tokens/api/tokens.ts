import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export interface ApiToken {
  id: number;
  name: string;
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
  active: boolean;
}

export const tokenKeys = {
  all: ['tokens'] as const,
  mine: () => [...tokenKeys.all, 'mine'] as const,
};

export const myTokensQueryOptions = () => queryOptions({ queryKey: tokenKeys.mine(), queryFn: () => api<{ tokens: ApiToken[] }>('/tokens').then((r) => r.tokens) });

export const useMyTokens = () => useQuery(myTokensQueryOptions());

/** The answer carries the secret; it lives only in the component that shows it once, never in the cache. */
export const useCreateToken = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { name: string }) => api<ApiToken & { token: string }>('/tokens', { body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: tokenKeys.all }),
  });
};

export const useRevokeToken = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api<ApiToken>(`/tokens/${id}`, { method: 'DELETE' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: tokenKeys.all }),
  });
};
