/**
 * Reference checks of the molecular-dynamics engine that run in milliseconds (lattice sums, order parameters, the
 * random-number generator, tail corrections), and the simulation checks that take minutes and stay in the test suite.
 */
import { ljEosDensity, ljTailCorrections } from '../../physics/lj-eos';
import { fccLattice } from '../../physics/md/lattice';
import { LjSystem } from '../../physics/md/lj-system';
import { globalQ6, globalQ6FromBonds } from '../../physics/md/order-parameter';
import { Xoshiro128 } from '../../physics/md/rng';
import { reducedB2 } from '../../physics/virial';
import { absolute, closeToDigits, type ReferenceCheck, type TestSuiteOnlyCheck } from '../reference-check';

const LJ_SYSTEM_TEST = 'shared/physics/md/lj-system.test.ts';
const ORDER_TEST = 'shared/physics/md/order-parameter.test.ts';
const RNG_TEST = 'shared/physics/md/rng.test.ts';
const JZG_TEST = 'shared/physics/lj-eos.test.ts';

/** Step 0 of the LAMMPS LJ-melt benchmark on 500 atoms: fcc ρ* = 0.8442, rc = 2.5, no tail. */
function ljMeltStepZero(): { energyPerAtom: number; pressure: number } {
  const lat = fccLattice(500, 0.8442);
  const s = new LjSystem(lat.positions, lat.boxLength, 2.5, 0.3);
  s.buildList();
  const sums = s.computeForcesAndEnergy();
  return { energyPerAtom: sums.potentialTruncated / 500, pressure: 0.8442 * 1.44 * (1 - 1 / 500) + sums.virial / (3 * s.volume) };
}
const LAMMPS_MELT = 'LAMMPS bench/in.lj log, step 0 (32000 atoms; lattice sums per atom do not depend on N)';

const icosahedronBonds = (): number[] => {
  const phi = (1 + Math.sqrt(5)) / 2;
  const bonds: number[] = [];
  for (const a of [-1, 1]) for (const b of [-phi, phi]) bonds.push(0, a, b, a, b, 0, b, 0, a);
  return bonds;
};
const STEINHARDT = 'Steinhardt, Nelson & Ronchetti 1983, Phys. Rev. B 28, 784, Table I';

// Blackman & Vigna, xoshiro128starstar.c (prng.di.unimi.it), compiled with gcc and run from s = {1,2,3,4}; the same six
// numbers are the reference vector of the Rust crate rand_xoshiro (from memory).
export const XOSHIRO128_REFERENCE = [11520, 0, 5927040, 70819200, 2031721883, 1637235492];

// Allen & Tildesley 2017, §2.8 formulas evaluated by hand (see the comments in lj-eos.test.ts).
const TAIL_HAND: Array<[string, number, number, 'energyPerParticle' | 'pressure' | 'potentialAtCutoff', number, number]> = [
  ['energy', 0.8, 2.5, 'energyPerParticle', -0.428346, 6],
  ['pressure', 0.8, 2.5, 'pressure', -0.684417, 5],
  ['potential-at-cutoff', 0.8, 2.5, 'potentialAtCutoff', -0.0163169, 7],
  ['energy', 0.5, 3, 'energyPerParticle', -0.155069, 5],
  ['pressure', 0.5, 3, 'pressure', -0.154999, 5],
];

export const MD_CHECKS: ReferenceCheck[] = [
  {
    id: 'md.lammps-melt.energy',
    area: 'Molecular dynamics',
    quantity: 'potential energy per atom at step 0',
    unit: 'ε',
    state: 'fcc ρ* = 0.8442, rc = 2.5σ, 500 atoms',
    source: LAMMPS_MELT,
    reference: -6.7733681,
    tolerance: closeToDigits(7),
    testFile: LJ_SYSTEM_TEST,
    compute: () => ljMeltStepZero().energyPerAtom,
  },
  {
    id: 'md.lammps-melt.pressure',
    area: 'Molecular dynamics',
    quantity: 'pressure at step 0 (kinetic part ρT(1 − 1/N) for N = 500)',
    unit: 'ε/σ³',
    state: 'fcc ρ* = 0.8442, T* = 1.44, rc = 2.5σ, 500 atoms',
    source: `${LAMMPS_MELT}: −5.0197073, moved to N = 500 by −ρT(1/500 − 1/32000)`,
    reference: -5.0197073 - 0.8442 * 1.44 * (1 / 500 - 1 / 32000),
    tolerance: closeToDigits(6),
    testFile: LJ_SYSTEM_TEST,
    compute: () => ljMeltStepZero().pressure,
  },
  {
    id: 'md.q6.fcc',
    area: 'Molecular dynamics',
    quantity: 'Steinhardt Q6 of a perfect fcc crystal',
    unit: '1',
    state: '500 atoms, ρ* = 1.05',
    source: `${STEINHARDT}: 0.575 (0.57452 to 5 digits)`,
    reference: 0.57452,
    tolerance: closeToDigits(4),
    testFile: ORDER_TEST,
    compute: () => {
      const lat = fccLattice(500, 1.05);
      const s = new LjSystem(lat.positions, lat.boxLength, 2.5, 0.3);
      s.buildList();
      return globalQ6(s.pos, s.box, s.nbStart, s.nbList, s.n).q6;
    },
  },
  {
    id: 'md.q6.simple-cubic',
    area: 'Molecular dynamics',
    quantity: 'Steinhardt Q6, simple cubic',
    unit: '1',
    state: '6 neighbours',
    source: `${STEINHARDT}: 0.354`,
    reference: 0.35355,
    tolerance: closeToDigits(4),
    testFile: ORDER_TEST,
    compute: () => globalQ6FromBonds([1, 0, 0, 0, 1, 0, 0, 0, 1]),
  },
  {
    id: 'md.q6.icosahedron',
    area: 'Molecular dynamics',
    quantity: 'Steinhardt Q6, icosahedral cluster',
    unit: '1',
    state: '12 neighbours',
    source: `${STEINHARDT}: 0.663`,
    reference: 0.66332,
    tolerance: closeToDigits(4),
    testFile: ORDER_TEST,
    compute: () => globalQ6FromBonds(icosahedronBonds()),
  },
  ...XOSHIRO128_REFERENCE.map((value, i): ReferenceCheck => ({
    id: `md.xoshiro128.output${i + 1}`,
    area: 'Molecular dynamics',
    quantity: `xoshiro128** output ${i + 1} (exact integer)`,
    unit: '1',
    state: 'state {1, 2, 3, 4}',
    source: 'Blackman & Vigna, xoshiro128starstar.c reference implementation; rand_xoshiro test vector (from memory)',
    reference: value,
    tolerance: absolute(0.5),
    testFile: RNG_TEST,
    compute: () => {
      const g = Xoshiro128.fromState(1, 2, 3, 4);
      let out = 0;
      for (let k = 0; k <= i; k++) out = g.nextUint32();
      return out;
    },
  })),
  ...TAIL_HAND.map(([what, rho, rc, field, value, digits]): ReferenceCheck => ({
    id: `md.tail.${what}.rho${rho}.rc${rc}`,
    area: 'Molecular dynamics',
    quantity: field === 'energyPerParticle' ? 'tail correction to U/N' : field === 'pressure' ? 'tail correction to P*' : 'u(rc)',
    unit: field === 'pressure' ? 'ε/σ³' : 'ε',
    state: `ρ* = ${rho}, rc = ${rc}σ`,
    source: 'Allen & Tildesley 2017, §2.8 formulas, evaluated by hand',
    reference: value,
    tolerance: closeToDigits(digits),
    testFile: JZG_TEST,
    compute: () => ljTailCorrections(rho, rc)[field],
  })),
];

const TOO_SLOW = 'run in the test suite only (too slow for a page)';
const NIST_MC = 'NIST SRSW, LJ fluid, NVT Monte Carlo, N = 500, rc = 3σ + LRC, mmlapps.nist.gov/srs/LJ_PURE/mc.htm';
const virialDensity = (t: number, p: number) => {
  const b2 = reducedB2(t) * ((2 * Math.PI) / 3);
  return (-1 + Math.sqrt(1 + (4 * b2 * p) / t)) / (2 * b2);
};

// NIST SRSW, LJ fluid, MC NVT, N = 500, rc = 3σ with analytic long-range corrections: energies with their quoted
// uncertainties as reproduced in a public HOOMD-blue validation test; pressures from the same table.
export const NIST_NVT_MC_500: Array<{ t: number; rho: number; u: number; uErr: number; p: number }> = [
  { t: 0.85, rho: 0.776, u: -5.5121, uErr: 4.55e-4, p: 6.7714e-3 },
  { t: 0.9, rho: 0.776, u: -5.4689, uErr: 4.2e-4, p: 2.4056e-1 },
];

/** NPT states compared with the JZG 1993 equation in npt-eos.test.ts. */
export const NPT_EOS_STATES: Array<[number, number, string]> = [
  [1.0, 1.0, 'liquid'],
  [1.2, 0.5, 'liquid near the critical temperature'],
  [1.5, 2.0, 'supercritical, liquid-like'],
  [2.0, 5.0, 'supercritical, dense'],
];

export const MD_TEST_SUITE_ONLY: TestSuiteOnlyCheck[] = [
  ...NIST_NVT_MC_500.flatMap(({ t, u, p }): TestSuiteOnlyCheck[] => [
    {
      id: `md.nvt.nist.u.t${t}`,
      area: 'Molecular dynamics',
      quantity: 'NVT U*/N (with long-range corrections)',
      unit: 'ε',
      state: `T* = ${t}, ρ* = 0.776, 500 atoms, 12 000 steps`,
      source: NIST_MC,
      reference: u,
      tolerance: '3 standard errors of run and reference combined',
      testFile: 'shared/physics/md/nvt.test.ts',
      why: `${TOO_SLOW}: one run of 6 M atom-steps, 10–60 s of one core`,
    },
    {
      id: `md.nvt.nist.p.t${t}`,
      area: 'Molecular dynamics',
      quantity: 'NVT P* (with long-range corrections)',
      unit: 'ε/σ³',
      state: `T* = ${t}, ρ* = 0.776, 500 atoms, 12 000 steps`,
      source: NIST_MC,
      reference: p,
      tolerance: '3 standard errors of the run + 0.01',
      testFile: 'shared/physics/md/nvt.test.ts',
      why: `${TOO_SLOW}: one run of 6 M atom-steps, 10–60 s of one core`,
    },
  ]),
  ...NPT_EOS_STATES.map(([t, p]): TestSuiteOnlyCheck => ({
    id: `md.npt.jzg.t${t}.p${p}`,
    area: 'Molecular dynamics',
    quantity: 'NPT ρ* against the JZG 1993 equation of state',
    unit: 'σ⁻³',
    state: `T* = ${t}, P* = ${p}, 500 atoms, 12 000 steps`,
    source: 'Johnson, Zollweg & Gubbins 1993, Mol. Phys. 78, 591 (equation of state)',
    reference: ljEosDensity(t, p).reducedDensity,
    tolerance: '3 standard errors of the run + 0.5 %',
    testFile: 'shared/physics/md/npt-eos.test.ts',
    why: `${TOO_SLOW}: one run of 6 M atom-steps, 10–60 s of one core`,
  })),
  {
    id: 'md.npt.dilute-virial',
    area: 'Molecular dynamics',
    quantity: 'NPT ρ* of the dilute gas against P/T = ρ(1 + B2ρ)',
    unit: 'σ⁻³',
    state: 'T* = 2.0, P* = 0.05, 500 atoms, 12 000 steps',
    source: 'second-virial equation with B2* of Hirschfelder, Curtiss & Bird 1954 (B2*(2.0) = −0.628, from memory)',
    reference: virialDensity(2.0, 0.05),
    tolerance: '3 standard errors of the run + 0.3 %',
    testFile: 'shared/physics/md/npt.test.ts',
    why: `${TOO_SLOW}: one run of 6 M atom-steps, 10–60 s of one core`,
  },
  {
    id: 'md.npt.fluctuation.d-rho-d-p',
    area: 'Molecular dynamics',
    quantity: '(∂ρ*/∂P*)_T from NPT fluctuations against the JZG 1993 equation',
    unit: '1/ε (reduced units)',
    state: 'T* = 1.0, P* = 1.0, 500 atoms, 40 000 steps',
    source: 'Johnson, Zollweg & Gubbins 1993 equation of state, (∂ρ/∂P)_T = 1/(∂P/∂ρ)_T',
    reference: ljEosDensity(1.0, 1.0).dRhoDP,
    tolerance: '3 standard errors of the run + 10 %',
    testFile: 'shared/physics/md/npt-fluctuations.test.ts',
    why: `${TOO_SLOW}: one run of 20 M atom-steps, about a minute`,
  },
  {
    id: 'md.npt.fluctuation.d-rho-d-t',
    area: 'Molecular dynamics',
    quantity: '(∂ρ*/∂T*)_P from NPT fluctuations against the JZG 1993 equation',
    unit: 'σ⁻³ per ε/k_B',
    state: 'T* = 1.0, P* = 1.0, 500 atoms, 40 000 steps',
    source: 'Johnson, Zollweg & Gubbins 1993 equation of state, (∂ρ/∂T)_P = −(∂P/∂T)_ρ/(∂P/∂ρ)_T',
    reference: ljEosDensity(1.0, 1.0).dRhoDT,
    tolerance: '3 standard errors of the run + 10 %',
    testFile: 'shared/physics/md/npt-fluctuations.test.ts',
    why: `${TOO_SLOW}: one run of 20 M atom-steps, about a minute`,
  },
  {
    id: 'md.nvt.kinetic-variance',
    area: 'Molecular dynamics',
    quantity: 'Var(K) of the CSVR thermostat over its canonical value (Nf/2)T*²',
    unit: '1',
    state: 'T* = 0.9, ρ* = 0.776, 256 atoms, 12 000 steps',
    source: 'Bussi, Donadio & Parrinello 2007, Sec. II (canonical kinetic-energy distribution)',
    reference: 1,
    tolerance: '3 standard errors of the variance estimate',
    testFile: 'shared/physics/md/nvt.test.ts',
    why: `${TOO_SLOW}: two runs of 3 M atom-steps, 10–60 s of one core`,
  },
];
