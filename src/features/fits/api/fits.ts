import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { LjFitResult } from '@shared/fitting/lj-fit';
import type { CreateFitBody } from '@shared/schemas/fits';
import type { PropertyKind } from '@shared/measurements/property-kinds';
import { api } from '@/lib/api-client';

export type FitStatus = 'queued' | 'running' | 'succeeded' | 'failed' | 'cancelled';

export interface FitMeasurementSetRef {
  measurementSetId: number;
  version: number;
  versionId: number;
  kind: PropertyKind;
  name: string;
  weight: number;
  /** Rows (counted from 1) left out of the fit, and why. */
  excludeRows?: number[];
  excludeReason?: string | null;
}

export interface Fit {
  id: number;
  number: number;
  substanceId: number;
  substanceName: string;
  model: string;
  status: FitStatus;
  progress: number;
  stage: string | null;
  measurementSets: FitMeasurementSetRef[];
  options: { molarMassGPerMol?: number; quantumCorrection?: boolean; start?: { epsilonK: number; sigmaAngstrom: number }; bounds?: { epsilonK: [number, number]; sigmaAngstrom: [number, number] }; restarts?: number; maxIterations?: number };
  codeVersion: string;
  createdAt: string;
  createdBy: string;
  createdByName: string;
  startedAt: string | null;
  finishedAt: string | null;
  jobId: number;
  error: string | null;
  result: LjFitResult | null;
}

export interface FitListItem {
  id: number;
  number: number;
  createdAt: string;
  createdByName: string;
  status: FitStatus;
  progress: number;
  measurementSets: Array<{ measurementSetId: number; name: string; kind: PropertyKind; version: number; excludeRows?: number[] }>;
  /** False for a failed fit that kept its last iterate; null while queued or running. */
  converged?: boolean | null;
  heldParameters?: Array<'epsilonK' | 'sigmaAngstrom'>;
  epsilonK: number | null;
  sigmaAngstrom: number | null;
  stdErr: { epsilonK: number | null; sigmaAngstrom: number | null } | null;
  reducedChi2: number | null;
  warnings: string[];
}

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
    mutationFn: (body: CreateFitBody) => api<{ id: number; number: number }>('/fits', { body }),
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
