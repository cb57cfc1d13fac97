/**
 * Corresponding states of the LJ 12-6 fluid: every (T, P) maps to one reduced state (T*, P*) for given
 * (ε, σ), and the reduced density maps back to a mass density with the molar mass:
 *   T* = T / (ε/k_B),  P* = P σ³ / ε,  ρ = ρ* M / (N_A σ³)   (Allen & Tildesley 2017, §1.5, reduced units).
 * Derivatives for the density fit's chain rule are given analytically.
 */
import { AVOGADRO_PER_MOL, BOLTZMANN_J_PER_K } from './constants';

const ANGSTROM_M = 1e-10;

export interface StateInput {
  temperatureK: number;
  pressureMPa: number;
  epsilonK: number;
  sigmaAngstrom: number;
}

export function reducedStateOf({ temperatureK, pressureMPa, epsilonK, sigmaAngstrom }: StateInput): {
  reducedTemperature: number;
  reducedPressure: number;
} {
  const sigmaM = sigmaAngstrom * ANGSTROM_M;
  return {
    reducedTemperature: temperatureK / epsilonK,
    reducedPressure: (pressureMPa * 1e6 * sigmaM ** 3) / (epsilonK * BOLTZMANN_J_PER_K),
  };
}

/** Mass density (kg/m³) of a reduced density for a substance of molar mass M (g/mol) and size σ (Å). */
export function massDensityKgPerM3(reducedDensity: number, molarMassGPerMol: number, sigmaAngstrom: number): number {
  return (reducedDensity * molarMassGPerMol * 1e-3) / (AVOGADRO_PER_MOL * (sigmaAngstrom * ANGSTROM_M) ** 3);
}

/** Reduced density of a mass density: the inverse of massDensityKgPerM3. */
export function reducedDensityOf(densityKgPerM3: number, molarMassGPerMol: number, sigmaAngstrom: number): number {
  return densityKgPerM3 / massDensityKgPerM3(1, molarMassGPerMol, sigmaAngstrom);
}

/**
 * ρ(T, P; ε, σ) = ρ*(T*, P*)·M/(N_A σ³) and its gradient in (ε, σ), given ρ* and its partial
 * derivatives at the reduced state. Chain rule with d(T*)/dε = −T* / ε, d(P*)/dε = −P* / ε,
 * d(P*)/dσ = 3 P* / σ, and the prefactor's relative derivative in σ, −3 / σ.
 */
export function densityWithGradient(
  reduced: { reducedDensity: number; dRhoDT: number; dRhoDP: number },
  state: StateInput,
  molarMassGPerMol: number,
): { densityKgPerM3: number; dRhodEpsilonK: number; dRhodSigmaAngstrom: number } {
  const { reducedTemperature: t, reducedPressure: p } = reducedStateOf(state);
  const scale = massDensityKgPerM3(1, molarMassGPerMol, state.sigmaAngstrom);
  const dRhoStarDEps = reduced.dRhoDT * (-t / state.epsilonK) + reduced.dRhoDP * (-p / state.epsilonK);
  const dRhoStarDSigma = reduced.dRhoDP * ((3 * p) / state.sigmaAngstrom);
  return {
    densityKgPerM3: reduced.reducedDensity * scale,
    dRhodEpsilonK: scale * dRhoStarDEps,
    dRhodSigmaAngstrom: scale * (dRhoStarDSigma - (3 * reduced.reducedDensity) / state.sigmaAngstrom),
  };
}
