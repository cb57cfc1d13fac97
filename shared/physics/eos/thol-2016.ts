/**
 * Equation of state of the full Lennard-Jones 12-6 fluid of
 * M. Thol, G. Rutkai, A. Köster, R. Lustig, R. Span and J. Vrabec, "Equation of state for the
 * Lennard-Jones fluid", J. Phys. Chem. Ref. Data 45, 023101 (2016), doi:10.1063/1.4945000 (Thol below),
 * in reduced units (σ = ε = k_B = 1; ρ* = ρσ³, T* = kT/ε, P* = Pσ³/ε).
 *
 * Residual Helmholtz energy α_r = A_res/(NkT) in τ = T*c÷T*, δ = ρ*÷ρ*c with the reducing values
 * T*c = 1.32, ρ*c = 0.31 (Thol eq. 3, Table 2):
 *   α_r = Σ_{1..6} n τ^t δ^d + Σ_{7..12} n τ^t δ^d exp(−δ^l)
 *       + Σ_{13..23} n τ^t δ^d exp(−η(δ − ε)² − β(τ − γ)²)
 * and P* = ρ*T*(1 + δα_r,δ), μ/ε = T*(ln ρ* + α_r + δα_r,δ) + f(T*), u_res = T* τα_r,τ.
 *
 * The paper was not at hand: the 23 rows of Thol Table 2 (n, t, d, l, η, β, γ, ε) were taken from two
 * independent public copies and compared term by term: the Fortran module accompanying Allen & Tildesley,
 * Computer Simulation of Liquids, 2nd ed. 2017 (`eos_lj_module.f90`, "coefficients taken from Table 2"),
 * and a C++ routine distributed with the data of the Thol group; they agree in every printed digit. The tests
 * check the critical point Thol state (T*c = 1.32, ρ*c = 0.31, p*c = 0.13) and NIST SRSW coexistence data.
 * Thol fitted simulation data for 0.661 ≤ T* ≤ 9 and ρ* ≤ 1.08 or so (from memory); outside, it extrapolates
 * (smoothly; Thol designed the terms to behave physically far beyond the data).
 */
import {
  findCriticalPoint,
  solveCoexistence,
  solveDensity,
  type Coexistence,
  type CriticalPoint,
  type EosFunctions,
  type StableDensity,
} from './phase-equilibrium';

export const THOL_2016_SOURCE =
  'M. Thol, G. Rutkai, A. Köster, R. Lustig, R. Span, J. Vrabec, "Equation of state for the Lennard-Jones fluid", ' +
  'J. Phys. Chem. Ref. Data 45 (2016) 023101, doi:10.1063/1.4945000; residual Helmholtz energy of eq. 3 with the 23 terms of Table 2.';

/** Reducing temperature and density of Thol eq. 3 (equal to the critical point Thol report). */
export const THOL_REDUCING = { temperature: 1.32, density: 0.31 } as const;

/** Temperatures of the data Thol fitted (from memory of Thol 2016); beyond them the equation extrapolates. */
export const THOL_FIT_RANGE = { minReducedTemperature: 0.661, maxReducedTemperature: 9 } as const;

/** Highest density searched for a liquid root (the fluid freezes well below it at the temperatures fitted). */
export const THOL_MAX_REDUCED_DENSITY = 1.25;

// Thol 2016 Table 2, rows 1–6 (polynomial): [n, t, d].
const POWER: readonly (readonly [number, number, number])[] = [
  [0.005208073, 1.0, 4],
  [2.186252, 0.32, 1],
  [-2.161016, 0.505, 1],
  [1.4527, 0.672, 2],
  [-2.041792, 0.843, 2],
  [0.18695286, 0.898, 3],
];

// Rows 7–12 (exponential): [n, t, d, l].
const EXPONENTIAL: readonly (readonly [number, number, number, number])[] = [
  [-0.090988445, 1.294, 5, 1],
  [-0.4974561, 2.59, 2, 2],
  [0.10901431, 1.786, 2, 1],
  [-0.80055922, 2.77, 3, 2],
  [-0.568839, 1.786, 1, 2],
  [-0.6208625, 1.205, 1, 1],
];

// Rows 13–23 (Gaussian bell-shaped): [n, t, d, η, β, γ, ε].
const GAUSSIAN: readonly (readonly [number, number, number, number, number, number, number])[] = [
  [-1.4667177, 2.83, 1, 2.067, 0.625, 0.71, 0.2053],
  [1.891469, 2.548, 1, 1.522, 0.638, 0.86, 0.409],
  [-0.1383701, 4.65, 2, 8.82, 3.91, 1.94, 0.6],
  [-0.3869645, 1.385, 3, 1.722, 0.156, 1.48, 1.203],
  [0.1265702, 1.46, 3, 0.679, 0.157, 1.49, 1.829],
  [0.605781, 1.351, 2, 1.883, 0.153, 1.945, 1.397],
  [1.179189, 0.66, 1, 3.925, 1.16, 3.02, 1.39],
  [-0.47732679, 1.496, 2, 2.461, 1.73, 1.11, 0.539],
  [-9.9218575, 1.83, 3, 28.2, 383, 1.17, 0.934],
  [-0.5747932, 1.616, 1, 0.753, 0.112, 1.33, 2.369],
  [0.003772923, 4.97, 1, 0.82, 0.119, 0.24, 2.43],
];

/** α_r and its scaled derivatives: d1 = δα_δ, d2 = δ²α_δδ, t1 = τα_τ, dt = δτα_δτ, t2 = τ²α_ττ. */
export interface TholAlpha {
  a: number;
  d1: number;
  d2: number;
  t1: number;
  dt: number;
  t2: number;
}

/** Residual Helmholtz energy α_r = A_res/(NkT) and its scaled derivatives at (ρ*, T*). */
export function tholAlpha(rho: number, t: number): TholAlpha {
  const tau = THOL_REDUCING.temperature / t;
  const delta = rho / THOL_REDUCING.density;
  const out: TholAlpha = { a: 0, d1: 0, d2: 0, t1: 0, dt: 0, t2: 0 };
  if (delta === 0) return out;
  for (const [n, tt, d] of POWER) {
    const term = n * Math.pow(tau, tt) * Math.pow(delta, d);
    out.a += term;
    out.d1 += d * term;
    out.d2 += d * (d - 1) * term;
    out.t1 += tt * term;
    out.dt += d * tt * term;
    out.t2 += tt * (tt - 1) * term;
  }
  for (const [n, tt, d, l] of EXPONENTIAL) {
    const dl = Math.pow(delta, l);
    const term = n * Math.pow(tau, tt) * Math.pow(delta, d) * Math.exp(-dl);
    const g = d - l * dl;
    out.a += term;
    out.d1 += g * term;
    out.d2 += (g * (g - 1) - l * l * dl) * term;
    out.t1 += tt * term;
    out.dt += tt * g * term;
    out.t2 += tt * (tt - 1) * term;
  }
  for (const [n, tt, d, eta, beta, gamma, eps] of GAUSSIAN) {
    const term = n * Math.pow(tau, tt) * Math.pow(delta, d) * Math.exp(-eta * (delta - eps) ** 2 - beta * (tau - gamma) ** 2);
    const g = d - 2 * eta * delta * (delta - eps);
    const h = tt - 2 * beta * tau * (tau - gamma);
    out.a += term;
    out.d1 += g * term;
    out.d2 += (g * g - d - 2 * eta * delta * delta) * term;
    out.t1 += h * term;
    out.dt += g * h * term;
    out.t2 += (h * h - tt - 2 * beta * tau * tau) * term;
  }
  return out;
}

function check(rho: number, t: number): void {
  if (!(t > 0) || !Number.isFinite(t)) throw new RangeError(`reducedTemperature must be a finite number > 0, got ${String(t)}`);
  if (!(rho >= 0) || !Number.isFinite(rho) || rho > 2)
    throw new RangeError(`reducedDensity must be a finite number in [0, 2], got ${String(rho)}`);
}

/** P* = ρ*T*(1 + δα_r,δ). */
export function tholPressure(reducedDensity: number, reducedTemperature: number): number {
  check(reducedDensity, reducedTemperature);
  return reducedDensity * reducedTemperature * (1 + tholAlpha(reducedDensity, reducedTemperature).d1);
}

/** Residual internal energy per particle U_res/(Nε) = T* τα_r,τ. */
export function tholInternalEnergy(reducedDensity: number, reducedTemperature: number): number {
  check(reducedDensity, reducedTemperature);
  return reducedTemperature * tholAlpha(reducedDensity, reducedTemperature).t1;
}

/** Residual Helmholtz energy per particle A_res/(Nε) = T* α_r. */
export function tholResidualHelmholtz(reducedDensity: number, reducedTemperature: number): number {
  check(reducedDensity, reducedTemperature);
  return reducedTemperature * tholAlpha(reducedDensity, reducedTemperature).a;
}

/** The Thol equation as the functions the phase-equilibrium solvers need. */
export const THOL_2016: EosFunctions = {
  id: 'thol2016',
  maxDensity: THOL_MAX_REDUCED_DENSITY,
  pressure(rho, t) {
    return rho * t * (1 + tholAlpha(rho, t).d1);
  },
  dPdRho(rho, t) {
    const a = tholAlpha(rho, t);
    return t * (1 + 2 * a.d1 + a.d2);
  },
  dPdT(rho, t) {
    const a = tholAlpha(rho, t);
    return rho * (1 + a.d1 - a.dt);
  },
  chemicalPotential(rho, t) {
    const a = tholAlpha(rho, t);
    return t * (Math.log(rho) + a.a + a.d1);
  },
  residualEnergy(rho, t) {
    return t * tholAlpha(rho, t).t1;
  },
};

let critical: CriticalPoint | undefined;

/** Critical point of the Thol equation (∂P/∂ρ = ∂²P/∂ρ² = 0), computed once. */
export function tholCriticalPoint(): CriticalPoint {
  critical ??= findCriticalPoint(THOL_2016);
  return critical;
}

/** Vapour–liquid coexistence of the Thol equation at T* (below its critical temperature; AboveCriticalError otherwise). */
export function tholCoexistence(reducedTemperature: number): Coexistence {
  return solveCoexistence(THOL_2016, reducedTemperature, tholCriticalPoint());
}

/** Density at (T*, P*): the stable root unless `prefer` names the phase. */
export function tholDensity(reducedTemperature: number, reducedPressure: number, prefer?: 'liquid' | 'vapour'): StableDensity {
  return solveDensity(THOL_2016, reducedTemperature, reducedPressure, tholCriticalPoint(), prefer);
}
