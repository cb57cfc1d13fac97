import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CreatedToken, TokenList, TokenView } from '@shared/contracts/token';
import { api } from '@/lib/api-client';

export type ApiToken = TokenView;

export const tokenKeys = {
  all: ['tokens'] as const,
  mine: () => [...tokenKeys.all, 'mine'] as const,
};

export const myTokensQueryOptions = () =>
  queryOptions({ queryKey: tokenKeys.mine(), queryFn: () => api<TokenList>('/tokens').then((r) => r.tokens) });

export const useMyTokens = () => useQuery(myTokensQueryOptions());

/** The answer carries the secret; it lives only in the component that shows it once, never in the cache. */
export const useCreateToken = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { name: string }) => api<CreatedToken>('/tokens', { body }),
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
