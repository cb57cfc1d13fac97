/**
 * Bayesian posterior of a few parameters by the affine-invariant ensemble sampler of Goodman & Weare,
 * "Ensemble samplers with affine invariance", Comm. Appl. Math. Comput. Sci. 5, 65 (2010), stretch move
 * (their eq. 7–11, serial update of one walker at a time against the current positions of the others).
 * An affine-invariant move is insensitive to the strong ε–σ correlation that slows a plain Metropolis walk.
 *
 * Diagnostics:
 * - integrated autocorrelation time τ per parameter: the normalised autocorrelation function averaged over
 *   walkers, summed up to Sokal's automatic window M ≥ c·τ(M), c = 5 (Sokal, "Monte Carlo methods in
 *   statistical mechanics", 1997, §3; the estimator recommended for ensemble samplers by Foreman-Mackey et al.,
 *   PASP 125, 306, 2013);
 * - R-hat across walkers (Gelman & Rubin, Stat. Sci. 7, 457, 1992, eq. 3 without the degrees-of-freedom factor).
 *   Walkers of one ensemble are not independent chains, so R-hat is a sanity check, τ the main criterion.
 * Priors: flat within the bounds (zero outside), optionally times an independent Gaussian per parameter and/or a
 * correlated multivariate Gaussian (e.g. the mean and covariance of a previous approved parameter set).
 * Reproducible: the same seed, options and log-likelihood give the same samples to the last digit.
 */
import { gaussianGenerator, mulberry32 } from './random';

/** Seed used when none is given, so that a posterior is reproducible. */
export const POSTERIOR_SEED = 20261202;
/** Goodman & Weare's stretch scale a (their recommended value). */
export const STRETCH_SCALE = 2;
/** Sokal's window constant c. */
const SOKAL_WINDOW = 5;
/** Chains shorter than this many autocorrelation times give unreliable τ (Foreman-Mackey et al. advise ~50). */
export const MIN_CHAIN_OVER_TAU = 50;
/** R-hat above which the walkers have not mixed (Gelman et al., "Bayesian Data Analysis", 3rd ed., 2013, §11.4: 1.1). */
export const MAX_R_HAT = 1.1;

export interface GaussianPrior {
  mean: number;
  standardDeviation: number;
}

/** A correlated Gaussian prior over all sampled parameters: mean and covariance (symmetric positive definite). */
export interface MultivariateGaussianPrior {
  mean: readonly number[];
  covariance: ReadonlyArray<readonly number[]>;
}

export interface EnsembleSamplerOptions {
  /** [lower, upper] per parameter: the flat prior's support. */
  bounds: ReadonlyArray<readonly [number, number]>;
  /** Centre of the starting ball (e.g. the least-squares optimum). */
  initial: readonly number[];
  /** Standard deviation of the starting ball per parameter (e.g. a fraction of the standard errors). */
  initialSpread: readonly number[];
  /** Optional Gaussian prior per parameter (null or missing: flat). */
  gaussianPriors?: ReadonlyArray<GaussianPrior | null>;
  /** Optional correlated Gaussian prior over all parameters (multiplies the others). */
  multivariatePrior?: MultivariateGaussianPrior;
  /** Walkers (even, at least 2·p + 2; default max(16, 4·p)). */
  walkers?: number;
  /** Steps per walker kept after the burn-in (default 1000). */
  steps?: number;
  /** Steps per walker discarded first (default 300). */
  burnIn?: number;
  seed?: number;
}

export interface ParameterSummary {
  median: number;
  lower95: number;
  upper95: number;
  mean: number;
  standardDeviation: number;
}

export interface EnsembleRun {
  /** Kept samples, step-major: samples[s·walkers + w] = parameters of walker w at kept step s. */
  samples: number[][];
  /** Log posterior of each kept sample (same order). */
  logPosterior: number[];
  walkers: number;
  steps: number;
  burnIn: number;
  seed: number;
  acceptanceFraction: number;
  /** Integrated autocorrelation time per parameter, in steps. */
  autocorrelationTime: number[];
  /** Gelman–Rubin R-hat per parameter, walkers taken as chains. */
  rHat: number[];
  /** walkers·steps/τ, the smallest over the parameters. */
  effectiveSamples: number;
  /** True when every R-hat ≤ MAX_R_HAT and steps ≥ MIN_CHAIN_OVER_TAU·τ for every parameter. */
  converged: boolean;
  /** Plain-words reasons when not converged. */
  warnings: string[];
}

export class PosteriorInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PosteriorInputError';
  }
}

function validate(options: EnsembleSamplerOptions): { p: number; walkers: number; steps: number; burnIn: number; seed: number } {
  const p = options.initial.length;
  if (p === 0) throw new PosteriorInputError('at least one parameter is needed');
  if (options.bounds.length !== p || options.initialSpread.length !== p)
    throw new PosteriorInputError(`bounds, initial and initialSpread must all have ${p} entries`);
  options.bounds.forEach(([lo, hi], k) => {
    if (!(hi > lo) || !Number.isFinite(lo) || !Number.isFinite(hi))
      throw new PosteriorInputError(`bounds of parameter ${k + 1} must be finite with lower < upper, got [${lo}, ${hi}]`);
    const x = options.initial[k];
    if (!(x >= lo && x <= hi))
      throw new PosteriorInputError(`the starting value of parameter ${k + 1} (${x}) lies outside its bounds [${lo}, ${hi}]`);
    if (!(options.initialSpread[k] > 0) || !Number.isFinite(options.initialSpread[k]))
      throw new PosteriorInputError(`initialSpread of parameter ${k + 1} must be a positive finite number`);
  });
  options.gaussianPriors?.forEach((prior, k) => {
    if (prior && (!Number.isFinite(prior.mean) || !(prior.standardDeviation > 0) || !Number.isFinite(prior.standardDeviation))) {
      throw new PosteriorInputError(`the Gaussian prior of parameter ${k + 1} needs a finite mean and a positive standard deviation`);
    }
  });
  if (options.multivariatePrior) {
    const { mean, covariance } = options.multivariatePrior;
    if (mean.length !== p || covariance.length !== p || covariance.some((row) => row.length !== p))
      throw new PosteriorInputError(`the multivariate prior needs a mean of ${p} entries and a ${p}×${p} covariance`);
    if (!mean.every(Number.isFinite) || !choleskyLower(covariance))
      throw new PosteriorInputError('the multivariate prior needs a finite mean and a symmetric positive-definite covariance');
  }
  const walkers = options.walkers ?? Math.max(16, 4 * p);
  if (!Number.isInteger(walkers) || walkers < 2 * p + 2 || walkers % 2 !== 0)
    throw new PosteriorInputError(`walkers must be an even integer of at least ${2 * p + 2}, got ${walkers}`);
  const steps = options.steps ?? 1000;
  if (!Number.isInteger(steps) || steps < 10) throw new PosteriorInputError(`steps must be an integer of at least 10, got ${steps}`);
  const burnIn = options.burnIn ?? 300;
  if (!Number.isInteger(burnIn) || burnIn < 0) throw new PosteriorInputError(`burnIn must be a non-negative integer, got ${burnIn}`);
  const seed = options.seed ?? POSTERIOR_SEED;
  if (!Number.isInteger(seed)) throw new PosteriorInputError(`seed must be an integer, got ${seed}`);
  return { p, walkers, steps, burnIn, seed };
}

/** Lower Cholesky factor L (C = L Lᵀ) of a symmetric matrix, or null when it is not positive definite. */
export function choleskyLower(c: ReadonlyArray<readonly number[]>): number[][] | null {
  const n = c.length;
  const l = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      if (!(Math.abs(c[i][j] - c[j][i]) <= 1e-9 * Math.max(Math.abs(c[i][j]), Math.abs(c[j][i]), Number.MIN_VALUE))) return null;
      let sum = c[i][j];
      for (let k = 0; k < j; k++) sum -= l[i][k] * l[j][k];
      if (i === j) {
        if (!(sum > 0) || !Number.isFinite(sum)) return null;
        l[i][i] = Math.sqrt(sum);
      } else l[i][j] = sum / l[j][j];
    }
  }
  return l;
}

/** −½ (x − μ)ᵀ C⁻¹ (x − μ) by forward substitution with the Cholesky factor (no explicit inverse). */
function multivariateGaussianLog(x: readonly number[], prior: MultivariateGaussianPrior, l: number[][]): number {
  const z: number[] = [];
  let q = 0;
  for (let i = 0; i < x.length; i++) {
    let v = x[i] - prior.mean[i];
    for (let k = 0; k < i; k++) v -= l[i][k] * z[k];
    z.push(v / l[i][i]);
    q += z[i] * z[i];
  }
  return -0.5 * q;
}

/** Log prior: flat within the bounds, −∞ outside, plus the Gaussian terms where given. */
export function logPrior(
  parameters: readonly number[],
  bounds: EnsembleSamplerOptions['bounds'],
  gaussianPriors?: EnsembleSamplerOptions['gaussianPriors'],
  multivariatePrior?: MultivariateGaussianPrior,
): number {
  let lp = 0;
  for (let k = 0; k < parameters.length; k++) {
    const [lo, hi] = bounds[k];
    if (!(parameters[k] >= lo && parameters[k] <= hi)) return -Infinity;
    const prior = gaussianPriors?.[k];
    if (prior) lp -= 0.5 * ((parameters[k] - prior.mean) / prior.standardDeviation) ** 2;
  }
  if (multivariatePrior) {
    const l = choleskyLower(multivariatePrior.covariance);
    if (!l) return -Infinity;
    lp += multivariateGaussianLog(parameters, multivariatePrior, l);
  }
  return lp;
}

/**
 * Samples exp(logLikelihood + logPrior) with the stretch move. logLikelihood may return −∞ (or throw) where the
 * model cannot be evaluated; such proposals are rejected.
 */
export function sampleEnsemble(logLikelihood: (parameters: readonly number[]) => number, options: EnsembleSamplerOptions): EnsembleRun {
  const steps = ensembleSteps(logLikelihood, options);
  for (;;) {
    const next = steps.next();
    if (next.done) return next.value;
  }
}

/**
 * The same sampler, giving the event loop a turn every `yieldEveryMs` of work (a fit's orchestration runs on the web
 * process's main thread, and a density posterior takes tens of seconds); the samples are the very same as
 * sampleEnsemble's. Stops with the signal's reason when it is aborted.
 */
export async function sampleEnsembleAsync(
  logLikelihood: (parameters: readonly number[]) => number,
  options: EnsembleSamplerOptions,
  { yieldEveryMs = 20, signal }: { yieldEveryMs?: number; signal?: AbortSignal } = {},
): Promise<EnsembleRun> {
  const steps = ensembleSteps(logLikelihood, options);
  let since = Date.now();
  for (;;) {
    const next = steps.next();
    if (next.done) return next.value;
    if (Date.now() - since >= yieldEveryMs) {
      await new Promise((resolve) => setTimeout(resolve, 0));
      if (signal?.aborted) throw signal.reason ?? new Error('aborted');
      since = Date.now();
    }
  }
}

/** The sampler itself, pausing (yield) after every step of the ensemble. */
function* ensembleSteps(
  logLikelihood: (parameters: readonly number[]) => number,
  options: EnsembleSamplerOptions,
): Generator<void, EnsembleRun, void> {
  const { p, walkers, steps, burnIn, seed } = validate(options);
  const uniform = mulberry32(seed);
  const gaussian = gaussianGenerator(mulberry32(seed ^ 0x5bd1e995));
  const mvFactor = options.multivariatePrior ? choleskyLower(options.multivariatePrior.covariance)! : null;
  const logPosteriorOf = (x: readonly number[]): number => {
    const prior =
      logPrior(x, options.bounds, options.gaussianPriors) +
      (mvFactor ? multivariateGaussianLog(x, options.multivariatePrior!, mvFactor) : 0);
    if (prior === -Infinity) return -Infinity;
    let like: number;
    try {
      like = logLikelihood(x);
    } catch {
      return -Infinity;
    }
    return Number.isFinite(like) ? like + prior : -Infinity;
  };

  // Start in a small ball around the initial point; redraw a walker until its posterior is finite.
  const positions: number[][] = [];
  const logP: number[] = [];
  for (let w = 0; w < walkers; w++) {
    let x: number[] = [];
    let lp = -Infinity;
    for (let tries = 0; tries < 1000 && lp === -Infinity; tries++) {
      x = options.initial.map((c, k) => {
        const [lo, hi] = options.bounds[k];
        return Math.min(hi, Math.max(lo, c + options.initialSpread[k] * gaussian()));
      });
      lp = logPosteriorOf(x);
    }
    if (lp === -Infinity) throw new PosteriorInputError('the posterior is zero everywhere near the starting point: no walker could start');
    positions.push(x);
    logP.push(lp);
  }

  const a = STRETCH_SCALE;
  const samples: number[][] = [];
  const logPosterior: number[] = [];
  // Per-walker traces of each parameter over the kept steps, for the diagnostics.
  const traces: Float64Array[][] = Array.from({ length: p }, () => Array.from({ length: walkers }, () => new Float64Array(steps)));
  let accepted = 0;
  const total = burnIn + steps;
  for (let step = 0; step < total; step++) {
    for (let w = 0; w < walkers; w++) {
      // Another walker j ≠ w, uniformly.
      let j = Math.floor(uniform() * (walkers - 1));
      if (j >= w) j++;
      // z from g(z) ∝ 1/√z on [1/a, a] (Goodman & Weare eq. 9) by inversion.
      const z = ((a - 1) * uniform() + 1) ** 2 / a;
      const xw = positions[w];
      const xj = positions[j];
      const proposal = xw.map((v, k) => xj[k] + z * (v - xj[k]));
      const lpNew = logPosteriorOf(proposal);
      const logAccept = (p - 1) * Math.log(z) + lpNew - logP[w];
      if (lpNew !== -Infinity && Math.log(uniform()) < logAccept) {
        positions[w] = proposal;
        logP[w] = lpNew;
        if (step >= burnIn) accepted++;
      }
    }
    if (step >= burnIn) {
      const s = step - burnIn;
      for (let w = 0; w < walkers; w++) {
        samples.push([...positions[w]]);
        logPosterior.push(logP[w]);
        for (let k = 0; k < p; k++) traces[k][w][s] = positions[w][k];
      }
    }
    yield;
  }

  const autocorrelationTime = traces.map((walkerTraces) => integratedAutocorrelationTime(walkerTraces));
  const rHat = traces.map((walkerTraces) => gelmanRubin(walkerTraces));
  const effectiveSamples = Math.min(...autocorrelationTime.map((tau) => (walkers * steps) / tau));
  const warnings: string[] = [];
  autocorrelationTime.forEach((tau, k) => {
    if (steps < MIN_CHAIN_OVER_TAU * tau)
      warnings.push(
        `parameter ${k + 1}: the chains are ${(steps / tau).toFixed(0)} autocorrelation times long (τ = ${tau.toFixed(1)} steps), fewer than ${MIN_CHAIN_OVER_TAU}: run more steps before trusting the intervals`,
      );
  });
  rHat.forEach((r, k) => {
    if (!(r <= MAX_R_HAT))
      warnings.push(
        `parameter ${k + 1}: the walkers disagree (R-hat ${r.toFixed(3)} > ${MAX_R_HAT}): they have not mixed; run more steps or a longer burn-in`,
      );
  });
  return {
    samples,
    logPosterior,
    walkers,
    steps,
    burnIn,
    seed,
    acceptanceFraction: accepted / (walkers * steps),
    autocorrelationTime,
    rHat,
    effectiveSamples,
    converged: warnings.length === 0,
    warnings,
  };
}

/**
 * Integrated autocorrelation time of one parameter from several walkers' traces: ρ(t) is the walker-averaged
 * autocovariance at lag t over the lag-0 one, τ(M) = 1 + 2 Σ_{t=1}^{M} ρ(t), and M is the smallest lag with
 * M ≥ 5 τ(M) (Sokal 1997). Returns at least 1.
 */
export function integratedAutocorrelationTime(traces: readonly ArrayLike<number>[]): number {
  const n = traces[0]?.length ?? 0;
  if (n < 2) return 1;
  const centred = traces.map((trace) => {
    let mean = 0;
    for (let i = 0; i < n; i++) mean += trace[i];
    mean /= n;
    const out = new Float64Array(n);
    for (let i = 0; i < n; i++) out[i] = trace[i] - mean;
    return out;
  });
  const autocovariance = (lag: number): number => {
    let sum = 0;
    for (const c of centred) for (let i = 0; i + lag < n; i++) sum += c[i] * c[i + lag];
    return sum / (centred.length * n);
  };
  const c0 = autocovariance(0);
  if (!(c0 > 0)) return 1;
  let tau = 1;
  for (let lag = 1; lag < n; lag++) {
    tau += (2 * autocovariance(lag)) / c0;
    if (lag >= SOKAL_WINDOW * tau) break;
  }
  return Math.max(1, tau);
}

/** Gelman–Rubin potential scale reduction factor √(V̂/W) with V̂ = (n−1)/n·W + B/n, walkers taken as chains. */
export function gelmanRubin(traces: readonly ArrayLike<number>[]): number {
  const m = traces.length;
  const n = traces[0]?.length ?? 0;
  if (m < 2 || n < 2) return NaN;
  const means = traces.map((t) => {
    let s = 0;
    for (let i = 0; i < n; i++) s += t[i];
    return s / n;
  });
  const grand = means.reduce((s, v) => s + v, 0) / m;
  const between = (n / (m - 1)) * means.reduce((s, v) => s + (v - grand) ** 2, 0);
  const within =
    traces.reduce((s, t, c) => {
      let v = 0;
      for (let i = 0; i < n; i++) v += (t[i] - means[c]) ** 2;
      return s + v / (n - 1);
    }, 0) / m;
  if (!(within > 0)) return between > 0 ? Infinity : 1;
  const pooled = ((n - 1) / n) * within + between / n;
  return Math.sqrt(pooled / within);
}

/** Sample quantile with linear interpolation between order statistics (Hyndman & Fan 1996, definition 7). */
export function quantile(sorted: readonly number[], probability: number): number {
  if (sorted.length === 0) return NaN;
  const h = (sorted.length - 1) * probability;
  const lo = Math.floor(h);
  const hi = Math.min(sorted.length - 1, lo + 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

/** Median, central 95 % interval, mean and standard deviation of one parameter's samples. */
export function summarise(values: readonly number[]): ParameterSummary {
  const sorted = [...values].sort((x, y) => x - y);
  const mean = values.reduce((s, v) => s + v, 0) / values.length;
  const variance = values.reduce((s, v) => s + (v - mean) ** 2, 0) / Math.max(1, values.length - 1);
  return {
    median: quantile(sorted, 0.5),
    lower95: quantile(sorted, 0.025),
    upper95: quantile(sorted, 0.975),
    mean,
    standardDeviation: Math.sqrt(variance),
  };
}

/**
 * Where the posterior and the linearised interval disagree, a plain-words sentence; null when they agree.
 * They disagree when either end of the 95 % interval moves by more than `tolerance` (default 10 %) of the
 * linearised half-width, i.e. when the χ² surface is not the parabola the standard error assumes.
 */
export function intervalDisagreement(
  label: string,
  unit: string,
  posterior: Pick<ParameterSummary, 'lower95' | 'upper95' | 'median'>,
  linearised: { lower95: number; upper95: number },
  tolerance = 0.1,
): string | null {
  const half = (linearised.upper95 - linearised.lower95) / 2;
  if (!(half > 0)) return null;
  const lowShift = (posterior.lower95 - linearised.lower95) / half;
  const highShift = (posterior.upper95 - linearised.upper95) / half;
  if (Math.abs(lowShift) <= tolerance && Math.abs(highShift) <= tolerance) return null;
  const fmt = (v: number) => v.toPrecision(5);
  const widthRatio = (posterior.upper95 - posterior.lower95) / (2 * half);
  const below = posterior.median - posterior.lower95;
  const above = posterior.upper95 - posterior.median;
  const shape =
    Math.abs(widthRatio - 1) > tolerance
      ? `the posterior interval is ${widthRatio > 1 ? `${((widthRatio - 1) * 100).toFixed(0)} % wider` : `${((1 - widthRatio) * 100).toFixed(0)} % narrower`} than the standard error suggests`
      : 'the posterior interval is shifted against the linearised one';
  const skew =
    Math.abs(above - below) > tolerance * (above + below)
      ? `; it is lopsided, reaching further toward ${above > below ? 'larger' : 'smaller'} values`
      : '';
  return `${label}: the posterior 95 % interval, ${fmt(posterior.lower95)} to ${fmt(posterior.upper95)} ${unit}, differs from the linearised one, ${fmt(linearised.lower95)} to ${fmt(linearised.upper95)} ${unit}: ${shape}${skew}. The χ² surface is not the parabola the standard error assumes; quote the posterior interval.`;
}

/**
 * Outline of the 95 % highest-posterior-density region of two parameters for drawing: the samples whose log
 * posterior lies above the 5 % quantile, and in each of `sectors` angular sectors around the median (in
 * coordinates scaled by the sample standard deviations) the one farthest out. Star-shaped regions (the usual
 * banana included) are traced faithfully; the outline goes once round.
 */
export function credibleRegionOutline(
  samples: readonly number[][],
  logPosterior: readonly number[],
  a = 0,
  b = 1,
  sectors = 72,
): Array<[number, number]> {
  if (samples.length < 10) return [];
  const sortedLp = [...logPosterior].sort((x, y) => x - y);
  const threshold = quantile(sortedLp, 0.05);
  const sa = summarise(samples.map((s) => s[a]));
  const sb = summarise(samples.map((s) => s[b]));
  const best: Array<{ r: number; point: [number, number] } | null> = new Array(sectors).fill(null);
  samples.forEach((s, i) => {
    if (logPosterior[i] < threshold) return;
    const u = (s[a] - sa.median) / sa.standardDeviation;
    const v = (s[b] - sb.median) / sb.standardDeviation;
    const angle = Math.atan2(v, u) + Math.PI;
    const sector = Math.min(sectors - 1, Math.floor((angle / (2 * Math.PI)) * sectors));
    const r = u * u + v * v;
    if (!best[sector] || r > best[sector]!.r) best[sector] = { r, point: [s[a], s[b]] };
  });
  return best.filter((x): x is { r: number; point: [number, number] } => x !== null).map((x) => x.point);
}
