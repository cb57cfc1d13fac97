import { describe, expect, it } from 'vitest';
import { runCli, type CliOutcome } from '../support/run-cli';
import { ljEosDensity } from '../../shared/physics/lj-eos';

const cli = (...args: string[]): Promise<CliOutcome> => runCli(args, 120_000);

describe('cli md', () => {
  it('prints an NPT result as JSON with the contract fields and the settings echoed', async () => {
    const out = await cli(
      'md',
      '--reduced-temperature',
      '2.0',
      '--reduced-pressure',
      '5.0',
      '--atoms',
      '256',
      '--steps',
      '4000',
      '--cutoff',
      '2.5',
      '--scheme',
      'truncated-tail',
      '--seed',
      '4',
      '--json',
    );
    expect(out.stderr).toBe('');
    expect(out.code).toBe(0);
    const json = JSON.parse(out.stdout) as Record<string, unknown>;
    for (const key of ['reducedDensity', 'stdErr', 'phase', 'reducedPotentialEnergy', 'dRhoDT', 'dRhoDP']) expect(json).toHaveProperty(key);
    expect(json.trace).toBeUndefined();
    expect(json.frames).toBeUndefined();
    // How much independent data the run holds and how it started (a fluid state: from a melted lattice).
    expect(json.effectiveSamples).toBeGreaterThan(0);
    expect(json.statisticalInefficiency).toBeGreaterThanOrEqual(1);
    expect(json.startedFrom).toBe('melted-lattice');
    expect(json.settings).toMatchObject({
      reducedTemperature: 2,
      reducedPressure: 5,
      atoms: 256,
      steps: 4000,
      cutoff: 2.5,
      scheme: 'truncated-tail',
      seed: 4,
    });
    expect(json.phase).toBe('fluid');
    // Supercritical fluid: JZG 1993 EOS density at T* = 2, P* = 5; a short run, so 3 % tolerance.
    const eos = ljEosDensity(2, 5).reducedDensity;
    expect(Math.abs((json.reducedDensity as number) - eos) / eos).toBeLessThan(0.03);
  });

  it('names the offending flag in errors', async () => {
    const missing = await cli('md', '--reduced-temperature', '1', '--json');
    expect(missing.code).toBe(1);
    expect(missing.stderr).toMatch(/--reduced-pressure/);
    const badCutoff = await cli('md', '--reduced-temperature', '1', '--reduced-pressure', '1', '--cutoff', '6', '--json');
    expect(badCutoff.code).toBe(1);
    expect(badCutoff.stderr).toMatch(/--cutoff must be between 2 and 4/);
    const badScheme = await cli('md', '--reduced-temperature', '1', '--reduced-pressure', '1', '--scheme', 'cut', '--json');
    expect(badScheme.stderr).toMatch(/--scheme/);
    const unknown = await cli('md', '--reduced-temperature', '1', '--reduced-pressure', '1', '--temperature', '3', '--json');
    expect(unknown.code).toBe(1);
    expect(unknown.stderr).toMatch(/temperature/);
    const notNumber = await cli('md', '--reduced-temperature', 'hot', '--reduced-pressure', '1', '--json');
    expect(notNumber.stderr).toMatch(/--reduced-temperature must be a finite number/);
  });
});
