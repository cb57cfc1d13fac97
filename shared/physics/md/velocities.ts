import type { LjSystem } from './lj-system';
import type { Xoshiro128 } from './rng';

/**
 * Draws initial velocities, removes the centre-of-mass momentum and scales the kinetic energy to
 * exactly (3N − 3)·T/2. 'gaussian' draws Maxwell–Boltzmann components; 'uniform' draws components
 * uniformly in [−½, ½) as the LAMMPS LJ-melt benchmark does (Plimpton 1995, J. Comput. Phys. 117, 1).
 */
export function assignVelocities(
  system: LjSystem,
  reducedTemperature: number,
  rng: Xoshiro128,
  distribution: 'gaussian' | 'uniform',
): void {
  const v = system.vel;
  const n = system.n;
  const p = [0, 0, 0];
  for (let k = 0; k < 3 * n; k++) {
    v[k] = distribution === 'gaussian' ? rng.gaussian() : rng.uniform() - 0.5;
    p[k % 3] += v[k];
  }
  for (let k = 0; k < 3 * n; k++) v[k] -= p[k % 3] / n;
  const scale = Math.sqrt((reducedTemperature * (3 * n - 3)) / (2 * system.kineticEnergy()));
  for (let k = 0; k < 3 * n; k++) v[k] *= scale;
}
