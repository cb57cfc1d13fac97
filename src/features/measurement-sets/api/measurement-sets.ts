import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { PropertyKind } from '@shared/measurements/property-kinds';
import { api } from '@/lib/api-client';
import { substanceKeys } from '@/features/substances/api/substances';

export interface MeasurementSetSummary {
  id: number;
  substanceId: number;
  substanceName: string;
  kind: PropertyKind;
  kindLabel: string;
  name: string;
  version: number;
  versionId: number;
  rowCount: number;
  source: string | null;
  doi: string | null;
  sha256: string;
  uploadedAt: string;
  withdrawn: boolean;
}

export type MeasurementSetRow = { row: number; temperatureK: number; pressureMPa?: number; uncertaintySource: 'measured' | 'default-relative'; raw: Record<string, string> } & Record<string, number | string | Record<string, string> | undefined>;

export interface MeasurementSetDetail {
  id: number;
  name: string;
  substanceId: number;
  substanceName: string;
  kind: PropertyKind;
  kindLabel: string;
  valueField: string;
  uncertaintyField: string;
  version: number;
  versionId: number;
  latestVersion: number;
  sha256: string;
  originalFilename: string;
  source: string | null;
  doi: string | null;
  method: string | null;
  notes: string | null;
  defaultRelativeUncertainty: number;
  delimiter: string;
  decimal: string;
  columns: Array<{ index: number; header: string; quantity: string | null; unitText: string | null; canonicalUnit: string | null }>;
  rowCount: number;
  uploadedAt: string;
  uploadedByName: string;
  withdrawn: { at: string; reason: string } | null;
  versions: Array<{ version: number; sha256: string; rowCount: number; uploadedAt: string; uploadedByName: string; originalFilename: string; source: string | null }>;
  rows: MeasurementSetRow[];
}

export const measurementSetKeys = {
  all: ['measurementSets'] as const,
  list: (substanceId?: number) => [...measurementSetKeys.all, 'list', { substanceId }] as const,
  detail: (id: number, version?: number) => [...measurementSetKeys.all, 'detail', id, { version }] as const,
};

export const measurementSetsQueryOptions = (substanceId?: number) =>
  queryOptions({
    queryKey: measurementSetKeys.list(substanceId),
    queryFn: () => api<{ measurementSets: MeasurementSetSummary[] }>(`/measurement-sets${substanceId ? `?substanceId=${substanceId}` : ''}`).then((r) => r.measurementSets),
  });

export const measurementSetQueryOptions = (id: number, version?: number) =>
  queryOptions({ queryKey: measurementSetKeys.detail(id, version), queryFn: () => api<MeasurementSetDetail>(`/measurement-sets/${id}${version ? `?version=${version}` : ''}`) });

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
      api<{ id: number; version: number; rowCount: number; sha256: string }>(measurementSetId ? `/measurement-sets/${measurementSetId}/versions` : '/measurement-sets', { formData: toFormData(input) }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: measurementSetKeys.all });
      void qc.invalidateQueries({ queryKey: substanceKeys.all });
    },
  });
};

export const useWithdrawMeasurementSet = (id: number) => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (reason: string) => api<{ id: number }>(`/measurement-sets/${id}/withdraw`, { body: { reason } }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: measurementSetKeys.all });
      void qc.invalidateQueries({ queryKey: substanceKeys.all });
    },
  });
};
