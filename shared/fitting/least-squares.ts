/**
 * Weighted nonlinear least squares: minimise χ² = Σ r_i², r_i = (model_i − measured_i)/u_i.
 *
 * The step is the Levenberg–Marquardt step of ml-levenberg-marquardt 5.1.0, driven one iteration at a time:
 * - the library sees the weighted residual vector fitted against zeros with its own weights left at 1
 *   (its per-point weights are treated inconsistently between the step and the error measure);
 * - the analytic Jacobian goes in through `jacobianFunction` (the library negates it itself: it expects ∂model/∂p);
 * - parameters are divided by their starting magnitudes, because the library adds the damping λ to the
 *   diagonal of JᵀJ unscaled (Levenberg 1944), which only behaves when all parameters are of order one;
 * - bounds use the library's clamping; the damping schedule (÷9 on success, ×11 on failure, the library's own
 *   factors) and the stopping test on the relative parameter change (Dennis & Schnabel 1983, §7.2) are ours,
 *   since the library's `errorTolerance` is an absolute threshold on χ².
 * Covariance, statistics and warnings follow the fit (see covariance.ts).
 */
import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { correlationFromCovariance, covarianceFromJacobian, standardErrorsFromCovariance } from './covariance';
import { chiSquareTwoSidedPValue } from './statistics';

export interface ResidualEvaluation {
  /** Weighted residuals r_i = (model_i − measured_i)/u_i. */
  residuals: ArrayLike<number>;
  /** J_ik = ∂r_i/∂p_k (n rows × p columns). */
  jacobian: ArrayLike<ArrayLike<number>>;
}

export interface WeightedResidualProblem {
  parameterNames: readonly string[];
  pointCount: number;
  evaluate(parameters: readonly number[]): ResidualEvaluation;
}

export type Convergence = 'parameter-change' | 'max-iterations' | 'failed';
export type CovarianceScaling = 'reduced-chi2' | 'none';

export interface LeastSquaresOptions {
  initialParameters: readonly number[];
  lowerBounds?: readonly number[];
  upperBounds?: readonly number[];
  /** Levenberg–Marquardt iterations at most (default 200). */
  maxIterations?: number;
  /** Stop when every |Δp_k| ≤ tol·(|p_k| + tol·scale_k) (default 1e-10, relative). */
  parameterTolerance?: number;
  /** Starting damping λ, in parameters scaled by their starting magnitudes (default 1e-2, the library's default). */
  initialDamping?: number;
  /** Which covariance the standard errors use (default 'reduced-chi2': the uncertainties are taken as relative). */
  covarianceScaling?: CovarianceScaling;
}

export interface LeastSquaresResult {
  parameterNames: string[];
  parameters: number[];
  /** Covariance the standard errors use (see covarianceScaling); null when singular or undefined. */
  covariance: number[][] | null;
  covarianceScaling: CovarianceScaling;
  /** (JᵀWJ)⁻¹. */
  covarianceUnscaled: number[][] | null;
  /** (JᵀWJ)⁻¹ · χ²/ν. */
  covarianceScaled: number[][] | null;
  standardErrors: number[] | null;
  correlation: number[][] | null;
  chi2: number;
  dof: number;
  reducedChi2: number | null;
  /** Two-sided probability of a χ² this far from ν if the model and uncertainties were right. */
  chi2PValue: number | null;
  /** Weighted residuals at the solution. */
  residuals: number[];
  /** Jacobian of the weighted residuals at the solution (n × p). */
  jacobian: number[][];
  iterations: number;
  convergence: Convergence;
  warnings: string[];
  /** Names of parameters that ended on a bound. */
  hitBounds: string[];
  singularValueRatio: number;
}

/** Error raised for invalid input to the least-squares core; `code` names the problem. */
export class LeastSquaresInputError extends Error {
  constructor(
    readonly code: 'too-few-points' | 'bad-start' | 'bad-bounds' | 'bad-option',
    message: string,
  ) {
    super(message);
    this.name = 'LeastSquaresInputError';
  }
}

/** Two-sided χ² probability below which the reduced χ² is reported as far from 1. */
export const CHI2_WARNING_PROBABILITY = 0.01;

const DAMPING_STEP_DOWN = 9;
const DAMPING_STEP_UP = 11;
const MIN_DAMPING = 1e-15;
const MAX_DAMPING = 1e30;

function sumOfSquares(values: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < values.length; i++) s += values[i] * values[i];
  return s;
}

function allFinite(evaluation: ResidualEvaluation): boolean {
  for (let i = 0; i < evaluation.residuals.length; i++) if (!Number.isFinite(evaluation.residuals[i])) return false;
  for (let i = 0; i < evaluation.jacobian.length; i++) {
    const row = evaluation.jacobian[i];
    for (let k = 0; k < row.length; k++) if (!Number.isFinite(row[k])) return false;
  }
  return true;
}

/** Fits a weighted residual problem; throws LeastSquaresInputError for invalid input, reports fit trouble in the result. */
export function weightedLeastSquares(problem: WeightedResidualProblem, options: LeastSquaresOptions): LeastSquaresResult {
  const names = [...problem.parameterNames];
  const p = names.length;
  const n = problem.pointCount;
  const start = [...options.initialParameters];
  if (p === 0) throw new LeastSquaresInputError('bad-option', 'at least one parameter is needed');
  if (start.length !== p) throw new LeastSquaresInputError('bad-start', `expected ${p} starting values, got ${start.length}`);
  if (!start.every(Number.isFinite))
    throw new LeastSquaresInputError('bad-start', `starting values must be finite numbers, got [${start.join(', ')}]`);
  if (n < p || n < 2) {
    throw new LeastSquaresInputError(
      'too-few-points',
      `too few points: ${n} point(s) for ${p} parameter(s); need at least ${Math.max(p, 2)}`,
    );
  }
  const lower = options.lowerBounds ? [...options.lowerBounds] : new Array<number>(p).fill(-Infinity);
  const upper = options.upperBounds ? [...options.upperBounds] : new Array<number>(p).fill(Infinity);
  if (lower.length !== p || upper.length !== p) throw new LeastSquaresInputError('bad-bounds', `bounds must have ${p} entries each`);
  for (let k = 0; k < p; k++) {
    if (Number.isNaN(lower[k]) || Number.isNaN(upper[k]) || !(lower[k] < upper[k])) {
      throw new LeastSquaresInputError('bad-bounds', `bounds of ${names[k]} must satisfy lower < upper, got [${lower[k]}, ${upper[k]}]`);
    }
  }
  const maxIterations = options.maxIterations ?? 200;
  const tolerance = options.parameterTolerance ?? 1e-10;
  const scaling = options.covarianceScaling ?? 'reduced-chi2';
  if (!(Number.isInteger(maxIterations) && maxIterations >= 1))
    throw new LeastSquaresInputError('bad-option', `maxIterations must be a positive integer, got ${maxIterations}`);
  if (!(tolerance > 0 && tolerance < 1))
    throw new LeastSquaresInputError('bad-option', `parameterTolerance must lie in (0, 1), got ${tolerance}`);
  let damping = options.initialDamping ?? 1e-2;
  if (!(damping > 0)) throw new LeastSquaresInputError('bad-option', `initialDamping must be positive, got ${damping}`);

  const warnings: string[] = [];
  for (let k = 0; k < p; k++) {
    const clamped = Math.min(Math.max(start[k], lower[k]), upper[k]);
    if (clamped !== start[k])
      warnings.push(`starting value of ${names[k]} (${start[k]}) lay outside its bounds and was moved to ${clamped}`);
    start[k] = clamped;
  }

  // Internal coordinates q_k = p_k / scale_k keep the library's unscaled damping meaningful.
  const scale = start.map((v) => (Math.abs(v) > 0 ? Math.abs(v) : 1));
  const toExternal = (q: readonly number[]) => q.map((v, k) => v * scale[k]);
  const lowerQ = lower.map((v, k) => v / scale[k]);
  const upperQ = upper.map((v, k) => v / scale[k]);

  // Small cache: the library evaluates the same point for the error and the step.
  const cache = new Map<string, ResidualEvaluation | null>();
  const evaluateInternal = (q: readonly number[]): ResidualEvaluation | null => {
    const key = q.join(',');
    if (cache.has(key)) return cache.get(key) ?? null;
    let evaluation: ResidualEvaluation | null;
    try {
      evaluation = problem.evaluate(toExternal(q));
    } catch {
      evaluation = null; // a model that cannot be evaluated there counts as an infinitely bad point
    }
    if (evaluation && (evaluation.residuals.length !== n || evaluation.jacobian.length !== n)) {
      throw new Error(
        `the problem returned ${evaluation.residuals.length} residuals and ${evaluation.jacobian.length} Jacobian rows for ${n} points`,
      );
    }
    if (evaluation && !allFinite(evaluation)) evaluation = null;
    if (cache.size > 8) cache.delete(cache.keys().next().value as string);
    cache.set(key, evaluation);
    return evaluation;
  };

  let q = start.map((v, k) => v / scale[k]);
  let current = evaluateInternal(q);
  const failed = (reason: string, iterations: number): LeastSquaresResult => ({
    parameterNames: names,
    parameters: toExternal(q),
    covariance: null,
    covarianceScaling: scaling,
    covarianceUnscaled: null,
    covarianceScaled: null,
    standardErrors: null,
    correlation: null,
    chi2: current ? sumOfSquares(current.residuals) : NaN,
    dof: n - p,
    reducedChi2: null,
    chi2PValue: null,
    residuals: current ? Array.from(current.residuals) : [],
    jacobian: current ? Array.from(current.jacobian, (row) => Array.from(row)) : [],
    iterations,
    convergence: 'failed',
    warnings: [...warnings, reason],
    hitBounds: [],
    singularValueRatio: NaN,
  });
  if (!current) return failed(`the model could not be evaluated at the starting values [${toExternal(q).join(', ')}]`, 0);

  let chi2 = sumOfSquares(current.residuals);
  const xs = Array.from({ length: n }, (_, i) => i);
  const zeros = new Array<number>(n).fill(0);
  let convergence: Convergence = 'max-iterations';
  let iterations: number;
  let lastEvaluated: number[] = q;

  for (iterations = 1; iterations <= maxIterations; iterations++) {
    const outcome = levenbergMarquardt(
      { x: xs, y: zeros },
      (params) => {
        lastEvaluated = params.slice();
        const evaluation = evaluateInternal(params);
        return (i) => (evaluation ? evaluation.residuals[i] : NaN);
      },
      {
        initialValues: q,
        damping,
        maxIterations: 1,
        errorTolerance: 0,
        minValues: lowerQ,
        maxValues: upperQ,
        jacobianFunction: (params) => {
          const evaluation = evaluateInternal(params);
          return (i) => {
            const row = evaluation ? evaluation.jacobian[i] : [];
            return scale.map((s, k) => (evaluation ? row[k] * s : NaN));
          };
        },
      },
    );
    // The library evaluates the trial point last; it returns it only if χ² went down.
    const trial = lastEvaluated;
    const libraryAccepted = outcome.parameterValues.some((v, k) => v !== q[k]);
    // Near the minimum χ² is flat to rounding: a step that leaves χ² equal within a few ulps is also taken,
    // otherwise the Gauss–Newton step to the exact minimiser can be refused on rounding noise.
    const trialEvaluation = libraryAccepted ? null : evaluateInternal(trial);
    const withinRounding = trialEvaluation !== null && sumOfSquares(trialEvaluation.residuals) <= chi2 * (1 + 16 * Number.EPSILON);
    const accepted = libraryAccepted || withinRounding;
    let converged = true;
    for (let k = 0; k < p; k++) {
      if (!(Math.abs(trial[k] - q[k]) <= tolerance * (Math.abs(q[k]) + tolerance))) converged = false;
    }
    if (accepted) {
      q = libraryAccepted ? outcome.parameterValues.slice() : trial.slice();
      current = evaluateInternal(q) as ResidualEvaluation;
      chi2 = sumOfSquares(current.residuals);
      damping = Math.max(damping / DAMPING_STEP_DOWN, MIN_DAMPING);
    } else {
      damping *= DAMPING_STEP_UP;
    }
    if (converged) {
      convergence = 'parameter-change';
      break;
    }
    if (damping > MAX_DAMPING) return failed('the damping grew without bound: no step lowered χ²', iterations);
  }
  if (iterations > maxIterations) {
    iterations = maxIterations;
    warnings.push(`no convergence within ${maxIterations} iterations: the parameters were still changing`);
  }

  const parameters = toExternal(q);
  const residuals = Array.from(current.residuals);
  const jacobian = Array.from(current.jacobian, (row) => Array.from(row));
  const dof = n - p;
  const hitBounds: string[] = [];
  for (let k = 0; k < p; k++) {
    const slack = 1e-9 * scale[k];
    const onLower = Number.isFinite(lower[k]) && parameters[k] - lower[k] <= slack;
    const onUpper = Number.isFinite(upper[k]) && upper[k] - parameters[k] <= slack;
    if (onLower || onUpper) {
      hitBounds.push(names[k]);
      warnings.push(
        `${names[k]} sits on its ${onLower ? 'lower' : 'upper'} bound (${onLower ? lower[k] : upper[k]}): the best fit lies outside the allowed range, and the standard errors ignore the bound`,
      );
    }
  }
  if (dof === 0)
    warnings.push(
      `too few points: ${n} point(s) for ${p} parameter(s) leave no degrees of freedom, so χ²/ν and the scaled covariance are undefined`,
    );

  const cov = covarianceFromJacobian(jacobian, chi2, dof);
  if (cov.singular) {
    warnings.push(
      `singular Jacobian (singular-value ratio ${cov.singularValueRatio.toExponential(2)}): the data do not determine all parameters, so no covariance is given`,
    );
  }
  const covariance = scaling === 'reduced-chi2' ? cov.scaled : cov.unscaled;
  const reducedChi2 = dof > 0 ? chi2 / dof : null;
  const chi2PValue = dof > 0 ? chiSquareTwoSidedPValue(chi2, dof) : null;
  if (reducedChi2 !== null && chi2PValue !== null && chi2PValue < CHI2_WARNING_PROBABILITY) {
    warnings.push(
      `reduced χ² = ${reducedChi2.toPrecision(3)} is far from 1 (two-sided probability ${chi2PValue.toExponential(1)} for ν = ${dof}): the uncertainties are ${reducedChi2 > 1 ? 'underestimated or the model does not describe the data' : 'overestimated'}`,
    );
  }
  return {
    parameterNames: names,
    parameters,
    covariance,
    covarianceScaling: scaling,
    covarianceUnscaled: cov.unscaled,
    covarianceScaled: cov.scaled,
    standardErrors: covariance ? standardErrorsFromCovariance(covariance) : null,
    correlation: covariance ? correlationFromCovariance(covariance) : null,
    chi2,
    dof,
    reducedChi2,
    chi2PValue,
    residuals,
    jacobian,
    iterations,
    convergence,
    warnings,
    hitBounds,
    singularValueRatio: cov.singularValueRatio,
  };
}

export interface CurveData {
  x: readonly number[];
  y: readonly number[];
  /** Standard uncertainty of each y (all positive). */
  uncertainty: readonly number[];
}

/** Model of one point: its value and ∂value/∂p_k. */
export type CurveModel = (x: number, parameters: readonly number[]) => { value: number; gradient: readonly number[] };

/** Builds a weighted residual problem from (x, y, u) data and a model with its analytic gradient. */
export function curveFitProblem(data: CurveData, model: CurveModel, parameterNames: readonly string[]): WeightedResidualProblem {
  const n = data.x.length;
  if (data.y.length !== n || data.uncertainty.length !== n) {
    throw new LeastSquaresInputError(
      'bad-option',
      `x, y and uncertainty must have the same length (got ${n}, ${data.y.length}, ${data.uncertainty.length})`,
    );
  }
  data.uncertainty.forEach((u, i) => {
    if (!(u > 0) || !Number.isFinite(u))
      throw new LeastSquaresInputError('bad-option', `uncertainty of point ${i} must be a positive finite number, got ${u}`);
  });
  return {
    parameterNames,
    pointCount: n,
    evaluate(parameters) {
      const residuals = new Array<number>(n);
      const jacobian: number[][] = [];
      for (let i = 0; i < n; i++) {
        const { value, gradient } = model(data.x[i], parameters);
        residuals[i] = (value - data.y[i]) / data.uncertainty[i];
        jacobian.push(gradient.map((g) => g / data.uncertainty[i]));
      }
      return { residuals, jacobian };
    },
  };
}
