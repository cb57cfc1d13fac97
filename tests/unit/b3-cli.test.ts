import { describe, expect, it } from 'vitest';
import { runCli } from '../support/run-cli';
import { reducedB3 } from '../../shared/physics/third-virial';
import { b2ZeroCm3PerMol } from '../../shared/physics/virial';
import { expectWithinReference } from '../../shared/validation/reference-check-tests';
import { referenceCheckById } from '../../shared/validation/reference-checks';

describe('cli b3', () => {
  it('prints B3/b0² per reduced temperature, and cm6/mol2 when given ε and σ', async () => {
    const out = await runCli(['b3', '--reduced-temperatures', '1,2', '--epsilon-k', '150', '--sigma-angstrom', '3.8', '--json']);
    expect(out.code).toBe(0);
    const json = JSON.parse(out.stdout) as {
      rows: Array<{ reducedTemperature: number; b3Reduced: number; temperatureK: number; b3Cm6PerMol2: number }>;
    };
    expect(json.rows.map((r) => r.reducedTemperature)).toEqual([1, 2]);
    // Hirschfelder, Curtiss & Bird 1954, Table I-C: C*(1.00) = 0.4297 (from memory): registry entry b3.hcb-table.t1.
    expectWithinReference(json.rows[0].b3Reduced, referenceCheckById('b3.hcb-table.t1'));
    expect(json.rows[1].b3Reduced).toBe(reducedB3(2));
    expect(json.rows[1].temperatureK).toBe(300);
    expect(json.rows[1].b3Cm6PerMol2).toBeCloseTo(b2ZeroCm3PerMol(3.8) ** 2 * reducedB3(2), 6);
  });

  it('refuses a temperature outside the quadrature range, naming the flag', async () => {
    const out = await runCli(['b3', '--reduced-temperatures', '1,0.1', '--json']);
    expect(out.code).not.toBe(0);
    expect(out.stderr).toMatch(/--reduced-temperatures 0.1: .*outside the range/);
  });
});
