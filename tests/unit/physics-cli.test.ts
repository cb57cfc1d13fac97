import { describe, expect, it } from 'vitest';
import { runCli, type CliOutcome } from '../support/run-cli';
import { b2WithGradient } from '../../shared/physics/virial';
import { omega11, omega22 } from '../../shared/physics/collision-integrals';
import { viscosityWithGradient } from '../../shared/physics/viscosity';
import { expectWithinReference } from '../../shared/validation/reference-check-tests';
import { referenceCheckById } from '../../shared/validation/reference-checks';

const cli = (...args: string[]): Promise<CliOutcome> => runCli(args);

describe('cli b2', () => {
  it('prints B2 rows for argon that match the library and the measured sign change near the Boyle point', async () => {
    const out = await cli('b2', '--epsilon-k', '119.8', '--sigma-angstrom', '3.405', '--temperatures', '150,300,600', '--json');
    expect(out.code).toBe(0);
    const json = JSON.parse(out.stdout) as { rows: { temperatureK: number; b2Cm3PerMol: number }[] };
    expect(json.rows.map((r) => Object.keys(r).sort())).toEqual(Array(3).fill(['b2Cm3PerMol', 'temperatureK']));
    expect(json.rows.map((r) => r.temperatureK)).toEqual([150, 300, 600]);
    for (const r of json.rows) expect(r.b2Cm3PerMol).toBe(b2WithGradient(r.temperatureK, 119.8, 3.405).b2Cm3PerMol);
    // Argon B2 is about −15.5 cm³/mol at 300 K and positive above its Boyle temperature ≈ 410 K (Dymond & Smith 1980, from memory).
    expect(json.rows[1].b2Cm3PerMol).toBeGreaterThan(-19);
    expect(json.rows[1].b2Cm3PerMol).toBeLessThan(-13);
    expect(json.rows[2].b2Cm3PerMol).toBeGreaterThan(0);
  });

  it('adds the quantum correction with --quantum --molar-mass', async () => {
    const args = ['--epsilon-k', '10.22', '--sigma-angstrom', '2.556', '--temperatures', '20'];
    const classical = JSON.parse((await cli('b2', ...args, '--json')).stdout) as { rows: { b2Cm3PerMol: number }[] };
    const out = await cli('b2', ...args, '--molar-mass', '4.0026', '--quantum', '--json');
    expect(out.code).toBe(0);
    const quantum = JSON.parse(out.stdout) as { rows: { b2Cm3PerMol: number }[] };
    expect(quantum.rows[0].b2Cm3PerMol).toBe(b2WithGradient(20, 10.22, 2.556, { molarMassGPerMol: 4.0026 }).b2Cm3PerMol);
    expect(quantum.rows[0].b2Cm3PerMol).toBeGreaterThan(classical.rows[0].b2Cm3PerMol);
  });

  it('rejects bad input with a non-zero exit and a message naming the flag', async () => {
    const bad = await cli('b2', '--epsilon-k', 'abc', '--sigma-angstrom', '3.4', '--temperatures', '300', '--json');
    expect(bad.code).not.toBe(0);
    expect(bad.stderr).toMatch(/--epsilon-k/);
    const unknown = await cli('b2', '--epsilon', '100', '--json');
    expect(unknown.code).not.toBe(0);
    expect(unknown.stderr).toMatch(/--epsilon/);
    const list = await cli('b2', '--epsilon-k', '100', '--sigma-angstrom', '3.4', '--temperatures', '300,,400');
    expect(list.code).not.toBe(0);
    expect(list.stderr).toMatch(/--temperatures/);
    const quantum = await cli('b2', '--epsilon-k', '100', '--sigma-angstrom', '3.4', '--temperatures', '300', '--quantum');
    expect(quantum.code).not.toBe(0);
    expect(quantum.stderr).toMatch(/--molar-mass/);
  });
});

describe('cli collision', () => {
  it('prints Ω(1,1)* and Ω(2,2)* rows (Bird, Stewart & Lightfoot 2002 Table E.2 at T* = 1: 1.440 and 1.593)', async () => {
    const out = await cli('collision', '--reduced-temperatures', '0.5,1,2', '--json');
    expect(out.code).toBe(0);
    const json = JSON.parse(out.stdout) as { rows: { reducedTemperature: number; omega11: number; omega22: number }[] };
    expect(json.rows.map((r) => Object.keys(r).sort())).toEqual(Array(3).fill(['omega11', 'omega22', 'reducedTemperature']));
    for (const r of json.rows) {
      expect(r.omega11).toBe(omega11(r.reducedTemperature));
      expect(r.omega22).toBe(omega22(r.reducedTemperature));
    }
    // Reference values and tolerances: registry entries collision.bsl.omega11.t1 and collision.bsl.omega22.t1.
    expectWithinReference(json.rows[1].omega11, referenceCheckById('collision.bsl.omega11.t1'));
    expectWithinReference(json.rows[1].omega22, referenceCheckById('collision.bsl.omega22.t1'));
  });

  it('reports a reduced temperature outside the table on stderr with a non-zero exit', async () => {
    const out = await cli('collision', '--reduced-temperatures', '0.05', '--json');
    expect(out.code).not.toBe(0);
    expect(out.stderr).toMatch(/--reduced-temperatures 0\.05: .*range/);
  });
});

describe('cli viscosity', () => {
  it('prints viscosity rows for argon matching the library, with the correction statement', async () => {
    const out = await cli(
      'viscosity',
      '--epsilon-k',
      '122.4',
      '--sigma-angstrom',
      '3.432',
      '--molar-mass',
      '39.948',
      '--temperatures',
      '300,500',
      '--json',
    );
    expect(out.code).toBe(0);
    const json = JSON.parse(out.stdout) as { rows: { temperatureK: number; viscosityMicroPaS: number }[]; higherOrderCorrection: string };
    expect(json.rows.map((r) => Object.keys(r).sort())).toEqual(Array(2).fill(['temperatureK', 'viscosityMicroPaS']));
    for (const r of json.rows)
      expect(r.viscosityMicroPaS).toBe(viscosityWithGradient(r.temperatureK, 122.4, 3.432, 39.948).viscosityMicroPaS);
    // measured argon: 22.7 µPa·s at 300 K (Lemmon & Jacobsen 2004, from memory): registry entry viscosity.argon-300.
    expectWithinReference(json.rows[0].viscosityMicroPaS, referenceCheckById('viscosity.argon-300'));
    expect(json.higherOrderCorrection).toBe('none (first Chapman–Enskog approximation)');
  });

  it("applies Kihara's factor with --higher-order-correction kihara and rejects other values", async () => {
    const args = ['--epsilon-k', '122.4', '--sigma-angstrom', '3.432', '--molar-mass', '39.948', '--temperatures', '1500'];
    const out = await cli('viscosity', ...args, '--higher-order-correction', 'kihara', '--json');
    expect(out.code).toBe(0);
    const json = JSON.parse(out.stdout) as { rows: { viscosityMicroPaS: number }[]; higherOrderCorrection: string };
    expect(json.rows[0].viscosityMicroPaS).toBe(
      viscosityWithGradient(1500, 122.4, 3.432, 39.948, { higherOrderCorrection: 'kihara' }).viscosityMicroPaS,
    );
    expect(json.higherOrderCorrection).toMatch(/Kihara/);
    const bad = await cli('viscosity', ...args, '--higher-order-correction', 'full', '--json');
    expect(bad.code).not.toBe(0);
    expect(bad.stderr).toMatch(/--higher-order-correction/);
  });

  it('rejects a missing --molar-mass with a message naming it', async () => {
    const out = await cli('viscosity', '--epsilon-k', '122.4', '--sigma-angstrom', '3.432', '--temperatures', '300', '--json');
    expect(out.code).not.toBe(0);
    expect(out.stderr).toMatch(/--molar-mass/);
  });
});
