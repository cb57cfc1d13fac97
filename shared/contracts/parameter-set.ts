/**
 * Contract of a parameter set: the answers of /api/parameter-sets (list, detail, draft, moves, comments, diff,
 * manifest, re-run) and /api/review-queue, and its stored JSON column (measurement_sets_json, see measurement-set-ref.ts).
 * Built in server/features/parameter-sets/parameter-sets.view.ts; the row's pressureMinMpa is validity.pressureMinMPa here.
 */
import { z } from 'zod';
import { MOVES, PARAMETER_SET_STATES } from '../parameter-sets/transitions';
import { CUTOFF_SCHEMES } from '../physics/cutoff-schemes';
import { propertyKindSchema } from '../schemas/measurements';

export const parameterSetStateSchema = z.enum(PARAMETER_SET_STATES);
export const cutoffSchemeSchema = z.enum(CUTOFF_SCHEMES);
export const potentialSchema = z.enum(['lj-12-6', 'mie']);

export const standardErrorsView = z.strictObject({ epsilonK: z.number().nullable(), sigmaAngstrom: z.number().nullable() });
export const validityView = z.strictObject({
  temperatureMinK: z.number(),
  temperatureMaxK: z.number(),
  pressureMinMPa: z.number().nullable(),
  pressureMaxMPa: z.number().nullable(),
});

/** The values of a set and what identifies them: the part every view of a set shares (list, catalog, card). */
export const parameterSetValuesView = z.strictObject({
  id: z.number().int(),
  substanceId: z.number().int(),
  substanceName: z.string(),
  version: z.number().int(),
  scheme: cutoffSchemeSchema,
  cutoffSigma: z.number().nullable(),
  model: z.literal('lj-12-6'),
  /** 'lj-12-6' or 'mie', with λr (12 for LJ 12-6) and the label people read ("Mie 16-6"). */
  potential: potentialSchema,
  repulsiveExponent: z.number(),
  potentialLabel: z.string(),
  state: parameterSetStateSchema,
  stateLabel: z.string(),
  epsilonK: z.number(),
  sigmaAngstrom: z.number(),
  stdErr: standardErrorsView,
  correlation: z.number().nullable(),
  validity: validityView,
  fitId: z.number().int(),
});
export type ParameterSetValues = z.infer<typeof parameterSetValuesView>;

/** A parameter set as every list shows it. */
export const parameterSetSummaryView = parameterSetValuesView.extend({
  label: z.string(),
  fitNumber: z.number().int(),
  revisionOf: z.number().int().nullable(),
  revisedBy: z.number().int().nullable(),
  createdBy: z.string(),
  createdByName: z.string(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type ParameterSetSummary = z.infer<typeof parameterSetSummaryView>;
export const parameterSetListView = z.strictObject({ parameterSets: z.array(parameterSetSummaryView) });

export const reviewQueueItemView = parameterSetSummaryView.extend({ submittedAt: z.string().nullable() });
export type ReviewQueueItem = z.infer<typeof reviewQueueItemView>;
export const reviewQueueView = z.strictObject({ parameterSets: z.array(reviewQueueItemView) });

/** The fit behind a set, as its detail page and the parameter card show it. */
export const parameterSetFitView = z.strictObject({
  id: z.number().int(),
  number: z.number().int(),
  createdBy: z.string(),
  createdByName: z.string(),
  createdAt: z.string(),
  codeVersion: z.string(),
  quantumCorrection: z.boolean(),
  molarMassGPerMol: z.number().nullable(),
  chi2: z.number().nullable(),
  dof: z.number().nullable(),
  reducedChi2: z.number().nullable(),
  warnings: z.array(z.string()),
  dataSpan: z.strictObject({ temperatureMinK: z.number(), temperatureMaxK: z.number() }).nullable(),
});

/** A measurement set version behind a set, with its source. */
export const parameterSetMeasurementSetView = z.strictObject({
  measurementSetId: z.number().int(),
  name: z.string(),
  kind: propertyKindSchema,
  version: z.number().int(),
  versionId: z.number().int(),
  weight: z.number(),
  source: z.string().nullable(),
  doi: z.string().nullable(),
  method: z.string().nullable(),
  rowCount: z.number().int().nullable(),
  sha256: z.string().nullable(),
});

export const parameterSetTransitionView = z.strictObject({
  id: z.number().int(),
  move: z.enum([...MOVES, 'create']),
  fromState: parameterSetStateSchema.nullable(),
  toState: parameterSetStateSchema,
  actorId: z.string().nullable(),
  actorName: z.string().nullable(),
  comment: z.string().nullable(),
  at: z.string(),
});

/** A comment (201 of POST /api/parameter-sets/:id/comments, and each entry of the detail's comments). */
export const parameterSetCommentView = z.strictObject({
  id: z.number().int(),
  authorId: z.string(),
  authorName: z.string(),
  body: z.string(),
  createdAt: z.string(),
});
export type ParameterSetComment = z.infer<typeof parameterSetCommentView>;

/** GET /api/parameter-sets/:id, and the answer of every move. */
export const parameterSetDetailView = parameterSetSummaryView.extend({
  rationale: z.string(),
  fit: parameterSetFitView,
  measurementSets: z.array(parameterSetMeasurementSetView),
  history: z.array(parameterSetTransitionView),
  comments: z.array(parameterSetCommentView),
  currentApproved: parameterSetSummaryView.nullable(),
  allowedMoves: z.array(z.enum(MOVES)),
  canComment: z.boolean(),
});
export type ParameterSetDetail = z.infer<typeof parameterSetDetailView>;

/** GET /api/parameter-sets/:id/diff: the changes against the version this set revises. */
export const parameterSetChangeView = z.strictObject({
  field: z.string(),
  label: z.string(),
  before: z.union([z.string(), z.number()]).nullable(),
  after: z.union([z.string(), z.number()]).nullable(),
});
export type ParameterSetChange = z.infer<typeof parameterSetChangeView>;
export const parameterSetDiffView = z.strictObject({
  previous: z.strictObject({ id: z.number().int(), version: z.number().int() }).nullable(),
  changes: z.array(parameterSetChangeView),
});
export type ParameterSetDiff = z.infer<typeof parameterSetDiffView>;

/** GET /api/parameter-sets/:id/manifest. `options` are the fit's stored options as they were sent (fit contract). */
export const parameterSetManifestView = z.strictObject({
  format: z.literal('epsigma.manifest/1'),
  parameterSet: z.strictObject({
    id: z.number().int(),
    version: z.number().int(),
    substanceName: z.string(),
    potential: potentialSchema,
    repulsiveExponent: z.number(),
    epsilonK: z.number(),
    sigmaAngstrom: z.number(),
    scheme: cutoffSchemeSchema,
    cutoffSigma: z.number().nullable(),
  }),
  fit: z.strictObject({
    id: z.number().int(),
    number: z.number().int(),
    model: z.string(),
    createdAt: z.string(),
    codeVersion: z.string(),
    engineVersion: z.string(),
    jobSeed: z.number().nullable(),
  }),
  measurementSets: z.array(
    z.strictObject({
      measurementSetId: z.number().int(),
      version: z.number().int(),
      name: z.string(),
      kind: propertyKindSchema,
      weight: z.number(),
      excludeRows: z.array(z.number().int()),
      rowCount: z.number().int().nullable(),
      sha256: z.string().nullable(),
    }),
  ),
  options: z.record(z.string(), z.unknown()),
  seeds: z.strictObject({ restartPerturbations: z.number(), posterior: z.number().nullable(), simulations: z.number().nullable() }),
  result: z.record(z.string(), z.unknown()).nullable(),
  reproducible: z.string(),
});
export type ParameterSetManifest = z.infer<typeof parameterSetManifestView>;

/** GET /api/parameter-sets/:id/rerun: the fit repeated from the manifest, compared number by number. */
export const parameterSetRerunView = z.strictObject({
  parameterSetId: z.number().int(),
  fitId: z.number().int(),
  codeVersion: z.strictObject({ fit: z.string(), now: z.string() }),
  reproduced: z.boolean(),
  compared: z.array(z.string()),
  differences: z.array(z.strictObject({ field: z.string(), original: z.unknown(), rerun: z.unknown() })),
  rerun: z.record(z.string(), z.unknown()),
});
export type ParameterSetRerun = z.infer<typeof parameterSetRerunView>;
