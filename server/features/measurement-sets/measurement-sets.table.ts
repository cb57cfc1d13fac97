import type { Generated } from 'kysely';
import type { PropertyKind } from '../../../shared/measurements/property-kinds';

export interface MeasurementSetTable {
  id: Generated<number>;
  substanceId: number;
  kind: PropertyKind;
  name: string;
  createdBy: string;
  createdAt: string;
}

export interface MeasurementSetVersionTable {
  id: Generated<number>;
  measurementSetId: number;
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

/** One measured state point in canonical units; which quantity `value` is follows from the measurement set's kind. */
export interface MeasurementRowTable {
  id: Generated<number>;
  measurementSetVersionId: number;
  position: number;
  fileRow: number;
  temperatureK: number;
  pressureMpa: number | null;
  value: number;
  uncertainty: number;
  uncertaintySource: 'measured' | 'default-relative';
  rawJson: string;
}

export interface MeasurementSetWithdrawalTable {
  measurementSetId: number;
  withdrawnBy: string;
  withdrawnAt: string;
  reason: string;
}
