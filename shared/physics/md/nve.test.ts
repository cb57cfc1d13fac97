import { describe, expect, it } from 'vitest';
import { runNve } from './nve';

describe('runNve', () => {
  it('conserves energy at the LJ-melt state over 10^4 steps (N = 500)', () => {
    // Bound: |ΔE|/N < 2e-3 ε over 50 τ with dt = 0.005 and rc = 2.5 (common practice for velocity Verlet with a
    // truncated LJ force, no source); the conserved quantity is kinetic + shifted potential energy.
    const r = runNve({ atoms: 500, steps: 10000, reducedDensity: 0.8442, reducedTemperature: 1.44, seed: 12345 });
    expect(Math.abs(r.energyDriftPerAtom)).toBeLessThan(2e-3);
    expect(Math.abs(r.energyDriftSlopePerAtomPerTime) * 50).toBeLessThan(2e-3);
    // The melt ends near T* ≈ 0.7 (half of the initial kinetic energy turns into potential energy; LAMMPS bench log, from memory).
    expect(r.final.temperature).toBeGreaterThan(0.6);
    expect(r.final.temperature).toBeLessThan(0.8);
    // A step 4× larger must conserve energy clearly worse: the check can fail.
    const coarse = runNve({ atoms: 500, steps: 2500, reducedDensity: 0.8442, reducedTemperature: 1.44, seed: 12345, timestep: 0.02 });
    expect(coarse.energyRangePerAtom).toBeGreaterThan(r.energyRangePerAtom);
  });

  it('rejects bad options with a RangeError naming the parameter', () => {
    expect(() => runNve({ atoms: 500, steps: 10, reducedDensity: 0.8, reducedTemperature: 1, cutoff: 5 })).toThrow(/cutoff/);
    expect(() => runNve({ atoms: 500.5, steps: 10, reducedDensity: 0.8, reducedTemperature: 1 })).toThrow(/atoms/);
    expect(() => runNve({ atoms: 32, steps: 10, reducedDensity: 0.8, reducedTemperature: 1 })).toThrow(RangeError);
  });
});
