/**
 * Equation of state of the full Lennard-Jones 12-6 fluid in reduced units (σ = ε = m = k_B = 1;
 * ρ* = ρσ³, T* = k_BT/ε, P* = Pσ³/ε, energies per particle in ε) after
 * J. Kolafa and I. Nezbeda, "The Lennard-Jones fluid: an accurate analytic and theoretically-based
 * equation of state", Fluid Phase Equilibria 100 (1994) 1–34, doi:10.1016/0378-3812(94)80001-4 (KN below).
 *
 * KN eq. 30 (the "hBH" form), residual Helmholtz energy per particle:
 *   A_res/N = T·a_hs(η) + exp(−γρ²)·ρ·T·ΔB2,hBH(T) + Σ_ij C_ij T^{i/2} ρ^j
 * with the hard-sphere term of KN eq. 5 (a Carnahan–Starling form corrected at high packing)
 *   a_hs(η) = (5/3) ln(1 − η) + η(34 − 33η + 4η²) / (6(1 − η)²),   η = (π/6) ρ d³,
 *   Z_hs(η) = (1 + η + η² − (2/3)η³(1 + η)) / (1 − η)³              (KN eq. 4),
 * the hybrid Barker–Henderson diameter and second-virial correction of KN eq. 29 / Table 2
 *   d(T)      = Σ_{i=−2..1} C_i T^{i/2} + C_ln ln T,
 *   ΔB2(T)    = Σ_{i=−7..0} C_i T^{i/2},
 * and the residual double series of KN Table 3 (C_ij, i = 0, −1, −2, −4; j = 2..6), γ = 1.92907278.
 * Pressure P = ρ²∂(A/N)/∂ρ (KN eq. 31) and energy U = ∂(A/T)/∂(1/T) (KN eqs. 32–33) are written out
 * analytically below.
 *
 * The paper itself was not at hand: the coefficients were taken from two independent public copies of
 * KN Tables 2–3 (the Fortran module accompanying Allen & Tildesley, Computer Simulation of Liquids, 2nd ed.
 * 2017, `eos_lj_kn_module.f90`, and NIST's teqp `LJ126KolafaNezbeda1994`), which agree in every printed
 * digit (teqp prints one C_ij with a digit fewer). The tests check the critical point and the exact B2 the
 * equation reproduces, and published simulation data (NIST SRSW).
 *
 * KN fitted simulation data for 0.68 ≤ T* ≤ 10 over the whole fluid range (from memory of KN 1994);
 * outside it the formula extrapolates. The equation knows nothing of the solid: a root in the solid region
 * of the phase diagram is a metastable-fluid density, and telling the two apart is the caller's business
 * (a freezing-line check sits beside this module).
 */
import { criticalTemperature, minimumIsothermSlope } from './isotherm-slope';

export const KOLAFA_NEZBEDA_1994_SOURCE =
  'J. Kolafa, I. Nezbeda, "The Lennard-Jones fluid: an accurate analytic and theoretically-based equation of state", ' +
  'Fluid Phase Equilibria 100 (1994) 1-34, doi:10.1016/0378-3812(94)80001-4; hBH form, eq. 30 with Tables 2-3.';

/** Temperatures of the data KN fitted (from memory of KN 1994); beyond them results are extrapolations. */
export const KN_FIT_RANGE = { minReducedTemperature: 0.68, maxReducedTemperature: 10 } as const;

/** Upper end of the density search in `knDensityRoots`; no fluid state of the LJ model lies beyond. */
export const KN_MAX_REDUCED_DENSITY = 1.5;

const GAMMA = 1.92907278;
const PI6 = Math.PI / 6;

// KN Table 2, left column: hBH diameter, d = Σ C_i T^{i/2} + C_ln ln T, as [i, C_i].
const D_TERMS: readonly (readonly [number, number])[] = [
  [-2, 0.011117524],
  [-1, -0.076383859],
  [0, 1.080142248],
  [1, 0.000693129],
];
const D_LN = -0.063920968;

// KN Table 2, right column: ΔB2,hBH = Σ C_i T^{i/2}, as [i, C_i] (the i = −1 coefficient is zero).
const B_TERMS: readonly (readonly [number, number])[] = [
  [0, 0.02459877],
  [-2, -7.02181962],
  [-3, 2.90616279],
  [-4, -4.13749995],
  [-5, 0.87361369],
  [-6, 0.43102052],
  [-7, -0.58544978],
];

// KN Table 3: C_ij T^{i/2} ρ^j, as [i, j, C_ij].
const C_TERMS: readonly (readonly [number, number, number])[] = [
  [0, 2, 2.01546797],
  [0, 3, -28.17881636],
  [0, 4, 28.28313847],
  [0, 5, -10.42402873],
  [-1, 2, -19.58371655],
  [-1, 3, 75.62340289],
  [-1, 4, -120.70586598],
  [-1, 5, 93.92740328],
  [-1, 6, -27.37737354],
  [-2, 2, 29.3447052],
  [-2, 3, -112.35356937],
  [-2, 4, 170.6490898],
  [-2, 5, -123.06669187],
  [-2, 6, 34.42288969],
  [-4, 2, -13.37031968],
  [-4, 3, 65.3805957],
  [-4, 4, -115.09233113],
  [-4, 5, 88.91973082],
  [-4, 6, -25.6209989],
];

/** Temperature functions at one T*, kept because root finding evaluates one isotherm many times. */
interface Isotherm {
  t: number;
  d: number;
  /** ∂d/∂(1/T). */
  dDBeta: number;
  deltaB2: number;
  /** ∂ΔB2/∂(1/T). */
  deltaB2DBeta: number;
  /** Polynomial coefficients in ρ: c[j] = Σ_i C_ij T^{i/2}, and e[j] = Σ_i (1 − i/2) C_ij T^{i/2} for U. */
  c: Float64Array;
  e: Float64Array;
}

function isothermAt(t: number): Isotherm {
  let d = D_LN * Math.log(t);
  let dT = D_LN; // Σ (i/2) C_i T^{i/2} + C_ln = T·∂d/∂T
  for (const [i, ci] of D_TERMS) {
    const term = ci * t ** (i / 2);
    d += term;
    dT += (i / 2) * term;
  }
  let b = 0;
  let bT = 0; // T·∂ΔB2/∂T
  for (const [i, ci] of B_TERMS) {
    const term = ci * t ** (i / 2);
    b += term;
    bT += (i / 2) * term;
  }
  const c = new Float64Array(7);
  const e = new Float64Array(7);
  for (const [i, j, cij] of C_TERMS) {
    const term = cij * t ** (i / 2);
    c[j] += term;
    e[j] += (1 - i / 2) * term;
  }
  // ∂f/∂(1/T) = −T² ∂f/∂T = −T·(T ∂f/∂T).
  return { t, d, dDBeta: -t * dT, deltaB2: b, deltaB2DBeta: -t * bT, c, e };
}

let lastIsotherm: Isotherm = isothermAt(1);

function isotherm(t: number): Isotherm {
  if (lastIsotherm.t !== t) lastIsotherm = isothermAt(t);
  return lastIsotherm;
}

function hardSphereHelmholtz(eta: number): number {
  return (5 / 3) * Math.log1p(-eta) + (eta * (34 - 33 * eta + 4 * eta * eta)) / (6 * (1 - eta) ** 2);
}

function hardSphereZ(eta: number): number {
  const e2 = eta * eta;
  return (1 + eta + e2 - (2 / 3) * e2 * eta * (1 + eta)) / (1 - eta) ** 3;
}

function hardSphereZDerivative(eta: number): number {
  const e2 = eta * eta;
  const num = 1 + eta + e2 - (2 / 3) * e2 * eta * (1 + eta);
  const dNum = 1 + 2 * eta - 2 * e2 - (8 / 3) * e2 * eta;
  const w = 1 - eta;
  return dNum / w ** 3 + (3 * num) / w ** 4;
}

function packingFraction(rho: number, k: Isotherm): number {
  return PI6 * rho * k.d ** 3;
}

function helmholtz(rho: number, t: number): number {
  const k = isotherm(t);
  let sum = t * hardSphereHelmholtz(packingFraction(rho, k)) + Math.exp(-GAMMA * rho * rho) * rho * t * k.deltaB2;
  for (let j = 2; j <= 6; j++) sum += k.c[j] * rho ** j;
  return sum;
}

/** P and (∂P/∂ρ)_T, analytic (KN eq. 31 and its derivative). */
function pressureAndSlope(rho: number, t: number): { pressure: number; dPdRho: number } {
  const k = isotherm(t);
  const eta = packingFraction(rho, k);
  const z = hardSphereZ(eta);
  const rho2 = rho * rho;
  const f = Math.exp(-GAMMA * rho2);
  let pressure = rho * t * z + t * k.deltaB2 * rho2 * (1 - 2 * GAMMA * rho2) * f;
  let dPdRho =
    t * (z + eta * hardSphereZDerivative(eta)) +
    t * k.deltaB2 * f * (2 * rho - 10 * GAMMA * rho2 * rho + 4 * GAMMA * GAMMA * rho2 * rho2 * rho);
  for (let j = 2; j <= 6; j++) {
    pressure += j * k.c[j] * rho ** (j + 1);
    dPdRho += j * (j + 1) * k.c[j] * rho ** j;
  }
  return { pressure, dPdRho };
}

function pressure(rho: number, t: number): number {
  return pressureAndSlope(rho, t).pressure;
}

function internalEnergy(rho: number, t: number): number {
  const k = isotherm(t);
  const eta = packingFraction(rho, k);
  // ∂(T a_hs)/T /∂(1/T) = a_hs'(η)·∂η/∂(1/T) = ((Z_hs − 1)/η)·3η·(∂d/∂β)/d.
  let sum = (3 * (hardSphereZ(eta) - 1) * k.dDBeta) / k.d + rho * Math.exp(-GAMMA * rho * rho) * k.deltaB2DBeta;
  for (let j = 2; j <= 6; j++) sum += k.e[j] * rho ** j;
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
    reducedDensity > KN_MAX_REDUCED_DENSITY + 0.1
  ) {
    throw new RangeError(`reducedDensity must be a finite number in [0, ${KN_MAX_REDUCED_DENSITY + 0.1}], got ${String(reducedDensity)}`);
  }
}

/** Residual Helmholtz energy per particle A_res/(Nε), KN eq. 30 (ideal gas excluded). */
export function knResidualHelmholtz(reducedDensity: number, reducedTemperature: number): number {
  checkDensity(reducedDensity);
  checkTemperature(reducedTemperature);
  return helmholtz(reducedDensity, reducedTemperature);
}

/** Reduced pressure Pσ³/ε (ideal part included), KN eq. 31. */
export function knPressure(reducedDensity: number, reducedTemperature: number): number {
  checkDensity(reducedDensity);
  checkTemperature(reducedTemperature);
  return pressure(reducedDensity, reducedTemperature);
}

/** Residual (configurational) internal energy per particle U_res/(Nε), KN eq. 32. */
export function knInternalEnergy(reducedDensity: number, reducedTemperature: number): number {
  checkDensity(reducedDensity);
  checkTemperature(reducedTemperature);
  return internalEnergy(reducedDensity, reducedTemperature);
}

/** Chemical potential μ/ε with the thermal wavelength set to σ: T ln ρ + A_res + P/ρ − T. */
export function knChemicalPotential(reducedDensity: number, reducedTemperature: number): number {
  checkDensity(reducedDensity);
  checkTemperature(reducedTemperature);
  const rho = reducedDensity;
  const t = reducedTemperature;
  return t * Math.log(rho) + helmholtz(rho, t) + pressure(rho, t) / rho - t;
}

export interface KnPressureDerivatives {
  pressure: number;
  /** (∂P/∂ρ)_T, analytic. */
  dPdRho: number;
  /** (∂P/∂T)_ρ, central difference with step 1e-5·T (relative error below 1e-9). */
  dPdT: number;
}

export function knPressureDerivatives(reducedDensity: number, reducedTemperature: number): KnPressureDerivatives {
  checkDensity(reducedDensity);
  checkTemperature(reducedTemperature);
  return derivatives(reducedDensity, reducedTemperature);
}

function derivatives(rho: number, t: number): KnPressureDerivatives {
  const h = 1e-5 * t;
  const dPdT = (pressure(rho, t + h) - pressure(rho, t - h)) / (2 * h);
  const s = pressureAndSlope(rho, t);
  return { pressure: s.pressure, dPdRho: s.dPdRho, dPdT };
}

export interface KnCriticalPoint {
  reducedTemperature: number;
  reducedDensity: number;
  reducedPressure: number;
}

/** Minimum of (∂P/∂ρ)_T over ρ* ∈ [0.1, 0.6]. */
function minimumSlope(t: number): { rho: number; slope: number } {
  return minimumIsothermSlope((rho) => pressureAndSlope(rho, t).dPdRho, { from: 0.1, to: 0.6, tolerance: 1e-10 });
}

let criticalCache: KnCriticalPoint | undefined;

/** Critical point of the equation: the lowest T* at which min_ρ (∂P/∂ρ)_T no longer goes below zero. */
export function knCriticalPoint(): KnCriticalPoint {
  if (criticalCache) return criticalCache;
  const lo = 1.0;
  const hi = 2.0;
  const t = criticalTemperature((temp) => minimumSlope(temp).slope, lo, hi);
  const { rho } = minimumSlope(t);
  criticalCache = { reducedTemperature: t, reducedDensity: rho, reducedPressure: pressure(rho, t) };
  return criticalCache;
}

export type KnRootPhase = 'vapour' | 'liquid' | 'supercritical';

export interface KnRoot {
  reducedDensity: number;
  phase: KnRootPhase;
  /** μ/ε with Λ = σ (compare roots at one state: the lower one is the stable fluid). */
  chemicalPotential: number;
  /** (∂ρ/∂T)_P = −(∂P/∂T)_ρ/(∂P/∂ρ)_T. */
  dRhoDT: number;
  /** (∂ρ/∂P)_T = 1/(∂P/∂ρ)_T. */
  dRhoDP: number;
}

const GRID_INTERVALS = 750;

/** Zero of ∂P/∂ρ between lo and hi (a spinodal) by bisection. */
function slopeZero(lo: number, hi: number, t: number): number {
  let sLo = pressureAndSlope(lo, t).dPdRho;
  for (let k = 0; k < 200 && hi - lo > 1e-15; k++) {
    const mid = (lo + hi) / 2;
    const sMid = pressureAndSlope(mid, t).dPdRho;
    if (Math.sign(sMid) === Math.sign(sLo)) {
      lo = mid;
      sLo = sMid;
    } else hi = mid;
  }
  return (lo + hi) / 2;
}

/** Root of P − target on a monotonic piece [lo, hi] that brackets it: safeguarded Newton (Press et al. 2007, §9.4). */
function monotonicRoot(lo: number, hi: number, t: number, target: number): number {
  let fLo = pressure(lo, t) - target;
  let x = (lo + hi) / 2;
  let prevStep = hi - lo;
  for (let k = 0; k < 300; k++) {
    const s = pressureAndSlope(x, t);
    const fx = s.pressure - target;
    if (fx === 0) return x;
    if (Math.sign(fx) === Math.sign(fLo)) {
      lo = x;
      fLo = fx;
    } else hi = x;
    let next = x - fx / s.dPdRho;
    if (!(next > lo && next < hi) || Math.abs(next - x) > 0.5 * prevStep) next = (lo + hi) / 2;
    prevStep = Math.abs(next - x);
    if (prevStep <= 4 * Number.EPSILON * x || hi - lo <= 4 * Number.EPSILON * hi) return next;
    x = next;
  }
  return x;
}

/**
 * All mechanically stable roots (∂P/∂ρ > 0) of P(ρ; T*) = P* for ρ* ∈ (0, 1.5], ascending. The isotherm is cut
 * at its spinodals (found on a 0.002 grid) so that each piece is monotonic and holds at most one root.
 */
export function knDensityRoots(reducedTemperature: number, reducedPressure: number): KnRoot[] {
  checkTemperature(reducedTemperature);
  if (typeof reducedPressure !== 'number' || !Number.isFinite(reducedPressure) || reducedPressure <= 0) {
    throw new RangeError(`reducedPressure must be a finite number > 0, got ${String(reducedPressure)}`);
  }
  const t = reducedTemperature;
  const target = reducedPressure;
  const critical = knCriticalPoint();
  const h = KN_MAX_REDUCED_DENSITY / GRID_INTERVALS;
  const nodes: number[] = [];
  for (let k = 0; k <= GRID_INTERVALS; k++) nodes.push(k * h);
  if (t < critical.reducedTemperature) {
    // Just below T*c the loop can be narrower than a grid cell.
    const centre = minimumSlope(t).rho;
    nodes.splice(Math.floor(centre / h) + 1, 0, centre);
  }
  const breaks = [0];
  let prev = pressureAndSlope(0, t).dPdRho;
  for (let k = 1; k < nodes.length; k++) {
    const slope = pressureAndSlope(nodes[k], t).dPdRho;
    if (slope !== 0 && prev !== 0 && Math.sign(slope) !== Math.sign(prev)) breaks.push(slopeZero(nodes[k - 1], nodes[k], t));
    prev = slope;
  }
  breaks.push(KN_MAX_REDUCED_DENSITY);
  const roots: KnRoot[] = [];
  for (let k = 0; k + 1 < breaks.length; k++) {
    const lo = breaks[k];
    const hi = breaks[k + 1];
    const fLo = pressure(lo, t) - target;
    const fHi = pressure(hi, t) - target;
    if (Math.sign(fLo) === Math.sign(fHi) && fHi !== 0) continue;
    const rho = monotonicRoot(lo, hi, t, target);
    const s = derivatives(rho, t);
    if (!(s.dPdRho > 0)) continue;
    if (roots.length > 0 && Math.abs(rho - roots[roots.length - 1].reducedDensity) < 1e-12) continue;
    roots.push({
      reducedDensity: rho,
      phase: t >= critical.reducedTemperature ? 'supercritical' : rho > critical.reducedDensity ? 'liquid' : 'vapour',
      chemicalPotential: t * Math.log(rho) + helmholtz(rho, t) + s.pressure / rho - t,
      dRhoDT: -s.dPdT / s.dPdRho,
      dRhoDP: 1 / s.dPdRho,
    });
  }
  return roots;
}

export interface KnDensityOptions {
  /**
   * 'stable' (default): the root of lowest chemical potential; 'liquid' / 'vapour': that root, even when it is
   * metastable. Above T*c the one supercritical root answers every choice.
   */
  phase?: 'stable' | 'liquid' | 'vapour';
}

export interface KnDensityResult extends KnRoot {
  /** True when this root has the lowest chemical potential of all fluid roots at the state. */
  stableAmongFluidRoots: boolean;
  /** Every stable-slope root at the state. */
  roots: KnRoot[];
}

/**
 * Fluid density at (T*, P*) from KN. Throws RangeError when the requested phase has no root (for example
 * 'liquid' at a pressure below the liquid spinodal, or 'vapour' above the vapour spinodal).
 */
export function knDensity(reducedTemperature: number, reducedPressure: number, options: KnDensityOptions = {}): KnDensityResult {
  const want = options.phase ?? 'stable';
  if (want !== 'stable' && want !== 'liquid' && want !== 'vapour') {
    throw new RangeError(`phase must be 'stable', 'liquid' or 'vapour', got ${String(options.phase)}`);
  }
  const roots = knDensityRoots(reducedTemperature, reducedPressure);
  if (roots.length === 0) {
    throw new RangeError(
      `no fluid root of the Kolafa-Nezbeda EOS at reducedTemperature = ${reducedTemperature}, reducedPressure = ${reducedPressure} for reducedDensity up to ${KN_MAX_REDUCED_DENSITY}`,
    );
  }
  const lowest = roots.reduce((a, b) => (b.chemicalPotential < a.chemicalPotential ? b : a));
  let chosen: KnRoot | undefined;
  if (want === 'stable' || roots[0].phase === 'supercritical') chosen = lowest;
  else chosen = want === 'liquid' ? roots.filter((r) => r.phase === 'liquid').pop() : roots.find((r) => r.phase === 'vapour');
  if (!chosen) {
    throw new RangeError(
      `the Kolafa-Nezbeda EOS has no ${want} root at reducedTemperature = ${reducedTemperature}, reducedPressure = ${reducedPressure} (only ${roots.map((r) => r.phase).join(', ')})`,
    );
  }
  return { ...chosen, stableAmongFluidRoots: chosen === lowest, roots };
}
