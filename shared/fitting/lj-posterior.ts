/**
 * Posterior of the Lennard-Jones parameters of a finished fit: likelihood exp(−χ²/2s²) with the fit's own
 * weighted residuals (χ² as in lj-fit.ts, left-out rows excluded), flat priors within the fit's bounds and,
 * optionally, a Gaussian prior per parameter (e.g. a previous approved set), sampled by the ensemble sampler of
 * posterior.ts from the least-squares optimum.
 * s² = 1 when the stated uncertainties are taken as absolute; when the fit scaled its covariance by the reduced χ²
 * (uncertainties taken as relative), s² = χ²_min/ν, so posterior and linearised intervals rest on the same noise.
 * B2 without the quantum term uses the interpolated reduced B2 (virial-interpolant.ts, within 1e-9 of the
 * quadrature); every other model is the fit's own (property-models.ts).
 */
import { b2Interpolated } from '../physics/virial-interpolant';
import { DEFAULT_POSTERIOR_SAMPLES } from './fit-defaults';
import { type FitMeasurementSet, type LjFitOptions, type LjFitResult, type LjParameter } from './lj-fit';
import {
  credibleRegionOutline,
  intervalDisagreement,
  POSTERIOR_SEED,
  sampleEnsemble,
  summarise,
  type EnsembleRun,
  type GaussianPrior,
  type MultivariateGaussianPrior,
  type ParameterSummary,
} from './posterior';
import { PROPERTY_MODELS, type FitKind, type PropertyContext } from './property-models';

export interface LjPosteriorOptions {
  /** Steps per walker kept (default 1000). */
  samples?: number;
  burnIn?: number;
  walkers?: number;
  seed?: number;
  /** 'as-fit' (default): the likelihood uses the same noise as the fit's covariance; 'stated': the uncertainties as given. */
  noise?: 'as-fit' | 'stated';
  /** Gaussian priors, e.g. from a previous approved parameter set. */
  priors?: Partial<Record<LjParameter, GaussianPrior>>;
  /** A correlated Gaussian prior from a previous approved parameter set (its values and covariance). */
  prior?: ParameterSetPrior;
  /** Posterior draws returned for plotting (default 1000). */
  drawsReturned?: number;
}

export interface LjPosterior {
  epsilonK: ParameterSummary;
  sigmaAngstrom: ParameterSummary;
  /** Sample correlation of ε and σ (null when one is held). */
  correlation: number | null;
  /** Thinned posterior draws for plotting. */
  draws: Array<{ epsilonK: number; sigmaAngstrom: number }>;
  /** Outline of the 95 % highest-posterior-density region (empty when one parameter is held). */
  credibleRegion95: Array<{ epsilonK: number; sigmaAngstrom: number }>;
  /** The linearised intervals compared: estimate ± 1.96 standard errors. */
  linearised: Partial<Record<LjParameter, { lower95: number; upper95: number }>>;
  diagnostics: {
    walkers: number;
    steps: number;
    burnIn: number;
    seed: number;
    acceptanceFraction: number;
    autocorrelationTimeSteps: Partial<Record<LjParameter, number>>;
    rHat: Partial<Record<LjParameter, number>>;
    effectiveSamples: number;
    converged: boolean;
  };
  /** How the noise was taken, in words. */
  likelihood: string;
  priors: string;
  /** Plain-words messages: disagreement with the linearised intervals and sampler warnings. */
  messages: string[];
  /** The parameter set whose mean and covariance gave the Gaussian prior, when one did. */
  priorSet?: { parameterSetId: number; label: string | null; epsilonK: number; sigmaAngstrom: number; covariance: number[][] };
}

/**
 * A bivariate Gaussian prior on (ε/k_B, σ) from a previous parameter set: its values as the mean and its covariance
 * (standard errors and correlation). The server resolves it from the set (options.posterior.prior.parameterSetId).
 */
export interface ParameterSetPrior {
  parameterSetId: number;
  /** How the result names the set, e.g. "Argon set v2 (approved)". */
  label?: string;
  epsilonK: number;
  sigmaAngstrom: number;
  /** [[εε, εσ], [σε, σσ]] in K² , K·Å, Å². */
  covariance: number[][];
}

/**
 * The prior of the free parameters: the bivariate Gaussian itself when both are free; with one held, the Gaussian of
 * the other conditioned on the held value (mean μ₂ + C₂₁/C₁₁·(x₁ − μ₁), variance C₂₂ − C₂₁²/C₁₁).
 */
export function priorOnFree(
  prior: ParameterSetPrior | undefined,
  free: readonly LjParameter[],
  held: Record<LjParameter, number>,
): MultivariateGaussianPrior | undefined {
  if (!prior) return undefined;
  const mean = [prior.epsilonK, prior.sigmaAngstrom];
  const c = prior.covariance;
  if (free.length === 2) return { mean, covariance: c.map((row) => [...row]) };
  const k = NAMES.indexOf(free[0]);
  const h = 1 - k;
  const given = held[NAMES[h]];
  return { mean: [mean[k] + (c[k][h] / c[h][h]) * (given - mean[h])], covariance: [[c[k][k] - (c[k][h] * c[k][h]) / c[h][h]]] };
}

/**
 * Where the walkers start: the least-squares estimate, or with a Gaussian prior the mode of likelihood × prior in the
 * linear approximation (precision-weighted mean of the two Gaussians), so a tight prior far from the data's optimum
 * does not leave the ensemble to find it during the burn-in.
 */
export function startingBall(
  estimate: readonly number[],
  covariance: ReadonlyArray<readonly number[]> | null,
  prior: MultivariateGaussianPrior | undefined,
): { initial: number[]; spread: number[] } | null {
  if (!covariance) return null;
  const p = estimate.length;
  const inv = (m: ReadonlyArray<readonly number[]>): number[][] | null => {
    if (p === 1) return m[0][0] > 0 ? [[1 / m[0][0]]] : null;
    const det = m[0][0] * m[1][1] - m[0][1] * m[1][0];
    return det > 0 && m[0][0] > 0
      ? [
          [m[1][1] / det, -m[0][1] / det],
          [-m[1][0] / det, m[0][0] / det],
        ]
      : null;
  };
  const a = inv(covariance);
  if (!a) return null;
  const b = prior ? inv(prior.covariance) : null;
  const sum = a.map((row, i) => row.map((v, j) => v + (b ? b[i][j] : 0)));
  const post = inv(sum);
  if (!post) return null;
  const rhs = estimate.map((_, i) => estimate.reduce((s, x, j) => s + a[i][j] * x + (b && prior ? b[i][j] * prior.mean[j] : 0), 0));
  const initial = post.map((row) => row.reduce((s, v, j) => s + v * rhs[j], 0));
  return { initial, spread: post.map((row, i) => 0.1 * Math.sqrt(row[i])) };
}

/** The words for the priors of the free parameters (flat within the bounds, times the set's Gaussian when given). */
export function priorWords(
  free: readonly LjParameter[],
  bounds: Record<LjParameter, [number, number]>,
  priors?: LjPosteriorOptions['priors'],
  set?: ParameterSetPrior,
): string {
  const words = free.map((n) => {
    const p = priors?.[n];
    const [lo, hi] = bounds[n];
    return p
      ? `${LABELS[n][0]}: Gaussian ${p.mean} ± ${p.standardDeviation} ${LABELS[n][1]} within [${lo}, ${hi}]`
      : `${LABELS[n][0]}: flat on [${lo}, ${hi}] ${LABELS[n][1]}`;
  });
  if (set) {
    const se = [Math.sqrt(set.covariance[0][0]), Math.sqrt(set.covariance[1][1])];
    const r = set.covariance[0][1] / (se[0] * se[1]);
    words.push(
      `times the bivariate Gaussian of ${set.label ?? `parameter set ${set.parameterSetId}`} (ε/k_B = ${set.epsilonK} ± ${se[0].toPrecision(3)} K, σ = ${set.sigmaAngstrom} ± ${se[1].toPrecision(3)} Å, correlation ${r.toFixed(3)})` +
        (free.length === 1 ? `, conditioned on the held ${free[0] === 'epsilonK' ? 'σ' : 'ε/k_B'}` : ''),
    );
  }
  return words.join('; ');
}

/** Summaries, correlation, draws, region and diagnostics of a run over the free parameters, in (ε, σ). */
export function summariseRun(
  run: EnsembleRun,
  free: readonly LjParameter[],
  held: Record<LjParameter, number>,
  drawsWanted: number,
): Pick<LjPosterior, 'epsilonK' | 'sigmaAngstrom' | 'correlation' | 'draws' | 'credibleRegion95' | 'diagnostics'> & {
  samplerWarnings: string[];
} {
  const full = (x: readonly number[]): [number, number] => {
    const values: Record<LjParameter, number> = { ...held };
    free.forEach((n, k) => (values[n] = x[k]));
    return [values.epsilonK, values.sigmaAngstrom];
  };
  const summaries = {} as Record<LjParameter, ParameterSummary>;
  NAMES.forEach((n) => {
    const k = free.indexOf(n);
    if (k < 0) summaries[n] = { median: held[n], lower95: held[n], upper95: held[n], mean: held[n], standardDeviation: 0 };
    else summaries[n] = summarise(run.samples.map((x) => x[k]));
  });
  let correlation: number | null = null;
  if (free.length === 2) {
    const [a, b] = [summaries.epsilonK, summaries.sigmaAngstrom];
    correlation =
      run.samples.reduce((s, x) => s + (x[0] - a.mean) * (x[1] - b.mean), 0) /
      ((run.samples.length - 1) * a.standardDeviation * b.standardDeviation);
  }
  const stride = Math.max(1, Math.floor(run.samples.length / drawsWanted));
  const draws: LjPosterior['draws'] = [];
  for (let i = run.samples.length - 1; i >= 0 && draws.length < drawsWanted; i -= stride) {
    const [e, s] = full(run.samples[i]);
    draws.push({ epsilonK: e, sigmaAngstrom: s });
  }
  const credibleRegion95 =
    free.length === 2 ? credibleRegionOutline(run.samples, run.logPosterior).map(([e, s]) => ({ epsilonK: e, sigmaAngstrom: s })) : [];
  const perParameter = <T>(values: readonly T[]): Partial<Record<LjParameter, T>> => Object.fromEntries(free.map((n, k) => [n, values[k]]));
  return {
    epsilonK: summaries.epsilonK,
    sigmaAngstrom: summaries.sigmaAngstrom,
    correlation,
    draws,
    credibleRegion95,
    diagnostics: {
      walkers: run.walkers,
      steps: run.steps,
      burnIn: run.burnIn,
      seed: run.seed,
      acceptanceFraction: run.acceptanceFraction,
      autocorrelationTimeSteps: perParameter(run.autocorrelationTime),
      rHat: perParameter(run.rHat),
      effectiveSamples: run.effectiveSamples,
      converged: run.converged,
    },
    samplerWarnings: run.warnings.map((w) => w.replace(/parameter (\d)/g, (_, d: string) => LABELS[free[Number(d) - 1]][0])),
  };
}

/** Disagreement notes against the linearised intervals and a note where the posterior reaches a bound of the flat prior. */
export function comparisonMessages(
  summaries: Record<LjParameter, ParameterSummary>,
  free: readonly LjParameter[],
  estimate: Record<LjParameter, number>,
  stdErr: Record<LjParameter, number | null>,
  bounds: Record<LjParameter, [number, number]>,
): { linearised: LjPosterior['linearised']; messages: string[] } {
  const messages: string[] = [];
  const linearised: LjPosterior['linearised'] = {};
  for (const n of free) {
    const se = stdErr[n];
    if (se === null || !(se > 0)) continue;
    linearised[n] = { lower95: estimate[n] - Z_95 * se, upper95: estimate[n] + Z_95 * se };
    const msg = intervalDisagreement(LABELS[n][0], LABELS[n][1], summaries[n], linearised[n]!);
    if (msg) messages.push(msg);
  }
  const hitBound = free.filter((n) => {
    const [lo, hi] = bounds[n];
    const width = summaries[n].upper95 - summaries[n].lower95;
    return summaries[n].lower95 - lo < 0.01 * width || hi - summaries[n].upper95 < 0.01 * width;
  });
  if (hitBound.length)
    messages.push(
      `The posterior of ${hitBound.map((n) => LABELS[n][0]).join(' and ')} reaches the bound of the flat prior: the interval there is set by the bound, not by the data.`,
    );
  return { linearised, messages };
}

const NAMES: readonly LjParameter[] = ['epsilonK', 'sigmaAngstrom'];
const LABELS: Record<LjParameter, [string, string]> = { epsilonK: ['ε/k_B', 'K'], sigmaAngstrom: ['σ', 'Å'] };
/** Two-sided 95 % normal quantile (Abramowitz & Stegun 1964, table 26.1, from memory). */
export const Z_95 = 1.959964;

interface Point {
  kind: FitKind;
  temperatureK: number;
  pressureMPa?: number;
  value: number;
  scale: number;
}

/** One model value at (ε, σ): the interpolated B2 where it applies, the fit's own model otherwise. */
export function modelValue(
  kind: FitKind,
  point: { temperatureK: number; pressureMPa?: number; measured?: number },
  epsilonK: number,
  sigmaAngstrom: number,
  context: PropertyContext,
): number {
  if (kind === 'b2' && !context.quantumCorrection)
    return b2Interpolated(point.temperatureK, epsilonK, sigmaAngstrom, context.repulsiveExponent ?? 12).b2Cm3PerMol;
  return PROPERTY_MODELS[kind].evaluate(point, epsilonK, sigmaAngstrom, context).value;
}

/** χ² of the included rows of the measurement sets at (ε, σ), as lj-fit.ts defines it. */
export function chi2Function(
  measurementSets: readonly FitMeasurementSet[],
  options: Pick<LjFitOptions, 'molarMassGPerMol' | 'quantumCorrection' | 'repulsiveExponent'>,
): (epsilonK: number, sigmaAngstrom: number) => number {
  const context: PropertyContext = {
    molarMassGPerMol: options.molarMassGPerMol,
    quantumCorrection: options.quantumCorrection ?? false,
    ...(options.repulsiveExponent !== undefined && options.repulsiveExponent !== 12
      ? { repulsiveExponent: options.repulsiveExponent }
      : {}),
  };
  const points: Point[] = [];
  for (const d of measurementSets) {
    const excluded = new Set(d.excludeRows ?? []);
    d.rows.forEach((row, i) => {
      if (excluded.has(i + 1)) return;
      points.push({
        kind: d.kind,
        temperatureK: row.temperatureK,
        ...(row.pressureMPa !== undefined ? { pressureMPa: row.pressureMPa } : {}),
        value: row.value,
        scale: (d.weight ?? 1) / row.uncertainty,
      });
    });
  }
  return (epsilonK, sigmaAngstrom) => {
    let chi2 = 0;
    for (const p of points) {
      const r =
        (modelValue(
          p.kind,
          { temperatureK: p.temperatureK, pressureMPa: p.pressureMPa, measured: p.value },
          epsilonK,
          sigmaAngstrom,
          context,
        ) -
          p.value) *
        p.scale;
      chi2 += r * r;
    }
    return chi2;
  };
}

/** Samples the posterior of a succeeded fit (see file header). Throws when the fit did not succeed. */
export function ljPosterior(
  measurementSets: readonly FitMeasurementSet[],
  fitOptions: LjFitOptions,
  fit: LjFitResult,
  options: LjPosteriorOptions = {},
): LjPosterior {
  if (fit.status !== 'succeeded') throw new Error('a posterior needs a succeeded fit to start from');
  const chi2 = chi2Function(measurementSets, fitOptions);
  const noise = options.noise ?? 'as-fit';
  const s2 =
    noise === 'as-fit' && fit.covarianceScaling === 'reduced-chi2' && fit.reducedChi2 !== null && fit.reducedChi2 > 0 ? fit.reducedChi2 : 1;
  const free = NAMES.filter((n) => !fit.heldParameters.includes(n));
  const held: Record<LjParameter, number> = { epsilonK: fit.epsilonK, sigmaAngstrom: fit.sigmaAngstrom };
  const full = (x: readonly number[]): [number, number] => {
    const values: Record<LjParameter, number> = { ...held };
    free.forEach((n, k) => (values[n] = x[k]));
    return [values.epsilonK, values.sigmaAngstrom];
  };
  const multivariatePrior = priorOnFree(options.prior, free, held);
  let initial = free.map((n) => fit[n]);
  let spread = free.map((n) => {
    const se = fit.stdErr[n];
    return se !== null && se > 0 ? 0.1 * se : 1e-4 * fit[n];
  });
  if (multivariatePrior && fit.covariance) {
    const idx = free.map((n) => NAMES.indexOf(n));
    const ball = startingBall(
      initial,
      idx.map((i) => idx.map((j) => fit.covariance![i][j])),
      multivariatePrior,
    );
    if (ball) ({ initial, spread } = ball);
    initial = initial.map((x, k) => Math.min(Math.max(x, fit.bounds[free[k]][0]), fit.bounds[free[k]][1]));
  }
  const run = sampleEnsemble((x) => -chi2(...full(x)) / (2 * s2), {
    bounds: free.map((n) => fit.bounds[n]),
    initial,
    initialSpread: spread,
    gaussianPriors: free.map((n) => options.priors?.[n] ?? null),
    ...(multivariatePrior ? { multivariatePrior } : {}),
    walkers: options.walkers,
    steps: options.samples ?? DEFAULT_POSTERIOR_SAMPLES,
    burnIn: options.burnIn,
    seed: options.seed ?? POSTERIOR_SEED,
  });
  const summary = summariseRun(run, free, held, options.drawsReturned ?? 1000);
  const { samplerWarnings, ...rest } = summary;
  const { linearised, messages } = comparisonMessages(
    { epsilonK: summary.epsilonK, sigmaAngstrom: summary.sigmaAngstrom },
    free,
    held,
    fit.stdErr,
    fit.bounds,
  );
  // Sampler warnings come after the disagreement notes and before the bound note, as they always have.
  const boundNote = messages.length && /reaches the bound/.test(messages[messages.length - 1]) ? messages.pop()! : null;
  messages.push(...samplerWarnings);
  if (boundNote) messages.push(boundNote);
  if (options.prior) messages.push(priorNote(options.prior, linearised));
  return {
    ...rest,
    linearised,
    likelihood:
      s2 === 1
        ? 'exp(−χ²/2) with the stated uncertainties'
        : `exp(−χ²/2s²) with s² = χ²/ν = ${s2.toPrecision(4)} (uncertainties taken as relative, like the fit's covariance)`,
    priors: priorWords(free, fit.bounds, options.priors, options.prior),
    messages,
    ...(options.prior ? { priorSet: priorSetOf(options.prior) } : {}),
  };
}

/** What the result keeps of the set behind the prior. */
export function priorSetOf(prior: ParameterSetPrior): NonNullable<LjPosterior['priorSet']> {
  return {
    parameterSetId: prior.parameterSetId,
    label: prior.label ?? null,
    epsilonK: prior.epsilonK,
    sigmaAngstrom: prior.sigmaAngstrom,
    covariance: prior.covariance.map((r) => [...r]),
  };
}

/** One sentence naming the set behind the prior (the linearised intervals compared are the data's alone). */
export function priorNote(prior: ParameterSetPrior, linearised: LjPosterior['linearised']): string {
  const name = prior.label ?? `parameter set ${prior.parameterSetId}`;
  return `The prior is the bivariate Gaussian of ${name} (set ${prior.parameterSetId}): the posterior combines it with these data${Object.keys(linearised).length ? ', while the linearised intervals compared above are the data’s alone, so a difference there may be the prior’s doing' : ''}.`;
}

/**
 * Posterior-predictive band of one kind at the given states: median and central 95 % of the model over the draws
 * (the model only: the measurement noise of a new point is not added).
 */
export function posteriorPredictiveBand(
  kind: FitKind,
  states: ReadonlyArray<{ temperatureK: number; pressureMPa?: number }>,
  draws: ReadonlyArray<{ epsilonK: number; sigmaAngstrom: number }>,
  context: PropertyContext,
): Array<{ temperatureK: number; pressureMPa?: number; median: number; lower95: number; upper95: number }> {
  return states.map((state) => {
    const values: number[] = [];
    for (const d of draws) {
      try {
        const v = modelValue(kind, state, d.epsilonK, d.sigmaAngstrom, context);
        if (Number.isFinite(v)) values.push(v);
      } catch {
        // a draw where the model cannot be evaluated adds nothing to the band
      }
    }
    const s = summarise(values);
    return { ...state, median: s.median, lower95: s.lower95, upper95: s.upper95 };
  });
}
