import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { PairSetList, PairSetView } from '@shared/contracts/pair-set';
import type { PairSetCreateBody } from '@shared/schemas/pair-sets';
import { api } from '@/lib/api-client';

export type { PairSetView } from '@shared/contracts/pair-set';

/** A B12 measurement set that a pair set can be fitted to. */
export interface B12MeasurementSet {
  id: number;
  name: string;
  substanceName: string;
  version: number;
  rowCount: number;
}

export const pairSetKeys = {
  all: ['pair-sets'] as const,
  list: () => [...pairSetKeys.all, 'list'] as const,
  b12MeasurementSets: () => [...pairSetKeys.all, 'b12-measurementSets'] as const,
  approvedSets: () => [...pairSetKeys.all, 'approved-sets'] as const,
};

/** An approved parameter set a pair set can hold fixed. */
export interface ApprovedSet {
  id: number;
  substanceName: string;
  version: number;
  epsilonK: number;
  sigmaAngstrom: number;
}

export const approvedSetsQueryOptions = () =>
  queryOptions({
    queryKey: pairSetKeys.approvedSets(),
    queryFn: () =>
      api<{ sets: Array<ApprovedSet & { state: string }> }>('/catalog').then((r) => r.sets.filter((x) => x.state === 'approved')),
  });
export const useApprovedSets = (enabled: boolean) => useQuery({ ...approvedSetsQueryOptions(), enabled });

export const pairSetsQueryOptions = () =>
  queryOptions({ queryKey: pairSetKeys.list(), queryFn: () => api<PairSetList>('/pair-sets').then((r) => r.pairSets) });

export const b12MeasurementSetsQueryOptions = () =>
  queryOptions({
    queryKey: pairSetKeys.b12MeasurementSets(),
    queryFn: () =>
      api<{ measurementSets: Array<B12MeasurementSet & { kind: string }> }>('/measurement-sets').then((r) =>
        r.measurementSets.filter((d) => d.kind === 'b12'),
      ),
  });

export const usePairSets = () => useQuery(pairSetsQueryOptions());
export const useB12MeasurementSets = (enabled: boolean) => useQuery({ ...b12MeasurementSetsQueryOptions(), enabled });

/** Fits and submits a pair set; the list and every mixture answer may change. */
export const useCreatePairSet = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: PairSetCreateBody) => api<PairSetView>('/pair-sets', { method: 'POST', body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: pairSetKeys.all }),
  });
};

export const useReviewPairSet = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, decision, comment }: { id: number; decision: 'approve' | 'request-changes'; comment?: string }) =>
      api<PairSetView>(`/pair-sets/${id}/review`, { method: 'POST', body: { decision, ...(comment ? { comment } : {}) } }),
    // The Mixtures page refetches on mount (no stale time), so an approval shows there without reaching into its cache.
    onSuccess: () => qc.invalidateQueries({ queryKey: pairSetKeys.all }),
  });
};
