/**
 * Mie λr-6 fits with λr fitted as a third parameter, by profiling: χ²_min(λr) = min over (ε, σ) of χ² at fixed λr
 * (lj-fit.ts with the exponent held), minimised over λr ∈ [8, 36] by a grid scan and a golden-section refinement
 * (Kiefer 1953). The interval of λr is where the profile rises by Δχ² = 1 (standard error) and 3.84 (95 %) times s²,
 * s² the reduced χ² when the fit scales its covariance (Press et al., "Numerical Recipes", 3rd ed. 2007, §15.6.5).
 * ε and σ are then reported at the best λr; their standard errors are conditional on it (a warning says so).
 *
 * Model choice between fits of the same data: AIC = χ² + 2k and BIC = χ² + k ln n (−2 ln L up to a constant for
 * Gaussian errors with the stated uncertainties; Akaike 1974, Schwarz 1978).
 */
import { REPULSIVE_EXPONENT_RANGE, potentialLabel } from '../physics/mie-potential';
import { fitLennardJones, type FitMeasurementSet, type LjFitOptions, type LjFitResult } from './lj-fit';

export interface RepulsiveExponentProfile {
  values: number[];
  chi2: number[];
  /** λr at the profile minimum. */
  best: number;
  /** Half-width of the Δχ² = s² interval, mean of both sides (null when a side is not reached). */
  stdErr: number | null;
  /** Δχ² = 3.84·s² interval ends (null when not reached inside 8–36). */
  lower95: number | null;
  upper95: number | null;
}

export interface MieFitResult extends LjFitResult {
  repulsiveExponentFitted: true;
  repulsiveExponentProfile: RepulsiveExponentProfile;
}

const GRID = [8, 9, 10, 11, 12, 13, 14, 15, 16, 17, 18, 20, 22, 24, 27, 30, 33, 36];
const GOLDEN = (Math.sqrt(5) - 1) / 2;

/** Fits (ε, σ, λr): see the file header. Throws LjFitInputError on bad input like fitLennardJones. */
export function fitMieWithExponent(
  measurementSets: FitMeasurementSet[],
  options: LjFitOptions,
  onProgress?: (p: { fraction: number; stage: string }) => void,
): MieFitResult {
  const cache = new Map<number, LjFitResult>();
  let warm = options.start;
  const at = (n: number): LjFitResult => {
    const key = Number(n.toPrecision(12));
    let fit = cache.get(key);
    if (!fit) {
      fit = fitLennardJones(measurementSets, {
        ...options,
        repulsiveExponent: key,
        profiles: false,
        restarts: warm ? 0 : options.restarts,
        ...(warm ? { start: warm } : {}),
      });
      if (fit.status === 'succeeded') warm = { epsilonK: fit.epsilonK, sigmaAngstrom: fit.sigmaAngstrom };
      cache.set(key, fit);
    }
    return fit;
  };
  const chi2 = (n: number) => {
    const f = at(n);
    return f.status === 'succeeded' ? f.chi2 : Infinity;
  };
  // Scan from 12 outwards so every fit starts next to a converged one.
  const order = [...GRID.filter((n) => n >= 12), ...GRID.filter((n) => n < 12).reverse()];
  order.forEach((n, i) => {
    if (n === 11)
      warm =
        cache.get(12)?.status === 'succeeded' ? { epsilonK: cache.get(12)!.epsilonK, sigmaAngstrom: cache.get(12)!.sigmaAngstrom } : warm;
    onProgress?.({ fraction: (0.7 * i) / order.length, stage: `λr = ${n}` });
    chi2(n);
  });
  const values = GRID.map((n) => chi2(n));
  const k = values.indexOf(Math.min(...values));
  if (!Number.isFinite(values[k])) {
    const failed = at(12);
    return {
      ...failed,
      status: 'failed',
      converged: false,
      failureReason: `no λr from 8 to 36 gave a converged fit: ${failed.failureReason ?? 'fit failed'}`,
      repulsiveExponentFitted: true,
      repulsiveExponentProfile: { values: GRID, chi2: values, best: 12, stdErr: null, lower95: null, upper95: null },
    };
  }
  // Golden-section search on the bracket around the best grid point.
  let a = GRID[Math.max(0, k - 1)];
  let b = GRID[Math.min(GRID.length - 1, k + 1)];
  let c = b - GOLDEN * (b - a);
  let d = a + GOLDEN * (b - a);
  for (let i = 0; i < 25 && b - a > 1e-3; i++) {
    if (chi2(c) < chi2(d)) b = d;
    else a = c;
    c = b - GOLDEN * (b - a);
    d = a + GOLDEN * (b - a);
  }
  let best = (a + b) / 2;
  if (chi2(GRID[k]) < chi2(best)) best = GRID[k];
  onProgress?.({ fraction: 0.8, stage: `final fit at λr = ${best.toFixed(3)}` });
  const final = fitLennardJones(measurementSets, {
    ...options,
    repulsiveExponent: Number(best.toPrecision(12)),
    ...(warm ? { start: warm } : {}),
  });
  const s2 = final.covarianceScaling === 'reduced-chi2' && final.reducedChi2 !== null && final.reducedChi2 > 0 ? final.reducedChi2 : 1;
  const chiMin = final.chi2;
  // Where the profile crosses chiMin + level, by bisection between the best λr and each end of the range.
  const crossing = (level: number, toward: number): number | null => {
    if (chi2(toward) - chiMin < level) return null;
    let lo = best;
    let hi = toward;
    for (let i = 0; i < 30 && Math.abs(hi - lo) > 1e-3; i++) {
      const mid = (lo + hi) / 2;
      if (chi2(mid) - chiMin < level) lo = mid;
      else hi = mid;
    }
    return (lo + hi) / 2;
  };
  const [rLo, rHi] = REPULSIVE_EXPONENT_RANGE;
  const lo1 = crossing(s2, rLo);
  const hi1 = crossing(s2, rHi);
  const lower95 = crossing(3.841458820694124 * s2, rLo);
  const upper95 = crossing(3.841458820694124 * s2, rHi);
  const profile: RepulsiveExponentProfile = {
    // The grid and the best λr (the refinement's own evaluations are left out to keep the curve readable).
    values: [...new Set([...GRID, best])].sort((x, y) => x - y),
    chi2: [],
    best,
    stdErr: lo1 !== null && hi1 !== null ? (hi1 - lo1) / 2 : null,
    lower95,
    upper95,
  };
  profile.chi2 = profile.values.map((n) => chi2(n));
  const dof = Math.max(0, final.dof - 1);
  const warnings = [
    ...final.warnings,
    `λr was fitted by profiling χ² over 8–36 (best ${best.toFixed(2)}${profile.stdErr !== null ? ` ± ${profile.stdErr.toFixed(2)}` : ''}); the standard errors of ε and σ are those at the best λr and do not include its uncertainty.`,
  ];
  if (best <= rLo + 1e-3 || best >= rHi - 1e-3)
    warnings.push(
      `the best λr lies on the edge of the range 8–36: the data ask for a ${best <= rLo + 1e-3 ? 'softer' : 'harder'} repulsion than a Mie λr-6 potential in this range gives`,
    );
  if (lower95 === null || upper95 === null)
    warnings.push(
      `the data do not bound λr within 8–36 at 95 % (${lower95 === null ? 'no lower' : 'no upper'} limit): a ${potentialLabel(best)} potential is one of a range that fits equally well`,
    );
  onProgress?.({ fraction: 1, stage: 'done' });
  return {
    ...final,
    dof,
    reducedChi2: dof > 0 ? final.chi2 / dof : null,
    warnings,
    repulsiveExponentFitted: true,
    repulsiveExponentProfile: profile,
  };
}

export interface ModelCriterion {
  label: string;
  chi2: number;
  points: number;
  parameters: number;
  aic: number;
  bic: number;
}

/** AIC and BIC of a fit from its χ², the points it counted and its number of free parameters. */
export function informationCriteria(label: string, chi2: number, points: number, parameters: number): ModelCriterion {
  return { label, chi2, points, parameters, aic: chi2 + 2 * parameters, bic: chi2 + parameters * Math.log(points) };
}

/**
 * Plain-words comparison of two fits of the same data by BIC (lower is better); a difference above 10 is "very
 * strong" evidence, 6–10 "strong", 2–6 "positive", below 2 not worth more than a mention (Kass & Raftery 1995, §3.2).
 */
export function compareModels(
  a: ModelCriterion,
  b: ModelCriterion,
): { preferred: string | null; deltaBic: number; deltaAic: number; text: string } {
  const deltaBic = b.bic - a.bic;
  const deltaAic = b.aic - a.aic;
  const [better, worse] = deltaBic > 0 ? [a, b] : [b, a];
  const size = Math.abs(deltaBic);
  const strength = size > 10 ? 'very strongly' : size > 6 ? 'strongly' : size > 2 ? 'positively' : null;
  const text =
    strength === null
      ? `${a.label} and ${b.label} fit these data about equally well (ΔBIC = ${size.toFixed(1)}, below 2): prefer the simpler one.`
      : `The data ${strength} prefer ${better.label} over ${worse.label} (ΔBIC = ${size.toFixed(1)}, ΔAIC = ${Math.abs(deltaAic).toFixed(1)}; χ² ${better.chi2.toFixed(1)} with ${better.parameters} parameters against ${worse.chi2.toFixed(1)} with ${worse.parameters}).`;
  return { preferred: strength === null ? null : better.label, deltaBic, deltaAic, text };
}
