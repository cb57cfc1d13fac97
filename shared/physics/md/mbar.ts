/**
 * Multistate reweighting of stored NPT runs of the LJ fluid to a nearby reduced state (T*, P*): the MBAR estimator
 * of M. R. Shirts and J. D. Chodera, "Statistically optimal analysis of samples from multiple equilibrium states",
 * J. Chem. Phys. 129, 124105 (2008), eqs. 11 and 15 (the self-consistent form of the free energies), with the
 * reduced potential of the isothermal–isobaric ensemble u_i(x) = (H_pot(x) + P*_i V(x))/T*_i (their eq. 3).
 *
 * For the LJ fluid in reduced units a change of ε and σ is a change of reduced state only, so every run of the same
 * engine settings (atoms, cutoff in σ, cutoff scheme, timestep) samples the same family of ensembles and its frames
 * (frames.ts) predict ⟨ρ*⟩ at other (T*, P*):
 *   W_n ∝ exp(−u_t(x_n)) / Σ_k N_k exp(f_k − u_k(x_n)),   ⟨ρ*⟩_t = Σ_n W_n N/V_n,
 *   (∂⟨ρ*⟩/∂T*)_P = Cov_W(ρ*, H_pot + P*V)/T*²,   (∂⟨ρ*⟩/∂P*)_T = −Cov_W(ρ*, V)/T*,
 * which are the exact derivatives of the estimate itself (differentiate W_n), so a least-squares fit that steps on
 * reweighted predictions has a consistent Jacobian. The kinetic energy and the V^N of scaled coordinates are the same
 * in every ensemble and cancel.
 *
 * Uncertainties: frames of one run are correlated with statistical inefficiency g_k (of its density series), so
 * Var(Ā) ≈ Σ_k g_k Σ_{n∈k} W_n² (A_n − Ā)² / (1 − 1/n_eff) (the delta method for a self-normalised weighted mean,
 * uncertainty of the f_k neglected; at a run's own state it equals the run's own standard error), and the Kish
 * effective sample size n_eff = (Σ W_n)² / Σ_k g_k Σ_{n∈k} W_n² (L. Kish, Survey Sampling, 1965, counted in
 * independent samples) guards every prediction: below `minEffectiveSamples` the state is refused and a new run is
 * needed there.
 */
import { decodeFloat64 } from './frames';

export interface ReweightRun {
  id: number;
  reducedTemperature: number;
  reducedPressure: number;
  atoms: number;
  /** H_pot per frame (total, ε). */
  hamiltonianPotential: Float64Array;
  /** V per frame (σ³). */
  volume: Float64Array;
  statisticalInefficiency: number;
}

export interface ReweightState {
  reducedTemperature: number;
  reducedPressure: number;
}

export interface ReweightPrediction {
  reducedDensity: number;
  stdErr: number;
  dRhoDT: number;
  dRhoDTStdErr: number;
  dRhoDP: number;
  dRhoDPStdErr: number;
  /** Kish effective sample size in independent samples. */
  effectiveSamples: number;
  /** Runs that carry weight, with their share of it. */
  runs: Array<{ id: number; weight: number }>;
}

export type ReweightOutcome = ({ ok: true } & ReweightPrediction) | { ok: false; effectiveSamples: number; reason: string };

/**
 * Smallest Kish effective sample size at which a reweighted prediction is used. A run itself aims at 50; 20 lets a
 * Levenberg–Marquardt step move a few per cent in ε from one round of runs, while the prediction's standard error
 * (which grows as the effective samples fall) still says honestly how good it is. The final point is confirmed by runs.
 */
export const DEFAULT_MIN_REWEIGHT_SAMPLES = 20;

/** Runs whose own frames carry fewer effective samples than this at the target are left out of the MBAR solve. */
const MIN_SAMPLES_PER_RUN = 1;

/** A run from a task result's frames (frames.ts). */
export function reweightRunFromFrames(
  id: number,
  settings: { reducedTemperature: number; reducedPressure: number; atoms: number },
  frames: { statisticalInefficiency: number; hamiltonianPotentialBase64: string; volumeBase64: string },
): ReweightRun {
  return {
    id,
    reducedTemperature: settings.reducedTemperature,
    reducedPressure: settings.reducedPressure,
    atoms: settings.atoms,
    hamiltonianPotential: decodeFloat64(frames.hamiltonianPotentialBase64),
    volume: decodeFloat64(frames.volumeBase64),
    statisticalInefficiency: frames.statisticalInefficiency,
  };
}

const reduced = (h: number, v: number, s: ReweightState) => (h + s.reducedPressure * v) / s.reducedTemperature;

function logSumExp(values: Float64Array | number[]): number {
  let max = -Infinity;
  for (const v of values) if (v > max) max = v;
  if (!Number.isFinite(max)) return max;
  let s = 0;
  for (const v of values) s += Math.exp(v - max);
  return max + Math.log(s);
}

/** Kish effective samples of one run's frames reweighted alone to the target (for choosing the runs of a solve). */
function singleRunSamples(run: ReweightRun, target: ReweightState): number {
  const n = run.volume.length;
  const logW = new Float64Array(n);
  const own: ReweightState = run;
  for (let i = 0; i < n; i++) {
    const h = run.hamiltonianPotential[i];
    const v = run.volume[i];
    logW[i] = reduced(h, v, own) - reduced(h, v, target);
  }
  const a = logSumExp(logW);
  const b = logSumExp(logW.map((x) => 2 * x));
  return Math.exp(2 * a - b) / Math.max(1, run.statisticalInefficiency);
}

/**
 * Free energies of a set of runs, solved once and kept: the log of the MBAR denominator per frame,
 * log Σ_k N_k exp(f_k − u_k(x_n)), is all a prediction needs.
 */
class MbarSolve {
  readonly logDenominator: Float64Array;
  readonly runOf: Int32Array;
  readonly h: Float64Array;
  readonly v: Float64Array;

  constructor(readonly runs: ReweightRun[]) {
    const total = runs.reduce((s, r) => s + r.volume.length, 0);
    this.h = new Float64Array(total);
    this.v = new Float64Array(total);
    this.runOf = new Int32Array(total);
    let o = 0;
    runs.forEach((r, k) => {
      this.h.set(r.hamiltonianPotential, o);
      this.v.set(r.volume, o);
      this.runOf.fill(k, o, o + r.volume.length);
      o += r.volume.length;
    });
    const K = runs.length;
    const u = runs.map((r) => {
      const row = new Float64Array(total);
      for (let n = 0; n < total; n++) row[n] = reduced(this.h[n], this.v[n], r);
      return row;
    });
    const logN = runs.map((r) => Math.log(r.volume.length));
    const f = new Float64Array(K);
    const logDen = new Float64Array(total);
    const terms = new Float64Array(K);
    const computeDenominator = () => {
      for (let n = 0; n < total; n++) {
        for (let k = 0; k < K; k++) terms[k] = logN[k] + f[k] - u[k][n];
        logDen[n] = logSumExp(terms);
      }
    };
    // Self-consistent iteration (Shirts & Chodera 2008, eq. 11), f_0 = 0, until the free energies settle to 1e-9.
    const work = new Float64Array(total);
    for (let iteration = 0; iteration < 2000 && K > 1; iteration++) {
      computeDenominator();
      let change = 0;
      const next = new Float64Array(K);
      for (let i = 0; i < K; i++) {
        for (let n = 0; n < total; n++) work[n] = -u[i][n] - logDen[n];
        next[i] = -logSumExp(work);
      }
      for (let i = K - 1; i >= 0; i--) next[i] -= next[0];
      for (let i = 0; i < K; i++) {
        change = Math.max(change, Math.abs(next[i] - f[i]));
        f[i] = next[i];
      }
      if (change < 1e-9) break;
    }
    computeDenominator();
    this.logDenominator = logDen;
  }

  predict(target: ReweightState): { prediction: ReweightPrediction } {
    const total = this.v.length;
    const logW = new Float64Array(total);
    for (let n = 0; n < total; n++) logW[n] = -reduced(this.h[n], this.v[n], target) - this.logDenominator[n];
    const norm = logSumExp(logW);
    const w = new Float64Array(total);
    for (let n = 0; n < total; n++) w[n] = Math.exp(logW[n] - norm);
    const atoms = this.runs[0].atoms;
    let rho = 0;
    let hc = 0;
    let vol = 0;
    for (let n = 0; n < total; n++) {
      rho += w[n] * (atoms / this.v[n]);
      hc += w[n] * (this.h[n] + target.reducedPressure * this.v[n]);
      vol += w[n] * this.v[n];
    }
    let covRhoH = 0;
    let covRhoV = 0;
    for (let n = 0; n < total; n++) {
      const dr = atoms / this.v[n] - rho;
      covRhoH += w[n] * dr * (this.h[n] + target.reducedPressure * this.v[n] - hc);
      covRhoV += w[n] * dr * (this.v[n] - vol);
    }
    // Delta-method variances, each run's frames counted with its statistical inefficiency.
    let sumW2g = 0;
    let varRho = 0;
    let varCovH = 0;
    let varCovV = 0;
    const shares = new Float64Array(this.runs.length);
    for (let n = 0; n < total; n++) {
      const g = Math.max(1, this.runs[this.runOf[n]].statisticalInefficiency);
      const w2g = w[n] * w[n] * g;
      shares[this.runOf[n]] += w[n];
      sumW2g += w2g;
      const dr = atoms / this.v[n] - rho;
      varRho += w2g * dr * dr;
      varCovH += w2g * (dr * (this.h[n] + target.reducedPressure * this.v[n] - hc) - covRhoH) ** 2;
      varCovV += w2g * (dr * (this.v[n] - vol) - covRhoV) ** 2;
    }
    const effectiveSamples = 1 / sumW2g;
    // Small-sample corrections as for a plain mean (statistics.ts): variance and covariance are biased low by 1 − 1/n_eff.
    const bias = effectiveSamples > 2 ? effectiveSamples / (effectiveSamples - 1) : 2;
    const t = target.reducedTemperature;
    return {
      prediction: {
        reducedDensity: rho,
        stdErr: Math.sqrt(varRho * bias),
        dRhoDT: (covRhoH * bias) / (t * t),
        dRhoDTStdErr: (Math.sqrt(varCovH) * bias) / (t * t),
        dRhoDP: (-covRhoV * bias) / t,
        dRhoDPStdErr: (Math.sqrt(varCovV) * bias) / t,
        effectiveSamples,
        runs: this.runs.map((r, k) => ({ id: r.id, weight: shares[k] })).filter((r) => r.weight > 1e-3),
      },
    };
  }
}

/**
 * A pool of runs of one engine setting that predicts ⟨ρ*⟩ at nearby states. Each prediction solves MBAR over the
 * runs that overlap the target (solutions are cached by the set of runs), so a pool of many runs spread over a
 * phase diagram stays cheap.
 */
export class ReweightPool {
  private readonly runs: ReweightRun[] = [];
  private readonly solves = new Map<string, MbarSolve>();

  constructor(runs: ReweightRun[] = [], readonly minEffectiveSamples = DEFAULT_MIN_REWEIGHT_SAMPLES) {
    for (const r of runs) this.add(r);
  }

  get size(): number {
    return this.runs.length;
  }

  has(id: number): boolean {
    return this.runs.some((r) => r.id === id);
  }

  add(run: ReweightRun): void {
    if (this.has(run.id)) return;
    if (this.runs.length && run.atoms !== this.runs[0].atoms) throw new RangeError(`run ${run.id} has ${run.atoms} atoms, the pool ${this.runs[0].atoms}`);
    if (run.volume.length === 0 || run.volume.length !== run.hamiltonianPotential.length) throw new RangeError(`run ${run.id} has no usable frames`);
    this.runs.push(run);
  }

  /** ⟨ρ*⟩ and its derivatives at the target, or a refusal when the runs carry too few effective samples there. */
  predict(target: ReweightState): ReweightOutcome {
    const chosen = this.runs
      .map((r) => ({ r, samples: singleRunSamples(r, target) }))
      .filter((x) => x.samples >= MIN_SAMPLES_PER_RUN)
      .sort((a, b) => b.samples - a.samples)
      .slice(0, 8)
      .map((x) => x.r)
      .sort((a, b) => a.id - b.id);
    if (chosen.length === 0) {
      return { ok: false, effectiveSamples: 0, reason: `no stored run overlaps T* = ${target.reducedTemperature.toFixed(4)}, P* = ${target.reducedPressure.toFixed(4)}` };
    }
    const key = chosen.map((r) => r.id).join(',');
    let solve = this.solves.get(key);
    if (!solve) {
      solve = new MbarSolve(chosen);
      this.solves.set(key, solve);
    }
    const { prediction } = solve.predict(target);
    if (!(prediction.effectiveSamples >= this.minEffectiveSamples)) {
      return {
        ok: false,
        effectiveSamples: prediction.effectiveSamples,
        reason: `reweighting to T* = ${target.reducedTemperature.toFixed(4)}, P* = ${target.reducedPressure.toFixed(4)} keeps ${prediction.effectiveSamples.toFixed(1)} effective samples, fewer than ${this.minEffectiveSamples}`,
      };
    }
    return { ok: true, ...prediction };
  }
}
