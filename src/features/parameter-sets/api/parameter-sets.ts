import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { PropertyKind } from '@shared/measurements/property-kinds';
import type { Move, ParameterSetState } from '@shared/parameter-sets/transitions';
import type { CutoffScheme } from '@shared/physics/cutoff-schemes';
import type { CreateParameterSetBody, ReviseParameterSetBody, UpdateParameterSetBody } from '@shared/schemas/parameter-sets';
import { api } from '@/lib/api-client';

export interface ParameterSetSummary {
  id: number;
  label: string;
  substanceId: number;
  substanceName: string;
  version: number;
  scheme: CutoffScheme;
  cutoffSigma: number | null;
  model: 'lj-12-6';
  /** The pair potential: 'mie' for a Mie λr-6 set, with λr and its label ("Mie 16-6"). */
  potential: 'lj-12-6' | 'mie';
  repulsiveExponent: number;
  potentialLabel: string;
  state: ParameterSetState;
  stateLabel: string;
  epsilonK: number;
  sigmaAngstrom: number;
  stdErr: { epsilonK: number | null; sigmaAngstrom: number | null };
  correlation: number | null;
  validity: { temperatureMinK: number; temperatureMaxK: number; pressureMinMPa: number | null; pressureMaxMPa: number | null };
  fitId: number;
  fitNumber: number;
  revisionOf: number | null;
  revisedBy: number | null;
  createdBy: string;
  createdByName: string;
  createdAt: string;
  updatedAt: string;
}

export interface ParameterSetDetail extends ParameterSetSummary {
  rationale: string;
  fit: {
    id: number;
    number: number;
    createdBy: string;
    createdByName: string;
    createdAt: string;
    codeVersion: string;
    quantumCorrection: boolean;
    molarMassGPerMol: number | null;
    chi2: number | null;
    dof: number | null;
    reducedChi2: number | null;
    warnings: string[];
    dataSpan: { temperatureMinK: number; temperatureMaxK: number } | null;
  };
  measurementSets: Array<{ measurementSetId: number; name: string; kind: PropertyKind; version: number; versionId: number; weight: number; source: string | null; doi: string | null; method: string | null; rowCount: number | null; sha256: string | null }>;
  history: Array<{ id: number; move: Move | 'create'; fromState: ParameterSetState | null; toState: ParameterSetState; actorId: string | null; actorName: string | null; comment: string | null; at: string }>;
  comments: Array<{ id: number; authorId: string; authorName: string; body: string; createdAt: string }>;
  currentApproved: ParameterSetSummary | null;
  allowedMoves: Move[];
  canComment: boolean;
}

export type QueueItem = ParameterSetSummary & { submittedAt: string | null };

export const parameterSetKeys = {
  all: ['parameter-sets'] as const,
  detail: (id: number) => [...parameterSetKeys.all, 'detail', id] as const,
  ofSubstance: (substanceId: number) => [...parameterSetKeys.all, 'substance', substanceId] as const,
  queue: () => [...parameterSetKeys.all, 'queue'] as const,
  diff: (id: number) => [...parameterSetKeys.all, 'diff', id] as const,
  needsAction: () => [...parameterSetKeys.all, 'needs-action'] as const,
};

export interface NeedsActionItem {
  kind: 'changes-requested' | 'draft' | 'awaiting-my-review';
  parameterSetId: number;
  substanceId: number;
  substanceName: string;
  version: number;
  state: ParameterSetState;
  stateLabel?: string;
  since: string;
}

export interface ParameterSetDiff {
  previous: { id: number; version: number } | null;
  changes: Array<{ field: string; label: string; before: string | number | null; after: string | number | null }>;
}

export const parameterSetQueryOptions = (id: number) =>
  queryOptions({ queryKey: parameterSetKeys.detail(id), queryFn: () => api<ParameterSetDetail>(`/parameter-sets/${id}`) });

export const substanceParameterSetsQueryOptions = (substanceId: number) =>
  queryOptions({
    queryKey: parameterSetKeys.ofSubstance(substanceId),
    queryFn: () => api<{ parameterSets: ParameterSetSummary[] }>(`/substances/${substanceId}/parameter-sets`).then((r) => r.parameterSets),
  });

export const reviewQueueQueryOptions = () =>
  queryOptions({ queryKey: parameterSetKeys.queue(), queryFn: () => api<{ parameterSets: QueueItem[] }>('/review-queue').then((r) => r.parameterSets) });

/** What waits for the signed-in person: sets sent back to them, their drafts, sets awaiting their review. */
export const needsActionQueryOptions = () =>
  queryOptions({ queryKey: parameterSetKeys.needsAction(), queryFn: () => api<{ items: NeedsActionItem[] }>('/workbench/needs-action').then((r) => r.items) });

/** The changes of a revision against the version it revises (values, scheme, validity, data). */
export const parameterSetDiffQueryOptions = (id: number) =>
  queryOptions({ queryKey: parameterSetKeys.diff(id), queryFn: () => api<ParameterSetDiff>(`/parameter-sets/${id}/diff`) });

export const useNeedsAction = () => useQuery(needsActionQueryOptions());
export const useParameterSetDiff = (id: number, enabled = true) => useQuery({ ...parameterSetDiffQueryOptions(id), enabled });
export const useParameterSet = (id: number) => useQuery(parameterSetQueryOptions(id));
export const useSubstanceParameterSets = (substanceId: number) => useQuery(substanceParameterSetsQueryOptions(substanceId));
export const useReviewQueue = () => useQuery(reviewQueueQueryOptions());

/** Every change touches the set, its substance's list and the queue: invalidate the whole family. */
function useParameterSetMutation<TBody, TResult>(fn: (body: TBody) => Promise<TResult>) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: fn, onSuccess: () => qc.invalidateQueries({ queryKey: parameterSetKeys.all }) });
}

export const useDraftParameterSet = () => useParameterSetMutation((body: CreateParameterSetBody) => api<ParameterSetSummary>('/parameter-sets', { body }));
export const useSubmitParameterSet = (id: number) => useParameterSetMutation(() => api<ParameterSetDetail>(`/parameter-sets/${id}/submit`, { method: 'POST' }));
export const useReviewParameterSet = (id: number) =>
  useParameterSetMutation((body: { decision: 'approve' | 'request_changes'; comment: string }) => api<ParameterSetDetail>(`/parameter-sets/${id}/review`, { body }));
export const useRetireParameterSet = (id: number) => useParameterSetMutation((body: { reason: string }) => api<ParameterSetDetail>(`/parameter-sets/${id}/retire`, { body }));
export const useReviseParameterSet = (id: number) => useParameterSetMutation((body: ReviseParameterSetBody) => api<ParameterSetSummary>(`/parameter-sets/${id}/revise`, { body }));
export const useEditParameterSet = (id: number) => useParameterSetMutation((body: UpdateParameterSetBody) => api<ParameterSetDetail>(`/parameter-sets/${id}`, { method: 'PATCH', body }));
export const useCommentOnParameterSet = (id: number) => useParameterSetMutation((body: { body: string }) => api<{ id: number }>(`/parameter-sets/${id}/comments`, { body }));
