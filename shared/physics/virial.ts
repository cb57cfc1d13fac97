/**
 * Second virial coefficient of the Lennard-Jones 12-6 potential u(r) = 4ε[(σ/r)^12 − (σ/r)^6]
 * by direct quadrature of B2 = −2πN_A ∫_0^∞ (e^{−u/kT} − 1) r² dr (Hirschfelder, Curtiss & Bird,
 * "Molecular Theory of Gases and Liquids", 1954, eq. 3.3-3), in reduced form
 * B2* = B2/b0 = −3 ∫_0^∞ (e^{−u*(x)/T*} − 1) x² dx with x = r/σ, b0 = 2πN_Aσ³/3, T* = kT/ε.
 *
 * Optional first-order Wigner–Kirkwood quantum correction (Hirschfelder et al. 1954, §6.5):
 * B2,qm = N_A h²/(24π m (kT)³) ∫_0^∞ e^{−u/kT} (du/dr)² r² dr, which in reduced form is
 * B2,qm/b0 = Λ*² B_I*(T*), B_I* = (1/(16π² T*³)) ∫_0^∞ e^{−u*(x)/T*} (d(u*)/dx)² x² dx, Λ* = h/(σ√(mε)).
 * (Exchange effects are of higher order and not included.)
 */
import { AVOGADRO_PER_MOL, ANGSTROM_M, BOLTZMANN_J_PER_K, PLANCK_J_S } from './constants';
import { integrateVector, type QuadratureOptions } from './quadrature';

/** Reduced temperatures outside this span are rejected (e^{1/T*} overflows far below it; nothing physical lies beyond). */
export const VIRIAL_REDUCED_TEMPERATURE_RANGE = { minReducedTemperature: 0.02, maxReducedTemperature: 1e6 } as const;

const X_MIN = Math.pow(2, 1 / 6); // position of the potential minimum, r_m/σ
const QUAD: QuadratureOptions = { relativeTolerance: 1e-13, absoluteTolerance: 1e-15, maxSubintervals: 400 };

function requirePositiveFinite(name: string, value: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
    throw new RangeError(`${name} must be a finite number > 0 (got ${String(value)})`);
  }
}

function requireReducedTemperature(tStar: number): void {
  requirePositiveFinite('tStar', tStar);
  const { minReducedTemperature: lo, maxReducedTemperature: hi } = VIRIAL_REDUCED_TEMPERATURE_RANGE;
  if (tStar < lo || tStar > hi) {
    throw new RangeError(`tStar (reduced temperature) = ${tStar} is outside the supported range [${lo}, ${hi}]`);
  }
}

/**
 * ∫_0^∞ g(x) dx split at x = 1 (u = 0) and x = 2^{1/6} (minimum); the tail uses x = 2^{1/6}/t,
 * dx = 2^{1/6} dt/t², which turns the algebraic decay of the integrands into a polynomial in t.
 */
function integrateSplit(g: (x: number) => number[], components: number, tStar: number): number[] {
  const inner = integrateVector(g, 0, 1, components, QUAD);
  const well = integrateVector(g, 1, X_MIN, components, QUAD);
  const tail = integrateVector(
    (t) => {
      const x = X_MIN / t;
      const v = g(x);
      const jac = X_MIN / (t * t);
      return v.map((c) => c * jac);
    },
    0,
    1,
    components,
    QUAD,
  );
  if (!inner.converged || !well.converged || !tail.converged) {
    // Not seen anywhere in the supported range; fail loudly rather than hand a fit a rough value.
    throw new Error(`virial quadrature did not reach its tolerance at tStar = ${tStar}`);
  }
  return inner.values.map((v, c) => v + well.values[c] + tail.values[c]);
}

/** Reduced LJ potential u* = 4(w² − w) with w = x^−6, and x·d(u*)/dx = −24(2w² − w). */
function reducedPotential(x: number): { u: number; xDu: number } {
  const w = Math.pow(x, -6);
  return { u: 4 * w * (w - 1), xDu: -24 * w * (2 * w - 1) };
}

/** [B2*, d(B2*)/dT*] in one pass (the derivative is taken under the integral sign). */
function classicalReduced(tStar: number): [number, number] {
  const invT = 1 / tStar;
  const [b, db] = integrateSplit((x) => {
    const { u } = reducedPotential(x);
    const x2 = x * x;
    const boltz = Math.exp(-u * invT);
    // expm1 keeps full precision in the tail where |u/T*| ≪ 1.
    return [-3 * Math.expm1(-u * invT) * x2, -3 * boltz * u * invT * invT * x2];
  }, 2, tStar);
  return [b, db];
}

/** [B_I*, d(B_I*)/dT*] of the first quantum correction (see file header). */
function quantumReduced(tStar: number): [number, number] {
  const invT = 1 / tStar;
  const [i0, i1] = integrateSplit((x) => {
    const { u, xDu } = reducedPotential(x);
    // (d(u*)/dx)² x² = (x d(u*)/dx)²
    const k = Math.exp(-u * invT) * xDu * xDu;
    return [k, k * u * invT * invT];
  }, 2, tStar);
  const c = 1 / (16 * Math.PI * Math.PI);
  const t3 = tStar * tStar * tStar;
  return [(c * i0) / t3, (c * i1) / t3 - (3 * c * i0) / (t3 * tStar)];
}

/** Reduced classical second virial coefficient B2*(T*) = B2/b0 of the LJ 12-6 potential. */
export function reducedB2(tStar: number): number {
  requireReducedTemperature(tStar);
  return classicalReduced(tStar)[0];
}

/** d(B2*)/dT* of the classical reduced second virial coefficient. */
export function reducedB2Derivative(tStar: number): number {
  requireReducedTemperature(tStar);
  return classicalReduced(tStar)[1];
}

/** Reduced first quantum correction coefficient B_I*(T*), so that B2 = b0 (B2* + Λ*² B_I*). */
export function reducedQuantumB2Coefficient(tStar: number): number {
  requireReducedTemperature(tStar);
  return quantumReduced(tStar)[0];
}

/** b0 = 2πN_Aσ³/3 in cm³/mol for σ in Å. */
export function b2ZeroCm3PerMol(sigmaAngstrom: number): number {
  requirePositiveFinite('sigmaAngstrom', sigmaAngstrom);
  const sigmaCm = sigmaAngstrom * ANGSTROM_M * 100;
  return ((2 * Math.PI * AVOGADRO_PER_MOL) / 3) * sigmaCm * sigmaCm * sigmaCm;
}

/** Squared reduced de Boer parameter Λ*² = h²/(σ² m ε), m = M/N_A, ε = k_B·(ε/k_B). */
export function deBoerParameterSquared(epsilonK: number, sigmaAngstrom: number, molarMassGPerMol: number): number {
  requirePositiveFinite('epsilonK', epsilonK);
  requirePositiveFinite('sigmaAngstrom', sigmaAngstrom);
  requirePositiveFinite('molarMassGPerMol', molarMassGPerMol);
  const sigmaM = sigmaAngstrom * ANGSTROM_M;
  const massKg = (molarMassGPerMol * 1e-3) / AVOGADRO_PER_MOL; // m = M/N_A
  return (PLANCK_J_S * PLANCK_J_S) / (sigmaM * sigmaM * massKg * BOLTZMANN_J_PER_K * epsilonK);
}

export interface B2Point {
  /** B2 including the quantum correction when one was requested, cm³/mol. */
  b2Cm3PerMol: number;
  /** ∂B2/∂(ε/k_B), cm³/(mol·K). */
  dB2dEpsilonK: number;
  /** ∂B2/∂σ, cm³/(mol·Å). */
  dB2dSigmaAngstrom: number;
  /** First-order Wigner–Kirkwood term included in b2Cm3PerMol (0 when classical), cm³/mol. */
  quantumCorrectionCm3PerMol: number;
}

/**
 * B2(T) in cm³/mol with its analytic gradient in (ε/k_B [K], σ [Å]).
 * With T* = T/ε: ∂(B2*)/∂ε = −(T*)/ε d(B2*)/dT*. Classically ∂B2/∂σ = 3B2/σ; the quantum term
 * b0 Λ*² B_I* scales as σ³·σ^−2, so it contributes σ-derivative b0 Λ*² B_I* / σ and
 * ε-derivative b0 Λ*² [−B_I* / ε − (T*)/ε d(B_I*)/dT*].
 */
export function b2WithGradient(
  temperatureK: number,
  epsilonK: number,
  sigmaAngstrom: number,
  quantum?: { molarMassGPerMol: number },
): B2Point {
  requirePositiveFinite('temperatureK', temperatureK);
  requirePositiveFinite('epsilonK', epsilonK);
  requirePositiveFinite('sigmaAngstrom', sigmaAngstrom);
  if (quantum !== undefined) requirePositiveFinite('molarMassGPerMol', quantum.molarMassGPerMol);
  const tStar = temperatureK / epsilonK;
  requireReducedTemperature(tStar);
  const b0 = b2ZeroCm3PerMol(sigmaAngstrom);
  const [bStar, dbStar] = classicalReduced(tStar);
  const classical = b0 * bStar;
  let b2 = classical;
  let dEps = (-b0 * tStar * dbStar) / epsilonK;
  let dSigma = (3 * classical) / sigmaAngstrom;
  let quantumCorrection = 0;
  if (quantum !== undefined) {
    const lambda2 = deBoerParameterSquared(epsilonK, sigmaAngstrom, quantum.molarMassGPerMol);
    const [bI, dbI] = quantumReduced(tStar);
    quantumCorrection = b0 * lambda2 * bI;
    b2 += quantumCorrection;
    dEps += b0 * lambda2 * (-bI / epsilonK - (tStar * dbI) / epsilonK);
    dSigma += quantumCorrection / sigmaAngstrom; // d(σ³·σ^−2)/dσ = σ⁰ → (3 − 2)·term/σ
  }
  return { b2Cm3PerMol: b2, dB2dEpsilonK: dEps, dB2dSigmaAngstrom: dSigma, quantumCorrectionCm3PerMol: quantumCorrection };
}

let boyleCache: number | undefined;

/** Classical reduced Boyle temperature, the root of B2*(T*) = 0, by safeguarded Newton iteration. */
export function boyleReducedTemperature(): number {
  if (boyleCache !== undefined) return boyleCache;
  // B2* changes sign between T* = 3 and T* = 4 (Hirschfelder et al. 1954, Table I-B); start inside.
  let lo = 3;
  let hi = 4;
  let t = 3.4;
  for (let iter = 0; iter < 60; iter++) {
    const [b, db] = classicalReduced(t);
    if (b < 0) lo = t;
    else hi = t;
    let next = t - b / db;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - t) <= 1e-14 * t) {
      t = next;
      break;
    }
    t = next;
  }
  boyleCache = t;
  return t;
}
