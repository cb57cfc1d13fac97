import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { PropertyKind } from '@shared/measurements/property-kinds';
import { api } from '@/lib/api-client';
import { substanceKeys } from '@/features/substances/api/substances';

export interface DatasetSummary {
  id: number;
  substanceId: number;
  substanceName: string;
  property: PropertyKind;
  propertyLabel: string;
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

export type DatasetRow = { row: number; temperatureK: number; pressureMPa?: number; uncertaintySource: 'measured' | 'default-relative'; raw: Record<string, string> } & Record<string, number | string | Record<string, string> | undefined>;

export interface DatasetDetail {
  id: number;
  name: string;
  substanceId: number;
  substanceName: string;
  property: PropertyKind;
  propertyLabel: string;
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
  rows: DatasetRow[];
}

export const datasetKeys = {
  all: ['datasets'] as const,
  list: (substanceId?: number) => [...datasetKeys.all, 'list', { substanceId }] as const,
  detail: (id: number, version?: number) => [...datasetKeys.all, 'detail', id, { version }] as const,
};

export const datasetsQueryOptions = (substanceId?: number) =>
  queryOptions({
    queryKey: datasetKeys.list(substanceId),
    queryFn: () => api<{ datasets: DatasetSummary[] }>(`/datasets${substanceId ? `?substanceId=${substanceId}` : ''}`).then((r) => r.datasets),
  });

export const datasetQueryOptions = (id: number, version?: number) =>
  queryOptions({ queryKey: datasetKeys.detail(id, version), queryFn: () => api<DatasetDetail>(`/datasets/${id}${version ? `?version=${version}` : ''}`) });

export const useDatasets = (substanceId?: number) => useQuery(datasetsQueryOptions(substanceId));
export const useDataset = (id: number, version?: number) => useQuery(datasetQueryOptions(id, version));

export interface UploadInput {
  file: File;
  substanceId?: number;
  property?: PropertyKind;
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

/** Uploads a new dataset (datasetId absent) or a new version of one. */
export const useUploadDataset = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ datasetId, ...input }: UploadInput & { datasetId?: number }) =>
      api<{ id: number; version: number; rowCount: number; sha256: string }>(datasetId ? `/datasets/${datasetId}/versions` : '/datasets', { formData: toFormData(input) }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: datasetKeys.all });
      void qc.invalidateQueries({ queryKey: substanceKeys.all });
    },
  });
};

export const useWithdrawDataset = (id: number) => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (reason: string) => api<{ id: number }>(`/datasets/${id}/withdraw`, { body: { reason } }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: datasetKeys.all });
      void qc.invalidateQueries({ queryKey: substanceKeys.all });
    },
  });
};
