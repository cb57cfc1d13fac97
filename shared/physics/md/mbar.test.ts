import { beforeAll, describe, expect, it } from 'vitest';
import { runNpt } from './npt';
import { ReweightPool, reweightRunFromFrames } from './mbar';
import { decodeFloat64, encodeFloat64 } from './frames';

/**
 * Reweighting stored NPT frames to nearby reduced states (MBAR, Shirts & Chodera 2008). One run at T* = 1.5, P* = 0.5
 * (128 atoms, 5000 steps extended towards 50 effective samples) predicts three nearby states, which direct runs
 * check; a distant state must be refused by the Kish effective-sample-size guard. The reweighted estimate and a
 * direct run are independent, so they agree within 3 combined standard errors (common practice, no source).
 */
const BASE = { reducedTemperature: 1.5, reducedPressure: 0.5 };
const run = (state: { reducedTemperature: number; reducedPressure: number }, seed: number) =>
  runNpt({ ...state, atoms: 128, steps: 5000, seed });

describe('frames', () => {
  it('round-trip Float64 values through base64 exactly', () => {
    const values = [0, -1.5, Math.PI, 1e-300, -7.25e12, Number.MIN_VALUE, 123456.789];
    for (let n = 0; n <= values.length; n++)
      expect(Array.from(decodeFloat64(encodeFloat64(values.slice(0, n))))).toEqual(values.slice(0, n));
    expect(() => decodeFloat64('@@@@')).toThrow(/base64/);
  });
});

describe('MBAR reweighting of NPT runs', () => {
  let base: ReturnType<typeof runNpt>;
  let pool: ReweightPool;
  beforeAll(() => {
    base = run(BASE, 11);
    pool = new ReweightPool([reweightRunFromFrames(1, base.settings, base.frames)]);
  }, 300_000);

  it('is the identity at the run’s own state', () => {
    const own = pool.predict(BASE);
    if (!own.ok) throw new Error(own.reason);
    expect(own.reducedDensity).toBeCloseTo(base.reducedDensity, 12);
    expect(own.stdErr).toBeCloseTo(base.stdErr, 12);
    expect(own.effectiveSamples).toBeCloseTo(base.effectiveSamples, 8);
    // The fluctuation derivatives are the run's own covariances (the small-sample factor uses N_eff of ρ* alone).
    expect(Math.abs(own.dRhoDT / base.dRhoDT - 1)).toBeLessThan(0.02);
    expect(Math.abs(own.dRhoDP / base.dRhoDP - 1)).toBeLessThan(0.02);
  });

  const nearby = [
    { reducedTemperature: 1.53, reducedPressure: 0.5 },
    { reducedTemperature: 1.5, reducedPressure: 0.52 },
    { reducedTemperature: 1.48, reducedPressure: 0.49 },
  ];
  it.each(nearby)(
    'agrees with a direct run at T* = $reducedTemperature, P* = $reducedPressure',
    (state) => {
      const predicted = pool.predict(state);
      if (!predicted.ok) throw new Error(predicted.reason);
      const direct = run(state, 29);
      expect(Math.abs(predicted.reducedDensity - direct.reducedDensity)).toBeLessThan(3 * Math.hypot(predicted.stdErr, direct.stdErr));
      // A neighbouring state holds fewer effective samples than the run's own.
      expect(predicted.effectiveSamples).toBeLessThan(base.effectiveSamples);
      expect(predicted.stdErr).toBeGreaterThan(0);
    },
    300_000,
  );

  it('refuses a distant state by the effective-sample-size guard', () => {
    const far = pool.predict({ reducedTemperature: 2.0, reducedPressure: 1.0 });
    expect(far.ok).toBe(false);
    expect(far.effectiveSamples).toBeLessThan(pool.minEffectiveSamples);
    if (!far.ok) expect(far.reason).toMatch(/effective samples|overlaps/);
  });

  it('pools two runs: the prediction between them carries more effective samples than either alone', () => {
    const second = run({ reducedTemperature: 1.53, reducedPressure: 0.52 }, 12);
    const both = new ReweightPool(
      [reweightRunFromFrames(1, base.settings, base.frames), reweightRunFromFrames(2, second.settings, second.frames)],
      0,
    );
    const alone = new ReweightPool([reweightRunFromFrames(1, base.settings, base.frames)], 0);
    const middle = { reducedTemperature: 1.515, reducedPressure: 0.51 };
    const a = both.predict(middle);
    const b = alone.predict(middle);
    if (!a.ok || !b.ok) throw new Error('no prediction');
    expect(a.effectiveSamples).toBeGreaterThan(b.effectiveSamples);
    expect(a.runs.map((r) => r.id).sort()).toEqual([1, 2]);
  }, 300_000);
});
