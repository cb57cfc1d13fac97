import { describe, expect, it } from 'vitest';
import { runNpt } from './npt';

describe('NPT with a Mie λr-6 fluid', () => {
  // Short runs (108 atoms, 1000 steps) at a supercritical state: enough to compare code paths, not for physics.
  const base = { reducedTemperature: 2, reducedPressure: 1, atoms: 108, steps: 1000, seed: 3, minEffectiveSamples: 0 };

  it('λr = 12 is the 12-6 run to the last digit; λr = 16 runs the Mie kernel and gives a different, finite state', () => {
    const plain = runNpt(base);
    const twelve = runNpt({ ...base, repulsiveExponent: 12 });
    expect(twelve.reducedDensity).toBe(plain.reducedDensity);
    expect(twelve.stdErr).toEqual(plain.stdErr);
    const mie = runNpt({ ...base, repulsiveExponent: 16 });
    expect(Number.isFinite(mie.reducedDensity)).toBe(true);
    expect(mie.reducedDensity).toBeGreaterThan(0.1);
    expect(mie.reducedDensity).not.toBe(plain.reducedDensity);
  });

  it('rejects λr outside 8–36 naming the option', () => {
    expect(() => runNpt({ ...base, repulsiveExponent: 40 })).toThrow(/repulsiveExponent must be between 8 and 36, got 40/);
  });
});
