/**
 * Runs the exported fragments in the real engines when they are installed (Debian packages `lammps` and
 * `gromacs` provide `lmp` and `gmx`), and is skipped otherwise. Two atoms at a fixed distance, zero steps:
 * the engine's pair energy must equal 4ε[(σ/r)^12 − (σ/r)^6] (Lennard-Jones 1924 form as documented for
 * LAMMPS pair lj/cut and GROMACS), minus its value at rc for the shifted scheme, plus the analytic
 * long-range correction for the tail scheme.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { exportMixture, exportParameterSet, type ExportableParameterSet } from './parameter-set-export';
import { gromacsTypeName } from './gromacs-export';
import { brindleShifted, oskaneShifted, oskaneTail } from './export-test-sets';
import { combine } from '../mixing/combining-rules';

function has(program: string): boolean {
  try {
    execFileSync('sh', ['-c', `command -v ${program}`], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

/**
 * Debian's GROMACS 2022 is built to read the time-stamp counter with RDTSCP; on a CPU (or virtual machine)
 * that does not offer the instruction, mdrun stops before computing anything. grompp still runs there.
 */
function gromacsMdrunRuns(): boolean {
  if (!has('gmx')) return false;
  const version = execFileSync('gmx', ['-quiet', '-version'], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
  const needsRdtscp = /RDTSCP usage:\s*enabled/.test(version);
  const cpuHasRdtscp = !existsSync('/proc/cpuinfo') || /\brdtscp\b/.test(readFileSync('/proc/cpuinfo', 'utf8'));
  return !needsRdtscp || cpuHasRdtscp;
}

// Independent unit factors: R = 8.314462618 J/(mol K), thermochemical calorie 4.184 J (CODATA 2018; NIST SP 811).
const KCAL_PER_MOL_PER_K = 8.314462618 / 4184;
const KJ_PER_MOL_PER_K = 8.314462618 / 1000;
const lj = (eps: number, sigma: number, r: number) => 4 * eps * ((sigma / r) ** 12 - (sigma / r) ** 6);

function withDir<T>(fn: (dir: string) => T): T {
  const dir = mkdtempSync(join(tmpdir(), 'epsigma-engine-'));
  try {
    return fn(dir);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/**
 * LAMMPS pair energy of two atoms of the given types at distance r in a periodic box of side 2·half:
 * kcal/mol and Å in `units real`, ε and σ of type 1 in `units lj`.
 */
function lammpsEnergy(
  fragment: string,
  types: [number, number],
  ntypes: number,
  rAngstrom: number,
  units: 'real' | 'lj' = 'real',
  half = 25,
): number {
  return withDir((dir) => {
    const input = [
      `units ${units}`,
      'atom_style atomic',
      'boundary p p p',
      `region box block -${half} ${half} -${half} ${half} -${half} ${half}`,
      `create_box ${ntypes} box`,
      `create_atoms ${types[0]} single 0 0 0`,
      `create_atoms ${types[1]} single ${rAngstrom} 0 0`,
      fragment,
      'thermo_style custom step evdwl',
      'thermo_modify norm no format float %22.15g',
      'run 0',
    ].join('\n');
    writeFileSync(join(dir, 'in.test'), input);
    const out = execFileSync('lmp', ['-in', 'in.test', '-log', 'none'], { cwd: dir, encoding: 'utf8' });
    const lines = out.split('\n');
    const k = lines.findIndex((l) => /^\s*Step\s+E_vdwl/.test(l));
    expect(k).toBeGreaterThan(-1);
    return Number(lines[k + 1].trim().split(/\s+/)[1]);
  });
}

/** GROMACS LJ (SR) and dispersion correction (kJ/mol) of two atoms rNm apart in a 5 nm box. */
function gromacsEnergy(
  fragment: string,
  sets: ExportableParameterSet[],
  molTypes: [number, number],
  rNm: number,
  only: { preprocessOnly?: boolean } = {},
): { ljSr: number; dispCorr: number } {
  return withDir((dir) => {
    const mols = sets
      .map(
        (s, k) =>
          `[ moleculetype ]\nM${k + 1} 1\n[ atoms ]\n1 ${gromacsTypeName(s)} 1 M${k + 1} A${k + 1} 1 0.0 ${s.substance.molarMassGPerMol}\n`,
      )
      .join('\n');
    const top = `[ defaults ]\n1 2 no 1.0 1.0\n\n${fragment}\n${mols}\n[ system ]\ntwo atoms\n[ molecules ]\n${molTypes.map((t) => `M${t + 1} 1`).join('\n')}\n`;
    const gro =
      `two atoms\n2\n` +
      molTypes
        .map(
          (t, k) =>
            `${String(k + 1).padStart(5)}${`M${t + 1}`.padEnd(5)}${`A${t + 1}`.padStart(5)}${String(k + 1).padStart(5)}${(k * rNm).toFixed(3).padStart(8)}   0.000   0.000\n`,
        )
        .join('') +
      '   5.00000   5.00000   5.00000\n';
    const mdpFromFragment = fragment
      .split('\n')
      .filter((l) => /^; (cutoff-scheme|vdwtype|rvdw|vdw-modifier|DispCorr) = /.test(l))
      .map((l) => l.slice(2));
    expect(mdpFromFragment).toHaveLength(5);
    const rvdw = mdpFromFragment
      .find((l) => l.startsWith('rvdw'))!
      .split('=')[1]
      .trim();
    const mdp = [
      'integrator = md',
      'nsteps = 0',
      'nstcalcenergy = 1',
      'nstenergy = 1',
      'continuation = yes',
      'coulombtype = Cut-off',
      `rcoulomb = ${rvdw}`,
      'verlet-buffer-tolerance = -1',
      `rlist = ${rvdw}`,
      ...mdpFromFragment,
    ];
    writeFileSync(join(dir, 'topol.top'), top);
    writeFileSync(join(dir, 'conf.gro'), gro);
    writeFileSync(join(dir, 'run.mdp'), mdp.join('\n') + '\n');
    const grompp = execFileSync(
      'gmx',
      ['-quiet', 'grompp', '-f', 'run.mdp', '-c', 'conf.gro', '-p', 'topol.top', '-o', 'run.tpr', '-maxwarn', '0'],
      { cwd: dir, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] },
    );
    expect(grompp).not.toMatch(/WARNING/); // and -maxwarn 0 makes grompp exit non-zero on any warning
    if (only.preprocessOnly) return { ljSr: NaN, dispCorr: NaN };
    execFileSync('gmx', ['-quiet', 'mdrun', '-nt', '1', '-s', 'run.tpr', '-deffnm', 'run'], { cwd: dir, stdio: 'ignore' });
    // Ask for both terms; a term the run does not have is reported on stderr and skipped.
    const energy = execFileSync('gmx', ['-quiet', 'energy', '-f', 'run.edr', '-o', 'e.xvg'], {
      cwd: dir,
      input: 'LJ-(SR)\nDisper.-corr.\n\n',
      encoding: 'utf8',
      stdio: ['pipe', 'pipe', 'pipe'],
    });
    const value = (name: RegExp): number | null => {
      const line = energy.split('\n').find((l) => name.test(l));
      return line ? Number(line.trim().split(/\s{2,}/)[1]) : null;
    };
    const ljSr = value(/^LJ \(SR\)/);
    expect(ljSr).not.toBeNull();
    const dispCorr = value(/^Disper\. corr\./) ?? 0;
    return { ljSr: ljSr as number, dispCorr };
  });
}

describe.skipIf(!has('lmp'))('LAMMPS runs the exported fragments', () => {
  it('truncated-shifted set: energy of the shifted potential', () => {
    const eps = brindleShifted.epsilonK * KCAL_PER_MOL_PER_K;
    const s = brindleShifted.sigmaAngstrom;
    const e = lammpsEnergy(exportParameterSet(brindleShifted, 'lammps-real').body, [1, 1], 1, 3.8);
    expect(e).toBeCloseTo(lj(eps, s, 3.8) - lj(eps, s, 2.5 * s), 7);
  });

  it('units lj: the reduced fragment gives the same pair energy in units of ε at r/σ, and states the scales', () => {
    const set = brindleShifted;
    const body = exportParameterSet(set, 'lammps-lj').body;
    const rStar = 3.8 / set.sigmaAngstrom;
    const eStar = lammpsEnergy(body, [1, 1], 1, rStar, 'lj', 8);
    expect(eStar).toBeCloseTo(lj(1, 1, rStar) - lj(1, 1, 2.5), 9);
    // Back in kcal/mol it is the real-units energy: E = E*·ε.
    const eReal = lammpsEnergy(exportParameterSet(set, 'lammps-real').body, [1, 1], 1, 3.8);
    expect(eStar * set.epsilonK * KCAL_PER_MOL_PER_K).toBeCloseTo(eReal, 7);
    // The stated scales, computed independently: τ = σ√(m/ε) with m = M/N_A, ε = k_B·ε/k_B (CODATA 2018 constants).
    const tauPs =
      set.sigmaAngstrom * 1e-10 * Math.sqrt(set.substance.molarMassGPerMol / 1000 / 6.02214076e23 / (set.epsilonK * 1.380649e-23)) * 1e12;
    const stated = Number(/tau = sigma sqrt\(m\/epsilon\) = \S+ s = (\S+) ps/.exec(body)![1]);
    expect(stated / tauPs).toBeCloseTo(1, 6);
    expect(body).toContain(`length sigma = ${set.sigmaAngstrom} Angstrom`);
    expect(body).toContain(`mass m = ${set.substance.molarMassGPerMol} g/mol`);
    expect(body).toContain(`energy epsilon = ${set.epsilonK} K x k_B`);
  });

  it('units lj mixture: the 1-2 pair is the Kong cross pair in units of type 1', () => {
    const k = combine('kong', brindleShifted, oskaneShifted);
    const epsStar = k.epsilonK / brindleShifted.epsilonK;
    const sStar = k.sigmaAngstrom / brindleShifted.sigmaAngstrom;
    const rStar = 3.9 / brindleShifted.sigmaAngstrom;
    const e = lammpsEnergy(exportMixture([brindleShifted, oskaneShifted], 'kong', 'lammps-lj').body, [1, 2], 2, rStar, 'lj', 8);
    expect(e).toBeCloseTo(lj(epsStar, sStar, rStar) - lj(epsStar, sStar, 2.5 * sStar), 9);
  });

  it('truncated-tail set: pair energy plus the analytic tail correction', () => {
    // Tail energy for one species: (8/3)πNρεσ³[(1/3)(σ/rc)⁹ − (σ/rc)³] (Allen & Tildesley, Computer
    // Simulation of Liquids, 2nd ed. 2017, eq. 2.144; from memory), N = 2, ρ = N/V, V = (50 Å)³.
    const eps = oskaneTail.epsilonK * KCAL_PER_MOL_PER_K;
    const s = oskaneTail.sigmaAngstrom;
    const rc = 3 * s;
    const tail = (8 / 3) * Math.PI * 2 * (2 / 50 ** 3) * eps * s ** 3 * ((1 / 3) * (s / rc) ** 9 - (s / rc) ** 3);
    const e = lammpsEnergy(exportParameterSet(oskaneTail, 'lammps-real').body, [1, 1], 1, 4.0);
    expect(e).toBeCloseTo(lj(eps, s, 4.0) + tail, 7);
  });

  it('mixture: the 1-2 pair uses the Kong cross parameters and its own cutoff', () => {
    const k = combine('kong', brindleShifted, oskaneShifted);
    const eps = k.epsilonK * KCAL_PER_MOL_PER_K;
    const e = lammpsEnergy(exportMixture([brindleShifted, oskaneShifted], 'kong', 'lammps-real').body, [1, 2], 2, 3.9);
    expect(e).toBeCloseTo(lj(eps, k.sigmaAngstrom, 3.9) - lj(eps, k.sigmaAngstrom, 2.5 * k.sigmaAngstrom), 7);
  });
});

describe.skipIf(!has('gmx'))('GROMACS preprocesses the exported fragments', () => {
  it('grompp accepts every set and the mixture without a warning', () => {
    for (const [fragment, sets, types] of [
      [exportParameterSet(brindleShifted, 'gromacs').body, [brindleShifted], [0, 0]],
      [exportParameterSet(oskaneTail, 'gromacs').body, [oskaneTail], [0, 0]],
      [exportMixture([brindleShifted, oskaneShifted], 'kong', 'gromacs').body, [brindleShifted, oskaneShifted], [0, 1]],
    ] as Array<[string, ExportableParameterSet[], [number, number]]>) {
      expect(() => gromacsEnergy(fragment, sets, types, 0.4, { preprocessOnly: true })).not.toThrow();
    }
  });
});

describe.skipIf(!gromacsMdrunRuns())('GROMACS runs the exported fragments', () => {
  it('truncated-shifted set: grompp accepts it and LJ (SR) is the shifted potential', () => {
    const eps = brindleShifted.epsilonK * KJ_PER_MOL_PER_K;
    const s = brindleShifted.sigmaAngstrom / 10;
    const { ljSr } = gromacsEnergy(exportParameterSet(brindleShifted, 'gromacs').body, [brindleShifted], [0, 0], 0.38);
    expect(ljSr).toBeCloseTo(lj(eps, s, 0.38) - lj(eps, s, 2.5 * s), 5);
  });

  it('truncated-tail set: plain cutoff plus the dispersion correction', () => {
    // GROMACS EnerPres energy correction for one atom type: −(2/3)πN²⟨C6⟩/(V rc³), C6 = 4εσ⁶
    // (GROMACS reference manual, "Long range Van der Waals interactions", dispersion correction; from memory).
    const eps = oskaneTail.epsilonK * KJ_PER_MOL_PER_K;
    const s = oskaneTail.sigmaAngstrom / 10;
    const { ljSr, dispCorr } = gromacsEnergy(exportParameterSet(oskaneTail, 'gromacs').body, [oskaneTail], [0, 0], 0.4);
    expect(ljSr).toBeCloseTo(lj(eps, s, 0.4), 5);
    expect(dispCorr / ((((-(2 / 3) * Math.PI * 4) / 125) * (4 * eps * s ** 6)) / (3 * s) ** 3)).toBeCloseTo(1, 4);
  });

  it('mixture: [ nonbond_params ] gives the Kong cross pair', () => {
    const k = combine('kong', brindleShifted, oskaneShifted);
    const eps = k.epsilonK * KJ_PER_MOL_PER_K;
    const s = k.sigmaAngstrom / 10;
    const { ljSr } = gromacsEnergy(
      exportMixture([brindleShifted, oskaneShifted], 'kong', 'gromacs').body,
      [brindleShifted, oskaneShifted],
      [0, 1],
      0.39,
    );
    expect(ljSr).toBeCloseTo(lj(eps, s, 0.39) - lj(eps, s, 0.9), 5); // one rvdw = 2.5 × 0.36 nm
  });
});
