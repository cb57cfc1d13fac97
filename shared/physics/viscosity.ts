/**
 * Dilute-gas shear viscosity of a Lennard-Jones 12-6 gas in the first Chapman–Enskog approximation
 * (Chapman & Cowling 1970; Hirschfelder, Curtiss & Bird 1954, eq. 8.2-18):
 *   η = (5/16) √(π m k_B T) / (π σ² Ω^(2,2)*(T*)),  m = M/N_A,  T* = T/(ε/k_B).
 * Ω^(2,2)* and its derivative come from the precomputed table of collision-integrals.ts.
 */
import { ANGSTROM_M, AVOGADRO_PER_MOL, BOLTZMANN_J_PER_K } from './constants';
import { omega22, omega22Derivative } from './collision-integrals';

export const VISCOSITY_MODEL_NOTE =
  'Chapman–Enskog first approximation, η = (5/16)√(π m k_B T)/(π σ² Ω(2,2)*(T*)), with Ω(2,2)* of the ' +
  'Lennard-Jones 12-6 potential computed from the classical collision integrals and interpolated from a ' +
  'precomputed table; higherOrderCorrection: none (first Chapman–Enskog approximation), so f_η = 1 ' +
  '(the neglected factor is below 1 % for T* ≤ 100).';

export const VISCOSITY_HIGHER_ORDER_CORRECTION = 'none (first Chapman–Enskog approximation)' as const;

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
): ViscosityPoint {
  requirePositiveFinite('temperatureK', temperatureK);
  requirePositiveFinite('epsilonK', epsilonK);
  requirePositiveFinite('sigmaAngstrom', sigmaAngstrom);
  requirePositiveFinite('molarMassGPerMol', molarMassGPerMol);
  const tStar = temperatureK / epsilonK;
  const omega = omega22(tStar);
  const dOmega = omega22Derivative(tStar);
  const massKg = (molarMassGPerMol * 1e-3) / AVOGADRO_PER_MOL;
  const sigmaM = sigmaAngstrom * ANGSTROM_M;
  const etaPaS = ((5 / 16) * Math.sqrt(Math.PI * massKg * BOLTZMANN_J_PER_K * temperatureK)) / (Math.PI * sigmaM * sigmaM * omega);
  const eta = etaPaS * 1e6;
  return {
    viscosityMicroPaS: eta,
    dEtadEpsilonK: (eta * tStar * dOmega) / (epsilonK * omega),
    dEtadSigmaAngstrom: (-2 * eta) / sigmaAngstrom,
  };
}
