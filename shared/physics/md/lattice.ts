/**
 * Face-centred cubic start configuration in a cubic periodic box.
 * The conventional cubic cell has four sites at (0,0,0), (½,½,0), (½,0,½), (0,½,½)
 * (Allen & Tildesley, Computer Simulation of Liquids, 2nd ed. 2017, §5.6.1).
 */
export interface FccLattice {
  /** Interleaved x, y, z coordinates in reduced units (σ). */
  positions: Float64Array;
  /** Box edge in σ. */
  boxLength: number;
}

/**
 * Places `atoms` on an fcc lattice at number density `reducedDensity` (ρσ³).
 * With atoms = 4·nc³ the lattice is perfect; otherwise the smallest lattice that holds them is used
 * and the last sites stay empty (vacancies), the box still being sized for the requested density.
 */
export function fccLattice(atoms: number, reducedDensity: number): FccLattice {
  const nc = Math.ceil(Math.cbrt(atoms / 4) - 1e-9);
  const boxLength = Math.cbrt(atoms / reducedDensity);
  const a = boxLength / nc;
  const basis = [0, 0, 0, 0.5, 0.5, 0, 0.5, 0, 0.5, 0, 0.5, 0.5];
  const positions = new Float64Array(3 * atoms);
  let i = 0;
  for (let iz = 0; iz < nc && i < atoms; iz++) {
    for (let iy = 0; iy < nc && i < atoms; iy++) {
      for (let ix = 0; ix < nc && i < atoms; ix++) {
        for (let b = 0; b < 4 && i < atoms; b++, i++) {
          positions[3 * i] = (ix + basis[3 * b]) * a;
          positions[3 * i + 1] = (iy + basis[3 * b + 1]) * a;
          positions[3 * i + 2] = (iz + basis[3 * b + 2]) * a;
        }
      }
    }
  }
  return { positions, boxLength };
}
