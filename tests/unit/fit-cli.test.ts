import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { runCli, type CliOutcome } from '../support/run-cli';
import { run } from '../../scripts/cli/fit';
import { expectWithinReference } from '../../shared/validation/reference-check-tests';
import { referenceCheckById } from '../../shared/validation/reference-checks';

const workDir = mkdtempSync(join(tmpdir(), 'epsigma-fit-cli-'));
afterAll(() => rmSync(workDir, { recursive: true, force: true }));

const cli = (...args: string[]): Promise<CliOutcome> => runCli(args, 60_000);

function writeCsv(name: string, text: string): string {
  const path = join(workDir, name);
  writeFileSync(path, text);
  return path;
}

// Argon B2, cm³/mol: CRC Handbook of Chemistry and Physics, "Virial Coefficients of Selected Gases" (H. V. Kehiaian),
// smoothed from Dymond & Smith (1980); retrieved with the search tool. Uncertainty: 2 cm³/mol or 2 %, our assumption.
const ARGON_B2_CSV = [
  'T (K),B2 (cm3/mol),u(B2) (cm3/mol)',
  ...[
    [100, -184],
    [120, -131],
    [140, -98],
    [160, -76],
    [180, -60],
    [200, -48],
    [300, -16],
    [400, -1],
    [500, 7],
    [600, 12],
    [700, 15],
    [800, 18],
    [900, 20],
    [1000, 22],
  ].map(([t, b]) => `${t},${b},${Math.max(2, 0.02 * Math.abs(b))}`),
].join('\n');

// Argon low-pressure viscosity, µPa·s: CRC Handbook of Chemistry and Physics, "Viscosity of Gases" (low-pressure
// limiting values); retrieved with the search tool. The table quotes uncertainties "usually less than 3 %"; we use 1 %.
const ARGON_ETA_CSV = [
  'T (K),eta (uPa s),u(eta) (uPa s)',
  ...[
    [200, 15.9],
    [300, 22.7],
    [400, 28.6],
    [500, 33.9],
    [600, 38.8],
  ].map(([t, eta]) => `${t},${eta},${(0.01 * eta).toFixed(3)}`),
].join('\n');

const EXPECTED_KEYS = [
  'chi2',
  'convergence',
  'correlation',
  'deBoerParameter',
  'deBoerParameterStdErr',
  'dof',
  'epsilonK',
  'reducedChi2',
  'sigmaAngstrom',
  'status',
  'stdErr',
  'warnings',
];

describe('cli fit', () => {
  it('fits argon B2 from an upload-format CSV and prints the documented JSON', async () => {
    const out = await cli('fit', '--data', writeCsv('argon-b2.csv', ARGON_B2_CSV), '--json');
    expect(out.stderr).toBe('');
    expect(out.code).toBe(0);
    const json = JSON.parse(out.stdout) as Record<string, unknown>;
    expect(Object.keys(json).sort()).toEqual(EXPECTED_KEYS);
    expect(json.status).toBe('succeeded');
    expect(json.convergence).toBe('parameter-change');
    // Without --molar-mass there is no de Boer parameter to report.
    expect(json.deBoerParameter).toBeNull();
    // B2-derived argon LJ parameters ε/k = 119.8 K, σ = 3.405 Å (Hirschfelder, Curtiss & Bird 1954, Table I-A, from memory),
    // within the spread of published fits: registry entries fit.argon-b2.epsilon and fit.argon-b2.sigma.
    expectWithinReference(json.epsilonK as number, referenceCheckById('fit.argon-b2.epsilon'));
    expectWithinReference(json.sigmaAngstrom as number, referenceCheckById('fit.argon-b2.sigma'));
    expect(json.dof).toBe(12);
    const stdErr = json.stdErr as { epsilonK: number; sigmaAngstrom: number };
    expect(stdErr.epsilonK).toBeGreaterThan(0);
    expect(stdErr.sigmaAngstrom).toBeGreaterThan(0);
  });

  it('fits argon B2 and viscosity together with --molar-mass', async () => {
    const out = await cli(
      'fit',
      '--data',
      writeCsv('argon-b2-joint.csv', ARGON_B2_CSV),
      '--data',
      writeCsv('argon-eta.csv', ARGON_ETA_CSV),
      '--molar-mass',
      '39.948',
      '--json',
    );
    expect(out.code).toBe(0);
    const json = JSON.parse(out.stdout) as Record<string, unknown>;
    expect(json.status).toBe('succeeded');
    expect(json.dof).toBe(14 + 5 - 2);
    // Argon LJ parameters from B2 (119.8 K, 3.405 Å) and from viscosity (124 K, 3.418 Å): Hirschfelder, Curtiss & Bird
    // 1954, Table I-A (from memory). A joint fit should land near both.
    expect(json.epsilonK as number).toBeGreaterThan(112);
    expect(json.epsilonK as number).toBeLessThan(130);
    expect(json.sigmaAngstrom as number).toBeGreaterThan(3.35);
    expect(json.sigmaAngstrom as number).toBeLessThan(3.5);
    // With the molar mass the fit reports Λ* = h/(σ√(mε)); about 0.19 for argon (de Boer 1948; Hirschfelder, Curtiss &
    // Bird 1954, §6.5, from memory), with a standard error.
    expect(Math.abs((json.deBoerParameter as number) - 0.19)).toBeLessThan(0.01);
    expect(json.deBoerParameterStdErr as number).toBeGreaterThan(0);
  });

  it('reports a bad invocation on stderr with exit code 1 and nothing on stdout', async () => {
    const out = await cli('fit', '--data', writeCsv('eta-only.csv', ARGON_ETA_CSV), '--json');
    expect(out.code).toBe(1);
    expect(out.stdout).toBe('');
    expect(out.stderr).toContain('viscosity data need --molar-mass');
  });
});

// The remaining cases call the command module in-process: same code path as the dispatcher, without the
// cost of starting a TypeScript process per case.
describe('cli fit (in-process)', () => {
  it('--quantum changes the argon B2 fit only slightly (small de Boer parameter)', async () => {
    const file = writeCsv('argon-b2-q.csv', ARGON_B2_CSV);
    const classical = (await run(['--data', file])) as { epsilonK: number };
    const quantum = (await run(['--data', file, '--molar-mass', '39.948', '--quantum'])) as { epsilonK: number };
    expect(quantum.epsilonK).not.toBe(classical.epsilonK);
    expect(Math.abs(quantum.epsilonK / classical.epsilonK - 1)).toBeLessThan(0.02);
  });

  it.each([
    [[], 'missing required flag --data'],
    [['--data', '/nonexistent/file.csv'], 'cannot read --data /nonexistent/file.csv'],
    [['--data', 'ETA'], 'viscosity data need --molar-mass'],
    [['--data', 'B2', '--quantum'], '--quantum needs --molar-mass'],
    [['--data', 'B2', '--molar-mass', '0'], '--molar-mass must be a positive number, got "0"'],
    [['--data', 'B2', '--restarts', '1.5'], '--restarts must be a non-negative integer, got "1.5"'],
    [['--data', 'BAD'], 'Cannot tell which property the file holds'],
    [['--data', 'B2', '--frobnicate'], "Unknown option '--frobnicate'"],
    [
      ['--data', 'fixtures/demo/quillgas-qg1-density.csv', '--molar-mass', '28', '--model', 'mie', '--repulsive-exponent', '16'],
      'the command line runs density fits with LJ 12-6 only',
    ],
  ])('rejects bad input with a message (%#)', async (args, message) => {
    const files: Record<string, string> = {
      B2: writeCsv('b2.csv', ARGON_B2_CSV),
      ETA: writeCsv('eta.csv', ARGON_ETA_CSV),
      BAD: writeCsv('bad.csv', 'T (K),colour (nm)\n300,500\n'),
    };
    await expect(run(args.map((a) => files[a] ?? a))).rejects.toThrow(message);
  });
});
