import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { SubstanceDetail, SubstanceListItem, SubstanceWrite } from '@shared/contracts/substance';
import type { CreateSubstanceBody } from '@shared/schemas/measurements';
import { api } from '@/lib/api-client';
import { substanceKeys } from '@/lib/query-keys';

// Answers of the API: the contracts in shared/contracts/substance.ts (never declared again here).
export type { Substance, SubstanceDetail, SubstanceListItem } from '@shared/contracts/substance';

export const substancesQueryOptions = () =>
  queryOptions({
    queryKey: substanceKeys.list(),
    queryFn: () => api<{ substances: SubstanceListItem[] }>('/substances').then((r) => r.substances),
  });

export const substanceQueryOptions = (id: number) =>
  queryOptions({ queryKey: substanceKeys.detail(id), queryFn: () => api<SubstanceDetail>(`/substances/${id}`) });

export const useSubstances = () => useQuery(substancesQueryOptions());
export const useSubstance = (id: number) => useQuery(substanceQueryOptions(id));

/** What the substance form sends: the request schema's output (shared/schemas/measurements.ts), never declared again here. */
export type SubstanceInput = CreateSubstanceBody;

export const useCreateSubstance = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SubstanceInput) => api<SubstanceWrite>('/substances', { body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: substanceKeys.all }),
  });
};

export const useUpdateSubstance = (id: number) => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: Partial<SubstanceInput>) => api<SubstanceWrite>(`/substances/${id}`, { method: 'PATCH', body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: substanceKeys.all }),
  });
};
