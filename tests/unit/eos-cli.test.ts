import { describe, expect, it } from 'vitest';
import { runCli, type CliOutcome } from '../support/run-cli';
import { LJ_EOS_SOURCE, ljEosPressure } from '../../shared/physics/lj-eos';
import { THOL_2016_SOURCE, tholCoexistence, tholCriticalPoint, tholDensity, tholPressure } from '../../shared/physics/eos/thol-2016';
import { expectWithinReference } from '../../shared/validation/reference-check-tests';
import { referenceCheckById } from '../../shared/validation/reference-checks';

const cli = (...args: string[]): Promise<CliOutcome> => runCli(args);

describe('cli eos', () => {
  it('prints the liquid density at T* = 1.0, P* = 0.1 from the Thol equation as JSON', async () => {
    const out = await cli('eos', '--reduced-temperature', '1.0', '--reduced-pressure', '0.1', '--json');
    expect(out.code).toBe(0);
    const json = JSON.parse(out.stdout) as Record<string, unknown>;
    expect(Object.keys(json).sort()).toEqual([
      'chosenRoot',
      'dRhoDP',
      'dRhoDT',
      'model',
      'note',
      'phase',
      'reducedDensity',
      'roots',
      'source',
      'stablePhase',
    ]);
    expect(json.phase).toBe('liquid');
    expect(json.model).toBe('thol2016');
    expect(json.source).toBe(THOL_2016_SOURCE);
    const rho = json.reducedDensity as number;
    // Saturated liquid at T* = 1.0 is at rho* ~ 0.70 (NIST SRSW SAT-TMMC, from memory); slightly compressed here.
    expect(rho).toBeGreaterThan(0.7);
    expect(rho).toBeLessThan(0.73);
    // The printed density reproduces the requested pressure (round trip through the EOS, no source needed).
    expect(Math.abs(tholPressure(rho, 1.0) - 0.1)).toBeLessThan(1e-11);
    // JSON carries every digit of the library result.
    const lib = tholDensity(1.0, 0.1);
    expect(json.reducedDensity).toBe(lib.reducedDensity);
    expect(json.dRhoDT).toBe(lib.dRhoDT);
    expect(json.roots).toEqual(lib.roots.map((r) => r.reducedDensity));
  });

  it('answers the stable vapour at T* = 0.9, P* = 0.01 and says so; --prefer liquid gives the metastable liquid', async () => {
    // p*sat(0.9) ≈ 0.0118 (Thol 2016 equation; NIST SRSW TMMC ≈ 0.0117, from memory), so P* = 0.01 is a stable vapour.
    const out = await cli('eos', '--reduced-temperature', '0.9', '--reduced-pressure', '0.01', '--json');
    const json = JSON.parse(out.stdout) as {
      reducedDensity: number;
      phase: string;
      chosenRoot: string;
      stablePhase: string;
      roots: number[];
      note: string;
    };
    expect(json.phase).toBe('vapour');
    expect(json.chosenRoot).toBe('stable');
    expect(json.roots).toHaveLength(2);
    expect(json.reducedDensity).toBe(json.roots[0]);
    expect(json.note).toMatch(/liquid root is metastable/);
    const liquid = JSON.parse(
      (await cli('eos', '--reduced-temperature', '0.9', '--reduced-pressure', '0.01', '--prefer', 'liquid')).stdout,
    ) as typeof json;
    expect(liquid.phase).toBe('liquid');
    expect(liquid.chosenRoot).toBe('liquid');
    expect(liquid.stablePhase).toBe('vapour');
  });

  it('keeps JZG 1993 selectable', async () => {
    const json = JSON.parse(
      (await cli('eos', '--reduced-temperature', '1.0', '--reduced-pressure', '0.1', '--model', 'jzg1993')).stdout,
    ) as { reducedDensity: number; source: string };
    expect(json.source).toBe(LJ_EOS_SOURCE);
    expect(Math.abs(ljEosPressure(json.reducedDensity, 1.0) - 0.1)).toBeLessThan(1e-11);
  });

  it('prints saturation and critical point in reduced units', async () => {
    const sat = JSON.parse((await cli('eos', '--saturation', '--reduced-temperature', '0.9', '--json')).stdout) as Record<string, number>;
    const lib = tholCoexistence(0.9);
    expect(sat.saturationPressure).toBe(lib.saturationPressure);
    expect(sat.liquidDensity).toBe(lib.liquidDensity);
    expect(sat.vapourDensity).toBe(lib.vapourDensity);
    // Thol et al. 2016 state T*c = 1.32, rho*c = 0.31, p*c = 0.13 for their equation.
    const crit = JSON.parse((await cli('eos', '--critical-point', '--json')).stdout) as Record<string, number>;
    expect(crit.reducedTemperature).toBe(tholCriticalPoint().reducedTemperature);
    // Registry entries thol.critical.t and thol.critical.p.
    expectWithinReference(crit.reducedTemperature, referenceCheckById('thol.critical.t'));
    expectWithinReference(crit.reducedPressure, referenceCheckById('thol.critical.p'));
    const above = await cli('eos', '--saturation', '--reduced-temperature', '1.4', '--json');
    expect(above.code).not.toBe(0);
    expect(above.stderr).toMatch(/--reduced-temperature 1.4: .*at or above the critical temperature/);
  });

  it('exits non-zero with a message naming the missing flag', async () => {
    const out = await cli('eos', '--reduced-temperature', '1.0', '--json');
    expect(out.code).not.toBe(0);
    expect(out.stdout).toBe('');
    expect(out.stderr).toMatch(/--reduced-pressure/);
  });

  it('rejects a bad value, naming the flag', async () => {
    const out = await cli('eos', '--reduced-temperature', '1.0', '--reduced-pressure=0', '--json');
    expect(out.code).not.toBe(0);
    expect(out.stderr).toMatch(/--reduced-pressure must be a finite number > 0/);
  });

  it('rejects an unknown flag (strict parsing)', async () => {
    const out = await cli('eos', '--reduced-temperature', '1.0', '--reduced-pressure', '0.1', '--density', '0.5');
    expect(out.code).not.toBe(0);
    expect(out.stderr).toMatch(/--density/);
  });
});
