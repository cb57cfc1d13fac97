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
 *
 * The same integrals serve the Mie λr-6 potential u* = C[x^−λr − x^−6] (mie-potential.ts) through an optional
 * repulsive exponent; λr = 12 takes exactly the 12-6 code path, so 12-6 numbers do not change by a bit.
 * ∂B2*∕∂λr is taken under the integral sign: (3/T*) ∫ e^{−u*∕T*} (∂u*∕∂λr) x² dx with
 * ∂u*∕∂λr = u*·d ln C∕dλr − C x^−λr ln x.
 */
import { AVOGADRO_PER_MOL, ANGSTROM_M, BOLTZMANN_J_PER_K, PLANCK_J_S } from './constants';
import {
  LJ_REPULSIVE_EXPONENT,
  mieMinimumPosition,
  miePrefactor,
  miePrefactorLogDerivative,
  requireRepulsiveExponent,
} from './mie-potential';
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
function integrateSplit(g: (x: number) => number[], components: number, tStar: number, xMin = X_MIN): number[] {
  const inner = integrateVector(g, 0, 1, components, QUAD);
  const well = integrateVector(g, 1, xMin, components, QUAD);
  const tail = integrateVector(
    (t) => {
      const x = xMin / t;
      const v = g(x);
      const jac = xMin / (t * t);
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

/**
 * Reduced potential u* = C w (v − 1) with w = x^−6, v = x^(6−λr), and x·d(u*)/dx = −C w (λr v − 6);
 * for λr = 12 (v = w, C = 4) exactly the LJ forms u* = 4(w² − w), x·d(u*)/dx = −24(2w² − w).
 */
function reducedPotential(x: number, n = LJ_REPULSIVE_EXPONENT): { u: number; xDu: number } {
  const w = Math.pow(x, -6);
  if (n === LJ_REPULSIVE_EXPONENT) return { u: 4 * w * (w - 1), xDu: -24 * w * (2 * w - 1) };
  const c = miePrefactor(n);
  const v = Math.pow(x, 6 - n);
  return { u: c * w * (v - 1), xDu: -c * w * (n * v - 6) };
}

const minimumOf = (n: number) => (n === LJ_REPULSIVE_EXPONENT ? X_MIN : mieMinimumPosition(n));

/** [B2*, d(B2*)/dT*] in one pass (the derivative is taken under the integral sign). */
function classicalReduced(tStar: number, n = LJ_REPULSIVE_EXPONENT): [number, number] {
  const invT = 1 / tStar;
  const [b, db] = integrateSplit(
    (x) => {
      const { u } = reducedPotential(x, n);
      const x2 = x * x;
      const boltz = Math.exp(-u * invT);
      // expm1 keeps full precision in the tail where |u/T*| ≪ 1.
      return [-3 * Math.expm1(-u * invT) * x2, -3 * boltz * u * invT * invT * x2];
    },
    2,
    tStar,
    minimumOf(n),
  );
  return [b, db];
}

/** ∂(B2*)/∂λr at fixed T* (see file header). */
function classicalReducedExponentDerivative(tStar: number, n: number): number {
  const invT = 1 / tStar;
  const c = miePrefactor(n);
  const dLnC = miePrefactorLogDerivative(n);
  const [d] = integrateSplit(
    (x) => {
      const { u } = reducedPotential(x, n);
      const du = u * dLnC - c * Math.pow(x, -n) * Math.log(x);
      return [3 * invT * Math.exp(-u * invT) * du * x * x];
    },
    1,
    tStar,
    minimumOf(n),
  );
  return d;
}

/** [B_I*, d(B_I*)/dT*] of the first quantum correction (see file header). */
function quantumReduced(tStar: number, n = LJ_REPULSIVE_EXPONENT): [number, number] {
  const invT = 1 / tStar;
  const [i0, i1] = integrateSplit(
    (x) => {
      const { u, xDu } = reducedPotential(x, n);
      // (d(u*)/dx)² x² = (x d(u*)/dx)²
      const k = Math.exp(-u * invT) * xDu * xDu;
      return [k, k * u * invT * invT];
    },
    2,
    tStar,
    minimumOf(n),
  );
  const c = 1 / (16 * Math.PI * Math.PI);
  const t3 = tStar * tStar * tStar;
  return [(c * i0) / t3, (c * i1) / t3 - (3 * c * i0) / (t3 * tStar)];
}

/** Reduced classical second virial coefficient B2*(T*) = B2/b0 of the LJ 12-6 potential (or Mie λr-6 with λr given). */
export function reducedB2(tStar: number, repulsiveExponent = LJ_REPULSIVE_EXPONENT): number {
  requireReducedTemperature(tStar);
  requireRepulsiveExponent(repulsiveExponent);
  return classicalReduced(tStar, repulsiveExponent)[0];
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
  /** ∂B2/∂λr, cm³/mol (classical part), only when asked for with `exponentDerivative`. */
  dB2dRepulsiveExponent?: number;
}

export interface B2PotentialOptions {
  /** λr of the Mie λr-6 potential (default 12, the LJ 12-6 potential). */
  repulsiveExponent?: number;
  /** Also compute ∂B2/∂λr (one more quadrature). */
  exponentDerivative?: boolean;
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
  potential: B2PotentialOptions = {},
): B2Point {
  const n = potential.repulsiveExponent ?? LJ_REPULSIVE_EXPONENT;
  requireRepulsiveExponent(n);
  requirePositiveFinite('temperatureK', temperatureK);
  requirePositiveFinite('epsilonK', epsilonK);
  requirePositiveFinite('sigmaAngstrom', sigmaAngstrom);
  if (quantum !== undefined) requirePositiveFinite('molarMassGPerMol', quantum.molarMassGPerMol);
  const tStar = temperatureK / epsilonK;
  requireReducedTemperature(tStar);
  const b0 = b2ZeroCm3PerMol(sigmaAngstrom);
  const [bStar, dbStar] = classicalReduced(tStar, n);
  const classical = b0 * bStar;
  let b2 = classical;
  let dEps = (-b0 * tStar * dbStar) / epsilonK;
  let dSigma = (3 * classical) / sigmaAngstrom;
  let quantumCorrection = 0;
  if (quantum !== undefined) {
    const lambda2 = deBoerParameterSquared(epsilonK, sigmaAngstrom, quantum.molarMassGPerMol);
    const [bI, dbI] = quantumReduced(tStar, n);
    quantumCorrection = b0 * lambda2 * bI;
    b2 += quantumCorrection;
    dEps += b0 * lambda2 * (-bI / epsilonK - (tStar * dbI) / epsilonK);
    dSigma += quantumCorrection / sigmaAngstrom; // d(σ³·σ^−2)/dσ = σ⁰ → (3 − 2)·term/σ
  }
  const result: B2Point = { b2Cm3PerMol: b2, dB2dEpsilonK: dEps, dB2dSigmaAngstrom: dSigma, quantumCorrectionCm3PerMol: quantumCorrection };
  if (potential.exponentDerivative) result.dB2dRepulsiveExponent = b0 * classicalReducedExponentDerivative(tStar, n);
  return result;
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
