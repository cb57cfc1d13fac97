/**
 * Time-series statistics for correlated simulation output.
 * - Statistical inefficiency g = 1 + 2 Σ_t (1 − t/T) C(t), summed until the normalised autocorrelation C(t)
 *   first drops to zero or below (Chodera, Swope, Pitera, Seok & Dill 2007, J. Chem. Theory Comput. 3, 26, eq. 20;
 *   Müller-Krumbhaar & Binder 1973). Standard error of a mean: sqrt(Var·g/T).
 * - Equilibration detection: choose the discard point t0 that maximises N_eff = (T − t0)/g(t0), g computed on
 *   the retained part (Chodera 2016, J. Chem. Theory Comput. 12, 1799).
 * - Blocking standard error (Flyvbjerg & Petersen 1989, J. Chem. Phys. 91, 461) as a cross-check.
 */

export function mean(x: ArrayLike<number>, from = 0, to = x.length): number {
  let s = 0;
  for (let i = from; i < to; i++) s += x[i];
  return s / (to - from);
}

/** Biased (1/T) variance, as used in the autocorrelation estimate. */
export function variance(x: ArrayLike<number>, from = 0, to = x.length): number {
  const m = mean(x, from, to);
  let s = 0;
  for (let i = from; i < to; i++) s += (x[i] - m) * (x[i] - m);
  return s / (to - from);
}

/** Statistical inefficiency g ≥ 1 of x[from..to) (Chodera et al. 2007, eq. 20, minimum lag 3 as in their code). */
export function statisticalInefficiency(x: ArrayLike<number>, from = 0, to = x.length): number {
  const T = to - from;
  if (T < 3) return 1;
  const m = mean(x, from, to);
  let s0 = 0;
  for (let i = from; i < to; i++) s0 += (x[i] - m) * (x[i] - m);
  const sigma2 = s0 / T;
  if (!(sigma2 > 0)) return 1;
  let g = 1;
  for (let t = 1; t < T - 1; t++) {
    let s = 0;
    for (let i = from; i < to - t; i++) s += (x[i] - m) * (x[i + t] - m);
    const c = s / (T - t) / sigma2;
    if (c <= 0 && t > 3) break;
    g += 2 * c * (1 - t / T);
  }
  return Math.max(g, 1);
}

export interface MeanEstimate {
  mean: number;
  stdErr: number;
  statisticalInefficiency: number;
  samples: number;
}

/** Mean with standard error sqrt(Var·g/T). */
export function estimateMean(x: ArrayLike<number>, from = 0, to = x.length): MeanEstimate {
  const T = to - from;
  const g = statisticalInefficiency(x, from, to);
  const v = T > 1 ? (variance(x, from, to) * T) / (T - 1) : 0;
  return { mean: mean(x, from, to), stdErr: Math.sqrt((v * g) / T), statisticalInefficiency: g, samples: T };
}

export interface Equilibration {
  /** First retained sample. */
  t0: number;
  /** Statistical inefficiency of the retained part. */
  statisticalInefficiency: number;
  /** Effectively uncorrelated samples (T − t0)/g. */
  effectiveSamples: number;
}

/**
 * Chodera 2016: scan candidate origins (every sample for short series, an even grid of about 100 otherwise;
 * the last 10 % is never a candidate so that g can still be estimated) and keep the one with the most N_eff.
 */
export function detectEquilibration(x: ArrayLike<number>): Equilibration {
  const T = x.length;
  const last = Math.max(1, Math.floor(0.9 * T));
  const stride = Math.max(1, Math.floor(last / 100));
  let best: Equilibration = { t0: 0, statisticalInefficiency: 1, effectiveSamples: 0 };
  for (let t0 = 0; t0 < last; t0 += stride) {
    const g = statisticalInefficiency(x, t0, T);
    const neff = (T - t0) / g;
    if (neff > best.effectiveSamples) best = { t0, statisticalInefficiency: g, effectiveSamples: neff };
  }
  return best;
}

/** Blocking standard error: the largest estimate over block sizes that leave ≥ 16 blocks (Flyvbjerg & Petersen 1989). */
export function blockingStdErr(x: ArrayLike<number>, from = 0, to = x.length): number {
  let data = Array.from({ length: to - from }, (_, k) => x[from + k]);
  let best = 0;
  while (data.length >= 16) {
    const T = data.length;
    const v = (variance(data) * T) / (T - 1);
    best = Math.max(best, Math.sqrt(v / T));
    const next: number[] = [];
    for (let i = 0; i + 1 < T; i += 2) next.push(0.5 * (data[i] + data[i + 1]));
    data = next;
  }
  return best;
}

/** Covariance of a and b over [from, to) with the standard error of the product series (a − ā)(b − b̄). */
export function estimateCovariance(a: ArrayLike<number>, b: ArrayLike<number>, from = 0, to = a.length): MeanEstimate {
  const ma = mean(a, from, to);
  const mb = mean(b, from, to);
  const prod = new Float64Array(to - from);
  for (let i = from; i < to; i++) prod[i - from] = (a[i] - ma) * (b[i] - mb);
  const est = estimateMean(prod);
  const T = to - from;
  // Bessel correction for the two estimated means.
  const k = T > 1 ? T / (T - 1) : 1;
  return { ...est, mean: est.mean * k, stdErr: est.stdErr * k };
}

/** Least-squares slope of y against x. */
export function slope(x: ArrayLike<number>, y: ArrayLike<number>): number {
  const n = x.length;
  if (n < 2) return 0;
  const mx = mean(x);
  const my = mean(y);
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < n; i++) {
    sxy += (x[i] - mx) * (y[i] - my);
    sxx += (x[i] - mx) * (x[i] - mx);
  }
  return sxx > 0 ? sxy / sxx : 0;
}
