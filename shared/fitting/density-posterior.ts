/**
 * Posterior of (ε/k_B, σ) for a density fit through the simulation stage (md-stage.ts): the same ensemble sampler as
 * the gas-phase posterior (posterior.ts, Goodman & Weare 2010), with every density prediction of every proposal taken
 * from the stage's reweighting pool (MBAR over the stored NPT runs, ../physics/md/mbar.ts) rather than from new runs.
 *
 * Likelihood: each density point is Gaussian with the variance of the measurement plus that of the reweighted
 * prediction, v_i(θ) = (u_i² + u_MD,i(θ)²)/w_i², exactly the combination the Levenberg–Marquardt steps use; since
 * u_MD depends on θ (it grows as the Kish effective samples fall), the normalisation is kept:
 *   ln L(θ) = −½ Σ_i [(ρ_i(θ) − ρ_i,meas)²/(s² v_i(θ)) + ln v_i(θ)],
 * with s² = χ²/ν when the stage scaled its covariance by the reduced χ² (as the gas-phase posterior does), else 1.
 * Non-simulated kinds in a joint fit add their χ² terms with the models of the gas-phase posterior.
 *
 * Coverage: a proposal whose states no stored run reaches (Kish effective samples below the guard) has no honest
 * prediction. It is refused (zero posterior), counted, and reported. When more than `maxRefusedFraction` of the
 * proposals were refused, a short extra round of runs is made at the states of the refused proposals nearest the
 * posterior's centre (Mahalanobis distance in the sample covariance), one on each side of its long axis, and the
 * sampling is repeated from the same seed; at most `extraRounds` times. What is still refused after that is said in
 * words: the intervals are then those of the posterior restricted to where the runs reach.
 * A proposal that moves an included point into the solid region or into another phase than the sample is also refused
 * (the set of points in the likelihood stays that of the fit) and counted separately.
 */
import {
  comparisonMessages,
  priorNote,
  priorOnFree,
  priorSetOf,
  priorWords,
  startingBall,
  summariseRun,
  type LjPosterior,
  type ParameterSetPrior,
} from './lj-posterior';
import type { LjParameter } from './lj-fit';
import { DEFAULT_POSTERIOR_SAMPLES } from './fit-defaults';
import { POSTERIOR_SEED, sampleEnsembleAsync, type EnsembleRun } from './posterior';

export interface DensityPosteriorOptions {
  /** Steps per walker kept (default 1000). */
  samples?: number;
  burnIn?: number;
  walkers?: number;
  seed?: number;
  /** Bivariate Gaussian prior from a previous parameter set. */
  prior?: ParameterSetPrior;
  /** Posterior draws returned for plotting (default 400). */
  drawsReturned?: number;
  /** Fraction of refused proposals above which an extra round of runs is made (default 0.02). */
  maxRefusedFraction?: number;
  /** At most this many extra rounds of runs for the posterior (default 1; 0: never run more). */
  extraRounds?: number;
  /** Stops the sampling (e.g. the fit was cancelled); the sampler gives the event loop a turn every 20 ms either way. */
  signal?: AbortSignal;
}

/** What one proposal gives: the log likelihood, or why it has none. */
export type ProposalOutcome = { logLikelihood: number } | { refused: 'uncovered' | 'phase' };

export interface DensityPosteriorInput {
  free: readonly LjParameter[];
  /** Values of every parameter at the fit's optimum (the held one stays there). */
  estimate: Record<LjParameter, number>;
  stdErr: Record<LjParameter, number | null>;
  /** Covariance of the free parameters (the fit's, in their order). */
  covariance: number[][] | null;
  bounds: Record<LjParameter, [number, number]>;
  /** s² of the likelihood (see the file header), for the words. */
  noiseScale: number;
  /** The log likelihood at (ε, σ) from the reweighting pool (s² included), or a refusal. */
  evaluate(epsilonK: number, sigmaAngstrom: number): ProposalOutcome;
  /** Runs at the states of the given parameter points, added to the pool; resolves to the number of runs made. */
  extend?(points: Array<{ epsilonK: number; sigmaAngstrom: number }>): Promise<number>;
}

export interface DensityPosterior extends LjPosterior {
  /** How the proposals fared against the reach of the stored runs (the final sampling). */
  coverage: {
    proposals: number;
    /** Proposals refused because a state had too few effective samples (Kish guard). */
    refusedUncovered: number;
    /** Proposals refused because an included point left the fluid or changed phase. */
    refusedPhase: number;
    refusedFraction: number;
    /** Extra rounds of runs made for the posterior, and the runs in them. */
    extraRounds: number;
    extraRuns: number;
    /** Fractions refused by each sampling, first to last. */
    refusedFractionBySampling: number[];
  };
}

/** Refused proposals nearest the centre of the samples (Mahalanobis), at most one on each side of the long axis. */
function extraPoints(run: EnsembleRun, refused: number[][]): number[][] {
  const p = run.samples[0].length;
  const mean = Array.from({ length: p }, (_, k) => run.samples.reduce((s, x) => s + x[k], 0) / run.samples.length);
  const cov = Array.from({ length: p }, (_, a) =>
    Array.from(
      { length: p },
      (_, b) => run.samples.reduce((s, x) => s + (x[a] - mean[a]) * (x[b] - mean[b]), 0) / (run.samples.length - 1),
    ),
  );
  const distance = (x: number[]): number => {
    if (p === 1) return (x[0] - mean[0]) ** 2 / cov[0][0];
    const det = cov[0][0] * cov[1][1] - cov[0][1] ** 2;
    const d = [x[0] - mean[0], x[1] - mean[1]];
    return (cov[1][1] * d[0] * d[0] - 2 * cov[0][1] * d[0] * d[1] + cov[0][0] * d[1] * d[1]) / det;
  };
  // Long axis: the leading eigenvector of the sample covariance (closed form for 2×2), or the one axis.
  let axis = [1];
  if (p === 2) {
    const [a, b, d] = [cov[0][0], cov[0][1], cov[1][1]];
    const lambda = (a + d) / 2 + Math.sqrt(((a - d) / 2) ** 2 + b * b);
    axis = Math.abs(b) > 0 ? [b, lambda - a] : a >= d ? [1, 0] : [0, 1];
    const scale = [Math.sqrt(a), Math.sqrt(d)];
    axis = axis.map((v, k) => v / scale[k]);
  }
  const side = (x: number[]) => Math.sign(x.reduce((s, v, k) => s + ((v - mean[k]) / Math.sqrt(cov[k][k])) * axis[k], 0));
  const best = new Map<number, { x: number[]; d: number }>();
  for (const x of refused) {
    const s = side(x);
    const d = distance(x);
    const current = best.get(s);
    if (!current || d < current.d) best.set(s, { x, d });
  }
  return [...best.values()].map((b) => b.x);
}

/** Samples the posterior of a converged simulation stage (see file header). */
export async function densityPosterior(input: DensityPosteriorInput, options: DensityPosteriorOptions = {}): Promise<DensityPosterior> {
  const { free, estimate } = input;
  const held = { ...estimate };
  const full = (x: readonly number[]): [number, number] => {
    const v: Record<LjParameter, number> = { ...held };
    free.forEach((n, k) => (v[n] = x[k]));
    return [v.epsilonK, v.sigmaAngstrom];
  };
  const multivariatePrior = priorOnFree(options.prior, free, held);
  let initial = free.map((n) => estimate[n]);
  let spread = free.map((n) => {
    const se = input.stdErr[n];
    return se !== null && se > 0 ? 0.1 * se : 1e-4 * estimate[n];
  });
  if (multivariatePrior) {
    const ball = startingBall(initial, input.covariance, multivariatePrior);
    if (ball) ({ initial, spread } = ball);
    initial = initial.map((x, k) => Math.min(Math.max(x, input.bounds[free[k]][0]), input.bounds[free[k]][1]));
  }
  const maxRefused = options.maxRefusedFraction ?? 0.02;
  const extraAllowed = input.extend ? (options.extraRounds ?? 1) : 0;
  const fractions: number[] = [];
  let extraRounds = 0;
  let extraRuns = 0;
  for (;;) {
    let proposals = 0;
    let refusedUncovered = 0;
    let refusedPhase = 0;
    const refused: number[][] = [];
    const run = await sampleEnsembleAsync(
      (x) => {
        proposals++;
        const outcome = input.evaluate(...full(x));
        if ('logLikelihood' in outcome) return outcome.logLikelihood;
        if (outcome.refused === 'uncovered') {
          refusedUncovered++;
          if (refused.length < 20_000) refused.push([...x]);
        } else refusedPhase++;
        return -Infinity;
      },
      {
        bounds: free.map((n) => input.bounds[n]),
        initial,
        initialSpread: spread,
        ...(multivariatePrior ? { multivariatePrior } : {}),
        walkers: options.walkers,
        steps: options.samples ?? DEFAULT_POSTERIOR_SAMPLES,
        burnIn: options.burnIn,
        seed: options.seed ?? POSTERIOR_SEED,
      },
      { signal: options.signal },
    );
    const refusedFraction = proposals ? refusedUncovered / proposals : 0;
    fractions.push(refusedFraction);
    if (refusedFraction > maxRefused && extraRounds < extraAllowed && refused.length) {
      const points = extraPoints(run, refused).map((x) => {
        const [epsilonK, sigmaAngstrom] = full(x);
        return { epsilonK, sigmaAngstrom };
      });
      extraRuns += await input.extend!(points);
      extraRounds++;
      continue;
    }
    const summary = summariseRun(run, free, held, options.drawsReturned ?? 400);
    const { samplerWarnings, ...rest } = summary;
    const { linearised, messages } = comparisonMessages(
      { epsilonK: summary.epsilonK, sigmaAngstrom: summary.sigmaAngstrom },
      free,
      estimate,
      input.stdErr,
      input.bounds,
    );
    const boundNote = messages.length && /reaches the bound/.test(messages[messages.length - 1]) ? messages.pop()! : null;
    messages.push(...samplerWarnings);
    if (boundNote) messages.push(boundNote);
    const percent = (f: number) => `${(100 * f).toFixed(f < 0.01 ? 2 : 1)} %`;
    if (refusedFraction > maxRefused) {
      messages.push(
        `${percent(refusedFraction)} of the sampler's proposals fell where the stored runs do not reach (too few effective samples for reweighting)${extraRounds ? ` even after ${extraRounds} extra round(s) of runs` : ''}: they were refused, so the posterior is restricted to the reach of the runs and its intervals may be too narrow on that side.`,
      );
    }
    if (refusedPhase > 0) {
      messages.push(
        `${percent(refusedPhase / proposals)} of the proposals were refused because a point of the fit would leave the fluid region or change phase there; the posterior is zero at such parameters.`,
      );
    }
    if (options.prior) messages.push(priorNote(options.prior, linearised));
    const likelihoodWords =
      'exp(−½ Σ [r²/(s²v) + ln v]) with v = u² + u_MD², every density predicted by MBAR reweighting of the stored runs (no new run per proposal), u_MD its statistical error' +
      (input.noiseScale === 1
        ? ', s² = 1 (the stated uncertainties)'
        : `, s² = χ²/ν = ${input.noiseScale.toPrecision(4)} (uncertainties taken as relative, like the fit's covariance)`);
    return {
      ...rest,
      linearised,
      likelihood: likelihoodWords,
      priors: priorWords(free, input.bounds, undefined, options.prior),
      messages,
      ...(options.prior ? { priorSet: priorSetOf(options.prior) } : {}),
      coverage: {
        proposals,
        refusedUncovered,
        refusedPhase,
        refusedFraction,
        extraRounds,
        extraRuns,
        refusedFractionBySampling: fractions,
      },
    };
  }
}
