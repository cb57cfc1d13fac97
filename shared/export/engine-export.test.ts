import { describe, expect, it } from 'vitest';
import { lammpsMixture, lammpsParameterSet } from './lammps-export';
import { gromacsMixture, gromacsParameterSet, gromacsTypeName } from './gromacs-export';
import { brindleShifted, oskaneShifted, oskaneTail, tarrowFull } from './export-test-sets';
import { combine } from '../mixing/combining-rules';
import type { ExportableParameterSet } from './parameter-set-export';

const CAUTION =
  'Fitted model parameters, not validated property data for pressure, safety or process design; defer to local codes and licensed engineering practice.';

/**
 * Commands LAMMPS would run, following its documented parsing rules (https://docs.lammps.org/Commands_parse.html):
 * a line whose last printable character is "&" continues on the next line; an unclosed triple quote also
 * continues; then everything from the first "#" (outside quotes) is a comment.
 */
function lammpsCommands(text: string): string[][] {
  const raw = text.split('\n');
  const joined: string[] = [];
  let buffer = '';
  for (const line of raw) {
    buffer += line;
    const tripleCount = (buffer.match(/"""/g) ?? []).length;
    if (/&\s*$/.test(buffer)) {
      buffer = buffer.replace(/&\s*$/, ' ');
      continue;
    }
    if (tripleCount % 2 === 1) {
      buffer += '\n';
      continue;
    }
    joined.push(buffer);
    buffer = '';
  }
  if (buffer) joined.push(buffer);
  return joined
    .map((l) => {
      let quote: string | null = null;
      for (let k = 0; k < l.length; k++) {
        const c = l[k];
        if (quote) {
          if (c === quote) quote = null;
        } else if (c === '"' || c === "'") quote = c;
        else if (c === '#') return l.slice(0, k);
      }
      return l;
    })
    .map((l) => l.trim().split(/\s+/).filter(Boolean))
    .filter((t) => t.length > 0);
}

/**
 * Non-comment content of a GROMACS topology fragment: ";" starts a comment and a trailing "\" joins the next
 * line (GROMACS reference manual, "Topology file": comments with ";", line continuation with "\").
 */
function gromacsEntries(text: string): Array<{ section: string; fields: string[] }> {
  const out: Array<{ section: string; fields: string[] }> = [];
  let section = '';
  let buffer = '';
  for (const line of text.split('\n')) {
    buffer += line;
    if (/\\\s*$/.test(buffer)) {
      buffer = buffer.replace(/\\\s*$/, ' ');
      continue;
    }
    const content = buffer.split(';')[0].trim();
    buffer = '';
    if (!content) continue;
    const header = content.match(/^\[\s*(\S+)\s*\]$/);
    if (header) section = header[1];
    else out.push({ section, fields: content.split(/\s+/) });
  }
  return out;
}

// Outside references for the unit conversions:
//   1 kcal/mol ≙ 503.2195 K (4184 J / R, R = 8.314462618 J/(mol K), CODATA 2018; LAMMPS units real uses the
//   thermochemical calorie, https://docs.lammps.org/units.html);
//   1 eV ≙ 11604.51812 K (e/k_B, CODATA 2018, NIST);
//   1 kJ/mol ≙ 120.2722 K (1000 J / R).
const K_PER_KCAL_PER_MOL = 503.2195;
const K_PER_EV = 11604.51812;
const K_PER_KJ_PER_MOL = 120.2722;

describe('LAMMPS fragments', () => {
  it('units real: truncated-shifted set gives lj/cut at 2.5σ in Å, ε in kcal/mol and shift yes', () => {
    const cmds = lammpsCommands(lammpsParameterSet(brindleShifted, 'real'));
    expect(cmds.map((c) => c[0])).toEqual(['mass', 'pair_style', 'pair_coeff', 'pair_modify']);
    expect(cmds[0]).toEqual(['mass', '1', '41.25']);
    expect(cmds[1]).toEqual(['pair_style', 'lj/cut', '8.55']);
    expect(cmds[2].slice(0, 3)).toEqual(['pair_coeff', '1', '1']);
    expect(Number(cmds[2][3]) * K_PER_KCAL_PER_MOL).toBeCloseTo(127.5, 3);
    expect(cmds[2][4]).toBe('3.42');
    expect(cmds[3]).toEqual(['pair_modify', 'shift', 'yes', 'tail', 'no']);
  });

  it('units metal: ε in eV', () => {
    const cmds = lammpsCommands(lammpsParameterSet(brindleShifted, 'metal'));
    expect(Number(cmds[2][3]) * K_PER_EV).toBeCloseTo(127.5, 3);
    expect(lammpsParameterSet(brindleShifted, 'metal')).toContain('units metal (energy eV, distance Angstrom');
  });

  it('truncated-tail uses tail corrections; the full potential gets a long cutoff with tail corrections and says why', () => {
    const tail = lammpsCommands(lammpsParameterSet(oskaneTail, 'real'));
    expect(tail[1]).toEqual(['pair_style', 'lj/cut', '10.8']); // 3 σ × 3.6 Å
    expect(tail[3]).toEqual(['pair_modify', 'shift', 'no', 'tail', 'yes']);
    const fullText = lammpsParameterSet(tarrowFull, 'real');
    const full = lammpsCommands(fullText);
    expect(full[1]).toEqual(['pair_style', 'lj/cut', '18.79']); // 5 σ × 3.758 Å
    expect(full[3]).toEqual(['pair_modify', 'shift', 'no', 'tail', 'yes']);
    expect(fullText).toContain('# Cutoff treatment: these parameters describe the FULL potential');
    expect(fullText).toContain('long cutoff (here 5 sigma) with analytic tail corrections');
  });

  it('carries set id, version, approval date, validity and the caution text as comments', () => {
    const text = lammpsParameterSet(brindleShifted, 'real');
    const comments = text.split('\n').filter((l) => l.startsWith('#'));
    expect(comments[0]).toBe('# Epsigma parameter set 12 v3: Brindle gas (Bd), Lennard-Jones 12-6');
    expect(comments).toContain('# Status: approved 2026-11-30T10:00:00Z by R. Ostrova');
    expect(comments).toContain('# Valid for: T = 90-300 K; p = 0.1-10 MPa');
    expect(comments).toContain(`# CAUTION: ${CAUTION}`);
    expect(text).toMatch(/^[\x20-\x7e\n]*$/); // plain ASCII for old readers
  });

  it('marks a set that is not approved, superseded or retired', () => {
    // State names of shared/parameter-sets/transitions.ts.
    const draft = { ...brindleShifted, state: 'in_review', approvedAt: null, approvedBy: null };
    expect(lammpsParameterSet(draft, 'real')).toContain('# Status: NOT APPROVED (state: in_review)');
    expect(lammpsParameterSet({ ...brindleShifted, state: 'superseded' }, 'real')).toContain(
      '# Status: SUPERSEDED by a newer version (approved 2026-11-30T10:00:00Z by R. Ostrova)',
    );
    expect(gromacsParameterSet({ ...brindleShifted, state: 'retired' })).toContain(
      '; Status: RETIRED (was approved 2026-11-30T10:00:00Z by R. Ostrova)',
    );
  });

  it('free text cannot escape its comment line', () => {
    const evil: ExportableParameterSet = {
      ...brindleShifted,
      substance: { ...brindleShifted.substance, name: 'Brindle gas\npair_style zero 1.0\rshell rm -rf x', formula: 'Bd &' },
      approvedBy: 'someone """ &',
      measurementSets: [{ id: 1, version: 1, kind: 'b2', name: 'ends with &', source: 'trailing backslash \\', doi: null }],
    };
    const cmds = lammpsCommands(lammpsParameterSet(evil, 'real'));
    expect(cmds.map((c) => c[0])).toEqual(['mass', 'pair_style', 'pair_coeff', 'pair_modify']);
    expect(cmds[1]).toEqual(['pair_style', 'lj/cut', '8.55']);
    const entries = gromacsEntries(gromacsParameterSet({ ...evil, approvedBy: 'ends in a backslash \\' }));
    expect(entries.map((e) => e.section)).toEqual(['atomtypes']);
    expect(entries[0].fields).toHaveLength(6);
  });
});

describe('the test readers themselves', () => {
  it('see the attacks that the comment cleaning prevents', () => {
    // Without cleaning, each of these would change what the engine runs.
    expect(lammpsCommands('# name\npair_style zero 1.0\nmass 1 1').map((c) => c[0])).toEqual(['pair_style', 'mass']);
    expect(lammpsCommands('# by someone &\nmass 1 1\npair_style lj/cut 3').map((c) => c[0])).toEqual(['pair_style']);
    expect(lammpsCommands('# by """\nmass 1 1\n# """\npair_style lj/cut 3').map((c) => c[0])).toEqual(['pair_style']);
    expect(gromacsEntries('; by x \\\n[ atomtypes ]\n A 1 0 A 1 1').map((e) => e.section)).toEqual(['']);
  });
});

describe('LAMMPS mixture fragment', () => {
  it('writes every pair i ≤ j with its own cutoff rc/σ · σ_ij and marks cross pairs as estimates', () => {
    const text = lammpsMixture([brindleShifted, oskaneShifted], 'kong', 'real');
    const cmds = lammpsCommands(text);
    expect(cmds.filter((c) => c[0] === 'mass')).toEqual([
      ['mass', '1', '41.25'],
      ['mass', '2', '83.25'],
    ]);
    const coeffs = cmds.filter((c) => c[0] === 'pair_coeff');
    expect(coeffs.map((c) => `${c[1]}-${c[2]}`)).toEqual(['1-1', '1-2', '2-2']);
    const kong = combine('kong', brindleShifted, oskaneShifted);
    expect(Number(coeffs[1][3]) * K_PER_KCAL_PER_MOL).toBeCloseTo(kong.epsilonK, 3);
    expect(Number(coeffs[1][4])).toBeCloseTo(kong.sigmaAngstrom, 6);
    expect(Number(coeffs[1][5])).toBeCloseTo(2.5 * kong.sigmaAngstrom, 5);
    expect(cmds.find((c) => c[0] === 'pair_style')).toEqual(['pair_style', 'lj/cut', '9']); // 2.5 × 3.6 Å, the largest pair
    expect(cmds.at(-1)).toEqual(['pair_modify', 'shift', 'yes', 'tail', 'no']);
    expect(text).toContain('pair_coeff 1 2');
    expect(text.split('\n').find((l) => l.startsWith('pair_coeff 1 2'))).toContain('# Kong estimate, not fitted');
    expect(text).toContain('not fitted to mixture data');
    expect(text).toContain('# All components valid together for: T = 120-300 K; p = 0.5-10 MPa');
    expect(text).toContain(`# CAUTION: ${CAUTION}`);
  });

  it('warns when the components were fitted for different cutoff treatments', () => {
    const text = lammpsMixture([brindleShifted, tarrowFull], 'lorentz-berthelot', 'metal');
    expect(text).toContain('# WARNING: the components were fitted for different cutoff treatments');
    expect(lammpsCommands(text).at(-1)).toEqual(['pair_modify', 'shift', 'no', 'tail', 'yes']);
  });
});

describe('GROMACS fragments', () => {
  it('one [ atomtypes ] line: name, mass, charge, ptype A, σ in nm, ε in kJ/mol', () => {
    const entries = gromacsEntries(gromacsParameterSet(brindleShifted));
    expect(entries).toHaveLength(1);
    const f = entries[0].fields;
    expect(entries[0].section).toBe('atomtypes');
    expect(f).toHaveLength(6);
    expect(f[0]).toBe('Bd_ps12');
    expect(f.slice(1, 4)).toEqual(['41.25', '0.000', 'A']);
    expect(f[4]).toBe('0.342');
    expect(Number(f[5]) * K_PER_KJ_PER_MOL).toBeCloseTo(127.5, 3);
  });

  it('.mdp comments match the scheme', () => {
    const shifted = gromacsParameterSet(brindleShifted);
    expect(shifted).toContain('; vdwtype = Cut-off');
    expect(shifted).toContain('; rvdw = 0.855');
    expect(shifted).toContain('; vdw-modifier = Potential-shift');
    expect(shifted).toContain('; DispCorr = no');
    const tail = gromacsParameterSet(oskaneTail);
    expect(tail).toContain('; rvdw = 1.08');
    expect(tail).toContain('; vdw-modifier = None');
    expect(tail).toContain('; DispCorr = EnerPres');
    const full = gromacsParameterSet(tarrowFull);
    expect(full).toContain('; rvdw = 1.879');
    expect(full).toContain('; vdw-modifier = None');
    expect(full).toContain('; DispCorr = EnerPres');
    expect(full).toContain('FULL potential');
  });

  it('carries set id, version, approval, validity, caution and the combination-rule requirement', () => {
    const text = gromacsParameterSet(oskaneTail);
    expect(text).toContain('; Epsigma parameter set 15 v1: Oskane (Ok), Lennard-Jones 12-6');
    expect(text).toContain('; Status: approved 2026-11-30T10:00:00Z by R. Ostrova');
    expect(text).toContain('; Valid for: T = 120-400 K; pressure range not stated');
    expect(text).toContain(`; CAUTION: ${CAUTION}`);
    expect(text).toContain('combination rule 2 (or 3)');
    expect(text).toMatch(/^[\x20-\x7e\n]*$/);
  });

  it('builds safe, distinct type names', () => {
    expect(gromacsTypeName(brindleShifted)).toBe('Bd_ps12');
    expect(
      gromacsTypeName({ ...brindleShifted, substance: { ...brindleShifted.substance, formula: null, name: '1,2-Dichloroethane' } }),
    ).toBe('X12Dichloroet_ps12');
  });
});

describe('GROMACS mixture fragment', () => {
  it('lists all atom types and every cross pair in [ nonbond_params ] with func 1, σ_ij nm, ε_ij kJ/mol', () => {
    const sets = [brindleShifted, oskaneShifted, { ...tarrowFull, scheme: 'truncated-shifted' as const, cutoffSigma: 2.5 }];
    const text = gromacsMixture(sets, 'waldman-hagler');
    const entries = gromacsEntries(text);
    expect(entries.filter((e) => e.section === 'atomtypes').map((e) => e.fields[0])).toEqual(['Bd_ps12', 'Ok_ps16', 'Tw_ps21']);
    const nb = entries.filter((e) => e.section === 'nonbond_params');
    expect(nb.map((e) => `${e.fields[0]}-${e.fields[1]}`)).toEqual(['Bd_ps12-Ok_ps16', 'Bd_ps12-Tw_ps21', 'Ok_ps16-Tw_ps21']);
    const wh = combine('waldman-hagler', oskaneShifted, sets[2]);
    expect(nb[2].fields[2]).toBe('1');
    expect(Number(nb[2].fields[3])).toBeCloseTo(wh.sigmaAngstrom / 10, 7);
    expect(Number(nb[2].fields[4]) * K_PER_KJ_PER_MOL).toBeCloseTo(wh.epsilonK, 3);
    expect(text).toContain('Waldman-Hagler estimates, not fitted');
    expect(text).toContain('; rvdw = 0.9395'); // 2.5 × the largest σ_ij (3.758 Å)
    expect(text).toContain('one rvdw for all pairs');
  });
});
