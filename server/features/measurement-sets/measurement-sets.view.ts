import {
  storedColumns,
  storedRawCells,
  type MeasurementSetDetail,
  type MeasurementSetRow,
  type MeasurementSetSummary,
} from '../../../shared/contracts/measurement-set';
import { PROPERTY_KINDS, type PropertyKind } from '../../../shared/measurements/property-kinds';
import type { findMeasurementSet, listMeasurementSetsOfSubstance, listVersions, rowsOfVersion } from './measurement-sets.repository';

type SummaryRow = Awaited<ReturnType<typeof listMeasurementSetsOfSubstance>>[number];
type VersionRow = Awaited<ReturnType<typeof listVersions>>[number];
type StoredRow = Awaited<ReturnType<typeof rowsOfVersion>>[number];
type SetRow = NonNullable<Awaited<ReturnType<typeof findMeasurementSet>>>;

/** The one place a measurement set's rows become API names (shared/contracts/measurement-set.ts). */
export const toMeasurementSetSummaryView = (d: SummaryRow): MeasurementSetSummary => ({
  id: d.id,
  substanceId: d.substanceId,
  substanceName: d.substanceName,
  kind: d.kind,
  kindLabel: PROPERTY_KINDS[d.kind].label,
  name: d.name,
  version: d.version,
  versionId: d.versionId,
  rowCount: d.rowCount,
  source: d.source,
  doi: d.doi,
  sha256: d.sha256,
  uploadedAt: d.uploadedAt,
  withdrawn: d.withdrawnAt !== null,
});

/** A stored row in the API's shape: canonical units named in each field, via the kind registry. */
export function toMeasurementSetRowView(kind: PropertyKind, row: StoredRow): MeasurementSetRow {
  const def = PROPERTY_KINDS[kind];
  return {
    row: row.fileRow,
    temperatureK: row.temperatureK,
    ...(row.pressureMpa !== null ? { pressureMPa: row.pressureMpa } : {}),
    [def.valueField]: row.value,
    [def.uncertaintyField]: row.uncertainty,
    uncertaintySource: row.uncertaintySource,
    raw: storedRawCells.parse(JSON.parse(row.rawJson)),
  };
}

/** One version of a set (`chosen`, one of `versions`, newest first) with its rows. */
export function toMeasurementSetDetailView(input: {
  set: SetRow;
  substanceName: string;
  versions: VersionRow[];
  chosen: VersionRow;
  rows: StoredRow[];
}): MeasurementSetDetail {
  const { set, chosen, versions } = input;
  const def = PROPERTY_KINDS[set.kind];
  return {
    id: set.id,
    name: set.name,
    substanceId: set.substanceId,
    substanceName: input.substanceName,
    kind: set.kind,
    kindLabel: def.label,
    valueField: def.valueField,
    uncertaintyField: def.uncertaintyField,
    version: chosen.version,
    versionId: chosen.id,
    latestVersion: versions[0].version,
    sha256: chosen.sha256,
    originalFilename: chosen.originalFilename,
    source: chosen.source,
    doi: chosen.doi,
    method: chosen.method,
    notes: chosen.notes,
    defaultRelativeUncertainty: chosen.defaultRelativeUncertainty,
    delimiter: chosen.delimiter,
    decimal: chosen.decimal,
    columns: storedColumns.parse(JSON.parse(chosen.columnsJson)),
    rowCount: chosen.rowCount,
    uploadedAt: chosen.uploadedAt,
    uploadedByName: chosen.uploadedByName,
    withdrawn: set.withdrawnAt ? { at: set.withdrawnAt, reason: set.withdrawnReason ?? '' } : null,
    versions: versions.map((v) => ({
      version: v.version,
      sha256: v.sha256,
      rowCount: v.rowCount,
      uploadedAt: v.uploadedAt,
      uploadedByName: v.uploadedByName,
      originalFilename: v.originalFilename,
      source: v.source,
    })),
    rows: input.rows.map((r) => toMeasurementSetRowView(set.kind, r)),
  };
}
