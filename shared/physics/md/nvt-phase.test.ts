import { describe, expect, it } from 'vitest';
import { runNvt } from './nvt';

describe('phase check on vapour–liquid coexistence', () => {
  it('flags T* = 0.7, ρ* = 0.3 as two-phase and passes the supercritical fluid at T* = 2.0, ρ* = 0.3', () => {
    // T* = 0.7 is below the LJ critical temperature (T*c ≈ 1.31) and ρ* = 0.3 lies between the coexisting vapour
    // (≈ 0.002) and liquid (≈ 0.80) densities (NIST SRSW SAT-TMMC, rc = 3σ, from memory), so a homogeneous start
    // separates into vapour and liquid; at T* = 2.0 the same density is a single supercritical phase.
    const split = runNvt({ reducedTemperature: 0.7, reducedDensity: 0.3, atoms: 500, steps: 8000, seed: 1 });
    expect(split.phase).toBe('two-phase');
    expect(split.orderParameter.localDensityVarianceToMean).toBeGreaterThan(3);
    const one = runNvt({ reducedTemperature: 2.0, reducedDensity: 0.3, atoms: 500, steps: 8000, seed: 1 });
    expect(one.phase).toBe('fluid');
    expect(one.orderParameter.localDensityVarianceToMean).toBeLessThan(1.5);
  });
});
