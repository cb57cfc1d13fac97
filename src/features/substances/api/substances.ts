import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { MeasurementSetSummary } from '@/features/measurement-sets/api/measurement-sets';

export interface Substance {
  id: number;
  name: string;
  formula: string | null;
  description: string | null;
  molarMassGPerMol: number;
  createdAt: string;
  updatedAt: string;
}

export interface SubstanceListItem extends Substance {
  measurementSetCount: number;
  kinds: string[];
}

export interface SubstanceDetail extends Substance {
  createdByName: string;
  measurementSets: MeasurementSetSummary[];
}

export const substanceKeys = {
  all: ['substances'] as const,
  list: () => [...substanceKeys.all, 'list'] as const,
  detail: (id: number) => [...substanceKeys.all, 'detail', id] as const,
};

export const substancesQueryOptions = () =>
  queryOptions({ queryKey: substanceKeys.list(), queryFn: () => api<{ substances: SubstanceListItem[] }>('/substances').then((r) => r.substances) });

export const substanceQueryOptions = (id: number) =>
  queryOptions({ queryKey: substanceKeys.detail(id), queryFn: () => api<SubstanceDetail>(`/substances/${id}`) });

export const useSubstances = () => useQuery(substancesQueryOptions());
export const useSubstance = (id: number) => useQuery(substanceQueryOptions(id));

export interface SubstanceInput {
  name: string;
  molarMassGPerMol: number;
  formula?: string;
  description?: string;
}

export const useCreateSubstance = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SubstanceInput) => api<Substance>('/substances', { body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: substanceKeys.all }),
  });
};

export const useUpdateSubstance = (id: number) => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: Partial<SubstanceInput>) => api<Substance>(`/substances/${id}`, { method: 'PATCH', body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: substanceKeys.all }),
  });
};
