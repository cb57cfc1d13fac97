/**
 * Exports of a Mie λr-6 set: LAMMPS gets its native pair_style mie/cut (and the fragment runs in LAMMPS, giving the
 * Mie pair energy of two atoms: u = C ε[(σ/r)^λr − (σ/r)^6], Lafitte et al. 2013 eq. 2, as documented for LAMMPS
 * pair mie/cut), GROMACS is refused with the reason, JSON and CSV carry the model and λr.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { brindleShifted, oskaneTail } from './export-test-sets';
import { checkJsonSchema } from './json-schema-check';
import { PARAMETER_SET_JSON_SCHEMA } from './json-schema';
import { exportMixture, exportParameterSet, type ExportableParameterSet } from './parameter-set-export';

const mie: ExportableParameterSet = {
  ...oskaneTail,
  id: 31,
  model: 'mie',
  repulsiveExponent: 16,
  scheme: 'full-potential',
  cutoffSigma: null,
};
const has = (program: string) => {
  try {
    execFileSync('sh', ['-c', `command -v ${program}`], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
};
// R = 8.314462618 J/(mol K) and the thermochemical calorie 4.184 J (CODATA 2018; NIST SP 811).
const KCAL_PER_MOL_PER_K = 8.314462618 / 4184;

describe('Mie λr-6 exports', () => {
  it('LAMMPS: pair_style mie/cut with ε, σ, λr and 6, and the header names the Mie form', () => {
    const real = exportParameterSet(mie, 'lammps-real').body;
    expect(real).toMatch(/^pair_style mie\/cut [\d.]+$/m);
    expect(real).toMatch(new RegExp(`^pair_coeff 1 1 [\\d.]+ ${mie.sigmaAngstrom} 16 6$`, 'm'));
    // C(16) = (16/10)(16/6)^0.6 = 2.8820481 (checked by hand: ln(8/3) = 0.98083, times 0.6, exp, times 1.6).
    expect(real).toMatch(/Mie 16-6 \(u = C epsilon \[\(sigma\/r\)\^16 - \(sigma\/r\)\^6\], C = 2\.88204811?/);
    expect(real).not.toMatch(/lj\/cut/);
    expect(exportParameterSet(mie, 'lammps-lj').body).toMatch(/^pair_coeff 1 1 1\.0 1\.0 16 6$/m);
    // A 12-6 set is unchanged.
    expect(exportParameterSet(brindleShifted, 'lammps-real').body).toMatch(/^pair_style lj\/cut /m);
  });

  it.skipIf(!has('lmp'))('the LAMMPS fragment runs and gives the Mie pair energy of two atoms', () => {
    const dir = mkdtempSync(join(tmpdir(), 'epsigma-mie-export-'));
    try {
      const r = 1.12 * mie.sigmaAngstrom;
      const input = [
        'units real',
        'atom_style atomic',
        'boundary p p p',
        'region box block -25 25 -25 25 -25 25',
        'create_box 1 box',
        'create_atoms 1 single 0 0 0',
        `create_atoms 1 single ${r} 0 0`,
        exportParameterSet(mie, 'lammps-real').body,
        'pair_modify tail no',
        'thermo_style custom step evdwl',
        'thermo_modify norm no format float %22.15g',
        'run 0',
      ].join('\n');
      writeFileSync(join(dir, 'in.test'), input);
      const lines = execFileSync('lmp', ['-in', 'in.test', '-log', 'none'], { cwd: dir, encoding: 'utf8' }).split('\n');
      const k = lines.findIndex((l) => /^\s*Step\s+E_vdwl/.test(l));
      const energy = Number(lines[k + 1].trim().split(/\s+/)[1]);
      const c = (16 / 10) * Math.pow(16 / 6, 6 / 10);
      const expected = c * mie.epsilonK * KCAL_PER_MOL_PER_K * ((mie.sigmaAngstrom / r) ** 16 - (mie.sigmaAngstrom / r) ** 6);
      expect(Math.abs(energy / expected - 1)).toBeLessThan(1e-6);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('GROMACS and mixtures are refused with the reason', () => {
    expect(() => exportParameterSet(mie, 'gromacs')).toThrow(
      /GROMACS has no Mie 16-6 pair function .* use lammps-real, lammps-metal or lammps-lj \(pair_style mie\/cut\), json or csv/,
    );
    expect(() => exportMixture([mie, brindleShifted], 'lorentz-berthelot', 'lammps-real')).toThrow(
      /parameter set 31 is a Mie 16-6 set; mixtures are built from LJ 12-6 sets only/,
    );
  });

  it('JSON and CSV carry the model and λr; the JSON validates against the published schema', () => {
    const doc = JSON.parse(exportParameterSet(mie, 'json').body);
    expect(doc.model).toBe('mie');
    expect(doc.repulsiveExponent).toBe(16);
    expect(doc.potentialForm).toMatch(/^Mie 16-6/);
    expect(checkJsonSchema(PARAMETER_SET_JSON_SCHEMA, doc)).toEqual([]);
    const lj = JSON.parse(exportParameterSet(brindleShifted, 'json').body);
    expect([lj.model, lj.repulsiveExponent]).toEqual(['lj-12-6', 12]);
    const [header, row] = exportParameterSet(mie, 'csv').body.trim().split('\n');
    const cells = header.split(',');
    expect(row.split(',')[cells.indexOf('model')]).toBe('mie');
    expect(row.split(',')[cells.indexOf('repulsive_exponent')]).toBe('16');
  });
});
