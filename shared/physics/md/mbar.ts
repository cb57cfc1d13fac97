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
  const length = values.length;
  let max = -Infinity;
  for (let i = 0; i < length; i++) if (values[i] > max) max = values[i];
  if (!Number.isFinite(max)) return max;
  let s = 0;
  for (let i = 0; i < length; i++) s += Math.exp(values[i] - max);
  return max + Math.log(s);
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
    let total = runs.reduce((s, r) => s + r.volume.length, 0);
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
    // The free energies are solved on every ⌈g_k/2⌉-th frame of each run (nearly independent samples, Shirts & Chodera
    // 2008, section II.C); the weights then use every frame. A run alone needs no solve (f_0 = 0): the identity at its
    // own state is exact.
    const fullTotal = total;
    const pick: number[] = [];
    const subCounts = runs.map(() => 0);
    {
      let start = 0;
      runs.forEach((r, k) => {
        const stride = K > 1 ? Math.max(1, Math.floor(r.statisticalInefficiency / 2)) : r.volume.length;
        for (let i = 0; i < r.volume.length; i += stride) {
          pick.push(start + i);
          subCounts[k]++;
        }
        start += r.volume.length;
      });
    }
    const subTotal = pick.length;
    const u = runs.map((r) => {
      const row = new Float64Array(subTotal);
      for (let m = 0; m < subTotal; m++) row[m] = reduced(this.h[pick[m]], this.v[pick[m]], r);
      return row;
    });
    const logN = subCounts.map((c) => Math.log(c));
    const counts = subCounts;
    total = subTotal;
    const f = new Float64Array(K);
    const logDen = new Float64Array(total);
    const terms = new Float64Array(K);
    const computeDenominator = () => {
      for (let n = 0; n < total; n++) {
        for (let k = 0; k < K; k++) terms[k] = logN[k] + f[k] - u[k][n];
        logDen[n] = logSumExp(terms);
      }
    };
    // From f = 0: a few self-consistent
    // iterations (Shirts & Chodera 2008, eq. 11), then Newton–Raphson on Σ_n W_nk = 1 (their Appendix C), f_0 = 0.
    const work = new Float64Array(total);
    const selfConsistent = () => {
      computeDenominator();
      const next = new Float64Array(K);
      for (let i = 0; i < K; i++) {
        for (let n = 0; n < total; n++) work[n] = -u[i][n] - logDen[n];
        next[i] = -logSumExp(work);
      }
      let change = 0;
      for (let i = 0; i < K; i++) {
        const v = next[i] - next[0];
        change = Math.max(change, Math.abs(v - f[i]));
        f[i] = v;
      }
      return change;
    };
    let change = Infinity;
    for (let iteration = 0; iteration < 10 && K > 1 && change > 1e-9; iteration++) change = selfConsistent();
    for (let iteration = 0; iteration < 50 && K > 1 && change > 1e-9; iteration++) {
      computeDenominator();
      // W_nk = exp(f_k − u_k(x_n) − logDen_n); F_i = Σ_n W_ni − 1; J_ij = δ_ij Σ_n W_ni − N_j Σ_n W_ni W_nj.
      const sumW = new Float64Array(K);
      const J = Array.from({ length: K }, () => new Float64Array(K));
      const w = new Float64Array(K);
      for (let n = 0; n < total; n++) {
        for (let k = 0; k < K; k++) w[k] = Math.exp(f[k] - u[k][n] - logDen[n]);
        for (let i = 0; i < K; i++) {
          sumW[i] += w[i];
          for (let j = 0; j < K; j++) J[i][j] -= counts[j] * w[i] * w[j];
        }
      }
      for (let i = 0; i < K; i++) J[i][i] += sumW[i];
      // Solve the (K − 1) system without f_0 by Gaussian elimination with partial pivoting.
      const m = K - 1;
      const A = Array.from({ length: m }, (_, r) => [...Array.from({ length: m }, (_, c) => J[r + 1][c + 1]), sumW[r + 1] - 1]);
      let singular = false;
      for (let c = 0; c < m; c++) {
        let piv = c;
        for (let r = c + 1; r < m; r++) if (Math.abs(A[r][c]) > Math.abs(A[piv][c])) piv = r;
        if (!(Math.abs(A[piv][c]) > 1e-300)) {
          singular = true;
          break;
        }
        [A[c], A[piv]] = [A[piv], A[c]];
        for (let r = c + 1; r < m; r++) {
          const q = A[r][c] / A[c][c];
          for (let k = c; k <= m; k++) A[r][k] -= q * A[c][k];
        }
      }
      if (singular) {
        change = selfConsistent();
        continue;
      }
      const delta = new Float64Array(m);
      for (let r = m - 1; r >= 0; r--) {
        let v = A[r][m];
        for (let k = r + 1; k < m; k++) v -= A[r][k] * delta[k];
        delta[r] = v / A[r][r];
      }
      // A Newton step larger than one unit of k_BT per state is cut back (poor overlap makes J nearly singular).
      const largest = delta.reduce((a, b) => Math.max(a, Math.abs(b)), 0);
      const scale = largest > 1 ? 1 / largest : 1;
      change = 0;
      for (let i = 1; i < K; i++) {
        f[i] -= scale * delta[i - 1];
        change = Math.max(change, Math.abs(scale * delta[i - 1]));
      }
      if (!delta.every(Number.isFinite)) {
        f.fill(0);
        change = Infinity;
        for (let it = 0; it < 2000 && change > 1e-9; it++) change = selfConsistent();
        break;
      }
    }
    // Denominators of every frame with the solved free energies and the full frame counts.
    const fullLogN = runs.map((r) => Math.log(r.volume.length));
    const full = new Float64Array(fullTotal);
    for (let n = 0; n < fullTotal; n++) {
      for (let k = 0; k < K; k++) terms[k] = fullLogN[k] + f[k] - reduced(this.h[n], this.v[n], runs[k]);
      full[n] = logSumExp(terms);
    }
    this.logDenominator = full;
  }

  /** Scratch for the weights, reused by every prediction (a fit asks for hundreds). */
  private scratch: Float64Array = new Float64Array(0);

  predict(target: ReweightState): { prediction: ReweightPrediction } {
    const total = this.v.length;
    if (this.scratch.length !== total) this.scratch = new Float64Array(total);
    const w = this.scratch;
    for (let n = 0; n < total; n++) w[n] = -reduced(this.h[n], this.v[n], target) - this.logDenominator[n];
    const norm = logSumExp(w);
    for (let n = 0; n < total; n++) w[n] = Math.exp(w[n] - norm);
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

/** A pool of runs of one engine setting that predicts ⟨ρ*⟩ at nearby states (one MBAR solve over all its runs). */
export class ReweightPool {
  private readonly runs: ReweightRun[] = [];
  private solve: MbarSolve | null = null;

  constructor(
    runs: ReweightRun[] = [],
    readonly minEffectiveSamples = DEFAULT_MIN_REWEIGHT_SAMPLES,
  ) {
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
    if (this.runs.length && run.atoms !== this.runs[0].atoms)
      throw new RangeError(`run ${run.id} has ${run.atoms} atoms, the pool ${this.runs[0].atoms}`);
    if (run.volume.length === 0 || run.volume.length !== run.hamiltonianPotential.length)
      throw new RangeError(`run ${run.id} has no usable frames`);
    this.runs.push(run);
    this.solve = null;
  }

  /**
   * ⟨ρ*⟩ and its derivatives at the target, or a refusal when the runs carry too few effective samples there. MBAR is
   * solved once over all runs of the pool (again only when a run is added); runs far from the target get no weight.
   */
  predict(target: ReweightState): ReweightOutcome {
    if (this.runs.length === 0) return { ok: false, effectiveSamples: 0, reason: 'no stored runs' };
    if (!this.solve) this.solve = new MbarSolve([...this.runs].sort((a, b) => a.id - b.id));
    const { prediction } = this.solve.predict(target);
    if (!(prediction.effectiveSamples >= 1)) {
      return {
        ok: false,
        effectiveSamples: prediction.effectiveSamples,
        reason: `no stored run overlaps T* = ${target.reducedTemperature.toFixed(4)}, P* = ${target.reducedPressure.toFixed(4)}`,
      };
    }
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
