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
import { type FitDataset, type LjFitOptions, type LjFitResult, type LjParameter } from './lj-fit';
import { credibleRegionOutline, intervalDisagreement, POSTERIOR_SEED, sampleEnsemble, summarise, type GaussianPrior, type ParameterSummary } from './posterior';
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
export function modelValue(kind: FitKind, point: { temperatureK: number; pressureMPa?: number; measured?: number }, epsilonK: number, sigmaAngstrom: number, context: PropertyContext): number {
  if (kind === 'b2' && !context.quantumCorrection) return b2Interpolated(point.temperatureK, epsilonK, sigmaAngstrom, context.repulsiveExponent ?? 12).b2Cm3PerMol;
  return PROPERTY_MODELS[kind].evaluate(point, epsilonK, sigmaAngstrom, context).value;
}

/** χ² of the included rows of the datasets at (ε, σ), as lj-fit.ts defines it. */
export function chi2Function(datasets: readonly FitDataset[], options: Pick<LjFitOptions, 'molarMassGPerMol' | 'quantumCorrection' | 'repulsiveExponent'>): (epsilonK: number, sigmaAngstrom: number) => number {
  const context: PropertyContext = { molarMassGPerMol: options.molarMassGPerMol, quantumCorrection: options.quantumCorrection ?? false, ...(options.repulsiveExponent !== undefined && options.repulsiveExponent !== 12 ? { repulsiveExponent: options.repulsiveExponent } : {}) };
  const points: Point[] = [];
  for (const d of datasets) {
    const excluded = new Set(d.excludeRows ?? []);
    d.rows.forEach((row, i) => {
      if (excluded.has(i + 1)) return;
      points.push({ kind: d.kind, temperatureK: row.temperatureK, ...(row.pressureMPa !== undefined ? { pressureMPa: row.pressureMPa } : {}), value: row.value, scale: (d.weight ?? 1) / row.uncertainty });
    });
  }
  return (epsilonK, sigmaAngstrom) => {
    let chi2 = 0;
    for (const p of points) {
      const r = (modelValue(p.kind, { temperatureK: p.temperatureK, pressureMPa: p.pressureMPa, measured: p.value }, epsilonK, sigmaAngstrom, context) - p.value) * p.scale;
      chi2 += r * r;
    }
    return chi2;
  };
}

/** Samples the posterior of a succeeded fit (see file header). Throws when the fit did not succeed. */
export function ljPosterior(datasets: readonly FitDataset[], fitOptions: LjFitOptions, fit: LjFitResult, options: LjPosteriorOptions = {}): LjPosterior {
  if (fit.status !== 'succeeded') throw new Error('a posterior needs a succeeded fit to start from');
  const chi2 = chi2Function(datasets, fitOptions);
  const noise = options.noise ?? 'as-fit';
  const s2 = noise === 'as-fit' && fit.covarianceScaling === 'reduced-chi2' && fit.reducedChi2 !== null && fit.reducedChi2 > 0 ? fit.reducedChi2 : 1;
  const free = NAMES.filter((n) => !fit.heldParameters.includes(n));
  const heldValue = (n: LjParameter) => fit[n];
  const full = (x: readonly number[]): [number, number] => {
    const values: Record<LjParameter, number> = { epsilonK: heldValue('epsilonK'), sigmaAngstrom: heldValue('sigmaAngstrom') };
    free.forEach((n, k) => (values[n] = x[k]));
    return [values.epsilonK, values.sigmaAngstrom];
  };
  const spread = free.map((n) => {
    const se = fit.stdErr[n];
    return se !== null && se > 0 ? 0.1 * se : 1e-4 * fit[n];
  });
  const run = sampleEnsemble((x) => -chi2(...full(x)) / (2 * s2), {
    bounds: free.map((n) => fit.bounds[n]),
    initial: free.map((n) => fit[n]),
    initialSpread: spread,
    gaussianPriors: free.map((n) => options.priors?.[n] ?? null),
    walkers: options.walkers,
    steps: options.samples ?? 1000,
    burnIn: options.burnIn,
    seed: options.seed ?? POSTERIOR_SEED,
  });

  const summaries = {} as Record<LjParameter, ParameterSummary>;
  NAMES.forEach((n) => {
    const k = free.indexOf(n);
    if (k < 0) {
      const v = heldValue(n);
      summaries[n] = { median: v, lower95: v, upper95: v, mean: v, standardDeviation: 0 };
    } else summaries[n] = summarise(run.samples.map((x) => x[k]));
  });
  let correlation: number | null = null;
  if (free.length === 2) {
    const [a, b] = [summaries.epsilonK, summaries.sigmaAngstrom];
    correlation = run.samples.reduce((s, x) => s + (x[0] - a.mean) * (x[1] - b.mean), 0) / ((run.samples.length - 1) * a.standardDeviation * b.standardDeviation);
  }
  const messages: string[] = [];
  const linearised: LjPosterior['linearised'] = {};
  for (const n of free) {
    const se = fit.stdErr[n];
    if (se === null || !(se > 0)) continue;
    linearised[n] = { lower95: fit[n] - Z_95 * se, upper95: fit[n] + Z_95 * se };
    const msg = intervalDisagreement(LABELS[n][0], LABELS[n][1], summaries[n], linearised[n]!);
    if (msg) messages.push(msg);
  }
  run.warnings.forEach((w) => messages.push(w.replace(/parameter (\d)/g, (_, d: string) => LABELS[free[Number(d) - 1]][0])));
  const hitBound = free.filter((n, k) => {
    const [lo, hi] = fit.bounds[n];
    const width = summaries[n].upper95 - summaries[n].lower95;
    return summaries[n].lower95 - lo < 0.01 * width || hi - summaries[n].upper95 < 0.01 * width;
  });
  if (hitBound.length) messages.push(`The posterior of ${hitBound.map((n) => LABELS[n][0]).join(' and ')} reaches the bound of the flat prior: the interval there is set by the bound, not by the data.`);

  const wanted = options.drawsReturned ?? 1000;
  const stride = Math.max(1, Math.floor(run.samples.length / wanted));
  const draws: LjPosterior['draws'] = [];
  for (let i = run.samples.length - 1; i >= 0 && draws.length < wanted; i -= stride) {
    const [e, s] = full(run.samples[i]);
    draws.push({ epsilonK: e, sigmaAngstrom: s });
  }
  const credibleRegion95 = free.length === 2 ? credibleRegionOutline(run.samples, run.logPosterior).map(([e, s]) => ({ epsilonK: e, sigmaAngstrom: s })) : [];
  const perParameter = <T>(values: readonly T[]): Partial<Record<LjParameter, T>> => Object.fromEntries(free.map((n, k) => [n, values[k]]));
  const priorWords = free.map((n) => {
    const p = options.priors?.[n];
    const [lo, hi] = fit.bounds[n];
    return p ? `${LABELS[n][0]}: Gaussian ${p.mean} ± ${p.standardDeviation} ${LABELS[n][1]} within [${lo}, ${hi}]` : `${LABELS[n][0]}: flat on [${lo}, ${hi}] ${LABELS[n][1]}`;
  });
  return {
    epsilonK: summaries.epsilonK,
    sigmaAngstrom: summaries.sigmaAngstrom,
    correlation,
    draws,
    credibleRegion95,
    linearised,
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
    likelihood: s2 === 1 ? 'exp(−χ²/2) with the stated uncertainties' : `exp(−χ²/2s²) with s² = χ²/ν = ${s2.toPrecision(4)} (uncertainties taken as relative, like the fit's covariance)`,
    priors: priorWords.join('; '),
    messages,
  };
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
