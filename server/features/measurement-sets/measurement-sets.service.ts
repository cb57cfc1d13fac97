import { createHash } from 'node:crypto';
import { decodeCsvBytes } from '../../../shared/measurements/decode-bytes';
import { parseMeasurementCsv, type ParseOptions } from '../../../shared/measurements/parse-measurement-csv';
import { PROPERTY_KINDS, type CanonicalRow, type PropertyKind } from '../../../shared/measurements/property-kinds';
import type { StoredColumn } from '../../../shared/contracts/measurement-set';
import type { Db, Tx } from '../../db/database';
import type { CurrentUser } from '../../common/auth-middleware';
import { AppError, unprocessable } from '../../common/errors';
import { recordAudit } from '../audit/audit.service';
import { insertMeasurementSet, insertRows, insertVersion, latestVersionNumber, rowsOfVersion } from './measurement-sets.repository';

export interface UploadedFile {
  originalname: string;
  buffer: Buffer;
}

export interface VersionFields {
  source?: string;
  doi?: string;
  method?: string;
  notes?: string;
  defaultRelativeUncertainty?: number;
  delimiter?: ParseOptions['delimiter'];
  decimal?: ParseOptions['decimal'];
  mapping?: ParseOptions['mapping'];
}

/** Parses and validates an upload; any problem answers 422 with one detail per problem and stores nothing. */
export function parseUpload(file: UploadedFile, kind: PropertyKind, fields: VersionFields, molarMassGPerMol: number) {
  const text = decodeCsvBytes(file.buffer);
  const parsed = parseMeasurementCsv(text, {
    kind,
    delimiter: fields.delimiter,
    decimal: fields.decimal,
    mapping: fields.mapping,
    defaultRelativeUncertainty: fields.defaultRelativeUncertainty,
    molarMassGPerMol,
  });
  if (!parsed.ok) {
    const n = parsed.problems.length;
    const first = parsed.problems[0];
    throw unprocessable(
      `The file was not stored: ${n} problem${n === 1 ? '' : 's'} found${first ? ` — ${first.message}` : ''}.`,
      parsed.problems,
    );
  }
  return parsed;
}

/**
 * Stores one accepted upload as version n+1 of a measurement set (creating the measurement set for version 1), with
 * its original bytes, SHA-256 and rows, and an audit row. Runs inside the caller's transaction.
 */
export async function storeVersion(
  tx: Tx,
  input: {
    measurementSetId?: number;
    newMeasurementSet?: { substanceId: number; kind: PropertyKind; name: string };
    file: UploadedFile;
    fields: VersionFields;
    parsed: ReturnType<typeof parseUpload>;
    actor: CurrentUser;
  },
) {
  const now = new Date().toISOString();
  let measurementSetId = input.measurementSetId;
  if (measurementSetId === undefined) {
    if (!input.newMeasurementSet)
      throw new AppError(500, 'internal_error', 'storeVersion needs a measurement set id or a new measurement set.');
    measurementSetId = await insertMeasurementSet(tx, { ...input.newMeasurementSet, createdBy: input.actor.id, createdAt: now });
  }
  const version = (await latestVersionNumber(tx, measurementSetId)) + 1;
  const sha256 = createHash('sha256').update(input.file.buffer).digest('hex');
  const { parsed, fields } = input;
  const columns: StoredColumn[] = parsed.columns.map((c) => ({
    index: c.index,
    header: c.header,
    quantity: c.quantity ?? null,
    unitText: c.unitText ?? null,
    canonicalUnit: c.canonicalUnit ?? null,
  }));
  const versionId = await insertVersion(tx, {
    measurementSetId,
    version,
    sha256,
    originalFilename: input.file.originalname.slice(0, 255),
    originalBytes: input.file.buffer,
    source: fields.source ?? null,
    doi: fields.doi ?? null,
    method: fields.method ?? null,
    notes: fields.notes ?? null,
    defaultRelativeUncertainty: parsed.defaultRelativeUncertainty,
    delimiter: parsed.delimiter,
    decimal: parsed.decimal,
    columnsJson: JSON.stringify(columns),
    rowCount: parsed.rows.length,
    uploadedBy: input.actor.id,
    uploadedAt: now,
  });
  await insertRows(
    tx,
    parsed.rows.map((row, position) => toStoredRow(row, versionId, position)),
  );
  await recordAudit(tx, {
    actor: input.actor,
    action: version === 1 ? 'dataset.uploaded' : 'dataset.version_uploaded',
    targetType: 'dataset',
    targetId: measurementSetId,
    summary: `${input.actor.email} uploaded ${input.file.originalname} as v${version} (${parsed.rows.length} rows, sha256 ${sha256.slice(0, 12)}…)`,
    after: { version, sha256, rowCount: parsed.rows.length, kind: parsed.kind },
  });
  return { id: measurementSetId, version, rowCount: parsed.rows.length, sha256 };
}

function toStoredRow(row: CanonicalRow, measurementSetVersionId: number, position: number) {
  const def = PROPERTY_KINDS[row.kind];
  const r = row as unknown as Record<string, number>;
  return {
    measurementSetVersionId,
    position,
    fileRow: row.row,
    temperatureK: row.temperatureK,
    pressureMpa: row.kind === 'density' ? row.pressureMPa : null,
    value: r[def.valueField],
    uncertainty: r[def.uncertaintyField],
    uncertaintySource: row.uncertaintySource,
    rawJson: JSON.stringify(row.raw),
  };
}

/** Value/uncertainty rows of a stored version, for the fit (units are the kind's canonical units). */
export async function loadVersionForFit(db: Db | Tx, measurementSetVersionId: number) {
  const rows = await rowsOfVersion(db, measurementSetVersionId);
  return rows.map((r) => ({ temperatureK: r.temperatureK, pressureMPa: r.pressureMpa, value: r.value, uncertainty: r.uncertainty }));
}
