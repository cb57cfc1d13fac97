/**
 * Contract of a parameter set as every exporter reads it (shared/export/): built by toExportableParameterSet
 * (server/features/catalog/catalog.view.ts) from the catalog row, its approval and the sources of its data.
 */
import { z } from 'zod';
import { CUTOFF_SCHEMES } from '../physics/cutoff-schemes';

export const exportableParameterSetSchema = z.strictObject({
  id: z.number().int(),
  version: z.number().int(),
  substance: z.strictObject({
    id: z.number().int(),
    name: z.string(),
    formula: z.string().nullable().optional(),
    molarMassGPerMol: z.number(),
  }),
  /** 'mie' for a Mie λr-6 set (with repulsiveExponent); 'lj-12-6' otherwise. */
  model: z.enum(['lj-12-6', 'mie']),
  /** λr of a Mie set (absent or 12: LJ 12-6). */
  repulsiveExponent: z.number().optional(),
  epsilonK: z.number(),
  sigmaAngstrom: z.number(),
  stdErr: z.strictObject({ epsilonK: z.number().nullable(), sigmaAngstrom: z.number().nullable() }),
  /** Correlation coefficient of the ε and σ estimates from the fit covariance. */
  correlation: z.number().nullable(),
  scheme: z.enum(CUTOFF_SCHEMES),
  /** rc/σ for the truncated schemes; null for the full potential. */
  cutoffSigma: z.number().nullable(),
  validity: z.strictObject({
    temperatureMinK: z.number(),
    temperatureMaxK: z.number(),
    pressureMinMPa: z.number().nullable().optional(),
    pressureMaxMPa: z.number().nullable().optional(),
  }),
  approvedAt: z.string().nullable(),
  approvedBy: z.string().nullable(),
  state: z.string(),
  fitId: z.number().int(),
  measurementSets: z.array(
    z.strictObject({
      id: z.number().int(),
      version: z.number().int(),
      kind: z.string(),
      name: z.string(),
      source: z.string().nullable().optional(),
      doi: z.string().nullable().optional(),
    }),
  ),
});
export type ExportableParameterSet = z.infer<typeof exportableParameterSetSchema>;
