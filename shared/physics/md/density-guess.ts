/**
 * Fallback starting density for an NPT run from the van der Waals equation fitted to the LJ critical point
 * (T_c* ≈ 1.31, ρ_c* ≈ 0.31; Smit 1992, J. Chem. Phys. 96, 8639, for rc → ∞: T_c 1.316, ρ_c 0.304):
 * b = 1/(3ρ_c), a = 27 b T_c / 8. Where the cubic has three roots the one with the lowest chemical potential
 * is taken. A rough start only: the barostat finds the real density. Clamped to [1e-4, 1.1].
 */
import { LJ_EOS_FIT_RANGE, ljEosDensity, ljEosResidualHelmholtz } from '../lj-eos';

const RHO_C = 0.31;
const T_C = 1.31;
const B = 1 / (3 * RHO_C);
const A = (27 * B * T_C) / 8;

function pressure(rho: number, t: number): number {
  return (rho * t) / (1 - B * rho) - A * rho * rho;
}

/** vdW chemical potential up to a function of T alone. */
function chemicalPotential(rho: number, t: number): number {
  return t * (Math.log(rho / (1 - B * rho)) + (B * rho) / (1 - B * rho)) - 2 * A * rho;
}

function vanDerWaalsDensity(tStar: number, pStar: number): number {
  // Bracket sign changes of p(ρ) − P on a fine grid below the close-packing limit 1/b, then bisect.
  const roots: number[] = [];
  const top = 0.999 / B;
  const steps = 2000;
  let prev = 1e-6;
  let fPrev = pressure(prev, tStar) - pStar;
  for (let k = 1; k <= steps; k++) {
    const rho = 1e-6 + (top - 1e-6) * (k / steps) ** 2;
    const f = pressure(rho, tStar) - pStar;
    if (fPrev === 0 || fPrev * f < 0) {
      let lo = prev;
      let hi = rho;
      for (let it = 0; it < 80; it++) {
        const midRho = 0.5 * (lo + hi);
        const fm = pressure(midRho, tStar) - pStar;
        if (fm < 0 === pressure(lo, tStar) - pStar < 0) lo = midRho;
        else hi = midRho;
      }
      roots.push(0.5 * (lo + hi));
    }
    prev = rho;
    fPrev = f;
  }
  let best = roots.length > 0 ? roots[0] : top;
  for (const r of roots) if (chemicalPotential(r, tStar) < chemicalPotential(best, tStar)) best = r;
  // vdW underestimates liquid densities (its close packing 1/b = 0.93); nudge dense roots up.
  if (best > RHO_C) best = Math.min(1.1, best * 1.05);
  return Math.max(1e-4, best);
}

/**
 * Starting density from the Johnson–Zollweg–Gubbins 1993 EOS (../lj-eos.ts): of its mechanically stable roots at
 * (T*, P*) the one with the lowest chemical potential μ = T ln ρ + A_res + P/ρ (up to a function of T), i.e. the
 * stable phase, so that the run starts in the right basin. Falls back to the van der Waals estimate where the EOS
 * has no root or outside its fitted temperature range.
 */
export function guessReducedDensity(tStar: number, pStar: number): number {
  const vdw = vanDerWaalsDensity(tStar, pStar);
  // Outside the temperatures JZG fitted the polynomial's roots are unreliable (e.g. a spurious low root at T* = 0.3).
  if (tStar < LJ_EOS_FIT_RANGE.minReducedTemperature || tStar > LJ_EOS_FIT_RANGE.maxReducedTemperature) return vdw;
  try {
    const roots = ljEosDensity(tStar, pStar).roots.filter((r) => Number.isFinite(r) && r > 0);
    if (roots.length === 0) return vdw;
    const mu = (rho: number): number => tStar * Math.log(rho) + ljEosResidualHelmholtz(rho, tStar) + pStar / rho;
    let best = roots[0];
    for (const r of roots) if (mu(r) < mu(best)) best = r;
    return Math.min(1.1, Math.max(1e-4, best));
  } catch {
    return vdw;
  }
}
