/**
 * zod schemas of the measurement API, shared by the server (request validation) and the client
 * (forms). Units live in field names: `molarMassGPerMol` is in g/mol (its old name `molarMass` is still accepted).
 */
import { z } from 'zod';
import { PROPERTY_KIND_IDS, QUANTITIES, type PropertyKind, type QuantityKey } from '../measurements/property-kinds';
import type { ColumnMapping } from '../measurements/headers';
import { acceptOldFields } from './old-names';

/** Multipart and HTML forms send "" for an empty optional field: treat it as absent. */
const blankToUndefined = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v);
const optionalText = (max: number) => z.preprocess(blankToUndefined, z.string().trim().max(max, `at most ${max} characters`).optional());

export const propertyKindSchema = z.enum(PROPERTY_KIND_IDS as [PropertyKind, ...PropertyKind[]]);

/** Nothing is lighter than a hydrogen atom, 1.008 g/mol (IUPAC standard atomic weight). */
export const MOLAR_MASS_MIN_G_PER_MOL = 1;
/** Above this a single Lennard-Jones site is an unusual model: accepted with a warning. */
export const MOLAR_MASS_USUAL_MAX_G_PER_MOL = 1000;

const molarMass = z
  .number({ error: 'molar mass must be a number (g/mol)' })
  .gte(MOLAR_MASS_MIN_G_PER_MOL, 'molar mass must be at least 1 g/mol (a hydrogen atom is 1.008 g/mol)')
  .lt(10000, 'molar mass must be below 10000 g/mol');

/** Warnings for a molar mass that is possible but unusual (the substance is still saved). */
export function molarMassWarnings(molarMassGPerMol: number | undefined): string[] {
  if (molarMassGPerMol === undefined || molarMassGPerMol <= MOLAR_MASS_USUAL_MAX_G_PER_MOL) return [];
  return [
    `A molar mass of ${molarMassGPerMol} g/mol is unusual for a single Lennard-Jones site (most are below ${MOLAR_MASS_USUAL_MAX_G_PER_MOL} g/mol); check that it is per mole of molecules, in g/mol.`,
  ];
}

/**
 * The one spelling of a substance name: Unicode NFKC (a no-break or full-width character becomes its plain
 * form), runs of white space as one space, trimmed. Uniqueness compares these, ignoring letter case.
 */
export const normaliseSubstanceName = (name: string) => name.normalize('NFKC').replace(/\s+/g, ' ').trim();
const substanceName = (required: string) =>
  z.string().overwrite(normaliseSubstanceName).min(1, required).max(120, 'at most 120 characters');

/** POST /substances body. */
export const createSubstanceBody = acceptOldFields(
  z.object({
    name: substanceName('name is required'),
    formula: optionalText(60),
    description: optionalText(2000),
    molarMassGPerMol: molarMass,
  }),
  [['molarMass', 'molarMassGPerMol']],
);
export type CreateSubstanceBody = z.infer<typeof createSubstanceBody>;

/** PATCH /substances/:id body: any subset of the create fields, at least one. "" clears formula/description. */
export const updateSubstanceBody = acceptOldFields(
  z
    .object({
      name: substanceName('name must not be empty').optional(),
      formula: z.string().trim().max(60, 'at most 60 characters').optional(),
      description: z.string().trim().max(2000, 'at most 2000 characters').optional(),
      molarMassGPerMol: molarMass.optional(),
    })
    .refine((b) => Object.values(b).some((v) => v !== undefined), { message: 'give at least one field to change' }),
  [['molarMass', 'molarMassGPerMol']],
);
export type UpdateSubstanceBody = z.infer<typeof updateSubstanceBody>;

/**
 * DOI as registered by the DOI Foundation: prefix "10." + registrant code, "/", suffix
 * (Crossref's recommended pattern /^10.\d{4,9}\/[-._;()/:A-Z0-9]+$/i covers most; the suffix is
 * relaxed here to any non-space characters, as older DOIs carry <, >, [ and ]).
 * A resolver URL or a "doi:" prefix is stripped.
 */
export const DOI_PATTERN = /^10\.\d{4,9}\/\S+$/;
export const doiSchema = z.preprocess(
  (v) => (typeof v === 'string' ? v.trim().replace(/^(?:https?:\/\/(?:dx\.)?doi\.org\/|doi:\s*)/i, '') : v),
  z.string().max(255, 'at most 255 characters').regex(DOI_PATTERN, 'expected a DOI such as 10.1063/1.1234567'),
);

const delimiterSchema = z.preprocess(
  (v) => {
    if (typeof v !== 'string') return v;
    const names: Record<string, string> = { comma: ',', semicolon: ';', tab: '\t', '\\t': '\t' };
    return names[v.toLowerCase()] ?? v;
  },
  z.enum([',', ';', '\t'], { error: 'delimiter must be comma, semicolon or tab' }),
);

const decimalSchema = z.preprocess(
  (v) => {
    if (typeof v !== 'string') return v;
    const names: Record<string, string> = { dot: '.', point: '.', period: '.', comma: ',' };
    return names[v.toLowerCase()] ?? v;
  },
  z.enum(['.', ','], { error: 'decimal separator must be "." or ","' }),
);

const quantityKeys = Object.keys(QUANTITIES) as [QuantityKey, ...QuantityKey[]];

/** One mapping entry: what a column holds and in which unit. */
export const columnMappingEntrySchema = z.object({
  quantity: z.enum([...quantityKeys, 'ignore'] as [QuantityKey | 'ignore', ...(QuantityKey | 'ignore')[]]),
  unit: z.string().trim().max(40).optional(),
});

/** Column index (0-based, as a decimal string key) → entry. */
export const columnMappingSchema = z.record(
  z.string().regex(/^\d{1,4}$/, 'column keys are 0-based column numbers'),
  columnMappingEntrySchema,
);

/** The mapping arrives as a JSON string in a multipart field; an object is accepted too (JSON bodies). */
export const mappingFieldSchema = z.preprocess((v, ctx) => {
  if (typeof v !== 'string') return v;
  try {
    return JSON.parse(v);
  } catch {
    ctx.addIssue({ code: 'custom', message: 'mapping must be JSON such as {"0":{"quantity":"temperature","unit":"K"}}' });
    return z.NEVER;
  }
}, columnMappingSchema) as unknown as z.ZodType<ColumnMapping, unknown>;

/** Relative uncertainty 0 < x ≤ 1, from a number or a multipart string ("0.01"). */
export const relativeUncertaintySchema = z.coerce
  .number({ error: 'default relative uncertainty must be a number' })
  .gt(0, 'default relative uncertainty must be greater than 0')
  .lte(1, 'default relative uncertainty must be at most 1 (100 %)');

/** Fields of a new version of an existing measurement set (multipart, with the file in "file"). */
export const measurementSetVersionFields = z.object({
  source: optionalText(500),
  doi: z.preprocess(blankToUndefined, doiSchema.optional()),
  method: optionalText(500),
  notes: optionalText(5000),
  defaultRelativeUncertainty: z.preprocess(blankToUndefined, relativeUncertaintySchema.optional()),
  delimiter: z.preprocess(blankToUndefined, delimiterSchema.optional()),
  decimal: z.preprocess(blankToUndefined, decimalSchema.optional()),
  mapping: z.preprocess(blankToUndefined, mappingFieldSchema.optional()),
});
export type MeasurementSetVersionFields = z.infer<typeof measurementSetVersionFields>;

/** Fields of a new measurement set upload (multipart, with the file in "file"). */
export const measurementSetUploadFields = acceptOldFields(
  measurementSetVersionFields.extend({
    substanceId: z.coerce.number({ error: 'substanceId must be a number' }).int().positive(),
    kind: propertyKindSchema,
    name: z.string().trim().min(1, 'name is required').max(200, 'at most 200 characters'),
  }),
  [['property', 'kind']],
);
export type MeasurementSetUploadFields = z.infer<typeof measurementSetUploadFields>;

/** Canonical rows as the API returns them (units in field names). */
const rowCommon = {
  row: z.number().int().positive(),
  uncertaintySource: z.enum(['measured', 'default-relative']),
  raw: z.record(z.string(), z.string()),
};
const positive = () => z.number().finite().gt(0);

export const b2RowSchema = z.object({
  kind: z.literal('b2'),
  ...rowCommon,
  temperatureK: positive(),
  b2Cm3PerMol: z.number().finite(),
  uB2Cm3PerMol: positive(),
});
export const densityRowSchema = z.object({
  kind: z.literal('density'),
  ...rowCommon,
  temperatureK: positive(),
  pressureMPa: positive(),
  densityKgPerM3: positive(),
  uDensityKgPerM3: positive(),
});
export const viscosityRowSchema = z.object({
  kind: z.literal('viscosity'),
  ...rowCommon,
  temperatureK: positive(),
  viscosityMicroPaS: positive(),
  uViscosityMicroPaS: positive(),
});
export const b3RowSchema = z.object({
  kind: z.literal('b3'),
  ...rowCommon,
  temperatureK: positive(),
  b3Cm6PerMol2: z.number().finite(),
  uB3Cm6PerMol2: positive(),
});
export const saturatedLiquidDensityRowSchema = z.object({
  kind: z.literal('saturatedLiquidDensity'),
  ...rowCommon,
  temperatureK: positive(),
  liquidDensityKgPerM3: positive(),
  uLiquidDensityKgPerM3: positive(),
});
export const saturatedVapourDensityRowSchema = z.object({
  kind: z.literal('saturatedVapourDensity'),
  ...rowCommon,
  temperatureK: positive(),
  vapourDensityKgPerM3: positive(),
  uVapourDensityKgPerM3: positive(),
});
export const vapourPressureRowSchema = z.object({
  kind: z.literal('vapourPressure'),
  ...rowCommon,
  temperatureK: positive(),
  vapourPressureMPa: positive(),
  uVapourPressureMPa: positive(),
});
export const b12RowSchema = z.object({
  kind: z.literal('b12'),
  ...rowCommon,
  temperatureK: positive(),
  b12Cm3PerMol: z.number().finite(),
  uB12Cm3PerMol: positive(),
});
export const canonicalRowSchema = z.discriminatedUnion('kind', [
  b2RowSchema,
  densityRowSchema,
  viscosityRowSchema,
  b3RowSchema,
  saturatedLiquidDensityRowSchema,
  saturatedVapourDensityRowSchema,
  vapourPressureRowSchema,
  b12RowSchema,
]);
export type CanonicalRowSchema = z.infer<typeof canonicalRowSchema>;

/** Rows as GET /measurement-sets/:id returns them (the kind is given once for the measurement set), by kind. */
export const apiRowSchemas = {
  b2: b2RowSchema.omit({ kind: true }),
  density: densityRowSchema.omit({ kind: true }),
  viscosity: viscosityRowSchema.omit({ kind: true }),
  b3: b3RowSchema.omit({ kind: true }),
  saturatedLiquidDensity: saturatedLiquidDensityRowSchema.omit({ kind: true }),
  saturatedVapourDensity: saturatedVapourDensityRowSchema.omit({ kind: true }),
  vapourPressure: vapourPressureRowSchema.omit({ kind: true }),
  b12: b12RowSchema.omit({ kind: true }),
} as const;

/** POST /api/measurement-sets/:id/withdraw (the withdraw form validates with it too). */
export const withdrawMeasurementSetBody = z.object({
  reason: z.string().trim().min(3, 'give a reason of at least 3 characters').max(2000),
});
