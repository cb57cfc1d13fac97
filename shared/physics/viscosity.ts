/**
 * Dilute-gas shear viscosity of a Lennard-Jones 12-6 gas in the first Chapman–Enskog approximation
 * (Chapman & Cowling 1970; Hirschfelder, Curtiss & Bird 1954, eq. 8.2-18):
 *   η = (5/16) √(π m k_B T) / (π σ² Ω^(2,2)*(T*)),  m = M/N_A,  T* = T/(ε/k_B).
 * Ω^(2,2)* and its derivative come from the precomputed table of collision-integrals.ts.
 *
 * Optional (off by default): Kihara's second approximation multiplies η by
 * f_η = 1 + (3/196)(8E* − 7)², E* = Ω^(2,3)* /Ω^(2,2)* (Hirschfelder et al. 1954 §8.2, from memory; the same
 * form is used by Bzowski, Kestin, Mason & Uribe, J. Phys. Chem. Ref. Data 19, 1179, 1990), with
 * Ω^(2,3)* = Ω^(2,2)* + (T* /4) dΩ^(2,2)*∕dT* (the recursion that follows from the definition).
 *
 * Mie λr-6 (options.repulsiveExponent ≠ 12): the same formulas with Ω^(2,2)* of the Mie potential
 * (mie-collision-integrals.ts, the table interpolated in T* and λr); λr = 12 takes the 12-6 path unchanged.
 */
import { ANGSTROM_M, AVOGADRO_PER_MOL, BOLTZMANN_J_PER_K } from './constants';
import { omega22WithDerivatives } from './collision-integrals';
import { mieCollisionIntegrals } from './mie-collision-integrals';
import { LJ_REPULSIVE_EXPONENT, potentialLabel, requireRepulsiveExponent } from './mie-potential';

export const VISCOSITY_MODEL_NOTE =
  'Chapman–Enskog first approximation, η = (5/16)√(π m k_B T)/(π σ² Ω(2,2)*(T*)), with Ω(2,2)* of the ' +
  'Lennard-Jones 12-6 potential computed from the classical collision integrals and interpolated from a ' +
  'precomputed table; higherOrderCorrection: none (first Chapman–Enskog approximation), so f_η = 1 by default ' +
  "(Kihara's second-approximation factor, available as an option, stays below 1.01 for T* ≤ 100).";

export const VISCOSITY_HIGHER_ORDER_CORRECTION = 'none (first Chapman–Enskog approximation)' as const;
export const VISCOSITY_KIHARA_CORRECTION = 'Kihara second approximation f_η = 1 + (3/196)(8E* − 7)²' as const;

export interface ViscosityOptions {
  /** 'none' (default): first Chapman–Enskog approximation; 'kihara': multiply by Kihara's f_η. */
  higherOrderCorrection?: 'none' | 'kihara';
  /** λr of a Mie λr-6 potential (default 12: the LJ 12-6 table). */
  repulsiveExponent?: number;
}

/** Ω^(2,2)* with its first two T*-derivatives for the LJ 12-6 (λr = 12) or a Mie λr-6 potential. */
function omega22Of(tStar: number, repulsiveExponent: number): { omega22: number; dOmega22dT: number; d2Omega22dT2: number } {
  if (repulsiveExponent === LJ_REPULSIVE_EXPONENT) return omega22WithDerivatives(tStar);
  const m = mieCollisionIntegrals(tStar, repulsiveExponent);
  return { omega22: m.omega22, dOmega22dT: m.dOmega22dT, d2Omega22dT2: m.d2Omega22dT2 };
}

/** The viscosity model note for a Mie λr-6 potential (VISCOSITY_MODEL_NOTE for λr = 12). */
export function viscosityModelNote(repulsiveExponent = LJ_REPULSIVE_EXPONENT): string {
  if (repulsiveExponent === LJ_REPULSIVE_EXPONENT) return VISCOSITY_MODEL_NOTE;
  return VISCOSITY_MODEL_NOTE.replace('Lennard-Jones 12-6 potential', `${potentialLabel(repulsiveExponent)} potential`).replace(
    'interpolated from a precomputed table',
    'interpolated from a table precomputed at 15 values of λr from 8 to 36 (cubic in ln T*, 4-point Lagrange in 1/λr)',
  );
}

/**
 * Kihara's second-approximation factor f_η(T*) and its T*-derivative (see file header);
 * f_η − 1 stays below 1 % for the LJ 12-6 potential up to T* = 100.
 */
export function kiharaViscosityFactor(tStar: number, repulsiveExponent = LJ_REPULSIVE_EXPONENT): { factor: number; dFactordT: number } {
  const { omega22: o, dOmega22dT: d1, d2Omega22dT2: d2 } = omega22Of(tStar, repulsiveExponent);
  const eStar = 1 + (tStar * d1) / (4 * o);
  const dEStar = (d1 / o + tStar * (d2 / o - (d1 * d1) / (o * o))) / 4;
  const g = 8 * eStar - 7;
  return { factor: 1 + (3 / 196) * g * g, dFactordT: (3 / 196) * 2 * g * 8 * dEStar };
}

export interface ViscosityPoint {
  viscosityMicroPaS: number;
  /** ∂η/∂(ε/k_B), µPa·s per K. */
  dEtadEpsilonK: number;
  /** ∂η/∂σ, µPa·s per Å. */
  dEtadSigmaAngstrom: number;
}

function requirePositiveFinite(name: string, value: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
    throw new RangeError(`${name} must be a finite number > 0 (got ${String(value)})`);
  }
}

/**
 * η(T) in µPa·s with its analytic gradient. η ∝ σ^−2, so ∂η/∂σ = −2η/σ; with T* = T/ε,
 * ∂Ω/∂ε = −(T*)/ε · dΩ/d(T*), hence ∂η/∂ε = η · T* · dΩ/d(T*) / (ε Ω).
 * Throws a RangeError when T/ε lies outside the collision-integral table.
 */
export function viscosityWithGradient(
  temperatureK: number,
  epsilonK: number,
  sigmaAngstrom: number,
  molarMassGPerMol: number,
  options: ViscosityOptions = {},
): ViscosityPoint {
  requirePositiveFinite('temperatureK', temperatureK);
  requirePositiveFinite('epsilonK', epsilonK);
  requirePositiveFinite('sigmaAngstrom', sigmaAngstrom);
  requirePositiveFinite('molarMassGPerMol', molarMassGPerMol);
  const correction = options.higherOrderCorrection ?? 'none';
  if (correction !== 'none' && correction !== 'kihara') {
    throw new RangeError(`higherOrderCorrection must be 'none' or 'kihara' (got ${String(correction)})`);
  }
  const repulsiveExponent = options.repulsiveExponent ?? LJ_REPULSIVE_EXPONENT;
  requireRepulsiveExponent(repulsiveExponent);
  const tStar = temperatureK / epsilonK;
  const { omega22: omega, dOmega22dT: dOmega } = omega22Of(tStar, repulsiveExponent);
  const massKg = (molarMassGPerMol * 1e-3) / AVOGADRO_PER_MOL;
  const sigmaM = sigmaAngstrom * ANGSTROM_M;
  const etaPaS = ((5 / 16) * Math.sqrt(Math.PI * massKg * BOLTZMANN_J_PER_K * temperatureK)) / (Math.PI * sigmaM * sigmaM * omega);
  const eta1 = etaPaS * 1e6;
  const dEta1dEpsilon = (eta1 * tStar * dOmega) / (epsilonK * omega);
  if (correction === 'none') {
    return { viscosityMicroPaS: eta1, dEtadEpsilonK: dEta1dEpsilon, dEtadSigmaAngstrom: (-2 * eta1) / sigmaAngstrom };
  }
  const { factor, dFactordT } = kiharaViscosityFactor(tStar, repulsiveExponent);
  const eta = eta1 * factor;
  return {
    viscosityMicroPaS: eta,
    // ∂f/∂ε = f′(T*)·(−T* /ε)
    dEtadEpsilonK: dEta1dEpsilon * factor - (eta1 * dFactordT * tStar) / epsilonK,
    dEtadSigmaAngstrom: (-2 * eta) / sigmaAngstrom,
  };
}
