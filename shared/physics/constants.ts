/**
 * Physical constants in SI units, CODATA 2018 (Tiesinga et al., Rev. Mod. Phys. 93, 025010, 2021).
 * Since the 2019 SI redefinition N_A, k_B, h and e are exact.
 */
export const AVOGADRO_PER_MOL = 6.02214076e23;
export const BOLTZMANN_J_PER_K = 1.380649e-23;
export const PLANCK_J_S = 6.62607015e-34;
export const HBAR_J_S = PLANCK_J_S / (2 * Math.PI);
export const ELEMENTARY_CHARGE_C = 1.602176634e-19;
/** Molar gas constant R = N_A k_B, exact. */
export const GAS_CONSTANT_J_PER_MOL_K = AVOGADRO_PER_MOL * BOLTZMANN_J_PER_K;
/** Atomic mass constant m_u = 1 g/mol / N_A (CODATA 2018: 1.66053906660e-27 kg). */
export const ATOMIC_MASS_KG = 1.6605390666e-27;
/** Thermochemical calorie, exact (NIST SP 811, 2008, B.8). */
export const CALORIE_J = 4.184;

export const ANGSTROM_M = 1e-10;
