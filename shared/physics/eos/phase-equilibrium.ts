/**
 * Phase behaviour of any Helmholtz-energy equation of state of a one-component fluid in reduced units
 * (σ = ε = k_B = 1): the critical point, vapour–liquid coexistence and the density at (T*, P*) with the
 * stable root chosen. The equation of state comes in as an `EosFunctions` object, so Thol et al. (2016),
 * Johnson–Zollweg–Gubbins (1993) and Kolafa–Nezbeda (1994) share one solver.
 *
 * Coexistence (equal pressure and chemical potential) is solved in the pressure: between the two spinodals
 * the isotherm has exactly one vapour root on its low-density branch and one liquid root on its
 * high-density branch, each found inside its own monotonic bracket, and Δμ(P) = μ_liq − μ_vap falls strictly
 * with P (dΔμ/dP = 1/ρ_liq − 1/ρ_vap < 0). A bracketed root of Δμ(P) therefore exists, is unique, and can
 * never be the trivial solution ρ_liq = ρ_vap that direct Newton iteration on the two densities falls into
 * near the critical point. (Common practice, no source: the "pressure-bracket" form of the Maxwell
 * construction, e.g. Span, Multiparameter Equations of State, 2000, §3.3.)
 */
import { criticalTemperature, minimumIsothermSlope } from './isotherm-slope';

export interface EosFunctions {
  /** Short id, e.g. 'thol2016'. */
  id: string;
  /** P*(ρ*, T*). */
  pressure(rho: number, t: number): number;
  /** (∂P/∂ρ)_T. */
  dPdRho(rho: number, t: number): number;
  /** (∂P/∂T)_ρ. */
  dPdT(rho: number, t: number): number;
  /** μ/ε up to a function of T* alone (the same function for every density): T ln ρ + μ_res. */
  chemicalPotential(rho: number, t: number): number;
  /** Residual internal energy per particle U_res/(Nε) (for the Clapeyron slope of the saturation curve). */
  residualEnergy(rho: number, t: number): number;
  /** Highest density searched for a liquid root (below the solid region and any artefact of the fit). */
  maxDensity: number;
}

export interface CriticalPoint {
  reducedTemperature: number;
  reducedDensity: number;
  reducedPressure: number;
}

export interface Coexistence {
  reducedTemperature: number;
  saturationPressure: number;
  liquidDensity: number;
  vapourDensity: number;
  /** μ/ε of the two phases (equal to the solver's tolerance), with the T*-only term left out. */
  chemicalPotential: number;
  /**
   * Slopes along the saturation curve, d/dT*: dP_sat/dT* from the Clapeyron equation
   * dP/dT = Δh/(T Δv), Δh = ΔU_res + P Δv (the ideal-gas energy cancels), and for each phase
   * dρ/dT* = (dP_sat/dT* − (∂P/∂T)_ρ)/(∂P/∂ρ)_T (Rowlinson & Swinton, Liquids and Liquid Mixtures, 3rd ed. 1982, §2.3; from memory).
   */
  dPressureDT: number;
  dLiquidDensityDT: number;
  dVapourDensityDT: number;
}

/** Thrown when a saturation property is asked for at or above the critical temperature of the model. */
export class AboveCriticalError extends RangeError {
  constructor(
    readonly reducedTemperature: number,
    readonly criticalTemperature: number,
    modelId: string,
  ) {
    super(
      `reduced temperature T* = ${reducedTemperature} is at or above the critical temperature of the ${modelId} equation of state ` +
        `(T*c = ${criticalTemperature.toFixed(4)}): there is no vapour–liquid coexistence there`,
    );
    this.name = 'AboveCriticalError';
  }
}

/** Minimum of (∂P/∂ρ)_T over ρ* ∈ [0.05, 0.7]. */
function minimumSlope(eos: EosFunctions, t: number): { rho: number; slope: number } {
  return minimumIsothermSlope((rho) => eos.dPdRho(rho, t), { from: 0.05, to: 0.7, tolerance: 1e-11 });
}

/** Critical point: the temperature at which min_ρ (∂P/∂ρ)_T first reaches zero, by bisection in T* on [0.9, 2]. */
export function findCriticalPoint(eos: EosFunctions): CriticalPoint {
  const lo = 0.9;
  const hi = 2.0;
  if (!(minimumSlope(eos, lo).slope < 0) || !(minimumSlope(eos, hi).slope > 0)) {
    throw new Error(`the ${eos.id} isotherms do not bracket a critical point between T* = 0.9 and 2`);
  }
  const t = criticalTemperature((temp) => minimumSlope(eos, temp).slope, lo, hi);
  const { rho } = minimumSlope(eos, t);
  return { reducedTemperature: t, reducedDensity: rho, reducedPressure: eos.pressure(rho, t) };
}

/** Zero of ∂P/∂ρ between lo and hi (where it changes sign), by bisection. */
function slopeZero(eos: EosFunctions, lo: number, hi: number, t: number): number {
  let sLo = eos.dPdRho(lo, t);
  for (let k = 0; k < 200 && hi - lo > 1e-15 * Math.max(1, hi); k++) {
    const mid = (lo + hi) / 2;
    const sMid = eos.dPdRho(mid, t);
    if (Math.sign(sMid) === Math.sign(sLo)) {
      lo = mid;
      sLo = sMid;
    } else hi = mid;
  }
  return (lo + hi) / 2;
}

/**
 * The two spinodals of a subcritical isotherm: the first zero of ∂P/∂ρ going up from the dilute gas (end of
 * the vapour branch) and the last one coming down from the dense liquid (start of the liquid branch), and the
 * top of that liquid branch. Scanning from the outside in matters: multiparameter equations such as Thol's can
 * wiggle inside the two-phase region (extra zeros of ∂P/∂ρ between the spinodals), which are of no interest.
 * The loop's centre (least slope) stops both scans, so a loop narrower than the scan step is still found.
 */
export function spinodals(eos: EosFunctions, t: number): { vapour: number; liquid: number; liquidTop: number } {
  const centre = minimumSlope(eos, t);
  if (!(centre.slope < 0)) throw new RangeError(`T* = ${t}: the ${eos.id} isotherm has no van der Waals loop (supercritical)`);
  const step = 0.01;
  let a = 0;
  while (a + step < centre.rho && eos.dPdRho(a + step, t) > 0) a += step;
  const vapour = slopeZero(eos, a, Math.min(a + step, centre.rho), t);
  // From the top: skip a falling high-density artefact, then walk down the liquid branch to its spinodal.
  let top = eos.maxDensity;
  while (top > centre.rho && !(eos.dPdRho(top, t) > 0)) top -= step;
  if (top <= centre.rho) throw new RangeError(`T* = ${t}: the ${eos.id} isotherm has no liquid branch below ρ* = ${eos.maxDensity}`);
  let b = top;
  while (b - step > centre.rho && eos.dPdRho(b - step, t) > 0) b -= step;
  const liquid = slopeZero(eos, Math.max(b - step, centre.rho), b, t);
  const liquidTop = top === eos.maxDensity ? top : slopeZero(eos, top, top + step, t);
  return { vapour, liquid, liquidTop };
}

/** Root of P(ρ) = target on [lo, hi] where P rises monotonically: safeguarded Newton (Press et al., Numerical Recipes, 3rd ed. 2007, §9.4). */
function solveIncreasing(eos: EosFunctions, lo: number, hi: number, t: number, target: number): number {
  let x = 0.5 * (lo + hi);
  for (let k = 0; k < 400; k++) {
    const f = eos.pressure(x, t) - target;
    if (f === 0) return x;
    if (f < 0) lo = x;
    else hi = x;
    const slope = eos.dPdRho(x, t);
    let next = x - f / slope;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - x) <= 1e-15 * Math.max(x, 1e-300) || hi - lo <= 1e-15 * hi) return next;
    x = next;
  }
  return x;
}

/** Vapour root on (0, spinodal]: bisection in ln ρ first (the vapour density spans many decades at low T*), then Newton. */
function vapourRoot(eos: EosFunctions, spinodal: number, t: number, target: number): number {
  // Ideal-gas guess ρ = P/T bounds the root from below only loosely; widen until P(lo) < target.
  let lo = Math.min(target / t, spinodal) * 0.5;
  while (eos.pressure(lo, t) > target) lo *= 0.1;
  return solveIncreasing(eos, lo, spinodal, t, target);
}

/** Vapour–liquid coexistence at T* below the critical temperature `critical` of the same model. */
export function solveCoexistence(eos: EosFunctions, t: number, critical: CriticalPoint): Coexistence {
  if (!(t > 0) || !Number.isFinite(t)) throw new RangeError(`reduced temperature must be a finite number > 0, got ${String(t)}`);
  if (t >= critical.reducedTemperature) throw new AboveCriticalError(t, critical.reducedTemperature, eos.id);
  const spin = spinodals(eos, t);
  const pTop = eos.pressure(spin.vapour, t);
  const pBottom = eos.pressure(spin.liquid, t);
  const deltaMu = (p: number) => {
    const rv = vapourRoot(eos, spin.vapour, t, p);
    const rl = solveIncreasing(eos, spin.liquid, spin.liquidTop, t, p);
    return { rv, rl, d: eos.chemicalPotential(rl, t) - eos.chemicalPotential(rv, t) };
  };
  let lo = Math.max(pBottom, pTop * 1e-12);
  let hi = pTop;
  if (eos.pressure(spin.liquidTop, t) < hi)
    throw new RangeError(`T* = ${t}: the ${eos.id} liquid branch does not reach the spinodal pressure`);
  let fLo = deltaMu(lo);
  let fHi = deltaMu(hi);
  // At very low T* the liquid spinodal pressure is far below zero and the saturation pressure tiny: walk down.
  while (fLo.d < 0 && lo > 1e-300) {
    hi = lo;
    fHi = fLo;
    lo *= 1e-3;
    fLo = deltaMu(lo);
  }
  if (!(fLo.d >= 0 && fHi.d <= 0)) throw new Error(`T* = ${t}: no coexistence bracket in the ${eos.id} isotherm (Δμ ${fLo.d} … ${fHi.d})`);
  // Illinois regula falsi on Δμ(P), which is smooth and strictly decreasing: fast and never leaves the bracket.
  let best = fHi;
  let side = 0;
  let pBest = hi;
  for (let k = 0; k < 200; k++) {
    const p = (lo * fHi.d - hi * fLo.d) / (fHi.d - fLo.d);
    const f = deltaMu(p);
    best = f;
    pBest = p;
    if (f.d === 0 || Math.abs(hi - lo) <= 1e-14 * p) break;
    if (f.d > 0) {
      lo = p;
      fLo = f;
      if (side === 1) fHi = { ...fHi, d: fHi.d / 2 };
      side = 1;
    } else {
      hi = p;
      fHi = f;
      if (side === -1) fLo = { ...fLo, d: fLo.d / 2 };
      side = -1;
    }
    if (Math.abs(f.d) < 1e-13 * Math.max(1, Math.abs(eos.chemicalPotential(f.rl, t)))) break;
  }
  const { rl, rv } = best;
  const dv = 1 / rv - 1 / rl;
  const dh = eos.residualEnergy(rv, t) - eos.residualEnergy(rl, t) + pBest * dv;
  const dPressureDT = dh / (t * dv);
  return {
    reducedTemperature: t,
    saturationPressure: pBest,
    liquidDensity: rl,
    vapourDensity: rv,
    chemicalPotential: eos.chemicalPotential(rl, t),
    dPressureDT,
    dLiquidDensityDT: (dPressureDT - eos.dPdT(rl, t)) / eos.dPdRho(rl, t),
    dVapourDensityDT: (dPressureDT - eos.dPdT(rv, t)) / eos.dPdRho(rv, t),
  };
}

export type FluidPhase = 'vapour' | 'liquid' | 'supercritical';

export interface DensityRoot {
  reducedDensity: number;
  phase: FluidPhase;
  /** μ/ε with the T*-only term left out: at one state the lower value is the stable phase. */
  chemicalPotential: number;
  /** (∂ρ/∂T)_P and (∂ρ/∂P)_T at this root, reduced units. */
  dRhoDT: number;
  dRhoDP: number;
}

export interface StableDensity extends DensityRoot {
  /** How the root was chosen: the stable one (default), or the one asked for. */
  chosen: 'stable' | 'liquid' | 'vapour' | 'only root';
  /** Every mechanically stable root at this (T*, P*), ascending. */
  roots: DensityRoot[];
  /** The phase with the lowest chemical potential among the roots. */
  stablePhase: FluidPhase;
  note: string;
}

function rootAt(eos: EosFunctions, rho: number, t: number, phase: FluidPhase): DensityRoot {
  const slope = eos.dPdRho(rho, t);
  return {
    reducedDensity: rho,
    phase,
    chemicalPotential: eos.chemicalPotential(rho, t),
    dRhoDT: -eos.dPdT(rho, t) / slope,
    dRhoDP: 1 / slope,
  };
}

/**
 * Density at (T*, P*). Below T*c both a vapour and a liquid root can exist (one of them metastable); the
 * root with the lower chemical potential (the stable phase) is returned unless `prefer` names a phase.
 */
export function solveDensity(
  eos: EosFunctions,
  t: number,
  p: number,
  critical: CriticalPoint,
  prefer?: 'liquid' | 'vapour',
): StableDensity {
  if (!(t > 0) || !Number.isFinite(t)) throw new RangeError(`reduced temperature must be a finite number > 0, got ${String(t)}`);
  if (!(p > 0) || !Number.isFinite(p)) throw new RangeError(`reduced pressure must be a finite number > 0, got ${String(p)}`);
  const roots: DensityRoot[] = [];
  if (t < critical.reducedTemperature) {
    const spin = spinodals(eos, t);
    if (p <= eos.pressure(spin.vapour, t)) roots.push(rootAt(eos, vapourRoot(eos, spin.vapour, t, p), t, 'vapour'));
    const pLiquidLow = eos.pressure(spin.liquid, t);
    if (p >= pLiquidLow && p <= eos.pressure(spin.liquidTop, t))
      roots.push(rootAt(eos, solveIncreasing(eos, spin.liquid, spin.liquidTop, t, p), t, 'liquid'));
  } else if (p <= eos.pressure(eos.maxDensity, t)) {
    let lo = Math.min(p / t, eos.maxDensity) * 0.5;
    while (eos.pressure(lo, t) > p) lo *= 0.1;
    roots.push(rootAt(eos, solveIncreasing(eos, lo, eos.maxDensity, t, p), t, 'supercritical'));
  }
  if (roots.length === 0) {
    throw new RangeError(
      `no fluid root of the ${eos.id} equation of state at T* = ${t}, P* = ${p} below ρ* = ${eos.maxDensity} (solid or beyond the fitted range)`,
    );
  }
  const stable = roots.reduce((a, b) => (b.chemicalPotential < a.chemicalPotential ? b : a));
  if (roots.length === 1) {
    const only = roots[0];
    const note =
      prefer && prefer !== only.phase
        ? `only a ${only.phase} root exists at this state; the ${prefer} root asked for does not`
        : `one root: ${only.phase}`;
    return { ...only, chosen: 'only root', roots, stablePhase: only.phase, note };
  }
  const chosen = prefer ? (roots.find((r) => r.phase === prefer) ?? stable) : stable;
  const other = roots.find((r) => r !== stable)!;
  const note = prefer
    ? `liquid and vapour roots both exist; returned the ${prefer} root as asked; the stable phase is the ${stable.phase} (lower chemical potential)`
    : `liquid and vapour roots both exist; returned the stable ${stable.phase} root (lower chemical potential); the ${other.phase} root is metastable`;
  return { ...chosen, chosen: prefer ?? 'stable', roots, stablePhase: stable.phase, note };
}
