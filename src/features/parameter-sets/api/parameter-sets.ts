import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  ParameterSetComment,
  ParameterSetDetail,
  ParameterSetDiff,
  ParameterSetSummary,
  ReviewQueueItem,
} from '@shared/contracts/parameter-set';
import type { ParameterSetState } from '@shared/parameter-sets/transitions';
import type { CreateParameterSetBody, ReviseParameterSetBody, UpdateParameterSetBody } from '@shared/schemas/parameter-sets';
import { api } from '@/lib/api-client';

export type { ParameterSetDetail, ParameterSetDiff, ParameterSetSummary } from '@shared/contracts/parameter-set';
export type QueueItem = ReviewQueueItem;

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

export const parameterSetQueryOptions = (id: number) =>
  queryOptions({ queryKey: parameterSetKeys.detail(id), queryFn: () => api<ParameterSetDetail>(`/parameter-sets/${id}`) });

export const substanceParameterSetsQueryOptions = (substanceId: number) =>
  queryOptions({
    queryKey: parameterSetKeys.ofSubstance(substanceId),
    queryFn: () => api<{ parameterSets: ParameterSetSummary[] }>(`/substances/${substanceId}/parameter-sets`).then((r) => r.parameterSets),
  });

export const reviewQueueQueryOptions = () =>
  queryOptions({
    queryKey: parameterSetKeys.queue(),
    queryFn: () => api<{ parameterSets: QueueItem[] }>('/review-queue').then((r) => r.parameterSets),
  });

/** What waits for the signed-in person: sets sent back to them, their drafts, sets awaiting their review. */
export const needsActionQueryOptions = () =>
  queryOptions({
    queryKey: parameterSetKeys.needsAction(),
    queryFn: () => api<{ items: NeedsActionItem[] }>('/workbench/needs-action').then((r) => r.items),
  });

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

export const useDraftParameterSet = () =>
  useParameterSetMutation((body: CreateParameterSetBody) => api<ParameterSetSummary>('/parameter-sets', { body }));
export const useSubmitParameterSet = (id: number) =>
  useParameterSetMutation(() => api<ParameterSetDetail>(`/parameter-sets/${id}/submit`, { method: 'POST' }));
export const useReviewParameterSet = (id: number) =>
  useParameterSetMutation((body: { decision: 'approve' | 'request_changes'; comment: string }) =>
    api<ParameterSetDetail>(`/parameter-sets/${id}/review`, { body }),
  );
export const useRetireParameterSet = (id: number) =>
  useParameterSetMutation((body: { reason: string }) => api<ParameterSetDetail>(`/parameter-sets/${id}/retire`, { body }));
export const useReviseParameterSet = (id: number) =>
  useParameterSetMutation((body: ReviseParameterSetBody) => api<ParameterSetSummary>(`/parameter-sets/${id}/revise`, { body }));
export const useEditParameterSet = (id: number) =>
  useParameterSetMutation((body: UpdateParameterSetBody) => api<ParameterSetDetail>(`/parameter-sets/${id}`, { method: 'PATCH', body }));
export const useCommentOnParameterSet = (id: number) =>
  useParameterSetMutation((body: { body: string }) => api<ParameterSetComment>(`/parameter-sets/${id}/comments`, { body }));
