import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { FitCreated, FitListItem, FitView } from '@shared/contracts/fit';
import type { CreateFitBody } from '@shared/schemas/fits';
import { api } from '@/lib/api-client';

export type { FitListItem } from '@shared/contracts/fit';
export type FitStatus = FitView['status'];
export type FitMeasurementSetRef = FitView['measurementSets'][number];
/** A fit as GET /api/fits/:id answers it (shared/contracts/fit.ts); its result is the union of gas-phase and density results. */
export type Fit = FitView;

export const fitKeys = {
  all: ['fits'] as const,
  detail: (id: number) => [...fitKeys.all, 'detail', id] as const,
  ofSubstance: (substanceId: number) => [...fitKeys.all, 'substance', substanceId] as const,
};

const unfinished = (status?: FitStatus) => status === 'queued' || status === 'running';

/** A fit, polled every second while it is queued or running. */
export const fitQueryOptions = (id: number) =>
  queryOptions({
    queryKey: fitKeys.detail(id),
    queryFn: () => api<Fit>(`/fits/${id}`),
    refetchInterval: (q) => (unfinished(q.state.data?.status) ? 1000 : false),
  });

export const substanceFitsQueryOptions = (substanceId: number) =>
  queryOptions({
    queryKey: fitKeys.ofSubstance(substanceId),
    queryFn: () => api<{ fits: FitListItem[] }>(`/substances/${substanceId}/fits`).then((r) => r.fits),
    refetchInterval: (q) => (q.state.data?.some((f) => unfinished(f.status)) ? 2000 : false),
  });

export const useFit = (id: number) => useQuery(fitQueryOptions(id));
export const useSubstanceFits = (substanceId: number) => useQuery(substanceFitsQueryOptions(substanceId));

export const useCreateFit = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateFitBody) => api<FitCreated>('/fits', { body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: fitKeys.all }),
  });
};

export const useCancelFit = (id: number) => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api<Fit>(`/fits/${id}/cancel`, { method: 'POST' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: fitKeys.all }),
  });
};
