/**
 * The Mie λr-6 pair kernel of LjSystem against independent evaluations of the same configuration: a direct
 * O(N²) minimum-image sum written here from u = C[(σ/r)^λr − (σ/r)^6], and LAMMPS `pair_style mie/cut` (run 0,
 * Debian package `lammps`; skipped when `lmp` is not installed), for energy, pressure and the tail corrections.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { miePrefactor } from '../mie-potential';
import { fccLattice } from './lattice';
import { LjSystem, ljPairEnergy, meanFieldShiftPerAtom, tailEnergyPerAtom, tailPressure } from './lj-system';
import { runNve } from './nve';
import { Xoshiro128 } from './rng';

function mieDirect(pos: Float64Array, box: number, rc: number, n: number): { f: Float64Array; u: number; w: number; pairs: number } {
  const atoms = pos.length / 3;
  const c = (n / (n - 6)) * Math.pow(n / 6, 6 / (n - 6));
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
      u += c * (r ** -n - r ** -6);
      const minusDuDr = c * (n * r ** (-n - 1) - 6 * r ** -7);
      w += minusDuDr * r;
      for (let k = 0; k < 3; k++) {
        f[3 * i + k] += (minusDuDr * d[k]) / r;
        f[3 * j + k] -= (minusDuDr * d[k]) / r;
      }
    }
  }
  return { f, u, w, pairs };
}

function jiggled(atoms: number, rho: number, amp: number, seed: number) {
  const lat = fccLattice(atoms, rho);
  const g = new Xoshiro128(seed);
  return { pos: lat.positions.map((x) => x + amp * (2 * g.uniform() - 1)), box: lat.boxLength };
}

function has(program: string): boolean {
  try {
    execFileSync('sh', ['-c', `command -v ${program}`], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

describe('Mie λr-6 pair kernel', () => {
  it('energy, virial, pair count and forces equal a direct minimum-image sum (λr = 16 and 20.5)', () => {
    for (const n of [16, 20.5]) {
      const { pos, box } = jiggled(500, 0.75, 0.08, 3);
      const s = new LjSystem(pos, box, 2.5, 0.3, n);
      s.buildList();
      const sums = s.computeForcesAndEnergy();
      const ref = mieDirect(s.pos, s.box, 2.5, n);
      expect(sums.pairsInside).toBe(ref.pairs);
      expect(Math.abs(sums.potentialTruncated - ref.u)).toBeLessThan(1e-9 * Math.abs(ref.u));
      expect(Math.abs(sums.virial - ref.w)).toBeLessThan(1e-9 * Math.abs(ref.w) + 1e-9);
      let maxErr = 0;
      for (let k = 0; k < ref.f.length; k++) maxErr = Math.max(maxErr, Math.abs(s.force[k] - ref.f[k]));
      expect(maxErr).toBeLessThan(1e-8);
      // computeForces alone gives the same forces.
      const f = Float64Array.from(s.force);
      s.computeForces();
      expect(Array.from(s.force)).toEqual(Array.from(f));
    }
  });

  it('tail corrections: the Mie formulas give the 12-6 ones at λr = 12 and match a numerical integral at λr = 16', () => {
    // Evaluate the Mie branch at λr = 12 by asking for 12 + 1e-12, so the general formula runs.
    expect(Math.abs(tailEnergyPerAtom(0.8, 2.5, 12 + 1e-12) / tailEnergyPerAtom(0.8, 2.5) - 1)).toBeLessThan(1e-9);
    expect(Math.abs(tailPressure(0.8, 2.5, 12 + 1e-12) / tailPressure(0.8, 2.5) - 1)).toBeLessThan(1e-9);
    // 2πρ∫_rc^∞ u r² dr and (2π/3)ρ²∫_rc^∞ r³(−du/dr) dr by the midpoint rule in s = 1/r on (0, 1/rc] (common practice).
    const n = 16;
    const c = miePrefactor(n);
    const rho = 0.8;
    const rc = 2.5;
    let iu = 0;
    let ip = 0;
    const m = 200000;
    for (let k = 0; k < m; k++) {
      const sv = ((k + 0.5) / m) * (1 / rc);
      const r = 1 / sv;
      const dr = (1 / rc / m) * r * r; // |dr/ds| ds
      iu += c * (r ** -n - r ** -6) * r * r * dr;
      ip += c * (n * r ** -n - 6 * r ** -6) * r * r * dr; // r³(−du/dr) = c(n r^−n − 6 r^−6)·r²
    }
    expect(Math.abs(tailEnergyPerAtom(rho, rc, n) / (2 * Math.PI * rho * iu) - 1)).toBeLessThan(1e-6);
    expect(Math.abs(tailPressure(rho, rc, n) / (((2 * Math.PI) / 3) * rho * rho * ip) - 1)).toBeLessThan(1e-6);
    expect(meanFieldShiftPerAtom(rho, rc, n)).toBeCloseTo(((2 * Math.PI) / 3) * rho * rc ** 3 * ljPairEnergy(rc, n), 14);
  });

  it('NVE with the Mie 16-6 kernel conserves the shifted energy', () => {
    // Velocity Verlet drift at dt = 0.004 over 400 steps stays within 1e-3 ε per atom for a stiff repulsion (common practice).
    const r = runNve({
      atoms: 256,
      steps: 400,
      reducedDensity: 0.8,
      reducedTemperature: 1.2,
      timestep: 0.004,
      thermoEvery: 20,
      repulsiveExponent: 16,
    });
    expect(Math.abs(r.energyRangePerAtom)).toBeLessThan(1e-3);
    expect(r.final.temperature).toBeGreaterThan(0.3);
  });

  it.skipIf(!has('lmp'))(
    'potential energy, pressure and tail corrections equal LAMMPS pair_style mie/cut on the same configuration',
    () => {
      const n = 16;
      const { pos, box } = jiggled(256, 0.7, 0.05, 9);
      const s = new LjSystem(pos, box, 2.5, 0.3, n);
      s.buildList();
      const sums = s.computeForcesAndEnergy();
      const atoms = pos.length / 3;
      const ours = { pe: sums.potentialTruncated, press: sums.virial / (3 * s.volume) };
      const dir = mkdtempSync(join(tmpdir(), 'epsigma-mie-'));
      try {
        const lines = [
          'Mie test configuration',
          '',
          `${atoms} atoms`,
          '1 atom types',
          '',
          `0 ${box} xlo xhi`,
          `0 ${box} ylo yhi`,
          `0 ${box} zlo zhi`,
          '',
          'Masses',
          '',
          '1 1.0',
          '',
          'Atoms # atomic',
          '',
        ];
        for (let i = 0; i < atoms; i++) {
          const w = (v: number) => ((v % box) + box) % box;
          lines.push(
            `${i + 1} 1 ${w(s.pos[3 * i]).toPrecision(17)} ${w(s.pos[3 * i + 1]).toPrecision(17)} ${w(s.pos[3 * i + 2]).toPrecision(17)}`,
          );
        }
        writeFileSync(join(dir, 'conf.data'), lines.join('\n') + '\n');
        const run = (tail: 'yes' | 'no') => {
          writeFileSync(
            join(dir, 'in.mie'),
            [
              'units lj',
              'atom_style atomic',
              'boundary p p p',
              'read_data conf.data',
              `pair_style mie/cut 2.5`,
              `pair_coeff 1 1 1.0 1.0 ${n} 6`,
              `pair_modify tail ${tail}`,
              'thermo_style custom step pe press',
              'thermo_modify norm no format float %22.15g',
              'run 0',
            ].join('\n'),
          );
          const out = execFileSync('lmp', ['-in', 'in.mie', '-log', 'none'], { cwd: dir, encoding: 'utf8' }).split('\n');
          const k = out.findIndex((l) => /^\s*Step\s+PotEng\s+Press/.test(l));
          expect(k).toBeGreaterThan(-1);
          const [, pe, press] = out[k + 1].trim().split(/\s+/).map(Number);
          return { pe, press };
        };
        const plain = run('no');
        expect(Math.abs(plain.pe - ours.pe)).toBeLessThan(1e-9 * Math.abs(ours.pe));
        expect(Math.abs(plain.press - ours.press)).toBeLessThan(1e-9 * Math.abs(ours.press) + 1e-12);
        const tail = run('yes');
        const rho = atoms / s.volume;
        expect(Math.abs(tail.pe - plain.pe - atoms * tailEnergyPerAtom(rho, 2.5, n))).toBeLessThan(1e-9 * Math.abs(plain.pe));
        expect(Math.abs(tail.press - plain.press - tailPressure(rho, 2.5, n))).toBeLessThan(1e-9 * Math.abs(plain.press) + 1e-12);
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
    },
  );
});
