import { describe, expect, it } from 'vitest';
import { classifyPhase, globalQ6, localDensityStats } from './order-parameter';
import { fccLattice } from './lattice';
import { LjSystem } from './lj-system';
import { Xoshiro128 } from './rng';
import { MD_CHECKS } from '../../validation/checks/md-checks';
import { itPassesReferenceChecks } from '../../validation/reference-check-tests';

function q6OfConfiguration(positions: Float64Array, box: number): { q6: number; bondsPerAtom: number } {
  const s = new LjSystem(positions, box, 2.5, 0.3);
  s.buildList();
  return globalQ6(s.pos, s.box, s.nbStart, s.nbList, s.n);
}

describe('Steinhardt Q6', () => {
  // Steinhardt, Nelson & Ronchetti 1983, Phys. Rev. B 28, 784, Table I: fcc Q6 = 0.575 (0.57452 to 5 digits), simple
  // cubic 0.354, icosahedral cluster 0.663: registry entries md.q6.*.
  itPassesReferenceChecks(MD_CHECKS.filter((c) => c.id.startsWith('md.q6.')));

  it('counts 6 bonds per atom (12 neighbours) in the perfect fcc crystal', () => {
    const lat = fccLattice(500, 1.05);
    expect(q6OfConfiguration(lat.positions, lat.boxLength).bondsPerAtom).toBeCloseTo(6, 10);
  });

  it('is small for randomly placed points', () => {
    // Uncorrelated bond directions: Q6 ~ 1/sqrt(bonds) (Steinhardt et al. 1983, Sec. II); here bonds ≈ 300.
    const g = new Xoshiro128(5);
    const n = 400;
    const box = Math.cbrt(n / 0.8);
    const pos = new Float64Array(3 * n).map(() => g.uniform() * box);
    expect(q6OfConfiguration(pos, box).q6).toBeLessThan(0.15);
  });
});

describe('local density and phase classification', () => {
  it('sees near-Poisson counts for random points and a large spread for a slab', () => {
    // Poisson counts have variance/mean = 1 (an ideal gas); common practice, no source.
    const g = new Xoshiro128(9);
    const n = 2000;
    const box = 20;
    const gas = new Float64Array(3 * n).map(() => g.uniform() * box);
    const ideal = localDensityStats(gas, box, n);
    expect(ideal.varianceToMean).toBeGreaterThan(0.6);
    expect(ideal.varianceToMean).toBeLessThan(1.4);
    // All atoms in a slab filling 40 % of the box along z: empty cells next to full ones.
    const slab = new Float64Array(3 * n);
    for (let i = 0; i < n; i++) {
      slab[3 * i] = g.uniform() * box;
      slab[3 * i + 1] = g.uniform() * box;
      slab[3 * i + 2] = 0.4 * box * g.uniform();
    }
    const split = localDensityStats(slab, box, n);
    expect(split.varianceToMean).toBeGreaterThan(10);
    expect(split.sparseFraction).toBeGreaterThan(0.4);
    expect(classifyPhase(0.05, split.varianceToMean, split.sparseFraction, 5)).toBe('two-phase');
    expect(classifyPhase(0.05, ideal.varianceToMean, ideal.sparseFraction, 5)).toBe('fluid');
    expect(classifyPhase(0.5, 0.1, 0, 6)).toBe('solid');
    // A few accidental bonds in a dilute gas must not count as a crystal.
    expect(classifyPhase(0.5, 1, 0, 0.2)).toBe('fluid');
  });
});
