import { describe, expect, it } from 'vitest';
import { runCli, type CliOutcome } from '../support/run-cli';
import { LJ_EOS_SOURCE, ljEosDensity, ljEosPressure } from '../../shared/physics/lj-eos';

const cli = (...args: string[]): Promise<CliOutcome> => runCli(args);

describe('cli eos', () => {
  it('prints the liquid density at T* = 1.0, P* = 0.1 as JSON', async () => {
    const out = await cli('eos', '--reduced-temperature', '1.0', '--reduced-pressure', '0.1', '--json');
    expect(out.code).toBe(0);
    const json = JSON.parse(out.stdout) as Record<string, unknown>;
    expect(Object.keys(json).sort()).toEqual(['dRhoDP', 'dRhoDT', 'phase', 'reducedDensity', 'roots', 'source']);
    expect(json.phase).toBe('liquid');
    expect(json.source).toBe(LJ_EOS_SOURCE);
    const rho = json.reducedDensity as number;
    // Saturated liquid at T* = 1.0 is at rho* ~ 0.70 (NIST SRSW SAT-TMMC, from memory); slightly compressed here.
    expect(rho).toBeGreaterThan(0.7);
    expect(rho).toBeLessThan(0.73);
    // The printed density reproduces the requested pressure (round trip through the EOS, no source needed).
    expect(Math.abs(ljEosPressure(rho, 1.0) - 0.1)).toBeLessThan(1e-11);
    // JSON carries every digit of the library result.
    const lib = ljEosDensity(1.0, 0.1);
    expect(json.reducedDensity).toBe(lib.reducedDensity);
    expect(json.dRhoDT).toBe(lib.dRhoDT);
    expect(json.dRhoDP).toBe(lib.dRhoDP);
    expect(json.roots).toEqual(lib.roots);
  });

  it('returns the vapour root with --prefer vapour and explains the choice', async () => {
    const out = await cli('eos', '--reduced-temperature', '1.0', '--reduced-pressure', '0.01', '--prefer', 'vapour', '--json');
    expect(out.code).toBe(0);
    const json = JSON.parse(out.stdout) as { reducedDensity: number; phase: string; roots: number[]; note: string };
    expect(json.phase).toBe('vapour');
    expect(json.roots).toHaveLength(2);
    expect(json.reducedDensity).toBe(json.roots[0]);
    expect(json.note).toMatch(/vapour root/);
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
