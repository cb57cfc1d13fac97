/**
 * Contract of a measurement set: the list and detail answers of /api/measurement-sets, the answers of an upload
 * and a withdrawal, and the stored JSON columns of its versions and rows (columns_json, raw_json).
 * Built in server/features/measurement-sets/measurement-sets.view.ts.
 */
import { z } from 'zod';
import { PROPERTY_KINDS, QUANTITIES, type CanonicalField } from '../measurements/property-kinds';
import { propertyKindSchema } from '../schemas/measurements';

/** One column of the uploaded file as it was read (measurement_set_version.columns_json). */
export const storedColumn = z.strictObject({
  index: z.number().int(),
  header: z.string(),
  quantity: z.string().nullable(),
  unitText: z.string().nullable(),
  canonicalUnit: z.string().nullable(),
});
export const storedColumns = z.array(storedColumn);
export type StoredColumn = z.infer<typeof storedColumn>;

/** The cells of one file row as they were written (measurement_row.raw_json), by header. */
export const storedRawCells = z.record(z.string(), z.string());

/** Every canonical field a row may carry (the kind's value and uncertainty among them), each in its unit. */
const canonicalFields = [...new Set(Object.values(QUANTITIES).map((q) => q.field))].filter((f) => f !== 'temperatureK') as Exclude<
  CanonicalField,
  'temperatureK'
>[];
const optionalCanonical = Object.fromEntries(canonicalFields.map((f) => [f, z.number().optional()])) as Record<
  Exclude<CanonicalField, 'temperatureK'>,
  z.ZodOptional<z.ZodNumber>
>;

/** One stored state point in canonical units; which value field it has follows from the set's kind (`valueField`). */
export const measurementSetRowView = z.strictObject({
  row: z.number().int(),
  temperatureK: z.number(),
  ...optionalCanonical,
  uncertaintySource: z.enum(['measured', 'default-relative']),
  raw: storedRawCells,
});
export type MeasurementSetRow = z.infer<typeof measurementSetRowView>;

/** A measurement set with its newest version, as lists show it (also inside a substance's detail). */
export const measurementSetSummaryView = z.strictObject({
  id: z.number().int(),
  substanceId: z.number().int(),
  substanceName: z.string(),
  kind: propertyKindSchema,
  kindLabel: z.string(),
  name: z.string(),
  version: z.number().int(),
  versionId: z.number().int(),
  rowCount: z.number().int(),
  source: z.string().nullable(),
  doi: z.string().nullable(),
  sha256: z.string(),
  uploadedAt: z.string(),
  withdrawn: z.boolean(),
});
export type MeasurementSetSummary = z.infer<typeof measurementSetSummaryView>;

export const measurementSetListView = z.strictObject({ measurementSets: z.array(measurementSetSummaryView) });
export type MeasurementSetList = z.infer<typeof measurementSetListView>;

const canonicalFieldSchema = z.enum(
  Object.values(PROPERTY_KINDS).flatMap((k) => [k.valueField, k.uncertaintyField]) as [CanonicalField, ...CanonicalField[]],
);

export const measurementSetVersionSummaryView = z.strictObject({
  version: z.number().int(),
  sha256: z.string(),
  rowCount: z.number().int(),
  uploadedAt: z.string(),
  uploadedByName: z.string(),
  originalFilename: z.string(),
  source: z.string().nullable(),
});

/** GET /api/measurement-sets/:id[?version=n]: one version with its rows and the list of all versions. */
export const measurementSetDetailView = z.strictObject({
  id: z.number().int(),
  name: z.string(),
  substanceId: z.number().int(),
  substanceName: z.string(),
  kind: propertyKindSchema,
  kindLabel: z.string(),
  valueField: canonicalFieldSchema,
  uncertaintyField: canonicalFieldSchema,
  version: z.number().int(),
  versionId: z.number().int(),
  latestVersion: z.number().int(),
  sha256: z.string(),
  originalFilename: z.string(),
  source: z.string().nullable(),
  doi: z.string().nullable(),
  method: z.string().nullable(),
  notes: z.string().nullable(),
  defaultRelativeUncertainty: z.number(),
  delimiter: z.string(),
  decimal: z.string(),
  columns: storedColumns,
  rowCount: z.number().int(),
  uploadedAt: z.string(),
  uploadedByName: z.string(),
  withdrawn: z.strictObject({ at: z.string(), reason: z.string() }).nullable(),
  versions: z.array(measurementSetVersionSummaryView),
  rows: z.array(measurementSetRowView),
});
export type MeasurementSetDetail = z.infer<typeof measurementSetDetailView>;

/** 201 of an upload (new set or new version): what was stored, and warnings that did not stop it. */
export const measurementSetUploadView = z.strictObject({
  id: z.number().int(),
  version: z.number().int(),
  rowCount: z.number().int(),
  sha256: z.string(),
  warnings: z.array(z.string()),
});
export type MeasurementSetUpload = z.infer<typeof measurementSetUploadView>;

export const measurementSetWithdrawView = z.strictObject({ id: z.number().int(), withdrawn: z.literal(true) });
export type MeasurementSetWithdrawal = z.infer<typeof measurementSetWithdrawView>;
