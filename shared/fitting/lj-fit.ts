/**
 * Lennard-Jones 12-6 parameters (ε/k_B in K, σ in Å) fitted to any mix of property measurement sets by weighted
 * nonlinear least squares (least-squares.ts): χ² = Σ [w_d (model_i − measured_i)/u_i]², where w_d is the
 * measurement set weight. Property models come from the registry in property-models.ts.
 * Starting values are automatic unless given (lj-starting-values.ts); a few seeded, perturbed restarts guard
 * against a local minimum, and the lowest χ² wins.
 */
import type { LjEosModelId } from '../physics/eos/lj-eos-models';
import { jointConfidenceEllipse } from './ellipse';
import { DEFAULT_LJ_BOUNDS as FIT_DEFAULT_BOUNDS, DEFAULT_RESTARTS } from './fit-defaults';
import {
  LeastSquaresInputError,
  weightedLeastSquares,
  type Convergence,
  type CovarianceScaling,
  type LeastSquaresResult,
  type WeightedResidualProblem,
} from './least-squares';
import { estimateLjStart, type LjBounds, type StartPoint } from './lj-starting-values';
import { MIE_KINDS_TEXT, PROPERTY_MODELS, isFitKind, type FitKind, type PropertyContext, type PropertyModel } from './property-models';
import { profileChi2, type ProfileCurve } from './profile-chi2';
import { quantumDiagnostics } from './quantum-diagnostics';
import { gaussianGenerator, mulberry32 } from './random';
import { LJ_REPULSIVE_EXPONENT, potentialLabel, requireRepulsiveExponent, type PotentialModel } from '../physics/mie-potential';

export type { FitKind } from './property-models';
export type { LjBounds } from './lj-starting-values';
export type { ProfileCurve } from './profile-chi2';

export interface FitRow {
  temperatureK: number;
  /** MPa; required for 'density'. */
  pressureMPa?: number;
  /** cm3/mol for 'b2', µPa·s for 'viscosity'. */
  value: number;
  /** Standard uncertainty, same unit as value. */
  uncertainty: number;
}

export interface FitMeasurementSet {
  id: string | number;
  version?: number;
  kind: FitKind;
  /** Multiplies 1/u for every row of the measurement set (default 1). */
  weight?: number;
  label?: string;
  rows: FitRow[];
  /** Row numbers (1-based, as the measurement set page shows them) left out of χ²; their predictions are still reported. */
  excludeRows?: number[];
}

export type LjParameter = 'epsilonK' | 'sigmaAngstrom';

export interface LjFitOptions {
  /** Needed for viscosity and for the quantum correction to B2. */
  molarMassGPerMol?: number;
  /** LJ equation of state behind saturation data: 'thol2016' (default), 'jzg1993' or 'kn1994' for comparison. */
  eosModel?: LjEosModelId;
  /** First-order Wigner–Kirkwood correction to B2 (needs molarMassGPerMol). */
  quantumCorrection?: boolean;
  start?: { epsilonK: number; sigmaAngstrom: number };
  bounds?: LjBounds;
  /** Extra fits from perturbed starts (default 2). */
  restarts?: number;
  /** Levenberg–Marquardt iterations per fit (default 200). */
  maxIterations?: number;
  /** Hold one parameter at this value: it is exact in the result, has no standard error and costs no degree of freedom. */
  fixed?: { epsilonK?: number; sigmaAngstrom?: number };
  /** Compute the profile-χ² curves (default true). */
  profiles?: boolean;
  /** λr of a Mie λr-6 potential, held at this value (default 12: the LJ 12-6 potential). Kinds with a Mie model only. */
  repulsiveExponent?: number;
}

export interface LjResidual {
  /** Position of the measurement set in the input array. */
  measurementSetIndex: number;
  measurementSetId: string | number;
  kind: FitKind;
  /** Row number within its measurement set (1-based, as the measurement set page shows it). */
  rowNumber: number;
  /** Left out by the modeller: predicted at the final parameters, never counted in χ², dof or statistics. */
  excluded: boolean;
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

export interface LjMeasurementSetSummary {
  measurementSetId: string | number;
  kind: FitKind;
  /** Points counted in χ² (left-out rows not included). */
  points: number;
  /** Rows left out by the modeller. */
  excludedPoints: number;
  /** Root-mean-square of predicted − measured, in the measurement set's unit. */
  rms: number;
  /** Mean |predicted − measured|/|measured| in percent (points with measured = 0 left out); null if none remain. */
  aadPercent: number | null;
  chi2: number;
}

export interface LjFitResult {
  status: 'succeeded' | 'failed';
  /** False for a failed fit: epsilonK/sigmaAngstrom are then its last iterate, with no standard errors. */
  converged: boolean;
  failureReason?: string;
  /** Parameters held at a given value (exact, no standard error, no degree of freedom). */
  heldParameters: LjParameter[];
  /** |correlation(ε, σ)| > STRONG_CORRELATION: the data constrain a combination of the two (a warning says so). */
  strongCorrelation: boolean;
  /** Profile χ² of each parameter (null when held, not computed, or without standard errors). */
  profiles: { epsilonK: ProfileCurve | null; sigmaAngstrom: ProfileCurve | null };
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
  perMeasurementSet: LjMeasurementSetSummary[];
  ellipse95: { points: Array<{ epsilonK: number; sigmaAngstrom: number }>; method: string; description: string } | null;
  restartsTried: number;
  quantumCorrection: boolean;
  /** 'lj-12-6', or 'mie' when λr ≠ 12. */
  model?: PotentialModel;
  /** λr of the potential fitted (12 for LJ 12-6). */
  repulsiveExponent?: number;
  /** de Boer parameter Λ* = h/(σ√(mε)) of the fitted parameters (null without molar mass or without B2/viscosity data), see quantum-diagnostics.ts. */
  deBoerParameter?: number | null;
  deBoerParameterStdErr?: number | null;
}

export type LjFitInputErrorCode =
  'no-data' | 'unknown-kind' | 'missing-molar-mass' | 'bad-uncertainty' | 'bad-value' | 'bad-weight' | 'too-few-points' | 'bad-option';

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

/** Bounds used when none are given (fit-defaults.ts holds them, with the other defaults the fit form shows). */
export const DEFAULT_LJ_BOUNDS: LjBounds = FIT_DEFAULT_BOUNDS;
/** Seed of the restart perturbations: fixed so that a fit is reproducible. */
export const RESTART_SEED = 20240611;
const PARAMETER_NAMES = ['epsilonK', 'sigmaAngstrom'] as const;
/** |correlation(ε, σ)| above which the result warns that only a combination of the two is determined (common practice, no source). */
export const STRONG_CORRELATION = 0.95;

/** The plain-words warning for a strong ε–σ correlation. */
export function strongCorrelationWarning(correlation: number): string {
  return `ε and σ are strongly correlated (correlation ${correlation.toFixed(3)}): the data pin down a combination of the two rather than each on its own, so a larger ε with a ${correlation > 0 ? 'larger' : 'smaller'} σ fits almost as well. Read the joint 95 % region and the profile-χ² intervals, not the two standard errors alone.`;
}

interface FlatPoint {
  measurementSetIndex: number;
  measurementSetId: string | number;
  kind: FitKind;
  rowNumber: number;
  excluded: boolean;
  temperatureK: number;
  pressureMPa?: number;
  value: number;
  uncertainty: number;
  weight: number;
}

function validate(
  measurementSets: readonly FitMeasurementSet[],
  options: LjFitOptions,
): {
  allPoints: FlatPoint[];
  points: FlatPoint[];
  bounds: LjBounds;
  context: PropertyContext;
  held: Array<{ index: number; value: number }>;
} {
  if (!measurementSets || measurementSets.length === 0) throw new LjFitInputError('no-data', 'no measurement sets to fit');
  const points: FlatPoint[] = [];
  measurementSets.forEach((measurementSet, measurementSetIndex) => {
    // Named as the person sees it when the caller gives a label (the API passes the measurement set's name).
    const name = measurementSet.label ? `measurement set "${measurementSet.label}"` : `measurement set ${String(measurementSet.id)}`;
    if (!isFitKind(measurementSet.kind)) {
      throw new LjFitInputError(
        'unknown-kind',
        `${name}: unknown kind "${String(measurementSet.kind)}"; expected one of ${Object.keys(PROPERTY_MODELS).join(', ')}`,
      );
    }
    const model = PROPERTY_MODELS[measurementSet.kind];
    if (model.needsMolarMass && options.molarMassGPerMol === undefined) {
      throw new LjFitInputError('missing-molar-mass', `${name}: fitting the ${model.label} needs the molar mass (molarMassGPerMol)`);
    }
    const weight = measurementSet.weight ?? 1;
    if (!(weight > 0) || !Number.isFinite(weight))
      throw new LjFitInputError('bad-weight', `${name}: weight must be a positive finite number, got ${weight}`);
    const excludeRows = new Set(measurementSet.excludeRows ?? []);
    for (const r of excludeRows) {
      if (!Number.isInteger(r) || r < 1 || r > measurementSet.rows.length)
        throw new LjFitInputError(
          'bad-value',
          `${name}: row ${r} cannot be left out: the rows are numbered 1 to ${measurementSet.rows.length}`,
        );
    }
    measurementSet.rows.forEach((row, i) => {
      if (!(row.temperatureK > 0) || !Number.isFinite(row.temperatureK)) {
        throw new LjFitInputError(
          'bad-value',
          `${name}, row ${i + 1}: temperatureK must be a positive finite number, got ${row.temperatureK}`,
        );
      }
      if (!Number.isFinite(row.value))
        throw new LjFitInputError('bad-value', `${name}, row ${i + 1}: value must be a finite number, got ${row.value}`);
      if (!(row.uncertainty > 0) || !Number.isFinite(row.uncertainty)) {
        throw new LjFitInputError(
          'bad-uncertainty',
          `${name}, row ${i + 1}: uncertainty must be a positive finite number, got ${row.uncertainty}`,
        );
      }
      if (model.needsPressure && !(Number(row.pressureMPa) > 0)) {
        throw new LjFitInputError(
          'bad-value',
          `${name}, row ${i + 1}: the ${model.label} needs a positive pressureMPa, got ${row.pressureMPa}`,
        );
      }
      points.push({
        measurementSetIndex,
        measurementSetId: measurementSet.id,
        kind: measurementSet.kind,
        rowNumber: i + 1,
        excluded: excludeRows.has(i + 1),
        temperatureK: row.temperatureK,
        ...(row.pressureMPa !== undefined ? { pressureMPa: row.pressureMPa } : {}),
        value: row.value,
        uncertainty: row.uncertainty,
        weight,
      });
    });
  });
  const held: Array<{ index: number; value: number }> = [];
  PARAMETER_NAMES.forEach((name, index) => {
    const value = options.fixed?.[name];
    if (value === undefined) return;
    if (!(value > 0) || !Number.isFinite(value))
      throw new LjFitInputError('bad-option', `fixed.${name} must be a positive finite number, got ${value}`);
    held.push({ index, value });
  });
  if (held.length > 1)
    throw new LjFitInputError('bad-option', 'only one of epsilonK and sigmaAngstrom can be held; with both held there is nothing to fit');
  const included = points.filter((p) => !p.excluded);
  const free = PARAMETER_NAMES.length - held.length;
  if (included.length < Math.max(free, 2)) {
    const left = points.length - included.length;
    throw new LjFitInputError(
      'too-few-points',
      `too few points: ${included.length} point(s)${left ? ` after leaving out ${left}` : ''} for ${free === 2 ? '2 parameters (epsilonK, sigmaAngstrom)' : `1 free parameter (${PARAMETER_NAMES[1 - held[0].index]})`}; need at least ${Math.max(free, 2)}, and at least ${free + 1} for standard errors`,
    );
  }
  const molar = options.molarMassGPerMol;
  if (molar !== undefined && (!(molar > 0) || !Number.isFinite(molar))) {
    throw new LjFitInputError('bad-option', `molarMassGPerMol must be a positive finite number, got ${molar}`);
  }
  if (options.quantumCorrection && molar === undefined) {
    throw new LjFitInputError('missing-molar-mass', 'the quantum correction to B2 needs the molar mass (molarMassGPerMol)');
  }
  const repulsiveExponent = options.repulsiveExponent ?? LJ_REPULSIVE_EXPONENT;
  try {
    requireRepulsiveExponent(repulsiveExponent);
  } catch (err) {
    throw new LjFitInputError('bad-option', (err as Error).message);
  }
  if (repulsiveExponent !== LJ_REPULSIVE_EXPONENT) {
    for (const measurementSet of measurementSets) {
      const model: PropertyModel = PROPERTY_MODELS[measurementSet.kind];
      if (!model.supportsMie)
        throw new LjFitInputError(
          'bad-option',
          `measurement set ${String(measurementSet.id)}: the ${model.label} model is for the LJ 12-6 potential only; a ${potentialLabel(repulsiveExponent)} fit takes ${MIE_KINDS_TEXT} data today`,
        );
    }
  }
  const bounds = options.bounds ?? DEFAULT_LJ_BOUNDS;
  for (const name of PARAMETER_NAMES) {
    const [lo, hi] = bounds[name];
    if (!(lo > 0) || !(hi > lo) || !Number.isFinite(hi))
      throw new LjFitInputError('bad-option', `bounds.${name} must satisfy 0 < lower < upper < ∞, got [${lo}, ${hi}]`);
  }
  if (options.start) {
    for (const name of PARAMETER_NAMES) {
      const v = options.start[name];
      if (!(v > 0) || !Number.isFinite(v))
        throw new LjFitInputError('bad-option', `start.${name} must be a positive finite number, got ${v}`);
    }
  }
  const restarts = options.restarts ?? DEFAULT_RESTARTS;
  if (!Number.isInteger(restarts) || restarts < 0)
    throw new LjFitInputError('bad-option', `restarts must be a non-negative integer, got ${restarts}`);
  return {
    allPoints: points,
    points: included,
    bounds,
    held,
    context: {
      molarMassGPerMol: molar,
      quantumCorrection: options.quantumCorrection ?? false,
      ...(repulsiveExponent !== LJ_REPULSIVE_EXPONENT ? { repulsiveExponent } : {}),
      ...(options.eosModel ? { eosModel: options.eosModel } : {}),
    },
  };
}

const modelPoint = (p: { temperatureK: number; pressureMPa?: number; value: number }) => ({
  temperatureK: p.temperatureK,
  pressureMPa: p.pressureMPa,
  measured: p.value,
});

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

/** The problem in the free parameters only, with the held one at its value (its Jacobian column dropped). */
function holdParameter(problem: WeightedResidualProblem, heldIndex: number, heldValue: number): WeightedResidualProblem {
  const freeIndex = 1 - heldIndex;
  const full = (v: number) => (heldIndex === 0 ? [heldValue, v] : [v, heldValue]);
  return {
    parameterNames: [problem.parameterNames[freeIndex]],
    pointCount: problem.pointCount,
    evaluate([v]) {
      const e = problem.evaluate(full(v));
      return { residuals: e.residuals, jacobian: Array.from(e.jacobian, (row) => [row[freeIndex]]) };
    },
  };
}

const sumSquares = (r: ArrayLike<number>) => {
  let s = 0;
  for (let i = 0; i < r.length; i++) s += r[i] * r[i];
  return s;
};

/** Messages for the points a model cannot predict at (ε, σ), each naming its measurement set and row. */
function rangeProblemsAt(points: readonly FlatPoint[], [epsilonK, sigmaAngstrom]: number[], context: PropertyContext): string[] {
  const out: string[] = [];
  for (const point of points) {
    const model: PropertyModel = PROPERTY_MODELS[point.kind];
    const problem = model.rangeProblem?.(modelPoint(point), epsilonK, sigmaAngstrom, context);
    if (problem) out.push(`measurement set ${String(point.measurementSetId)}, row ${point.rowNumber}: ${problem}`);
  }
  return out;
}

/** Fits (ε/k_B, σ) to the measurement sets. Throws LjFitInputError on invalid input; fit trouble is reported in the result. */
export function fitLennardJones(
  measurementSets: FitMeasurementSet[],
  options: LjFitOptions,
  onProgress?: (progress: { fraction: number; stage: string }) => void,
): LjFitResult {
  const report = (fraction: number, stage: string) => onProgress?.({ fraction, stage });
  report(0, 'validating input');
  const { allPoints, points, bounds, context, held } = validate(measurementSets, options);
  const restarts = options.restarts ?? DEFAULT_RESTARTS;
  const warnings: string[] = [];
  const heldIndex = held.length ? held[0].index : null;
  const freeIndices = PARAMETER_NAMES.map((_, k) => k).filter((k) => k !== heldIndex);

  report(0.05, 'estimating starting values');
  let start: { epsilonK: number; sigmaAngstrom: number; method: string };
  if (options.start) {
    start = { ...options.start, method: 'given' };
  } else {
    const startPoints: StartPoint[] = points.map((p) => ({
      kind: p.kind,
      temperatureK: p.temperatureK,
      pressureMPa: p.pressureMPa,
      value: p.value,
      uncertainty: p.uncertainty / p.weight,
    }));
    const estimate = estimateLjStart(startPoints, context, bounds);
    if (estimate) {
      start = { epsilonK: estimate.epsilonK, sigmaAngstrom: estimate.sigmaAngstrom, method: estimate.method };
    } else {
      start = {
        epsilonK: Math.sqrt(bounds.epsilonK[0] * bounds.epsilonK[1]),
        sigmaAngstrom: Math.sqrt(bounds.sigmaAngstrom[0] * bounds.sigmaAngstrom[1]),
        method: 'geometric middle of the bounds (no automatic estimate was possible)',
      };
      warnings.push('no automatic starting values could be found; started from the middle of the bounds');
    }
  }
  if (heldIndex !== null)
    start = { ...start, [PARAMETER_NAMES[heldIndex]]: held[0].value, method: `${start.method}; ${PARAMETER_NAMES[heldIndex]} held` };

  const fullProblem = problemFor(points, context);
  const problem = heldIndex === null ? fullProblem : holdParameter(fullProblem, heldIndex, held[0].value);
  const boundsOf = (k: number) => bounds[PARAMETER_NAMES[k]];
  const lowerBounds = freeIndices.map((k) => boundsOf(k)[0]);
  const upperBounds = freeIndices.map((k) => boundsOf(k)[1]);
  const startFull = [start.epsilonK, start.sigmaAngstrom];
  const starts: number[][] = [freeIndices.map((k) => startFull[k])];
  const gaussian = gaussianGenerator(mulberry32(RESTART_SEED));
  for (let r = 0; r < restarts; r++) {
    // ±30 % in ε and ±8 % in σ (1 s.d.) spans the spread of plausible minima without leaving the basin of sane values.
    const eps = start.epsilonK * Math.exp(0.3 * gaussian());
    const sigma = start.sigmaAngstrom * Math.exp(0.08 * gaussian());
    const perturbed = [eps, sigma];
    starts.push(freeIndices.map((k, j) => Math.min(Math.max(perturbed[k], lowerBounds[j]), upperBounds[j])));
  }
  /** Free parameters back to (ε, σ). */
  const toFull = (free: readonly number[]): [number, number] => {
    const full = heldIndex === null ? [...free] : heldIndex === 0 ? [held[0].value, free[0]] : [free[0], held[0].value];
    return [full[0], full[1]];
  };

  const attempts: LeastSquaresResult[] = [];
  const solveErrors: string[] = [];
  const usable = (f: LeastSquaresResult) => f.convergence !== 'failed' && Number.isFinite(f.chi2);
  let bestIndex = 0;
  starts.forEach((initial, index) => {
    report(0.1 + (0.7 * index) / starts.length, index === 0 ? 'fitting' : `restart ${index} of ${restarts}`);
    let fit: LeastSquaresResult;
    try {
      fit = weightedLeastSquares(problem, {
        initialParameters: initial,
        lowerBounds,
        upperBounds,
        maxIterations: options.maxIterations ?? 200,
      });
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
    const [e, s] = toFull(starts[bestIndex]);
    start = { epsilonK: e, sigmaAngstrom: s, method: `restart ${bestIndex} (perturbed from: ${start.method})` };
  }
  // Points the model cannot predict at the final parameters (saturation at or above T*c) make the fit fail, naming them.
  const rangeProblems = rangeProblemsAt(
    allPoints.filter((p) => !p.excluded),
    toFull(fit.parameters),
    context,
  );
  const failed = fit.convergence === 'failed' || fit.convergence === 'max-iterations' || rangeProblems.length > 0;

  report(0.8, 'summarising');
  // A failed fit keeps its last iterate, so the per-point misfit is reported for it too (where the model can be evaluated).
  const [epsilonK, sigmaAngstrom] = toFull(fit.parameters);
  const residuals: LjResidual[] = [];
  try {
    allPoints.forEach((point) => {
      const predicted = PROPERTY_MODELS[point.kind].evaluate(modelPoint(point), epsilonK, sigmaAngstrom, context).value;
      residuals.push({
        measurementSetIndex: point.measurementSetIndex,
        measurementSetId: point.measurementSetId,
        kind: point.kind,
        rowNumber: point.rowNumber,
        excluded: point.excluded,
        temperatureK: point.temperatureK,
        ...(point.pressureMPa !== undefined ? { pressureMPa: point.pressureMPa } : {}),
        measured: point.value,
        uncertainty: point.uncertainty,
        predicted,
        residual: (point.weight * (predicted - point.value)) / point.uncertainty,
        relativeDeviationPercent: point.value !== 0 ? (100 * (predicted - point.value)) / point.value : null,
      });
    });
  } catch {
    residuals.length = 0;
    warnings.push('the model cannot be evaluated at the last iterate, so no per-point misfit is given');
  }
  const perMeasurementSet: LjMeasurementSetSummary[] = measurementSets.map((measurementSet, measurementSetIndex) => {
    const mine = residuals.filter((r) => r.measurementSetIndex === measurementSetIndex && !r.excluded);
    const relative = mine.filter((r) => r.relativeDeviationPercent !== null);
    return {
      measurementSetId: measurementSet.id,
      kind: measurementSet.kind,
      points: allPoints.filter((p) => p.measurementSetIndex === measurementSetIndex && !p.excluded).length,
      excludedPoints: allPoints.filter((p) => p.measurementSetIndex === measurementSetIndex && p.excluded).length,
      rms: mine.length ? Math.sqrt(mine.reduce((s, r) => s + (r.predicted - r.measured) ** 2, 0) / mine.length) : NaN,
      aadPercent: relative.length
        ? relative.reduce((s, r) => s + Math.abs(r.relativeDeviationPercent as number), 0) / relative.length
        : null,
      chi2: mine.reduce((s, r) => s + r.residual * r.residual, 0),
    };
  });
  const excludedCount = allPoints.length - points.length;
  if (excludedCount)
    warnings.push(`${excludedCount} point(s) were left out by the modeller: they are shown with their predictions but not counted in χ²`);

  // Covariance, standard errors and correlation in (ε, σ); the held parameter's row and column are zero.
  const embed = (m: number[][] | null): number[][] | null => {
    if (!m) return null;
    if (heldIndex === null) return m;
    const out = [
      [0, 0],
      [0, 0],
    ];
    out[freeIndices[0]][freeIndices[0]] = m[0][0];
    return out;
  };
  const covariance = failed ? null : embed(fit.covariance);
  const stdErr: LjFitResult['stdErr'] = { epsilonK: null, sigmaAngstrom: null };
  if (!failed && fit.standardErrors) freeIndices.forEach((k, j) => (stdErr[PARAMETER_NAMES[k]] = fit.standardErrors![j]));
  const correlation = !failed && heldIndex === null ? (fit.correlation?.[0][1] ?? null) : null;

  let ellipse95: LjFitResult['ellipse95'] = null;
  if (fit.covariance && !fit.covariance.every((row, j) => row[j] > 0)) {
    warnings.push(
      'χ² is zero to rounding: the data lie exactly on the model, so the scaled covariance and the confidence ellipse collapse to a point',
    );
  } else if (fit.covariance && !failed && fit.dof > 0 && heldIndex === null) {
    const ellipse = jointConfidenceEllipse([epsilonK, sigmaAngstrom], fit.covariance, fit.covarianceScaling, points.length);
    ellipse95 = {
      points: ellipse.points.map(([e, s]) => ({ epsilonK: e, sigmaAngstrom: s })),
      method: ellipse.method,
      description: ellipse.description,
    };
  }
  const strongCorrelation = correlation !== null && Math.abs(correlation) > STRONG_CORRELATION;
  if (strongCorrelation) warnings.push(strongCorrelationWarning(correlation));

  // Profile χ²: each free parameter held on a grid, the other (if free) re-optimised at every value.
  const profiles: LjFitResult['profiles'] = { epsilonK: null, sigmaAngstrom: null };
  const threshold = fit.covarianceScaling === 'reduced-chi2' && fit.reducedChi2 !== null ? fit.reducedChi2 : 1;
  if (!failed && (options.profiles ?? true) && fit.standardErrors && threshold > 0) {
    freeIndices.forEach((k, j) => {
      report(0.85 + 0.1 * j, `profile χ² of ${PARAMETER_NAMES[k]}`);
      const other = 1 - k;
      const otherFree = heldIndex === null;
      const otherValue = toFull(fit.parameters)[other];
      const chi2At = (value: number, warm: number[]): { chi2: number; others: number[] } | null => {
        try {
          if (!otherFree)
            return { chi2: sumSquares(fullProblem.evaluate(k === 0 ? [value, otherValue] : [otherValue, value]).residuals), others: [] };
          const sub = weightedLeastSquares(holdParameter(fullProblem, k, value), {
            initialParameters: warm,
            lowerBounds: [boundsOf(other)[0]],
            upperBounds: [boundsOf(other)[1]],
            maxIterations: 100,
            parameterTolerance: 1e-8,
          });
          return Number.isFinite(sub.chi2) && sub.convergence !== 'failed' ? { chi2: sub.chi2, others: sub.parameters } : null;
        } catch {
          return null;
        }
      };
      profiles[PARAMETER_NAMES[k]] = profileChi2({
        best: toFull(fit.parameters)[k],
        standardError: fit.standardErrors![j],
        chi2Min: fit.chi2,
        threshold,
        bounds: boundsOf(k),
        chi2At,
        othersAtBest: otherFree ? [otherValue] : [],
      });
    });
  }

  const failureReason = failed
    ? rangeProblems.length > 0
      ? `the fitted parameters leave ${rangeProblems.length} point(s) outside the model: ${rangeProblems.slice(0, 5).join('; ')}${rangeProblems.length > 5 ? '; …' : ''}`
      : fit.convergence === 'max-iterations'
        ? `the fit did not converge within ${options.maxIterations ?? 200} iterations from any of ${starts.length} start(s)`
        : `the fit failed from all ${starts.length} start(s): ${[...new Set(solveErrors)].join('; ')}`
    : undefined;
  const quantum = quantumDiagnostics(points, { epsilonK, sigmaAngstrom, covariance }, context.molarMassGPerMol, context.quantumCorrection);
  report(1, 'done');
  return {
    status: failed ? 'failed' : 'succeeded',
    converged: !failed,
    ...(failureReason ? { failureReason } : {}),
    heldParameters: heldIndex === null ? [] : [PARAMETER_NAMES[heldIndex]],
    strongCorrelation,
    profiles,
    epsilonK,
    sigmaAngstrom,
    stdErr,
    correlation,
    chi2: fit.chi2,
    dof: fit.dof,
    reducedChi2: fit.reducedChi2,
    covariance,
    covarianceUnscaled: failed ? null : embed(fit.covarianceUnscaled),
    covarianceScaling: fit.covarianceScaling,
    iterations: fit.iterations,
    convergence: fit.convergence,
    warnings: [...warnings, ...fit.warnings, ...quantum.warnings],
    hitBounds: fit.hitBounds,
    start,
    bounds,
    residuals,
    perMeasurementSet,
    ellipse95,
    restartsTried: starts.length - 1,
    quantumCorrection: context.quantumCorrection,
    model: context.repulsiveExponent === undefined ? 'lj-12-6' : 'mie',
    repulsiveExponent: context.repulsiveExponent ?? LJ_REPULSIVE_EXPONENT,
    deBoerParameter: quantum.deBoerParameter,
    deBoerParameterStdErr: quantum.deBoerParameterStdErr,
  };
}
