/**
 * Lennard-Jones 12-6 parameters (ε/k_B in K, σ in Å) fitted to any mix of property datasets by weighted
 * nonlinear least squares (least-squares.ts): χ² = Σ [w_d (model_i − measured_i)/u_i]², where w_d is the
 * dataset weight. Property models come from the registry in property-models.ts.
 * Starting values are automatic unless given (lj-starting-values.ts); a few seeded, perturbed restarts guard
 * against a local minimum, and the lowest χ² wins.
 */
import { jointConfidenceEllipse } from './ellipse';
import { LeastSquaresInputError, weightedLeastSquares, type Convergence, type CovarianceScaling, type LeastSquaresResult, type WeightedResidualProblem } from './least-squares';
import { estimateLjStart, type LjBounds, type StartPoint } from './lj-starting-values';
import { PROPERTY_MODELS, isFitKind, type FitKind, type PropertyContext } from './property-models';
import { gaussianGenerator, mulberry32 } from './random';

export type { FitKind } from './property-models';
export type { LjBounds } from './lj-starting-values';

export interface FitRow {
  temperatureK: number;
  /** MPa; required for 'density'. */
  pressureMPa?: number;
  /** cm3/mol for 'b2', µPa·s for 'viscosity'. */
  value: number;
  /** Standard uncertainty, same unit as value. */
  uncertainty: number;
}

export interface FitDataset {
  id: string | number;
  version?: number;
  kind: FitKind;
  /** Multiplies 1/u for every row of the dataset (default 1). */
  weight?: number;
  label?: string;
  rows: FitRow[];
}

export interface LjFitOptions {
  /** Needed for viscosity and for the quantum correction to B2. */
  molarMassGPerMol?: number;
  /** First-order Wigner–Kirkwood correction to B2 (needs molarMassGPerMol). */
  quantumCorrection?: boolean;
  start?: { epsilonK: number; sigmaAngstrom: number };
  bounds?: LjBounds;
  /** Extra fits from perturbed starts (default 2). */
  restarts?: number;
  /** Levenberg–Marquardt iterations per fit (default 200). */
  maxIterations?: number;
}

export interface LjResidual {
  /** Position of the dataset in the input array. */
  datasetIndex: number;
  datasetId: string | number;
  kind: FitKind;
  temperatureK: number;
  /** For state points given in T and P (densities). */
  pressureMPa?: number;
  measured: number;
  uncertainty: number;
  predicted: number;
  /** Weighted residual weight·(predicted − measured)/u; χ² is the sum of their squares. */
  residual: number;
  /** 100·(predicted − measured)/measured; null when measured is 0. */
  relativeDeviationPercent: number | null;
}

export interface LjDatasetSummary {
  datasetId: string | number;
  kind: FitKind;
  points: number;
  /** Root-mean-square of predicted − measured, in the dataset's unit. */
  rms: number;
  /** Mean |predicted − measured|/|measured| in percent (points with measured = 0 left out); null if none remain. */
  aadPercent: number | null;
  chi2: number;
}

export interface LjFitResult {
  status: 'succeeded' | 'failed';
  failureReason?: string;
  epsilonK: number;
  sigmaAngstrom: number;
  stdErr: { epsilonK: number | null; sigmaAngstrom: number | null };
  correlation: number | null;
  chi2: number;
  dof: number;
  reducedChi2: number | null;
  /** [[εε, εσ], [σε, σσ]], the covariance the standard errors use (see covarianceScaling). */
  covariance: number[][] | null;
  /** (JᵀWJ)⁻¹ before scaling. */
  covarianceUnscaled: number[][] | null;
  covarianceScaling: CovarianceScaling;
  iterations: number;
  convergence: Convergence;
  warnings: string[];
  hitBounds: string[];
  start: { epsilonK: number; sigmaAngstrom: number; method: string };
  bounds: LjBounds;
  residuals: LjResidual[];
  perDataset: LjDatasetSummary[];
  ellipse95: { points: Array<{ epsilonK: number; sigmaAngstrom: number }>; method: string; description: string } | null;
  restartsTried: number;
  quantumCorrection: boolean;
}

export type LjFitInputErrorCode =
  | 'no-data'
  | 'unknown-kind'
  | 'missing-molar-mass'
  | 'bad-uncertainty'
  | 'bad-value'
  | 'bad-weight'
  | 'too-few-points'
  | 'bad-option';

/** Invalid input to fitLennardJones; `code` names the problem for callers (API error codes, UI messages). */
export class LjFitInputError extends Error {
  constructor(
    readonly code: LjFitInputErrorCode,
    message: string,
  ) {
    super(message);
    this.name = 'LjFitInputError';
  }
}

/** Bounds used when none are given: wide enough for helium (ε/k ≈ 10 K) to large organic molecules. */
export const DEFAULT_LJ_BOUNDS: LjBounds = { epsilonK: [1, 5000], sigmaAngstrom: [1, 15] };
const DEFAULT_RESTARTS = 2;
/** Seed of the restart perturbations: fixed so that a fit is reproducible. */
const RESTART_SEED = 20240611;
const PARAMETER_NAMES = ['epsilonK', 'sigmaAngstrom'] as const;

interface FlatPoint {
  datasetIndex: number;
  datasetId: string | number;
  kind: FitKind;
  temperatureK: number;
  pressureMPa?: number;
  value: number;
  uncertainty: number;
  weight: number;
}

function validate(datasets: readonly FitDataset[], options: LjFitOptions): { points: FlatPoint[]; bounds: LjBounds; context: PropertyContext } {
  if (!datasets || datasets.length === 0) throw new LjFitInputError('no-data', 'no datasets to fit');
  const points: FlatPoint[] = [];
  datasets.forEach((dataset, datasetIndex) => {
    const name = `dataset ${String(dataset.id)}`;
    if (!isFitKind(dataset.kind)) {
      throw new LjFitInputError('unknown-kind', `${name}: unknown kind "${String(dataset.kind)}"; expected one of ${Object.keys(PROPERTY_MODELS).join(', ')}`);
    }
    const model = PROPERTY_MODELS[dataset.kind];
    if (model.needsMolarMass && options.molarMassGPerMol === undefined) {
      throw new LjFitInputError('missing-molar-mass', `${name}: fitting the ${model.label} needs the molar mass (molarMassGPerMol)`);
    }
    const weight = dataset.weight ?? 1;
    if (!(weight > 0) || !Number.isFinite(weight)) throw new LjFitInputError('bad-weight', `${name}: weight must be a positive finite number, got ${weight}`);
    dataset.rows.forEach((row, i) => {
      if (!(row.temperatureK > 0) || !Number.isFinite(row.temperatureK)) {
        throw new LjFitInputError('bad-value', `${name}, row ${i + 1}: temperatureK must be a positive finite number, got ${row.temperatureK}`);
      }
      if (!Number.isFinite(row.value)) throw new LjFitInputError('bad-value', `${name}, row ${i + 1}: value must be a finite number, got ${row.value}`);
      if (!(row.uncertainty > 0) || !Number.isFinite(row.uncertainty)) {
        throw new LjFitInputError('bad-uncertainty', `${name}, row ${i + 1}: uncertainty must be a positive finite number, got ${row.uncertainty}`);
      }
      if (model.needsPressure && !(Number(row.pressureMPa) > 0)) {
        throw new LjFitInputError('bad-value', `${name}, row ${i + 1}: the ${model.label} needs a positive pressureMPa, got ${row.pressureMPa}`);
      }
      points.push({ datasetIndex, datasetId: dataset.id, kind: dataset.kind, temperatureK: row.temperatureK, ...(row.pressureMPa !== undefined ? { pressureMPa: row.pressureMPa } : {}), value: row.value, uncertainty: row.uncertainty, weight });
    });
  });
  if (points.length < PARAMETER_NAMES.length) {
    throw new LjFitInputError('too-few-points', `too few points: ${points.length} point(s) for 2 parameters (epsilonK, sigmaAngstrom); need at least 2, and at least 3 for standard errors`);
  }
  const molar = options.molarMassGPerMol;
  if (molar !== undefined && (!(molar > 0) || !Number.isFinite(molar))) {
    throw new LjFitInputError('bad-option', `molarMassGPerMol must be a positive finite number, got ${molar}`);
  }
  if (options.quantumCorrection && molar === undefined) {
    throw new LjFitInputError('missing-molar-mass', 'the quantum correction to B2 needs the molar mass (molarMassGPerMol)');
  }
  const bounds = options.bounds ?? DEFAULT_LJ_BOUNDS;
  for (const name of PARAMETER_NAMES) {
    const [lo, hi] = bounds[name];
    if (!(lo > 0) || !(hi > lo) || !Number.isFinite(hi)) throw new LjFitInputError('bad-option', `bounds.${name} must satisfy 0 < lower < upper < ∞, got [${lo}, ${hi}]`);
  }
  if (options.start) {
    for (const name of PARAMETER_NAMES) {
      const v = options.start[name];
      if (!(v > 0) || !Number.isFinite(v)) throw new LjFitInputError('bad-option', `start.${name} must be a positive finite number, got ${v}`);
    }
  }
  const restarts = options.restarts ?? DEFAULT_RESTARTS;
  if (!Number.isInteger(restarts) || restarts < 0) throw new LjFitInputError('bad-option', `restarts must be a non-negative integer, got ${restarts}`);
  return { points, bounds, context: { molarMassGPerMol: molar, quantumCorrection: options.quantumCorrection ?? false } };
}

const modelPoint = (p: { temperatureK: number; pressureMPa?: number; value: number }) => ({ temperatureK: p.temperatureK, pressureMPa: p.pressureMPa, measured: p.value });

function problemFor(points: readonly FlatPoint[], context: PropertyContext): WeightedResidualProblem {
  return {
    parameterNames: PARAMETER_NAMES,
    pointCount: points.length,
    evaluate([epsilonK, sigmaAngstrom]) {
      const residuals = new Array<number>(points.length);
      const jacobian: number[][] = [];
      points.forEach((point, i) => {
        const prediction = PROPERTY_MODELS[point.kind].evaluate(modelPoint(point), epsilonK, sigmaAngstrom, context);
        const scale = point.weight / point.uncertainty;
        residuals[i] = (prediction.value - point.value) * scale;
        jacobian.push([prediction.dEpsilonK * scale, prediction.dSigmaAngstrom * scale]);
      });
      return { residuals, jacobian };
    },
  };
}

/** Fits (ε/k_B, σ) to the datasets. Throws LjFitInputError on invalid input; fit trouble is reported in the result. */
export function fitLennardJones(
  datasets: FitDataset[],
  options: LjFitOptions,
  onProgress?: (progress: { fraction: number; stage: string }) => void,
): LjFitResult {
  const report = (fraction: number, stage: string) => onProgress?.({ fraction, stage });
  report(0, 'validating input');
  const { points, bounds, context } = validate(datasets, options);
  const restarts = options.restarts ?? DEFAULT_RESTARTS;
  const warnings: string[] = [];

  report(0.05, 'estimating starting values');
  let start: { epsilonK: number; sigmaAngstrom: number; method: string };
  if (options.start) {
    start = { ...options.start, method: 'given' };
  } else {
    const startPoints: StartPoint[] = points.map((p) => ({ kind: p.kind, temperatureK: p.temperatureK, pressureMPa: p.pressureMPa, value: p.value, uncertainty: p.uncertainty / p.weight }));
    const estimate = estimateLjStart(startPoints, context, bounds);
    if (estimate) {
      start = { epsilonK: estimate.epsilonK, sigmaAngstrom: estimate.sigmaAngstrom, method: estimate.method };
    } else {
      start = { epsilonK: Math.sqrt(bounds.epsilonK[0] * bounds.epsilonK[1]), sigmaAngstrom: Math.sqrt(bounds.sigmaAngstrom[0] * bounds.sigmaAngstrom[1]), method: 'geometric middle of the bounds (no automatic estimate was possible)' };
      warnings.push('no automatic starting values could be found; started from the middle of the bounds');
    }
  }

  const problem = problemFor(points, context);
  const lowerBounds = [bounds.epsilonK[0], bounds.sigmaAngstrom[0]];
  const upperBounds = [bounds.epsilonK[1], bounds.sigmaAngstrom[1]];
  const starts: number[][] = [[start.epsilonK, start.sigmaAngstrom]];
  const gaussian = gaussianGenerator(mulberry32(RESTART_SEED));
  for (let r = 0; r < restarts; r++) {
    // ±30 % in ε and ±8 % in σ (1 s.d.) spans the spread of plausible minima without leaving the basin of sane values.
    const eps = start.epsilonK * Math.exp(0.3 * gaussian());
    const sigma = start.sigmaAngstrom * Math.exp(0.08 * gaussian());
    starts.push([Math.min(Math.max(eps, lowerBounds[0]), upperBounds[0]), Math.min(Math.max(sigma, lowerBounds[1]), upperBounds[1])]);
  }

  const attempts: LeastSquaresResult[] = [];
  const solveErrors: string[] = [];
  const usable = (f: LeastSquaresResult) => f.convergence !== 'failed' && Number.isFinite(f.chi2);
  let bestIndex = 0;
  starts.forEach((initial, index) => {
    report(0.1 + (0.8 * index) / starts.length, index === 0 ? 'fitting' : `restart ${index} of ${restarts}`);
    let fit: LeastSquaresResult;
    try {
      fit = weightedLeastSquares(problem, { initialParameters: initial, lowerBounds, upperBounds, maxIterations: options.maxIterations ?? 200 });
    } catch (err) {
      if (err instanceof LeastSquaresInputError) throw new LjFitInputError('bad-option', err.message);
      throw err;
    }
    attempts.push(fit);
    const best = attempts[bestIndex];
    // A restart must lower χ² by more than rounding to replace the first fit.
    if (index > 0 && usable(fit) && (!usable(best) || fit.chi2 < best.chi2 * (1 - 1e-12))) bestIndex = index;
    if (!usable(fit)) solveErrors.push(fit.warnings[fit.warnings.length - 1] ?? 'fit failed');
  });
  const fit = attempts[bestIndex];
  if (bestIndex > 0) {
    start = { epsilonK: starts[bestIndex][0], sigmaAngstrom: starts[bestIndex][1], method: `restart ${bestIndex} (perturbed from: ${start.method})` };
  }

  report(0.92, 'summarising');
  const [epsilonK, sigmaAngstrom] = fit.parameters;
  const residuals: LjResidual[] = [];
  if (fit.convergence !== 'failed') {
    points.forEach((point, i) => {
      const predicted = PROPERTY_MODELS[point.kind].evaluate(modelPoint(point), epsilonK, sigmaAngstrom, context).value;
      residuals.push({
        datasetIndex: point.datasetIndex,
        datasetId: point.datasetId,
        kind: point.kind,
        temperatureK: point.temperatureK,
        ...(point.pressureMPa !== undefined ? { pressureMPa: point.pressureMPa } : {}),
        measured: point.value,
        uncertainty: point.uncertainty,
        predicted,
        residual: fit.residuals[i],
        relativeDeviationPercent: point.value !== 0 ? (100 * (predicted - point.value)) / point.value : null,
      });
    });
  }
  const perDataset: LjDatasetSummary[] = datasets.map((dataset, datasetIndex) => {
    const mine = residuals.filter((r) => r.datasetIndex === datasetIndex);
    const relative = mine.filter((r) => r.relativeDeviationPercent !== null);
    return {
      datasetId: dataset.id,
      kind: dataset.kind,
      points: dataset.rows.length,
      rms: mine.length ? Math.sqrt(mine.reduce((s, r) => s + (r.predicted - r.measured) ** 2, 0) / mine.length) : NaN,
      aadPercent: relative.length ? relative.reduce((s, r) => s + Math.abs(r.relativeDeviationPercent as number), 0) / relative.length : null,
      chi2: mine.reduce((s, r) => s + r.residual * r.residual, 0),
    };
  });

  let ellipse95: LjFitResult['ellipse95'] = null;
  if (fit.covariance && !(fit.covariance[0][0] > 0 && fit.covariance[1][1] > 0)) {
    warnings.push('χ² is zero to rounding: the data lie exactly on the model, so the scaled covariance and the confidence ellipse collapse to a point');
  } else if (fit.covariance && fit.convergence !== 'failed' && fit.dof > 0) {
    const ellipse = jointConfidenceEllipse([epsilonK, sigmaAngstrom], fit.covariance, fit.covarianceScaling, points.length);
    ellipse95 = {
      points: ellipse.points.map(([e, s]) => ({ epsilonK: e, sigmaAngstrom: s })),
      method: ellipse.method,
      description: ellipse.description,
    };
  }

  const failed = fit.convergence === 'failed' || fit.convergence === 'max-iterations';
  const failureReason = failed
    ? fit.convergence === 'max-iterations'
      ? `the fit did not converge within ${options.maxIterations ?? 200} iterations from any of ${starts.length} start(s)`
      : `the fit failed from all ${starts.length} start(s): ${[...new Set(solveErrors)].join('; ')}`
    : undefined;
  report(1, 'done');
  return {
    status: failed ? 'failed' : 'succeeded',
    ...(failureReason ? { failureReason } : {}),
    epsilonK,
    sigmaAngstrom,
    stdErr: { epsilonK: fit.standardErrors?.[0] ?? null, sigmaAngstrom: fit.standardErrors?.[1] ?? null },
    correlation: fit.correlation?.[0][1] ?? null,
    chi2: fit.chi2,
    dof: fit.dof,
    reducedChi2: fit.reducedChi2,
    covariance: fit.covariance,
    covarianceUnscaled: fit.covarianceUnscaled,
    covarianceScaling: fit.covarianceScaling,
    iterations: fit.iterations,
    convergence: fit.convergence,
    warnings: [...warnings, ...fit.warnings],
    hitBounds: fit.hitBounds,
    start,
    bounds,
    residuals,
    perDataset,
    ellipse95,
    restartsTried: starts.length - 1,
    quantumCorrection: context.quantumCorrection,
  };
}
