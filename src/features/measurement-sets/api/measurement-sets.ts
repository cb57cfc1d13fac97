import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { PropertyKind } from '@shared/measurements/property-kinds';
import type {
  MeasurementSetDetail,
  MeasurementSetList,
  MeasurementSetUpload,
  MeasurementSetWithdrawal,
} from '@shared/contracts/measurement-set';
import { api } from '@/lib/api-client';
import { substanceKeys } from '@/lib/query-keys';

// Answers of the API: the contracts in shared/contracts/measurement-set.ts (never declared again here).
export type { MeasurementSetDetail, MeasurementSetRow, MeasurementSetSummary } from '@shared/contracts/measurement-set';

export const measurementSetKeys = {
  all: ['measurementSets'] as const,
  list: (substanceId?: number) => [...measurementSetKeys.all, 'list', { substanceId }] as const,
  detail: (id: number, version?: number) => [...measurementSetKeys.all, 'detail', id, { version }] as const,
};

export const measurementSetsQueryOptions = (substanceId?: number) =>
  queryOptions({
    queryKey: measurementSetKeys.list(substanceId),
    queryFn: () =>
      api<MeasurementSetList>(`/measurement-sets${substanceId ? `?substanceId=${substanceId}` : ''}`).then((r) => r.measurementSets),
  });

export const measurementSetQueryOptions = (id: number, version?: number) =>
  queryOptions({
    queryKey: measurementSetKeys.detail(id, version),
    queryFn: () => api<MeasurementSetDetail>(`/measurement-sets/${id}${version ? `?version=${version}` : ''}`),
  });

export const useMeasurementSets = (substanceId?: number) => useQuery(measurementSetsQueryOptions(substanceId));
export const useMeasurementSet = (id: number, version?: number) => useQuery(measurementSetQueryOptions(id, version));

export interface UploadInput {
  file: File;
  substanceId?: number;
  kind?: PropertyKind;
  name?: string;
  source?: string;
  doi?: string;
  method?: string;
  notes?: string;
  defaultRelativeUncertainty?: number;
  delimiter?: string;
  decimal?: string;
  mapping?: Record<number, { quantity: string; unit?: string }>;
}

function toFormData(input: UploadInput): FormData {
  const form = new FormData();
  for (const [key, value] of Object.entries(input)) {
    if (value === undefined || value === '' || key === 'file') continue;
    form.append(key, key === 'mapping' ? JSON.stringify(value) : String(value));
  }
  form.append('file', input.file);
  return form;
}

/** Uploads a new measurement set (measurementSetId absent) or a new version of one. */
export const useUploadMeasurementSet = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ measurementSetId, ...input }: UploadInput & { measurementSetId?: number }) =>
      api<MeasurementSetUpload>(measurementSetId ? `/measurement-sets/${measurementSetId}/versions` : '/measurement-sets', {
        formData: toFormData(input),
      }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: measurementSetKeys.all });
      void qc.invalidateQueries({ queryKey: substanceKeys.all });
    },
  });
};

export const useWithdrawMeasurementSet = (id: number) => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (reason: string) => api<MeasurementSetWithdrawal>(`/measurement-sets/${id}/withdraw`, { body: { reason } }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: measurementSetKeys.all });
      void qc.invalidateQueries({ queryKey: substanceKeys.all });
    },
  });
};
