/**
 * Contract of a fit's stored result (job.result_json of a `fit` job) and of `result` in the fit view: a declared union
 * of the gas-phase result (shared/fitting/gas-fit.ts: one least-squares fit with posterior, tension, next measurements),
 * the density result through the simulation stage (shared/fitting/md-stage.ts + server/features/fits/density-fit.ts) and
 * a density fit whose starting stage failed (the starting fit with `eosStage`/`startStage` and the reason).
 * The top level of each variant and the blocks the screens read are declared field by field; the sampler's, the tension
 * fit's and the simulation stage's internal blocks (diagnostics, runs, iterations) are loose objects with their read fields.
 */
import { z } from 'zod';
import { FIT_KINDS, type FitKind } from '../fitting/property-models';
import { propertyKindSchema } from '../schemas/measurements';

const idSchema = z.union([z.number(), z.string()]);
/** A residual's kind is one the fit has a property model for (b12 is a mixture's, never fitted). */
const fitKindSchema = z.enum(FIT_KINDS as [FitKind, ...FitKind[]]);
const point = z.strictObject({ epsilonK: z.number(), sigmaAngstrom: z.number() });
const parameterSchema = z.enum(['epsilonK', 'sigmaAngstrom']);

const profileCurve = z.strictObject({
  values: z.array(z.number()),
  deltaChi2: z.array(z.number()),
  lower: z.number().nullable(),
  upper: z.number().nullable(),
  threshold: z.number(),
});

export const fitResidualSchema = z.strictObject({
  measurementSetIndex: z.number().int(),
  measurementSetId: idSchema,
  kind: fitKindSchema,
  rowNumber: z.number().int(),
  excluded: z.boolean(),
  temperatureK: z.number(),
  pressureMPa: z.number().optional(),
  measured: z.number(),
  uncertainty: z.number(),
  predicted: z.number(),
  residual: z.number(),
  relativeDeviationPercent: z.number().nullable(),
});

/** A residual of the simulation stage: the simulation's error, the run behind it and how it was predicted. */
export const mdResidualSchema = fitResidualSchema.extend({
  modelUncertainty: z.number(),
  simulationId: z.number().int().nullable(),
  included: z.boolean(),
  effectiveSamples: z.number().nullable(),
  predictedBy: z.enum(['reweighted', 'run']).nullable(),
});

export const perMeasurementSetSchema = z.strictObject({
  measurementSetId: idSchema,
  kind: fitKindSchema,
  points: z.number().int(),
  excludedPoints: z.number().int(),
  rms: z.number(),
  aadPercent: z.number().nullable(),
  chi2: z.number(),
});

/** Fields every fit result has (shared/fitting/lj-fit.ts LjFitResult). */
const fitResultCore = {
  status: z.enum(['succeeded', 'failed']),
  converged: z.boolean(),
  failureReason: z.string().optional(),
  heldParameters: z.array(parameterSchema),
  strongCorrelation: z.boolean(),
  profiles: z.strictObject({ epsilonK: profileCurve.nullable(), sigmaAngstrom: profileCurve.nullable() }),
  epsilonK: z.number(),
  sigmaAngstrom: z.number(),
  stdErr: z.strictObject({ epsilonK: z.number().nullable(), sigmaAngstrom: z.number().nullable() }),
  correlation: z.number().nullable(),
  chi2: z.number(),
  dof: z.number().int(),
  reducedChi2: z.number().nullable(),
  covariance: z.array(z.array(z.number())).nullable(),
  covarianceUnscaled: z.array(z.array(z.number())).nullable(),
  covarianceScaling: z.enum(['reduced-chi2', 'none']),
  iterations: z.number().int(),
  convergence: z.enum(['parameter-change', 'max-iterations', 'failed']),
  warnings: z.array(z.string()),
  hitBounds: z.array(z.string()),
  start: z.strictObject({ epsilonK: z.number(), sigmaAngstrom: z.number(), method: z.string() }),
  bounds: z.strictObject({ epsilonK: z.tuple([z.number(), z.number()]), sigmaAngstrom: z.tuple([z.number(), z.number()]) }),
  residuals: z.array(fitResidualSchema),
  perMeasurementSet: z.array(perMeasurementSetSchema),
  ellipse95: z.strictObject({ points: z.array(point), method: z.string(), description: z.string() }).nullable(),
  restartsTried: z.number().int(),
  quantumCorrection: z.boolean(),
  model: z.enum(['lj-12-6', 'mie']).optional(),
  repulsiveExponent: z.number().optional(),
  deBoerParameter: z.number().nullable().optional(),
  deBoerParameterStdErr: z.number().nullable().optional(),
};

const interval = z.looseObject({ median: z.number(), lower95: z.number(), upper95: z.number() });

/** The posterior block (shared/fitting/lj-posterior.ts LjPosterior; a density fit's adds `coverage`). */
export const posteriorSchema = z.looseObject({
  epsilonK: interval,
  sigmaAngstrom: interval,
  correlation: z.number().nullable(),
  draws: z.array(point),
  credibleRegion95: z.array(point),
  linearised: z.looseObject({}),
  diagnostics: z.looseObject({}),
  likelihood: z.string(),
  priors: z.string(),
  messages: z.array(z.string()),
  priorSet: z
    .strictObject({
      parameterSetId: z.number().int(),
      label: z.string().nullable(),
      epsilonK: z.number(),
      sigmaAngstrom: z.number(),
      covariance: z.array(z.array(z.number())),
    })
    .optional(),
  coverage: z.looseObject({}).optional(),
});

/** Each kind's region alone and whether the regions overlap (shared/fitting/tension.ts KindTension). */
export const tensionSchema = z.strictObject({
  regions: z.array(
    z.looseObject({
      kind: propertyKindSchema,
      constrainsBoth: z.boolean(),
      reason: z.string().optional(),
      epsilonK: z.number().optional(),
      sigmaAngstrom: z.number().optional(),
      ellipse95: z.array(point).optional(),
    }),
  ),
  pairs: z.array(z.strictObject({ kinds: z.tuple([propertyKindSchema, propertyKindSchema]), overlap: z.boolean() })),
  messages: z.array(z.string()),
});

export const criterionSchema = z.strictObject({
  label: z.string(),
  chi2: z.number(),
  points: z.number().int(),
  parameters: z.number().int(),
  aic: z.number(),
  bic: z.number(),
});

export const repulsiveExponentProfileSchema = z.strictObject({
  values: z.array(z.number()),
  chi2: z.array(z.number()),
  best: z.number(),
  stdErr: z.number().nullable(),
  lower95: z.number().nullable(),
  upper95: z.number().nullable(),
});

/** A gas-phase fit (B2, viscosity, B3, saturation data): one least-squares fit and what is computed around it. */
export const gasPhaseFitResultSchema = z.strictObject({
  ...fitResultCore,
  posterior: posteriorSchema.optional(),
  tension: tensionSchema.optional(),
  nextMeasurements: z.array(z.looseObject({ kind: propertyKindSchema, temperatureK: z.number() })).optional(),
  criterion: criterionSchema.optional(),
  repulsiveExponentFitted: z.literal(true).optional(),
  repulsiveExponentProfile: repulsiveExponentProfileSchema.optional(),
});
export type GasPhaseFitResult = z.infer<typeof gasPhaseFitResultSchema>;

/** What density-fit.ts adds to the stage's result: the starting fit, engine settings, notes, run counts. */
const densityFitExtras = {
  eosStage: gasPhaseFitResultSchema.optional(),
  startStage: gasPhaseFitResultSchema.optional(),
  mdSettings: z.looseObject({}).optional(),
  schemeNote: z.string().optional(),
  notes: z.array(z.string()).optional(),
  mdRunCount: z.number().int().optional(),
  mdRunsReused: z.number().int().optional(),
};

/** A fit with densities through the simulation stage (md-stage.ts MdStageResult + density-fit.ts). */
export const densityFitResultSchema = z.strictObject({
  ...fitResultCore,
  residuals: z.array(mdResidualSchema),
  mdIterations: z.array(z.looseObject({ iteration: z.number().int(), epsilonK: z.number(), sigmaAngstrom: z.number(), chi2: z.number() })),
  mdRuns: z.array(
    z.looseObject({
      id: z.number().int(),
      reused: z.boolean(),
      temperatureK: z.number(),
      pressureMPa: z.number(),
      reducedDensity: z.number(),
    }),
  ),
  mdRounds: z.number().int(),
  stoppedBy: z.enum(['converged', 'round-limit']),
  newRuns: z.number().int(),
  reusedRuns: z.number().int(),
  reweightedPoints: z.number().int(),
  phaseWarnings: z.array(z.string()),
  stoppingRule: z.string(),
  posterior: posteriorSchema.optional(),
  ...densityFitExtras,
});
export type DensityFitResult = z.infer<typeof densityFitResultSchema>;

/** A density fit that stopped before the simulation stage: its starting fit, with the reason in failureReason. */
export const densityStartFailedResultSchema = gasPhaseFitResultSchema.extend(densityFitExtras);

/** job.result_json of a fit, read after readStoredJson (older rows say perMeasurementSet, measurementSetIndex…). */
export const fitResultSchema = z.union([densityFitResultSchema, gasPhaseFitResultSchema, densityStartFailedResultSchema]);
export type FitResult = z.infer<typeof fitResultSchema>;

/** True for a result of the simulation stage (it has runs and rounds). */
export const isDensityFitResult = (r: FitResult): r is DensityFitResult => 'mdRuns' in r;
