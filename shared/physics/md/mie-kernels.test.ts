/**
 * The fast Mie λr-6 loops (a power chain per integer λr, a table for the others) against the straightforward formula
 * u = C(r^−λr − r⁻⁶) with Math.pow on every pair of a liquid configuration, and the generated file against its source.
 * Speed is not tested here: `npm run -s bench:md -- --repulsive-exponent 16` measures it (README).
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { miePrefactor } from '../mie-potential';
import { fccLattice } from './lattice';
import { LjSystem } from './lj-system';
import { GENERATED_MIE_EXPONENTS, mieKernelSource } from './mie-kernel-source';
import { mieKernelFor, powerTable, tablePower } from './mie-kernels';
import { Xoshiro128 } from './rng';
import { assignVelocities } from './velocities';

/** A liquid: fcc at ρ* = 0.8442 melted by 300 steps of 12-6 velocity Verlet from T* = 1.44 (the LJ-melt state). */
function liquid(atoms: number): { pos: Float64Array; box: number } {
  const lattice = fccLattice(atoms, 0.8442);
  const s = new LjSystem(lattice.positions, lattice.boxLength, 2.5, 0.3);
  assignVelocities(s, 1.44, new Xoshiro128(7), 'uniform');
  s.buildList();
  s.computeForces();
  for (let step = 0; step < 300; step++) {
    if (s.kickDrift(0.005)) s.buildList();
    s.computeForces();
    s.kick(0.005);
  }
  return { pos: Float64Array.from(s.pos), box: s.box };
}

/** Every pair once with minimum image, r^−λr by Math.pow: the formula written the plain way. */
function straightforward(pos: Float64Array, box: number, rc: number, n: number) {
  const atoms = pos.length / 3;
  const c = miePrefactor(n);
  const f = new Float64Array(3 * atoms);
  let u = 0;
  let w = 0;
  let pairs = 0;
  for (let i = 0; i < atoms; i++) {
    for (let j = i + 1; j < atoms; j++) {
      const d = [0, 1, 2].map((k) => {
        const x = pos[3 * i + k] - pos[3 * j + k];
        return x - box * Math.round(x / box);
      });
      const r = Math.hypot(d[0], d[1], d[2]);
      if (r >= rc) continue;
      pairs++;
      u += c * (Math.pow(r, -n) - Math.pow(r, -6));
      const rF = c * (n * Math.pow(r, -n) - 6 * Math.pow(r, -6));
      w += rF;
      for (let k = 0; k < 3; k++) {
        f[3 * i + k] += (rF * d[k]) / (r * r);
        f[3 * j + k] -= (rF * d[k]) / (r * r);
      }
    }
  }
  return { f, u, w, pairs };
}

function compare(pos: Float64Array, box: number, n: number) {
  const s = new LjSystem(pos, box, 2.5, 0.3, n);
  s.buildList();
  const sums = s.computeForcesAndEnergy();
  const forcesWithSums = Float64Array.from(s.force);
  s.computeForces();
  // The list build re-sorts the atoms: compare with the plain sum on the system's own order.
  const ref = straightforward(s.pos, s.box, 2.5, n);
  let maxDiff = 0;
  let maxForce = 0;
  for (let k = 0; k < ref.f.length; k++) {
    maxDiff = Math.max(maxDiff, Math.abs(s.force[k] - ref.f[k]));
    maxForce = Math.max(maxForce, Math.abs(ref.f[k]));
  }
  return {
    sums,
    ref,
    energyError: Math.abs(sums.potentialTruncated - ref.u) / Math.abs(ref.u),
    virialError: Math.abs(sums.virial - ref.w) / Math.abs(ref.w),
    // Relative to the largest force component: a component that nearly cancels has no meaningful relative error.
    forceError: maxDiff / maxForce,
    sameForces: Array.from(s.force).every((v, k) => v === forcesWithSums[k]),
  };
}

describe('fast Mie λr-6 loops', () => {
  const { pos, box } = liquid(500);

  it.each([
    [8, 'chain'],
    [13, 'chain'],
    [16, 'chain'],
    [14.5, 'table'],
    [36, 'chain'],
  ] as const)('λr = %s (%s): energy, virial and forces equal the straightforward formula to 1e-12 on a liquid', (n, method) => {
    expect(mieKernelFor(n).method).toBe(method);
    const r = compare(pos, box, n);
    expect(r.sums.pairsInside).toBe(r.ref.pairs);
    expect(r.energyError).toBeLessThan(1e-12);
    expect(r.virialError).toBeLessThan(1e-12);
    expect(r.forceError).toBeLessThan(1e-12);
    expect(r.sameForces).toBe(true);
  });

  it('every generated integer λr (8 … 36) and a few other λr agree with the straightforward formula to 1e-12', () => {
    const small = liquid(256);
    for (const n of [...GENERATED_MIE_EXPONENTS, 8.25, 20.5, 35.9]) {
      const r = compare(small.pos, small.box, n);
      expect({ n, pairs: r.sums.pairsInside }).toEqual({ n, pairs: r.ref.pairs });
      expect({ n, worst: Math.max(r.energyError, r.virialError, r.forceError) < 1e-12 }).toEqual({ n, worst: true });
    }
  });

  it('the table gives (r²)^(−λr/2) within 1e-14 relative of Math.pow from r = 0.3σ to 10σ', () => {
    for (const n of [8.5, 14.5, 16.39, 20.5, 26.408, 35.9, 36]) {
      const table = powerTable(n);
      let worst = 0;
      for (let k = 0; k <= 200000; k++) {
        const r2 = 0.09 * Math.pow(100 / 0.09, k / 200000);
        const exact = Math.pow(r2, -n / 2);
        worst = Math.max(worst, Math.abs(tablePower(r2, table) / exact - 1));
      }
      expect({ n, worst: worst < 1e-14 }).toEqual({ n, worst: true });
    }
  });

  it('mie-kernels.generated.ts is what scripts/generate-mie-kernels.ts writes today', () => {
    const file = readFileSync(fileURLToPath(new URL('./mie-kernels.generated.ts', import.meta.url)), 'utf8');
    expect(file === mieKernelSource()).toBe(true);
  });
});
