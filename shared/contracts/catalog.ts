/**
 * Contract of the catalog: GET /api/catalog (the current approved sets), GET /api/catalog/:id (the parameter card),
 * GET /api/mixtures without a format (the pair table) and GET /api/parameter-sets/:id/predictions.
 * Built in server/features/catalog/catalog.view.ts from the one parameter-set mapping (parameter-sets.view.ts).
 */
import { z } from 'zod';
import { propertyKindSchema } from '../schemas/measurements';
import {
  cutoffSchemeSchema,
  parameterSetFitView,
  parameterSetMeasurementSetView,
  parameterSetStateSchema,
  parameterSetValuesView,
  potentialSchema,
  standardErrorsView,
  validityView,
} from './parameter-set';

/** One entry of the catalog: the set's values with its substance, approval, data kinds and count of older versions. */
export const catalogEntryView = parameterSetValuesView.extend({
  formula: z.string().nullable(),
  schemeLabel: z.string(),
  kinds: z.array(propertyKindSchema),
  approvedAt: z.string().nullable(),
  approvedByName: z.string().nullable(),
  olderVersions: z.number().int(),
});
export type CatalogEntry = z.infer<typeof catalogEntryView>;
export const catalogListView = z.strictObject({ sets: z.array(catalogEntryView) });

/** One published version of the card's substance and scheme, with its change against the version before it. */
export const parameterCardVersionView = z.strictObject({
  id: z.number().int(),
  version: z.number().int(),
  state: parameterSetStateSchema,
  stateLabel: z.string(),
  epsilonK: z.number(),
  sigmaAngstrom: z.number(),
  stdErr: standardErrorsView,
  validity: z.strictObject({ temperatureMinK: z.number(), temperatureMaxK: z.number() }),
  kinds: z.array(propertyKindSchema),
  fitId: z.number().int(),
  approvedAt: z.string().nullable(),
  approvedByName: z.string().nullable(),
  change: z.strictObject({ fromVersion: z.number().int(), epsilonK: z.number(), sigmaAngstrom: z.number() }).nullable(),
});

/** GET /api/catalog/:id: the parameter card. */
export const parameterCardView = catalogEntryView.extend({
  molarMassGPerMol: z.number(),
  approvalComment: z.string().nullable(),
  rationale: z.string(),
  fit: parameterSetFitView,
  measurementSets: z.array(parameterSetMeasurementSetView),
  exportable: z.boolean(),
  currentApprovedId: z.number().int().nullable(),
  versions: z.array(parameterCardVersionView),
});
export type ParameterCard = z.infer<typeof parameterCardView>;

/** GET /api/mixtures without a format: components, the pair table (cross pairs estimated or fitted), common validity, cutoff. */
export const mixtureView = z.strictObject({
  rule: z.string(),
  ruleName: z.string(),
  formulas: z.string(),
  reference: z.string(),
  components: z.array(
    z.strictObject({
      index: z.number().int(),
      setId: z.number().int(),
      version: z.number().int(),
      /** approved or superseded: only those are exported. */
      state: z.string(),
      substanceName: z.string(),
      scheme: cutoffSchemeSchema,
      cutoffSigma: z.number().nullable(),
      epsilonK: z.number(),
      sigmaAngstrom: z.number(),
    }),
  ),
  pairs: z.array(
    z.strictObject({
      i: z.number().int(),
      j: z.number().int(),
      setIdI: z.number().int(),
      setIdJ: z.number().int(),
      substanceI: z.string(),
      substanceJ: z.string(),
      epsilonK: z.number(),
      sigmaAngstrom: z.number(),
      kind: z.enum(['pure', 'combining-rule-estimate', 'fitted-pair-set']),
      /** Present on fitted pairs: the approved pair set and its k_ij (l_ij) with standard errors. */
      pairSetId: z.number().int().optional(),
      kij: z.number().optional(),
      kijStdErr: z.number().nullable().optional(),
      lij: z.number().nullable().optional(),
      epsilonStdErrK: z.number().nullable().optional(),
      sigmaStdErrAngstrom: z.number().nullable().optional(),
    }),
  ),
  note: z.string(),
  commonValidity: validityView.nullable(),
  cutoff: z.strictObject({ scheme: cutoffSchemeSchema, cutoffSigma: z.number(), consistent: z.boolean(), warning: z.string().nullable() }),
});
export type MixtureAnswer = z.infer<typeof mixtureView>;

/** GET /api/parameter-sets/:id/predictions: a property at the reader's states with its propagated uncertainty. */
export const predictionView = z.strictObject({
  kind: z.string(),
  unit: z.string(),
  temperatureK: z.number(),
  pressureMPa: z.number().optional(),
  value: z.number(),
  standardError: z.number(),
  lower95: z.number(),
  upper95: z.number(),
  intervalMethod: z.enum(['linearised covariance', 'posterior draws']),
  outsideValidity: z.boolean(),
  note: z.string().optional(),
});
export const predictionsView = z.strictObject({
  parameterSetId: z.number().int(),
  version: z.number().int(),
  substanceName: z.string(),
  potential: potentialSchema,
  repulsiveExponent: z.number(),
  kind: z.string(),
  unit: z.string(),
  method: z.string(),
  predictions: z.array(predictionView),
});
export type PredictionAnswer = z.infer<typeof predictionsView>;
