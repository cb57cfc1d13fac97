import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../support/run-cli';
import { crossB2 } from '../../shared/mixing/cross-virial';

describe('cli cross', () => {
  it('fits k_ij to a B12 file with both pure sets fixed (synthetic round trip)', async () => {
    // Invented pure sets; B12 generated at k_ij = 0.04 (cm3/mol), so the fit must return 0.04.
    const a = { epsilonK: 152.4, sigmaAngstrom: 3.71 };
    const b = { epsilonK: 231, sigmaAngstrom: 4.32 };
    const dir = mkdtempSync(join(tmpdir(), 'epsigma-cross-'));
    const file = join(dir, 'b12.csv');
    const lines = [
      'T (K),B12 (cm3/mol),u(B12) (cm3/mol)',
      ...[200, 250, 300, 400, 550].map((t) => `${t},${crossB2(t, a, b, 0.04).toFixed(6)},2`),
    ];
    writeFileSync(file, lines.join('\n'));
    const out = await runCli(['cross', '--pure', '152.4,3.71,0.8,0.006,-0.9', '--pure', '231,4.32,1.2,0.009', '--data', file, '--json']);
    expect(out.code).toBe(0);
    const json = JSON.parse(out.stdout) as {
      kij: number;
      kijStdErr: number;
      kijStdErrPure: number;
      epsilon12K: number;
      sigma12Angstrom: number;
      lij: null;
    };
    expect(json.kij).toBeCloseTo(0.04, 5);
    expect(json.kijStdErrPure).toBeGreaterThan(0);
    expect(json.kijStdErr).toBeGreaterThanOrEqual(json.kijStdErrPure);
    expect(json.epsilon12K).toBeCloseTo(0.96 * Math.sqrt(152.4 * 231), 3);
    expect(json.sigma12Angstrom).toBeCloseTo((3.71 + 4.32) / 2, 12);
    expect(json.lij).toBeNull();
    const bad = await runCli(['cross', '--pure', '152.4', '--pure', '231,4.32', '--data', file]);
    expect(bad.code).not.toBe(0);
    expect(bad.stderr).toMatch(/--pure \(set 1\) must be "EPS_K,SIGMA_A"/);
  });
});
