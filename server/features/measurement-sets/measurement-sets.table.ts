import type { Generated } from 'kysely';
import type { PropertyKind } from '../../../shared/measurements/property-kinds';

export interface DatasetTable {
  id: Generated<number>;
  substanceId: number;
  property: PropertyKind;
  name: string;
  createdBy: string;
  createdAt: string;
}

export interface DatasetVersionTable {
  id: Generated<number>;
  datasetId: number;
  version: number;
  sha256: string;
  originalFilename: string;
  originalBytes: Buffer;
  source: string | null;
  doi: string | null;
  method: string | null;
  notes: string | null;
  defaultRelativeUncertainty: number;
  delimiter: string;
  decimal: string;
  columnsJson: string;
  rowCount: number;
  uploadedBy: string;
  uploadedAt: string;
}

/** One measured state point in canonical units; which quantity `value` is follows from the dataset's kind. */
export interface MeasurementRowTable {
  id: Generated<number>;
  datasetVersionId: number;
  position: number;
  fileRow: number;
  temperatureK: number;
  pressureMpa: number | null;
  value: number;
  uncertainty: number;
  uncertaintySource: 'measured' | 'default-relative';
  rawJson: string;
}

export interface DatasetWithdrawalTable {
  datasetId: number;
  withdrawnBy: string;
  withdrawnAt: string;
  reason: string;
}
