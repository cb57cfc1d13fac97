/**
 * Equation of state of the full Lennard-Jones 12-6 fluid in reduced units
 * (σ = ε = m = k_B = 1): ρ* = ρσ³, T* = k_B T/ε, P* = Pσ³/ε, energies per particle in ε.
 *
 * Implements the modified Benedict–Webb–Rubin (MBWR) equation of
 * J. K. Johnson, J. A. Zollweg and K. E. Gubbins, "The Lennard-Jones equation of state revisited",
 * Mol. Phys. 78, 591–618 (1993), doi:10.1080/00268979300100411 (JZG below):
 *   A_res/(Nε) = Σ_{i=1..8} a_i(T) ρ^i / i + Σ_{i=1..6} b_i(T) G_i(ρ)
 *   P          = ρT + Σ_{i=1..8} a_i ρ^{i+1} + F Σ_{i=1..6} b_i ρ^{2i+1},   F = exp(−γρ²)
 *   U_res/(Nε) = Σ c_i ρ^i / i + Σ d_i G_i,   c_i = a_i − T da_i/dT,  d_i = b_i − T db_i/dT
 * with a_i(T) from JZG Table 5, b_i(T) from Table 6, G_i(ρ) from Table 7 and the 32 coefficients
 * x1..x32 of Table 10 with γ = 3; U follows from U = ∂(A/T)/∂(1/T) (JZG give c_i, d_i in Tables 8–9).
 * The paper itself was not at hand: the coefficients were taken from public copies of Table 10
 * and checked digit by digit across three independent ones (NIST teqp `mie/lennardjones/johnson.hpp`,
 * apsantos/ljeos_project `parameters.dat`, and a Julia port `LJSinglephase`), which agree in every
 * printed digit. The critical point the coefficients produce (tested) matches the one JZG report.
 *
 * JZG fitted simulation data for 0.7 ≤ T* ≤ 6 and densities up to ≈ 1.2; outside that range the
 * polynomial extrapolates without guarantee. The EOS's own critical point (computed here, see
 * `ljEosCriticalPoint`) is T*c ≈ 1.313, ρ*c ≈ 0.31, as JZG report.
 */
import { criticalTemperature, minimumIsothermSlope } from './eos/isotherm-slope';

export const LJ_EOS_SOURCE =
  'J. K. Johnson, J. A. Zollweg, K. E. Gubbins, "The Lennard-Jones equation of state revisited", ' +
  'Mol. Phys. 78 (1993) 591-618, doi:10.1080/00268979300100411; modified Benedict-Webb-Rubin form, ' +
  'coefficients x1..x32 of Table 10, gamma = 3.';

/** Range of the simulation data JZG fitted (from memory of JZG 1993); results outside it are extrapolations. */
export const LJ_EOS_FIT_RANGE = {
  minReducedTemperature: 0.7,
  maxReducedTemperature: 6,
  maxReducedDensity: 1.2,
} as const;

/** Upper end of the density search in `ljEosDensity`; no fluid state of the LJ model lies beyond. */
export const LJ_EOS_MAX_REDUCED_DENSITY = 1.3;

/** Largest density accepted by the property functions (a little beyond the search range, for numerical derivatives). */
const MAX_INPUT_REDUCED_DENSITY = 1.5;

const GAMMA = 3;

// JZG 1993 Table 10, x1..x32 (index 0 unused so that X[i] reads as x_i in the paper).
const X: readonly number[] = [
  Number.NaN,
  0.8623085097507421, // x1
  2.976218765822098, // x2
  -8.402230115796038, // x3
  0.1054136629203555, // x4
  -0.8564583828174598, // x5
  1.582759470107601, // x6
  0.7639421948305453, // x7
  1.753173414312048, // x8
  2.798291772190376e3, // x9
  -4.8394220260857657e-2, // x10
  0.9963265197721935, // x11
  -3.698000291272493e1, // x12
  2.084012299434647e1, // x13
  8.305402124717285e1, // x14
  -9.574799715203068e2, // x15
  -1.477746229234994e2, // x16
  6.398607852471505e1, // x17
  1.603993673294834e1, // x18
  6.805916615864377e1, // x19
  -2.791293578795945e3, // x20
  -6.245128304568454, // x21
  -8.11683610495841e3, // x22
  1.488735559561229e1, // x23
  -1.059346754655084e4, // x24
  -1.131607632802822e2, // x25
  -8.867771540418822e3, // x26
  -3.986982844450543e1, // x27
  -4.689270299917261e3, // x28
  2.593535277438717e2, // x29
  -2.694523589434903e3, // x30
  -7.218487631550215e2, // x31
  1.721802063863269e2, // x32
];

/** A temperature function Σ coefficient·T^power, stored as [coefficient, power] pairs. */
type PowerSeries = readonly (readonly [number, number])[];

// JZG Table 5: a_1..a_8 as functions of T*.
const A_SERIES: readonly PowerSeries[] = [
  [
    [X[1], 1],
    [X[2], 0.5],
    [X[3], 0],
    [X[4], -1],
    [X[5], -2],
  ],
  [
    [X[6], 1],
    [X[7], 0],
    [X[8], -1],
    [X[9], -2],
  ],
  [
    [X[10], 1],
    [X[11], 0],
    [X[12], -1],
  ],
  [[X[13], 0]],
  [
    [X[14], -1],
    [X[15], -2],
  ],
  [[X[16], -1]],
  [
    [X[17], -1],
    [X[18], -2],
  ],
  [[X[19], -2]],
];

// JZG Table 6: b_1..b_6 as functions of T*.
const B_SERIES: readonly PowerSeries[] = [
  [
    [X[20], -2],
    [X[21], -3],
  ],
  [
    [X[22], -2],
    [X[23], -4],
  ],
  [
    [X[24], -2],
    [X[25], -3],
  ],
  [
    [X[26], -2],
    [X[27], -4],
  ],
  [
    [X[28], -2],
    [X[29], -3],
  ],
  [
    [X[30], -2],
    [X[31], -3],
    [X[32], -4],
  ],
];

function seriesValue(series: PowerSeries, t: number): number {
  let sum = 0;
  for (const [c, p] of series) sum += c * t ** p;
  return sum;
}

/** d/dT of the series. */
function seriesDerivative(series: PowerSeries, t: number): number {
  let sum = 0;
  for (const [c, p] of series) if (p !== 0) sum += c * p * t ** (p - 1);
  return sum;
}

/** f − T df/dT, the combination that turns a Helmholtz coefficient into an energy one (JZG Tables 8–9). */
function seriesEnergy(series: PowerSeries, t: number): number {
  let sum = 0;
  for (const [c, p] of series) sum += c * (1 - p) * t ** p;
  return sum;
}

/**
 * G_i(ρ) = ∫_0^ρ exp(−γr²) r^{2i−1} dr for i = 1..6 (JZG Table 7).
 * JZG's recursion G_1 = (1−F)/(2γ), G_i = −(Fρ^{2(i−1)} − 2(i−1)G_{i−1})/(2γ) cancels badly at low
 * density, so for γρ² < 1 the convergent Taylor series of the integral is summed instead.
 */
function gIntegrals(rho: number): number[] {
  const x = GAMMA * rho * rho;
  const g = new Array<number>(6);
  if (x < 1) {
    for (let i = 1; i <= 6; i += 1) {
      // Σ_k (−x)^k / k! · ρ^{2i} / (2i + 2k)
      let term = 1;
      let sum = 1 / (2 * i);
      for (let k = 1; k < 60; k += 1) {
        term *= -x / k;
        const add = term / (2 * i + 2 * k);
        sum += add;
        if (Math.abs(add) < 1e-18 * Math.abs(sum)) break;
      }
      g[i - 1] = sum * rho ** (2 * i);
    }
    return g;
  }
  const f = Math.exp(-x);
  g[0] = -Math.expm1(-x) / (2 * GAMMA);
  for (let i = 2; i <= 6; i += 1) {
    g[i - 1] = -(f * rho ** (2 * (i - 1)) - 2 * (i - 1) * g[i - 2]) / (2 * GAMMA);
  }
  return g;
}

/** a_i, b_i of JZG Tables 5–6 at one temperature, with their T-derivatives and energy combinations. */
interface TemperatureCoefficients {
  t: number;
  a: Float64Array;
  aDT: Float64Array;
  aEnergy: Float64Array;
  b: Float64Array;
  bDT: Float64Array;
  bEnergy: Float64Array;
}

function computeCoefficients(t: number): TemperatureCoefficients {
  const k: TemperatureCoefficients = {
    t,
    a: new Float64Array(8),
    aDT: new Float64Array(8),
    aEnergy: new Float64Array(8),
    b: new Float64Array(6),
    bDT: new Float64Array(6),
    bEnergy: new Float64Array(6),
  };
  A_SERIES.forEach((series, i) => {
    k.a[i] = seriesValue(series, t);
    k.aDT[i] = seriesDerivative(series, t);
    k.aEnergy[i] = seriesEnergy(series, t);
  });
  B_SERIES.forEach((series, i) => {
    k.b[i] = seriesValue(series, t);
    k.bDT[i] = seriesDerivative(series, t);
    k.bEnergy[i] = seriesEnergy(series, t);
  });
  return k;
}

// Root finding evaluates one isotherm thousands of times; keeping the last temperature's
// coefficients makes each evaluation a short polynomial instead of 14 series of powers.
let lastCoefficients: TemperatureCoefficients = computeCoefficients(1);

function coefficientsAt(t: number): TemperatureCoefficients {
  if (lastCoefficients.t !== t) lastCoefficients = computeCoefficients(t);
  return lastCoefficients;
}

interface MbwrState {
  pressure: number;
  dPdRho: number;
  dPdT: number;
}

/** Pressure and its first derivatives, analytic in both variables. */
function mbwrPressure(rho: number, t: number): MbwrState {
  const k = coefficientsAt(t);
  const rho2 = rho * rho;
  const f = Math.exp(-GAMMA * rho2);
  let pressure = rho * t;
  let dPdRho = t;
  let dPdT = rho;
  let rhoI = 1;
  for (let i = 1; i <= 8; i += 1) {
    rhoI *= rho; // ρ^i
    pressure += k.a[i - 1] * rhoI * rho;
    dPdRho += (i + 1) * k.a[i - 1] * rhoI;
    dPdT += k.aDT[i - 1] * rhoI * rho;
  }
  let rho2i = 1;
  for (let i = 1; i <= 6; i += 1) {
    rho2i *= rho2; // ρ^{2i}
    pressure += f * k.b[i - 1] * rho2i * rho;
    dPdRho += f * k.b[i - 1] * rho2i * (2 * i + 1 - 2 * GAMMA * rho2);
    dPdT += f * k.bDT[i - 1] * rho2i * rho;
  }
  return { pressure, dPdRho, dPdT };
}

function residualHelmholtz(rho: number, t: number): number {
  const k = coefficientsAt(t);
  let sum = 0;
  for (let i = 1; i <= 8; i += 1) sum += (k.a[i - 1] * rho ** i) / i;
  const g = gIntegrals(rho);
  for (let i = 1; i <= 6; i += 1) sum += k.b[i - 1] * g[i - 1];
  return sum;
}

function residualEnergy(rho: number, t: number): number {
  const k = coefficientsAt(t);
  let sum = 0;
  for (let i = 1; i <= 8; i += 1) sum += (k.aEnergy[i - 1] * rho ** i) / i;
  const g = gIntegrals(rho);
  for (let i = 1; i <= 6; i += 1) sum += k.bEnergy[i - 1] * g[i - 1];
  return sum;
}

function checkTemperature(reducedTemperature: number): void {
  if (typeof reducedTemperature !== 'number' || !Number.isFinite(reducedTemperature) || reducedTemperature <= 0) {
    throw new RangeError(`reducedTemperature must be a finite number > 0, got ${String(reducedTemperature)}`);
  }
}

function checkDensity(reducedDensity: number): void {
  if (
    typeof reducedDensity !== 'number' ||
    !Number.isFinite(reducedDensity) ||
    reducedDensity < 0 ||
    reducedDensity > MAX_INPUT_REDUCED_DENSITY
  ) {
    throw new RangeError(`reducedDensity must be a finite number in [0, ${MAX_INPUT_REDUCED_DENSITY}], got ${String(reducedDensity)}`);
  }
}

/** Reduced pressure Pσ³/ε at reduced density and temperature, JZG eq. 7. */
export function ljEosPressure(reducedDensity: number, reducedTemperature: number): number {
  checkDensity(reducedDensity);
  checkTemperature(reducedTemperature);
  return mbwrPressure(reducedDensity, reducedTemperature).pressure;
}

/** Residual Helmholtz energy per particle A_res/(Nε) (ideal-gas part excluded), JZG eq. 5. */
export function ljEosResidualHelmholtz(reducedDensity: number, reducedTemperature: number): number {
  checkDensity(reducedDensity);
  checkTemperature(reducedTemperature);
  return residualHelmholtz(reducedDensity, reducedTemperature);
}

/** Residual (configurational) internal energy per particle U_res/(Nε), JZG eq. 9. */
export function ljEosInternalEnergy(reducedDensity: number, reducedTemperature: number): number {
  checkDensity(reducedDensity);
  checkTemperature(reducedTemperature);
  return residualEnergy(reducedDensity, reducedTemperature);
}

/** Isothermal slope (∂P/∂ρ)_T in reduced units, analytic derivative of JZG eq. 7. */
export function ljEosCompressibilityDerivative(reducedDensity: number, reducedTemperature: number): number {
  checkDensity(reducedDensity);
  checkTemperature(reducedTemperature);
  return mbwrPressure(reducedDensity, reducedTemperature).dPdRho;
}

/** Isochoric slope (∂P/∂T)_ρ in reduced units, analytic derivative of JZG eq. 7. */
export function ljEosThermalPressureCoefficient(reducedDensity: number, reducedTemperature: number): number {
  checkDensity(reducedDensity);
  checkTemperature(reducedTemperature);
  return mbwrPressure(reducedDensity, reducedTemperature).dPdT;
}

export interface LjEosCriticalPoint {
  reducedTemperature: number;
  reducedDensity: number;
  reducedPressure: number;
}

/** Minimum of (∂P/∂ρ)_T over the density window where the van der Waals loop lives. */
function minimumSlope(t: number): { rho: number; slope: number } {
  return minimumIsothermSlope((rho) => mbwrPressure(rho, t).dPdRho, { from: 0.1, to: 0.6, tolerance: 1e-10 });
}

let criticalPointCache: LjEosCriticalPoint | undefined;

/**
 * Critical point of this EOS: the temperature at which min_ρ (∂P/∂ρ)_T first reaches zero
 * (∂P/∂ρ = ∂²P/∂ρ² = 0), found by bisection in T*. Computed once and cached.
 */
export function ljEosCriticalPoint(): LjEosCriticalPoint {
  if (criticalPointCache) return criticalPointCache;
  const lo = 1.0; // loop present
  const hi = 2.0; // no loop
  const t = criticalTemperature((temp) => minimumSlope(temp).slope, lo, hi);
  const { rho } = minimumSlope(t);
  criticalPointCache = { reducedTemperature: t, reducedDensity: rho, reducedPressure: mbwrPressure(rho, t).pressure };
  return criticalPointCache;
}

export type EosPhase = 'liquid' | 'vapour' | 'supercritical';

export interface EosDensityResult {
  /** The chosen root ρ*. */
  reducedDensity: number;
  phase: EosPhase;
  /** All mechanically stable roots (∂P/∂ρ > 0), ascending; the unstable middle root of a loop is left out. */
  roots: number[];
  /** (∂ρ/∂T)_P = −(∂P/∂T)_ρ / (∂P/∂ρ)_T at the chosen root, reduced units. */
  dRhoDT: number;
  /** (∂ρ/∂P)_T = 1 / (∂P/∂ρ)_T at the chosen root, reduced units. */
  dRhoDP: number;
  /** Present when a choice was made or something is worth knowing: two roots, the stable phase, extrapolation. */
  note?: string;
}

export interface EosDensityOptions {
  /** Which root to return when both a liquid and a vapour root exist below T*c (default 'liquid'). */
  prefer?: 'liquid' | 'vapour';
}

/** Density above which a maximum of P(ρ) is the polynomial's high-density artefact, not a vapour spinodal. */
const ARTEFACT_SEARCH_FROM = 0.9;

/** Grid used to bracket roots in ljEosDensity: 650 intervals of 0.002 in ρ*. */
const GRID_INTERVALS = 650;

/** Zero of (∂P/∂ρ) between two grid nodes where it changes sign (a spinodal), by bisection. */
function locateSlopeZero(lo: number, hi: number, t: number): number {
  let sLo = mbwrPressure(lo, t).dPdRho;
  for (let k = 0; k < 200 && hi - lo > 1e-15 * Math.max(1, hi); k += 1) {
    const mid = (lo + hi) / 2;
    const sMid = mbwrPressure(mid, t).dPdRho;
    if (Math.sign(sMid) === Math.sign(sLo)) {
      lo = mid;
      sLo = sMid;
    } else {
      hi = mid;
    }
  }
  return (lo + hi) / 2;
}

/**
 * Root of P(ρ) − target on [lo, hi], where P is monotonic and the residual changes sign:
 * Newton steps with the analytic slope, falling back to bisection whenever Newton leaves the bracket
 * or its step is not at most half the previous one (safeguarded Newton as in rtsafe, Press et al.,
 * Numerical Recipes, 3rd ed. 2007, §9.4).
 */
function solveMonotonic(lo: number, hi: number, t: number, target: number): number {
  let fLo = mbwrPressure(lo, t).pressure - target;
  if (fLo === 0) return lo;
  let x = (lo + hi) / 2;
  let prevStep = hi - lo;
  for (let k = 0; k < 300; k += 1) {
    const s = mbwrPressure(x, t);
    const fx = s.pressure - target;
    if (fx === 0) return x;
    if (Math.sign(fx) === Math.sign(fLo)) {
      lo = x;
      fLo = fx;
    } else {
      hi = x;
    }
    let next = x - fx / s.dPdRho;
    const newtonStep = Math.abs(next - x);
    if (!(next > lo && next < hi) || newtonStep > 0.5 * prevStep) {
      next = (lo + hi) / 2;
    }
    prevStep = Math.abs(next - x);
    if (prevStep <= 4 * Number.EPSILON * Math.max(x, Number.MIN_VALUE) || hi - lo <= 4 * Number.EPSILON * hi) {
      return next;
    }
    x = next;
  }
  return x;
}

/** Chemical potential up to a function of T alone: μ = T ln ρ + A_res + P/ρ − T. */
function relativeChemicalPotential(rho: number, t: number): number {
  return t * Math.log(rho) + residualHelmholtz(rho, t) + mbwrPressure(rho, t).pressure / rho - t;
}

/**
 * Density ρ* at (T*, P*) from the JZG EOS.
 * All roots are bracketed on a 0.002 grid in ρ* ∈ (0, 1.3], with the grid cut at the spinodals
 * (zeros of ∂P/∂ρ) so that each piece is monotonic and holds at most one root; each root is then
 * refined by safeguarded Newton. Roots with ∂P/∂ρ < 0 are mechanically unstable and dropped.
 * Below T*c with a liquid and a vapour root, the liquid root is returned unless `prefer: 'vapour'`;
 * the note says which of the two has the lower chemical potential (the stable phase).
 */
export function ljEosDensity(reducedTemperature: number, reducedPressure: number, options: EosDensityOptions = {}): EosDensityResult {
  checkTemperature(reducedTemperature);
  if (typeof reducedPressure !== 'number' || !Number.isFinite(reducedPressure) || reducedPressure <= 0) {
    throw new RangeError(
      `reducedPressure must be a finite number > 0 (a fluid at T* > 0 has positive pressure in the dilute limit), got ${String(reducedPressure)}`,
    );
  }
  const prefer = options.prefer ?? 'liquid';
  if (prefer !== 'liquid' && prefer !== 'vapour') {
    throw new RangeError(`prefer must be 'liquid' or 'vapour', got ${String(options.prefer)}`);
  }
  const t = reducedTemperature;
  const target = reducedPressure;

  // Monotonic pieces of the isotherm: [0, spinodal_1, spinodal_2, ..., ρ_max]. Just below T*c the loop
  // can be narrower than a grid cell, so the density of the smallest slope near ρ*c joins the grid.
  const critical = ljEosCriticalPoint();
  const h = LJ_EOS_MAX_REDUCED_DENSITY / GRID_INTERVALS;
  const nodes: number[] = [];
  for (let k = 0; k <= GRID_INTERVALS; k += 1) nodes.push(k * h);
  if (t < critical.reducedTemperature) {
    const loopCentre = minimumSlope(t).rho;
    nodes.splice(Math.floor(loopCentre / h) + 1, 0, loopCentre);
  }
  const breaks: number[] = [0];
  let prevSlope = mbwrPressure(0, t).dPdRho;
  for (let k = 1; k < nodes.length; k += 1) {
    const rho = nodes[k];
    const slope = mbwrPressure(rho, t).dPdRho;
    if (slope === 0) {
      breaks.push(rho);
    } else if (prevSlope !== 0 && Math.sign(slope) !== Math.sign(prevSlope)) {
      breaks.push(locateSlopeZero(nodes[k - 1], rho, t));
    }
    prevSlope = slope;
  }
  if (breaks[breaks.length - 1] < LJ_EOS_MAX_REDUCED_DENSITY) breaks.push(LJ_EOS_MAX_REDUCED_DENSITY);

  // Below T* ≈ 1.5 the polynomial turns over at ρ* ≈ 1.09–1.27 (inside the solid region, beyond the
  // fitted data) and then falls steeply; that branch is an artefact, so the search stops at the maximum.
  const artefactIndex = breaks.findIndex((rho, k) => k > 0 && rho >= ARTEFACT_SEARCH_FROM && mbwrPressure(rho - 1e-9, t).dPdRho > 0);
  let highestFluidPressure: number | undefined;
  if (artefactIndex > 0 && artefactIndex < breaks.length - 1) {
    breaks.length = artefactIndex + 1;
    highestFluidPressure = mbwrPressure(breaks[artefactIndex], t).pressure;
  }

  const roots: number[] = [];
  let unstableRoots = 0;
  for (let k = 0; k + 1 < breaks.length; k += 1) {
    const lo = breaks[k];
    const hi = breaks[k + 1];
    const fLo = mbwrPressure(lo, t).pressure - target;
    const fHi = mbwrPressure(hi, t).pressure - target;
    if (fLo === 0 && lo === 0) continue; // ρ = 0 is never a root for P* > 0
    if (Math.sign(fLo) === Math.sign(fHi) && fHi !== 0) continue;
    const root = solveMonotonic(lo, hi, t, target);
    if (mbwrPressure(root, t).dPdRho > 0) {
      if (roots.length === 0 || Math.abs(root - roots[roots.length - 1]) > 1e-12) roots.push(root);
    } else {
      unstableRoots += 1;
    }
  }

  if (roots.length === 0) {
    const limit =
      highestFluidPressure === undefined
        ? `reducedDensity in (0, ${LJ_EOS_MAX_REDUCED_DENSITY}]`
        : `reducedDensity up to ${breaks[breaks.length - 1].toFixed(4)}, where the EOS reaches its highest fluid pressure ${highestFluidPressure.toPrecision(6)}`;
    throw new RangeError(
      `no fluid root of the LJ EOS at reducedTemperature = ${t}, reducedPressure = ${target} for ${limit}; ` +
        'the state lies beyond the fluid range of the EOS (solid or outside the fitted data)',
    );
  }

  const notes: string[] = [];
  let chosen: number;
  let phase: EosPhase;
  if (t >= critical.reducedTemperature) {
    chosen = roots[roots.length - 1];
    phase = 'supercritical';
    if (roots.length > 1) notes.push(`${roots.length} stable roots above T*c; returned the densest`);
  } else if (roots.length >= 2) {
    const vapour = roots[0];
    const liquid = roots[roots.length - 1];
    chosen = prefer === 'vapour' ? vapour : liquid;
    phase = prefer;
    const muVapour = relativeChemicalPotential(vapour, t);
    const muLiquid = relativeChemicalPotential(liquid, t);
    const stable = muVapour < muLiquid ? 'vapour' : 'liquid';
    notes.push(
      `liquid and vapour roots both exist below T*c = ${critical.reducedTemperature.toFixed(4)}; ` +
        `returned the ${prefer} root; the ${stable} root has the lower chemical potential (stable phase), the other is metastable`,
    );
    if (roots.length > 2) notes.push(`${roots.length} stable roots found; returned the outermost`);
  } else {
    chosen = roots[0];
    phase = chosen > critical.reducedDensity ? 'liquid' : 'vapour';
    if (options.prefer && options.prefer !== phase) {
      notes.push(`only a ${phase} root exists at this state; the preferred ${options.prefer} root does not`);
    }
  }
  if (unstableRoots > 0) notes.push('skipped the unstable root with dP/drho < 0 between the two stable roots');
  if (t < LJ_EOS_FIT_RANGE.minReducedTemperature || t > LJ_EOS_FIT_RANGE.maxReducedTemperature) {
    notes.push(
      `T* outside the range of the data fitted by JZG (${LJ_EOS_FIT_RANGE.minReducedTemperature}-${LJ_EOS_FIT_RANGE.maxReducedTemperature}); extrapolated`,
    );
  }

  const s = mbwrPressure(chosen, t);
  const result: EosDensityResult = {
    reducedDensity: chosen,
    phase,
    roots,
    dRhoDT: -s.dPdT / s.dPdRho,
    dRhoDP: 1 / s.dPdRho,
  };
  if (notes.length > 0) result.note = notes.join('; ');
  return result;
}

/**
 * Long-range (tail) corrections for a Lennard-Jones potential cut at r*c, with g(r) = 1 beyond the
 * cut-off (the standard mean-field formulas; Allen & Tildesley, Computer Simulation of Liquids,
 * 2nd ed. 2017, §2.8):
 *   u_tail = 2πρ ∫_rc^∞ u(r) r² dr          = (8/3)πρ [ rc⁻⁹/3 − rc⁻³ ]
 *   p_tail = −(2π/3)ρ² ∫_rc^∞ r u'(r) r² dr = (16/3)πρ² [ 2rc⁻⁹/3 − rc⁻³ ]
 * For the truncated-and-shifted potential u(r) − u(rc) (r < rc) the forces inside rc are unchanged and
 * continuous at rc, so p_tail alone restores the full-potential pressure; the energy also needs the shift
 * back, u(rc) per pair inside the cut-off (see `ljTruncatedShiftedToFull`).
 */
export interface LjTailCorrections {
  /** u_tail, energy per particle in ε of the pairs beyond the cut-off. */
  energyPerParticle: number;
  /** p_tail in ε/σ³. */
  pressure: number;
  /** u(rc) = 4(rc⁻¹² − rc⁻⁶) in ε, the constant subtracted by the shifted potential. */
  potentialAtCutoff: number;
}

function checkCutoff(cutoff: number): void {
  if (typeof cutoff !== 'number' || !Number.isFinite(cutoff) || cutoff < 1) {
    // Below σ the g(r) = 1 assumption behind the formulas is meaningless.
    throw new RangeError(`cutoff must be a finite reduced distance r*c >= 1, got ${String(cutoff)}`);
  }
}

/** Tail corrections at reduced density ρ* for a cut-off r*c ≥ 1 (formulas at `LjTailCorrections`). */
export function ljTailCorrections(reducedDensity: number, cutoff: number): LjTailCorrections {
  checkDensity(reducedDensity);
  checkCutoff(cutoff);
  const inv3 = cutoff ** -3;
  const inv9 = inv3 * inv3 * inv3;
  return {
    energyPerParticle: (8 / 3) * Math.PI * reducedDensity * (inv9 / 3 - inv3),
    pressure: (16 / 3) * Math.PI * reducedDensity * reducedDensity * ((2 / 3) * inv9 - inv3),
    potentialAtCutoff: 4 * (inv9 * inv3 - inv3 * inv3),
  };
}

export interface LjTruncatedShiftedEstimate {
  /** Configurational energy per particle measured with the truncated-and-shifted potential, ε. */
  energyPerParticle: number;
  /** Configurational (virial) pressure measured with the truncated-and-shifted potential, ε/σ³ (no kinetic part). */
  virialPressure: number;
  /** Mean number of pairs closer than the cut-off, per particle (pairs/N, each pair counted once). */
  pairsWithinCutoffPerParticle: number;
}

/**
 * Full-potential estimates from a truncated-and-shifted simulation, for comparison with the EOS:
 * U/N = U_ts/N + u(rc)·(pairs within rc)/N + u_tail and P_conf = P_ts,conf + p_tail
 * (Allen & Tildesley 2017, §2.8). The pair count comes from the simulation itself, so no g(r) = 1
 * approximation is made inside the cut-off.
 */
export function ljTruncatedShiftedToFull(
  measured: LjTruncatedShiftedEstimate,
  reducedDensity: number,
  cutoff: number,
): { energyPerParticle: number; virialPressure: number } {
  const tail = ljTailCorrections(reducedDensity, cutoff);
  for (const key of ['energyPerParticle', 'virialPressure', 'pairsWithinCutoffPerParticle'] as const) {
    if (typeof measured[key] !== 'number' || !Number.isFinite(measured[key])) {
      throw new RangeError(`measured.${key} must be a finite number, got ${String(measured[key])}`);
    }
  }
  if (measured.pairsWithinCutoffPerParticle < 0) {
    throw new RangeError(`measured.pairsWithinCutoffPerParticle must be >= 0, got ${measured.pairsWithinCutoffPerParticle}`);
  }
  return {
    energyPerParticle: measured.energyPerParticle + tail.potentialAtCutoff * measured.pairsWithinCutoffPerParticle + tail.energyPerParticle,
    virialPressure: measured.virialPressure + tail.pressure,
  };
}
