import { describe, expect, it } from 'vitest';
import { LjSystem, ljPairEnergy, tailEnergyPerAtom, tailPressure } from './lj-system';
import { fccLattice } from './lattice';
import { Xoshiro128 } from './rng';
import { MD_CHECKS } from '../../validation/checks/md-checks';
import { itPassesReferenceChecks } from '../../validation/reference-check-tests';

/** Direct O(N²) minimum-image sums: the definition the list-based code must reproduce. */
function bruteForce(pos: Float64Array, box: number, rc: number): { f: Float64Array; u: number; w: number } {
  const n = pos.length / 3;
  const f = new Float64Array(3 * n);
  let u = 0;
  let w = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const d = [0, 1, 2].map((k) => {
        const x = pos[3 * i + k] - pos[3 * j + k];
        return x - box * Math.round(x / box);
      });
      const r2 = d[0] * d[0] + d[1] * d[1] + d[2] * d[2];
      if (r2 >= rc * rc) continue;
      const ir6 = 1 / (r2 * r2 * r2);
      const ff = (48 * ir6 * (ir6 - 0.5)) / r2;
      u += 4 * ir6 * (ir6 - 1);
      w += ff * r2;
      for (let k = 0; k < 3; k++) {
        f[3 * i + k] += ff * d[k];
        f[3 * j + k] -= ff * d[k];
      }
    }
  }
  return { f, u, w };
}

function jiggledLattice(atoms: number, rho: number, amp: number, seed: number): { pos: Float64Array; box: number } {
  const lat = fccLattice(atoms, rho);
  const g = new Xoshiro128(seed);
  const pos = lat.positions.map((x) => x + amp * (2 * g.uniform() - 1));
  return { pos, box: lat.boxLength };
}

function expectForcesMatch(s: LjSystem, rc: number): void {
  const sums = s.computeForcesAndEnergy();
  const ref = bruteForce(s.pos, s.box, rc);
  expect(sums.potentialTruncated).toBeCloseTo(ref.u, 8);
  expect(sums.virial).toBeCloseTo(ref.w, 7);
  let maxErr = 0;
  for (let k = 0; k < ref.f.length; k++) maxErr = Math.max(maxErr, Math.abs(s.force[k] - ref.f[k]));
  expect(maxErr).toBeLessThan(1e-9);
  const f2 = Float64Array.from(s.force);
  s.computeForces();
  for (let k = 0; k < f2.length; k++) expect(s.force[k]).toBeCloseTo(f2[k], 12);
}

describe('LjSystem', () => {
  // The LAMMPS LJ-melt step-0 potential energy and pressure (bench/in.lj log: fcc ρ* = 0.8442, rc = 2.5, no tail:
  // PE = −6.7733681, P = −5.0197073 for 32000 atoms at T* = 1.44, 3N − 3 degrees of freedom). The lattice sums are per
  // atom and independent of N; the kinetic part of P is ρT(1 − 1/N), so for N = 500 subtract ρT(1/500 − 1/32000).
  // Registry entries md.lammps-melt.*.
  itPassesReferenceChecks(MD_CHECKS.filter((c) => c.id.startsWith('md.lammps-melt.')));

  it('matches direct minimum-image sums with the cell-list build (N = 4000) and the all-pairs build (N = 256)', () => {
    for (const [atoms, rc] of [
      [4000, 2.5],
      [256, 2.5],
      [864, 3.5],
    ] as const) {
      const { pos, box } = jiggledLattice(atoms, 0.8, 0.2, atoms);
      const s = new LjSystem(pos, box, rc, 0.3);
      s.buildList();
      expectForcesMatch(s, rc);
    }
  });

  it('keeps a valid list after atoms move and after uniform box scaling (volume moves)', () => {
    const { pos, box } = jiggledLattice(4000, 0.8, 0.1, 1);
    const s = new LjSystem(pos, box, 2.5, 0.3);
    s.buildList();
    const g = new Xoshiro128(2);
    // Move every atom by up to 0.08σ per axis (< half skin in total) and compress by 2 %.
    for (let k = 0; k < s.pos.length; k++) s.pos[k] += 0.08 * (2 * g.uniform() - 1);
    s.scaleBox(0.98);
    if (s.needsRebuild()) s.buildList();
    expectForcesMatch(s, 2.5);
    // A compression that brings r_list·s below rc (2.8·0.85 = 2.38 < 2.5) forces a rebuild.
    s.scaleBox(0.85);
    expect(s.needsRebuild()).toBe(true);
    s.buildList();
    expectForcesMatch(s, 2.5);
  });

  it('restores state exactly after a rejected move', () => {
    const { pos, box } = jiggledLattice(500, 0.8, 0.1, 3);
    const s = new LjSystem(pos, box, 2.5, 0.3);
    s.buildList();
    const before = s.computeForcesAndEnergy();
    s.saveState();
    s.scaleBox(1.03);
    s.computeForcesAndEnergy();
    s.restoreState();
    const after = s.computeForcesAndEnergy();
    expect(after.potentialTruncated).toBe(before.potentialTruncated);
    expect(s.box).toBe(box);
  });

  it('has tail corrections equal to their defining integrals', () => {
    // Allen & Tildesley 2017, §2.8: U_tail/N = 2πρ∫_rc^∞ r²u(r)dr, P_tail = −(2π/3)ρ²∫_rc^∞ r³u'(r)dr, g = 1 beyond rc.
    // Checked against a midpoint-rule quadrature of those integrals (substitution r = rc/t, t ∈ (0, 1]).
    for (const [rho, rc] of [
      [0.8, 2.5],
      [0.3, 4],
    ]) {
      let iu = 0;
      let ip = 0;
      const m = 200000;
      for (let k = 0; k < m; k++) {
        const t = (k + 0.5) / m;
        const r = rc / t;
        const jac = rc / (t * t);
        const ir6 = 1 / r ** 6;
        iu += r * r * 4 * ir6 * (ir6 - 1) * jac;
        ip += ((r * r * r * (-48 * ir6 * ir6 + 24 * ir6)) / r) * jac;
      }
      iu /= m;
      ip /= m;
      expect(tailEnergyPerAtom(rho, rc)).toBeCloseTo(2 * Math.PI * rho * iu, 8);
      expect(tailPressure(rho, rc)).toBeCloseTo(((-2 * Math.PI) / 3) * rho * rho * ip, 8);
    }
    // u(2^(1/6)) = −1 (minimum of the LJ potential, ε = 1).
    expect(ljPairEnergy(Math.pow(2, 1 / 6))).toBeCloseTo(-1, 12);
  });
});
