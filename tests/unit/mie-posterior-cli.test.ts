import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { b2WithGradient } from '../../shared/physics/virial';
import { runCli } from '../support/run-cli';
import { run as fitCommand } from '../../scripts/cli/fit';
import { run as b2Command } from '../../scripts/cli/b2';

const workDir = mkdtempSync(join(tmpdir(), 'epsigma-mie-cli-'));
afterAll(() => rmSync(workDir, { recursive: true, force: true }));
const cli = (...args: string[]) => runCli(args, 120_000);

// A synthetic B2 table of a Mie 16-6 gas (ε/k_B = 150 K, σ = 3.7 Å) from the quadrature of virial.ts (itself checked
// against an independent mpmath quadrature), with a fixed ±0.3 cm³/mol pattern as noise.
const csv = (): string => {
  const path = join(workDir, 'qg1-b2.csv');
  const rows = [90, 105, 120, 140, 165, 200, 250, 320, 420, 560, 750, 1000].map(
    (t, i) =>
      `${t},${(b2WithGradient(t, 150, 3.7, undefined, { repulsiveExponent: 16 }).b2Cm3PerMol + 0.3 * (i % 2 ? 1 : -1)).toFixed(4)},0.3`,
  );
  writeFileSync(path, ['T (K),B2 (cm3/mol),u(B2) (cm3/mol)', ...rows].join('\n'));
  return path;
};

describe('cli: Mie λr-6 and posterior', () => {
  it('b2 --repulsive-exponent 16 gives the Mie B2 and says so', async () => {
    const out = await cli(
      'b2',
      '--epsilon-k',
      '150',
      '--sigma-angstrom',
      '3.7',
      '--temperatures',
      '150',
      '--repulsive-exponent',
      '16',
      '--json',
    );
    expect(out.code).toBe(0);
    const json = JSON.parse(out.stdout);
    expect(json.model).toBe('mie');
    expect(json.rows[0].b2Cm3PerMol).toBe(b2WithGradient(150, 150, 3.7, undefined, { repulsiveExponent: 16 }).b2Cm3PerMol);
    await expect(
      b2Command(['--epsilon-k', '150', '--sigma-angstrom', '3.7', '--temperatures', '150', '--repulsive-exponent', '7', '--json']),
    ).rejects.toThrow(/--repulsive-exponent must be a number from 8 to 36, got "7"/);
  });

  it('fit --model mie --repulsive-exponent 16 --posterior prints the model and the posterior intervals', async () => {
    const out = await cli(
      'fit',
      '--data',
      csv(),
      '--model',
      'mie',
      '--repulsive-exponent',
      '16',
      '--posterior',
      '--samples',
      '300',
      '--json',
    );
    expect(out.stderr).toBe('');
    const json = JSON.parse(out.stdout);
    expect(json.model).toBe('mie');
    expect(json.repulsiveExponent).toBe(16);
    for (const name of ['epsilonK', 'sigmaAngstrom']) {
      const p = json.posterior[name];
      expect(p.lower95).toBeLessThan(p.median);
      expect(p.upper95).toBeGreaterThan(p.median);
      expect(p.lower95).toBeLessThan(json[name]);
      expect(p.upper95).toBeGreaterThan(json[name]);
    }
    expect(json.posterior.diagnostics.seed).toBe(20261202);
    // Same command, same numbers (fixed seed), here run in-process.
    const again = (await fitCommand([
      '--data',
      csv(),
      '--model',
      'mie',
      '--repulsive-exponent',
      '16',
      '--posterior',
      '--samples',
      '300',
      '--json',
    ])) as { posterior: unknown };
    expect(JSON.parse(JSON.stringify(again.posterior))).toEqual(json.posterior);
  });

  it('refuses inconsistent flags naming them', async () => {
    await expect(fitCommand(['--data', csv(), '--repulsive-exponent', '16', '--json'])).rejects.toThrow(
      /--repulsive-exponent and --fit-repulsive-exponent need --model mie/,
    );
    await expect(fitCommand(['--data', csv(), '--model', 'mie', '--json'])).rejects.toThrow(
      /--model mie needs either --repulsive-exponent <8–36> \(held\) or --fit-repulsive-exponent \(fitted\), not both/,
    );
    await expect(fitCommand(['--data', csv(), '--samples', '500', '--json'])).rejects.toThrow(/--samples is only used with --posterior/);
  });
});
