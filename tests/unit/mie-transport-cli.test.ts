import { describe, expect, it } from 'vitest';
import { omega11, omega22 } from '../../shared/physics/collision-integrals';
import { mieCollisionIntegrals } from '../../shared/physics/mie-collision-integrals';
import { viscosityWithGradient } from '../../shared/physics/viscosity';
import { runCli, type CliOutcome } from '../support/run-cli';

// Under a loaded machine a child process with tsx may take well over the default 30 s to start.
const cli = (...args: string[]): Promise<CliOutcome> => runCli(args, 120_000);

describe('cli collision and viscosity with --repulsive-exponent', () => {
  it('collision --repulsive-exponent 16 prints the Mie 16-6 values of the library; 12 prints the 12-6 table', async () => {
    const [mie, lj] = await Promise.all([
      cli('collision', '--reduced-temperatures', '2.281,4.563', '--repulsive-exponent', '16', '--json'),
      cli('collision', '--reduced-temperatures', '2.281,4.563', '--repulsive-exponent', '12', '--json'),
    ]);
    expect(mie.code, mie.stderr).toBe(0);
    const m = JSON.parse(mie.stdout) as {
      model: string;
      repulsiveExponent: number;
      rows: { reducedTemperature: number; omega11: number; omega22: number }[];
    };
    expect([m.model, m.repulsiveExponent]).toEqual(['mie', 16]);
    for (const r of m.rows) {
      const ref = mieCollisionIntegrals(r.reducedTemperature, 16);
      expect([r.omega11, r.omega22]).toEqual([ref.omega11, ref.omega22]);
    }
    const l = JSON.parse(lj.stdout) as typeof m;
    expect(l.model).toBe('lj-12-6');
    expect(l.rows.map((r) => [r.omega11, r.omega22])).toEqual(
      l.rows.map((r) => [omega11(r.reducedTemperature), omega22(r.reducedTemperature)]),
    );
    // A harder repulsion than 12 gives a larger Ω(2,2)* at T* well above 1 (mie-collision-integrals.test.ts).
    expect(m.rows[1].omega22).toBeGreaterThan(l.rows[1].omega22);
  }, 240_000);

  it('viscosity --repulsive-exponent 16 prints the Mie 16-6 viscosity of the library for quillgas QG-1', async () => {
    const out = await cli(
      'viscosity',
      '--epsilon-k',
      '131.5',
      '--sigma-angstrom',
      '3.524',
      '--molar-mass',
      '44.62',
      '--temperatures',
      '300,500',
      '--repulsive-exponent',
      '16',
      '--json',
    );
    expect(out.code, out.stderr).toBe(0);
    const json = JSON.parse(out.stdout) as {
      model: string;
      repulsiveExponent: number;
      rows: { temperatureK: number; viscosityMicroPaS: number }[];
    };
    expect([json.model, json.repulsiveExponent]).toEqual(['mie', 16]);
    for (const r of json.rows)
      expect(r.viscosityMicroPaS).toBe(
        viscosityWithGradient(r.temperatureK, 131.5, 3.524, 44.62, { repulsiveExponent: 16 }).viscosityMicroPaS,
      );
  }, 120_000);

  it('refuses λr outside 8–36 naming the flag, and --help shows Quillmoor examples', async () => {
    const [bad, helpCollision, helpViscosity] = await Promise.all([
      cli(
        'viscosity',
        '--epsilon-k',
        '131.5',
        '--sigma-angstrom',
        '3.524',
        '--molar-mass',
        '44.62',
        '--temperatures',
        '300',
        '--repulsive-exponent',
        '40',
        '--json',
      ),
      cli('collision', '--help'),
      cli('viscosity', '--help'),
    ]);
    expect(bad.code).not.toBe(0);
    expect(bad.stderr).toMatch(/--repulsive-exponent must be a number from 8 to 36, got "40"/);
    expect(helpCollision.code).toBe(0);
    expect(helpCollision.stdout).toMatch(/quillgas QG-1 of the Quillmoor demo/);
    expect(helpCollision.stdout).toMatch(/collision --reduced-temperatures 2\.281,4\.563 --repulsive-exponent 16 --json/);
    expect(helpViscosity.code).toBe(0);
    expect(helpViscosity.stdout).toMatch(
      /viscosity --epsilon-k 131\.5 --sigma-angstrom 3\.524 --molar-mass 44\.62 --temperatures 300,500 --repulsive-exponent 16 --json/,
    );
  }, 240_000);
});
