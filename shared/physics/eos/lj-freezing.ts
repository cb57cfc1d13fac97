/**
 * Where the Lennard-Jones fluid stops being the stable phase: the freezing line and the triple point, for the
 * checks "no fluid root / solid region" before a simulation is asked for (reduced units, σ = ε = k_B = 1).
 *
 * Liquid density at freezing, E. A. Mastny and J. J. de Pablo, "Melting line of the Lennard-Jones system,
 * infinite size, and full potential", J. Chem. Phys. 127, 104504 (2007), eq. 21 (coefficients as quoted on
 * SklogWiki, "Lennard-Jones equation of state"):
 *   ρ_l,freeze(β) = β^{−1/4} [0.90735 − 0.27120β + 0.91784β² − 1.16270β³ + 0.68012β⁴ − 0.15284β⁵],  β = 1/T*.
 * Triple-point temperature T*_tp ≈ 0.694 (Mastny & de Pablo 2007, from memory; Agrawal & Kofke 1995 give 0.687):
 * below it a dense fluid is never stable. The fluid density at the state comes from the Kolafa–Nezbeda (1994)
 * equation (kolafa-nezbeda-1994.ts), its stable root by chemical potential.
 */
import { knDensity, knDensityRoots, knPressure } from './kolafa-nezbeda-1994';

export const LJ_TRIPLE_POINT_TEMPERATURE = 0.694;

export const LJ_FREEZING_SOURCE =
  'E. A. Mastny, J. J. de Pablo, J. Chem. Phys. 127, 104504 (2007), eq. 21 (liquid density at freezing); fluid density from Kolafa & Nezbeda, Fluid Phase Equilib. 100, 1 (1994).';

/** Density of the liquid coexisting with the fcc solid at T* (Mastny & de Pablo 2007, eq. 21). */
export function freezingLiquidDensity(reducedTemperature: number): number {
  if (!(reducedTemperature > 0) || !Number.isFinite(reducedTemperature)) {
    throw new RangeError(`reducedTemperature must be a finite number > 0, got ${String(reducedTemperature)}`);
  }
  const b = 1 / reducedTemperature;
  const poly = 0.90735 + b * (-0.2712 + b * (0.91784 + b * (-1.1627 + b * (0.68012 + b * -0.15284))));
  return b ** -0.25 * poly;
}

export type LjRegion = 'fluid' | 'solid' | 'no-fluid-root';

export interface LjRegionCheck {
  region: LjRegion;
  /** The stable Kolafa–Nezbeda root, when there is one. */
  reducedDensity?: number;
  /** Plain words for a person, present unless the state is fluid. */
  reason?: string;
}

/**
 * Is (T*, P*) a fluid state of the LJ model? 'no-fluid-root' when the equation of state has no root there,
 * 'solid' when its stable root is denser than the liquid at freezing, or is a dense fluid below the triple point.
 * `reducedDensity` is given for solid states and below the triple point.
 */
export function ljRegionOf(reducedTemperature: number, reducedPressure: number): LjRegionCheck {
  const state = `T* = ${reducedTemperature.toFixed(3)}, P* = ${reducedPressure.toFixed(3)}`;
  if (reducedTemperature >= LJ_TRIPLE_POINT_TEMPERATURE && reducedPressure > 0) {
    // Fast path (a fit asks this for every trial step): above the triple point the liquid at freezing is denser than
    // the saturated liquid, and the isotherm rises monotonically beyond it, so the stable fluid root lies beyond the
    // freezing density exactly when P* exceeds the pressure there.
    const freeze = freezingLiquidDensity(reducedTemperature);
    if (reducedPressure <= knPressure(freeze, reducedTemperature)) return { region: 'fluid' };
    let rho: number | undefined;
    try {
      rho = knDensity(reducedTemperature, reducedPressure, { phase: 'liquid' }).reducedDensity;
    } catch {
      rho = undefined;
    }
    return {
      region: 'solid',
      ...(rho !== undefined ? { reducedDensity: rho } : {}),
      reason: `${state} lies in the solid region: the fluid would have ρ* = ${rho?.toFixed(3) ?? '?'}, denser than the liquid at freezing (ρ* = ${freeze.toFixed(3)}, Mastny & de Pablo 2007)`,
    };
  }
  let roots;
  try {
    roots = knDensityRoots(reducedTemperature, reducedPressure);
  } catch (err) {
    return {
      region: 'no-fluid-root',
      reason: `the equation of state has no fluid density at ${state}: ${err instanceof Error ? err.message : String(err)}`,
    };
  }
  if (roots.length === 0)
    return { region: 'no-fluid-root', reason: `the equation of state (Kolafa–Nezbeda 1994) has no fluid density at ${state}` };
  const stable = roots.reduce((a, b) => (b.chemicalPotential < a.chemicalPotential ? b : a));
  const rho = stable.reducedDensity;
  if (reducedTemperature < LJ_TRIPLE_POINT_TEMPERATURE && stable.phase !== 'vapour') {
    return {
      region: 'solid',
      reducedDensity: rho,
      reason: `${state} lies below the triple-point temperature T* ≈ ${LJ_TRIPLE_POINT_TEMPERATURE}, where the dense phase is the solid`,
    };
  }
  const freeze = freezingLiquidDensity(reducedTemperature);
  if (rho > freeze) {
    return {
      region: 'solid',
      reducedDensity: rho,
      reason: `${state} lies in the solid region: the fluid would have ρ* = ${rho.toFixed(3)}, denser than the liquid at freezing (ρ* = ${freeze.toFixed(3)}, Mastny & de Pablo 2007)`,
    };
  }
  return { region: 'fluid', reducedDensity: rho };
}
