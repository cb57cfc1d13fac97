/**
 * Third virial coefficient of a spherical pair potential with pairwise-additive interactions:
 *   B3 = −(N_A²/3) ∫∫ f(r12) f(r13) f(r23) dr2 dr3,   f = e^{−u/kT} − 1 (Mayer function),
 * (Hirschfelder, Curtiss & Bird, "Molecular Theory of Gases and Liquids", 1954, eq. 3.6-4). In bipolar
 * coordinates this is B3 = −(8π²N_A²/3) ∫∫∫ f(r) f(s) f(t) r s t dt ds dr over triangles (r, s, t), and in
 * reduced form (x = r/σ, b0 = 2πN_Aσ³/3)
 *   B3* = B3/b0² = −6 ∫_0^∞ ∫_0^∞ f(x) f(y) x y [G(x + y) − G(|x − y|)] dx dy,   G(r) = ∫_0^r f(z) z dz.
 * The double integral is done by composite Gauss–Legendre quadrature on panels matched to the shape of
 * the LJ Mayer function (direct quadrature, no Fourier transform); G comes from a table of cumulative
 * Gauss–Legendre integrals read by Hermite interpolation, so every value is a fixed, smooth function of
 * T* (its T*-derivative is taken under the integral sign).
 *
 * The LJ potential has no closed form for B3; Hirschfelder et al. 1954 tabulate B3*(T*) (their C*),
 * tested in third-virial.test.ts. Three-body (non-additive) forces are not included.
 */
import { b2ZeroCm3PerMol } from './virial';

/** Reduced temperatures outside this span are rejected (the Mayer function's exponent overflows below it). */
export const B3_REDUCED_TEMPERATURE_RANGE = { minReducedTemperature: 0.3, maxReducedTemperature: 1e4 } as const;

/** Gauss–Legendre nodes and weights on [−1, 1] by Newton's method on P_n (Golub–Welsch would do as well). */
function gaussLegendre(n: number): { nodes: number[]; weights: number[] } {
  const nodes: number[] = [];
  const weights: number[] = [];
  for (let i = 1; i <= n; i++) {
    let x = Math.cos((Math.PI * (i - 0.25)) / (n + 0.5));
    let dp = 0;
    for (let iter = 0; iter < 100; iter++) {
      let p0 = 1;
      let p1 = x;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      dp = (n * (x * p1 - p0)) / (x * x - 1);
      const dx = p1 / dp;
      x -= dx;
      if (Math.abs(dx) < 1e-16) break;
    }
    nodes.push(x);
    weights.push(2 / ((1 - x * x) * dp * dp));
  }
  return { nodes, weights };
}

const GL8 = gaussLegendre(8);

/** A Mayer function f(x) of the reduced distance and its derivative with respect to T* (0 when none is needed). */
export interface MayerFunction {
  f(x: number): number;
  dfdT?(x: number): number;
}

export interface B3QuadratureOptions {
  /** Panel edges in x for the outer double integral, ascending from 0; the last is the cut-off of the range. */
  breakpoints: readonly number[];
  /** Gauss–Legendre points per panel. */
  pointsPerPanel: number;
}

/** Panels for the LJ 12-6 Mayer function: fine where it turns from −1 to its well (0.85 < x < 1.5), coarse in the tail. */
const LJ_PANELS: B3QuadratureOptions = {
  breakpoints: [0, 0.4, 0.55, 0.7, 0.85, 0.92, 0.97, 1.02, 1.07, 1.12246, 1.18, 1.26, 1.36, 1.5, 1.7, 2, 2.5, 3.2, 4.2, 5.6, 7.5, 10],
  pointsPerPanel: 12,
};

const G_STEP = 0.004;

/**
 * G(r) = ∫_0^r f(z) z dz tabulated at r = k·G_STEP by cumulative 8-point Gauss–Legendre, and read between
 * nodes by cubic Hermite interpolation with the exact slope G'(r) = f(r)·r (error about h⁴/384 times the
 * fourth derivative of G, below 1e-10 for the LJ Mayer function at T* ≥ 0.3).
 */
function cumulativeTable(f: (x: number) => number, rMax: number): (r: number) => number {
  const cells = Math.ceil(rMax / G_STEP) + 1;
  const value = new Float64Array(cells + 1);
  const slope = new Float64Array(cells + 1);
  const half = 0.5 * G_STEP;
  for (let k = 1; k <= cells; k++) {
    const mid = (k - 1) * G_STEP + half;
    let s = 0;
    for (let i = 0; i < GL8.nodes.length; i++) {
      const z = mid + half * GL8.nodes[i];
      s += GL8.weights[i] * f(z) * z;
    }
    value[k] = value[k - 1] + s * half;
  }
  for (let k = 1; k <= cells; k++) slope[k] = f(k * G_STEP) * k * G_STEP;
  return (r: number) => {
    const k = Math.min(Math.floor(r / G_STEP), cells - 1);
    const t = r / G_STEP - k;
    const t2 = t * t;
    const t3 = t2 * t;
    return (
      (2 * t3 - 3 * t2 + 1) * value[k] +
      (t3 - 2 * t2 + t) * G_STEP * slope[k] +
      (-2 * t3 + 3 * t2) * value[k + 1] +
      (t3 - t2) * G_STEP * slope[k + 1]
    );
  };
}

/**
 * [B3*, d(B3*)/dT*] of any Mayer function (d(B3*)/dT* is 0 when the function has no dfdT).
 * The derivative uses the symmetry of the triple integral: d(f f f)/dT integrates to 3 f_T f f.
 */
export function reducedB3OfMayer(mayer: MayerFunction, options: B3QuadratureOptions = LJ_PANELS): [number, number] {
  const { breakpoints, pointsPerPanel } = options;
  const rule = gaussLegendre(pointsPerPanel);
  const xs: number[] = [];
  const ws: number[] = [];
  for (let p = 0; p + 1 < breakpoints.length; p++) {
    const lo = breakpoints[p];
    const hi = breakpoints[p + 1];
    const half = 0.5 * (hi - lo);
    for (let i = 0; i < pointsPerPanel; i++) {
      xs.push(0.5 * (lo + hi) + half * rule.nodes[i]);
      ws.push(half * rule.weights[i]);
    }
  }
  const n = xs.length;
  // a_i = w_i x_i f(x_i), b_i = w_i x_i f_T(x_i); H(x, y) = G(x + y) − G(|x − y|) is symmetric in x and y.
  const a = xs.map((x, i) => ws[i] * x * mayer.f(x));
  const b = xs.map((x, i) => (mayer.dfdT ? ws[i] * x * mayer.dfdT(x) : 0));
  const g = cumulativeTable((z) => mayer.f(z), 2 * breakpoints[breakpoints.length - 1]);
  let integral = 0;
  let derivative = 0;
  for (let i = 0; i < n; i++) {
    const xi = xs[i];
    for (let j = 0; j <= i; j++) {
      const h = g(xi + xs[j]) - g(Math.abs(xi - xs[j]));
      if (j === i) {
        integral += a[i] * a[i] * h;
        derivative += b[i] * a[i] * h;
      } else {
        integral += 2 * a[i] * a[j] * h;
        derivative += (b[i] * a[j] + b[j] * a[i]) * h;
      }
    }
  }
  return [-6 * integral, -18 * derivative];
}

function requireReducedTemperature(tStar: number): void {
  const { minReducedTemperature: lo, maxReducedTemperature: hi } = B3_REDUCED_TEMPERATURE_RANGE;
  if (typeof tStar !== 'number' || !Number.isFinite(tStar) || tStar < lo || tStar > hi) {
    throw new RangeError(`reduced temperature T* = ${String(tStar)} is outside the range of the B3 quadrature [${lo}, ${hi}]`);
  }
}

/** Mayer function of the LJ 12-6 potential at reduced temperature T*, with ∂f/∂T* = e^(−u*÷T*)·u*÷T*². */
export function ljMayerFunction(tStar: number): MayerFunction {
  const inv = 1 / tStar;
  return {
    f(x) {
      const w = Math.pow(x, -6);
      const u = 4 * w * (w - 1);
      return Math.expm1(-u * inv);
    },
    dfdT(x) {
      const w = Math.pow(x, -6);
      const u = 4 * w * (w - 1);
      const e = Math.exp(-u * inv);
      return e === 0 ? 0 : e * u * inv * inv;
    },
  };
}

const nodeCache = new Map<number, [number, number]>();

/** Grid step in ln T* of the interpolation table (nodes are computed on first use). */
const LN_T_STEP = 0.02;

/** [B3*, T*·d(B3*)/dT*] by quadrature at grid node k (T* = e^(k·LN_T_STEP)). */
function node(k: number): [number, number] {
  let hit = nodeCache.get(k);
  if (!hit) {
    const t = Math.exp(k * LN_T_STEP);
    const [b, d] = reducedB3OfMayer(ljMayerFunction(t));
    hit = [b, t * d];
    nodeCache.set(k, hit);
  }
  return hit;
}

/**
 * [B3*, d(B3*)/dT*] of the LJ 12-6 fluid. A fit asks for B3 at a new T* on every iteration, so the quadrature runs
 * on a grid in ln T* (step 0.02, nodes computed once on first use) and values in between come from cubic Hermite
 * interpolation with the exact slopes at the nodes (error below 2e-6 relative for T* ≥ 0.3, under the quadrature's own
 * 1e-5; tested against direct
 * quadrature). Values and slopes are those of one smooth interpolant, so the fit's Jacobian is consistent.
 */
export function reducedB3WithDerivative(tStar: number): [number, number] {
  requireReducedTemperature(tStar);
  const u = Math.log(tStar) / LN_T_STEP;
  const k = Math.floor(u);
  const x = u - k;
  const [b0, d0] = node(k);
  if (x === 0) return [b0, d0 / tStar];
  const [b1, d1] = node(k + 1);
  const h = LN_T_STEP;
  const x2 = x * x;
  const x3 = x2 * x;
  const value = (2 * x3 - 3 * x2 + 1) * b0 + (x3 - 2 * x2 + x) * h * d0 + (-2 * x3 + 3 * x2) * b1 + (x3 - x2) * h * d1;
  const dValueDx = (6 * x2 - 6 * x) * b0 + (3 * x2 - 4 * x + 1) * h * d0 + (-6 * x2 + 6 * x) * b1 + (3 * x2 - 2 * x) * h * d1;
  // d/dT* = (d/dx)(dx/d ln T*)(d ln T*/dT*) = dValueDx / (h T*)
  return [value, dValueDx / (h * tStar)];
}

/** B3* = B3/b0² of the LJ 12-6 fluid at reduced temperature T* = kT/ε. */
export function reducedB3(tStar: number): number {
  return reducedB3WithDerivative(tStar)[0];
}

export interface B3Point {
  b3Cm6PerMol2: number;
  /** ∂B3/∂(ε/k_B), cm⁶/(mol²·K). */
  dB3dEpsilonK: number;
  /** ∂B3/∂σ, cm⁶/(mol²·Å). */
  dB3dSigmaAngstrom: number;
}

/**
 * B3(T) in cm⁶/mol² with its analytic gradient in (ε/k_B [K], σ [Å]): B3 = b0² B3*(T/ε), so
 * ∂B3/∂σ = 6 B3/σ and ∂B3/∂ε = −b0² (T* ÷ ε) d(B3*)/dT*.
 */
export function b3WithGradient(temperatureK: number, epsilonK: number, sigmaAngstrom: number): B3Point {
  for (const [name, v] of [
    ['temperatureK', temperatureK],
    ['epsilonK', epsilonK],
    ['sigmaAngstrom', sigmaAngstrom],
  ] as const) {
    if (!(v > 0) || !Number.isFinite(v)) throw new RangeError(`${name} must be a finite number > 0 (got ${String(v)})`);
  }
  const tStar = temperatureK / epsilonK;
  const [b3Star, dB3Star] = reducedB3WithDerivative(tStar);
  const b0 = b2ZeroCm3PerMol(sigmaAngstrom);
  const b3 = b0 * b0 * b3Star;
  return { b3Cm6PerMol2: b3, dB3dEpsilonK: (-b0 * b0 * tStar * dB3Star) / epsilonK, dB3dSigmaAngstrom: (6 * b3) / sigmaAngstrom };
}
