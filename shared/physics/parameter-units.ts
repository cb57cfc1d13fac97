/**
 * Units for LJ parameters on screen and in exports. ε is stored as ε/k_B in K; σ in Å.
 * Conversions use CODATA 2018 exact constants (constants.ts): ε per mole = ε/k_B · R, per particle in eV = ε/k_B · k_B/e.
 */
import { BOLTZMANN_J_PER_K, CALORIE_J, ELEMENTARY_CHARGE_C, GAS_CONSTANT_J_PER_MOL_K } from './constants';

export const ENERGY_UNITS = ['K', 'kJ/mol', 'kcal/mol', 'eV'] as const;
export type EnergyUnit = (typeof ENERGY_UNITS)[number];
export const LENGTH_UNITS = ['Å', 'nm'] as const;
export type LengthUnit = (typeof LENGTH_UNITS)[number];

/** Multiply ε/k_B (K) by this to get ε in the unit. */
export const ENERGY_FACTOR_FROM_K: Record<EnergyUnit, number> = {
  K: 1,
  'kJ/mol': GAS_CONSTANT_J_PER_MOL_K / 1000,
  'kcal/mol': GAS_CONSTANT_J_PER_MOL_K / (1000 * CALORIE_J),
  eV: BOLTZMANN_J_PER_K / ELEMENTARY_CHARGE_C,
};

/** Multiply σ in Å by this to get σ in the unit. */
export const LENGTH_FACTOR_FROM_ANGSTROM: Record<LengthUnit, number> = { Å: 1, nm: 0.1 };

export const ENERGY_LABEL: Record<EnergyUnit, string> = {
  K: 'ε/k_B (K)',
  'kJ/mol': 'ε (kJ/mol)',
  'kcal/mol': 'ε (kcal/mol)',
  eV: 'ε (eV)',
};

export function convertEpsilon(epsilonK: number, unit: EnergyUnit): number {
  return epsilonK * ENERGY_FACTOR_FROM_K[unit];
}

export function convertSigma(sigmaAngstrom: number, unit: LengthUnit): number {
  return sigmaAngstrom * LENGTH_FACTOR_FROM_ANGSTROM[unit];
}

export function isEnergyUnit(u: unknown): u is EnergyUnit {
  return typeof u === 'string' && (ENERGY_UNITS as readonly string[]).includes(u);
}

export function isLengthUnit(u: unknown): u is LengthUnit {
  return typeof u === 'string' && (LENGTH_UNITS as readonly string[]).includes(u);
}
