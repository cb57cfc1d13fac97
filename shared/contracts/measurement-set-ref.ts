/**
 * Contract of a stored reference to one measurement set version: the entries of fit.measurement_sets_json and of
 * parameter_set.measurement_sets_json (a parameter set copies its fit's references when it is drafted).
 * Rows written before the vocabulary rename hold old keys: parse `readStoredJson(text)` with `measurementSetRefs`.
 */
import { z } from 'zod';
import { propertyKindSchema } from '../schemas/measurements';

export const measurementSetRef = z.strictObject({
  measurementSetId: z.number().int(),
  version: z.number().int(),
  versionId: z.number().int(),
  kind: propertyKindSchema,
  name: z.string(),
  weight: z.number(),
  /** Rows left out (1-based, as the measurement set page numbers them) and why; a parameter set's copy says [] and null. */
  excludeRows: z.array(z.number().int()).optional(),
  excludeReason: z.string().nullable().optional(),
  /** Canonical unit of the kind's values: a parameter set copies its fit's references as the fit view shows them, with it. */
  valueUnit: z.string().optional(),
});
export type MeasurementSetRef = z.infer<typeof measurementSetRef>;
export const measurementSetRefs = z.array(measurementSetRef);
