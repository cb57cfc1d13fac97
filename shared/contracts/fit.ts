/**
 * Contract of a fit: its stored options (fit.options_json), the view of GET /api/fits/:id and of a cancel, the list of
 * /api/substances/:id/fits and the 202 of POST /api/fits. The stored measurement set references are
 * shared/contracts/measurement-set-ref.ts, the result shared/contracts/fit-result.ts. Built in server/features/fits/fits.view.ts.
 */
import { z } from 'zod';
import { propertyKindSchema } from '../schemas/measurements';
import { fitResultSchema } from './fit-result';
import { measurementSetRef } from './measurement-set-ref';
import { jobStatusSchema } from './simulation';

/** fit.options_json: the fit options as frozen at the start (a prior resolved to its values), plus the engine settings of a density fit. */
export const storedFitOptions = z.looseObject({
  model: z.enum(['lj-12-6', 'mie']).optional(),
  molarMassGPerMol: z.number().optional(),
  repulsiveExponent: z.number().optional(),
  fitRepulsiveExponent: z.boolean().optional(),
  fixed: z.strictObject({ epsilonK: z.number().optional(), sigmaAngstrom: z.number().optional() }).optional(),
  // Loose blocks with the fields read elsewhere (the seeds of a parameter set's manifest).
  density: z.looseObject({ seed: z.number().optional() }).optional(),
  posterior: z.looseObject({ seed: z.number().optional() }).optional(),
});
export type StoredFitOptions = z.infer<typeof storedFitOptions>;

/** A reference as the fit page shows it: with the value's unit, rows left out as [] and no reason as null. */
export const fitMeasurementSetView = measurementSetRef.extend({
  valueUnit: z.string(),
  excludeRows: z.array(z.number().int()),
  excludeReason: z.string().nullable(),
});

export const fitView = z.strictObject({
  id: z.number().int(),
  number: z.number().int(),
  substanceId: z.number().int(),
  substanceName: z.string(),
  model: z.string(),
  /** The job's status, except that a finished computation whose least squares did not converge says failed. */
  status: jobStatusSchema,
  progress: z.number(),
  stage: z.string().nullable(),
  measurementSets: z.array(fitMeasurementSetView),
  options: storedFitOptions,
  codeVersion: z.string(),
  createdAt: z.string(),
  createdBy: z.string(),
  createdByName: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
  jobId: z.number().int(),
  error: z.string().nullable(),
  result: fitResultSchema.nullable(),
});
export type FitView = z.infer<typeof fitView>;

/** One fit of a substance's list: the numbers a table shows (a failed fit shows its last iterate without errors). */
export const fitListItemView = z.strictObject({
  id: z.number().int(),
  number: z.number().int(),
  createdAt: z.string(),
  createdByName: z.string(),
  status: jobStatusSchema,
  progress: z.number(),
  measurementSets: z.array(
    z.strictObject({
      measurementSetId: z.number().int(),
      name: z.string(),
      kind: propertyKindSchema,
      version: z.number().int(),
      excludeRows: z.array(z.number().int()),
    }),
  ),
  epsilonK: z.number().nullable(),
  sigmaAngstrom: z.number().nullable(),
  converged: z.boolean().nullable(),
  stdErr: z.strictObject({ epsilonK: z.number().nullable(), sigmaAngstrom: z.number().nullable() }).nullable(),
  heldParameters: z.array(z.enum(['epsilonK', 'sigmaAngstrom'])),
  reducedChi2: z.number().nullable(),
  warnings: z.array(z.string()),
});
export type FitListItem = z.infer<typeof fitListItemView>;
export const fitListView = z.strictObject({ fits: z.array(fitListItemView) });

/** 202 of POST /api/fits: the fit and the job that computes it. */
export const fitCreatedView = z.strictObject({ id: z.number().int(), number: z.number().int(), jobId: z.number().int() });
export type FitCreated = z.infer<typeof fitCreatedView>;
