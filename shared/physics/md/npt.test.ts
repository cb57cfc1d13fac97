import { describe, expect, it } from 'vitest';
import { runNpt } from './npt';
import { reducedB2 } from '../virial';

describe('runNpt', () => {
  it('flags the fcc solid at T* = 0.5, P* = 5 and passes the liquid at T* = 1, P* = 1', () => {
    // Agrawal & Kofke 1995 (Mol. Phys. 85, 43): the LJ triple point is at T*_t ≈ 0.69, so at T* = 0.5 and P* = 5 the
    // stable phase is the fcc solid; at T* = 1.0 their melting pressure is roughly 6–7 (from memory), so P* = 1 is
    // liquid. Q6 of fcc is 0.575, of a liquid ≈ 0 (Steinhardt et al. 1983).
    const solid = runNpt({ reducedTemperature: 0.5, reducedPressure: 5, atoms: 500, steps: 5000, seed: 2 });
    expect(solid.phase).toBe('solid');
    expect(solid.orderParameter.q6Mean).toBeGreaterThan(0.3);
    const liquid = runNpt({ reducedTemperature: 1.0, reducedPressure: 1.0, atoms: 500, steps: 5000, seed: 2 });
    expect(liquid.phase).toBe('fluid');
    expect(liquid.orderParameter.q6Mean).toBeLessThan(0.1);
    expect(liquid.trace.q6.length).toBeGreaterThan(10);
  });

  it('matches the second-virial equation of state in the dilute gas (T* = 2.0, P* = 0.05)', () => {
    // P/T = ρ(1 + B2 ρ), B2 = B2*·(2π/3)σ³ with B2* from ../virial.ts (classical LJ second virial coefficient;
    // Hirschfelder, Curtiss & Bird 1954 tabulate B2*(2.0) = −0.628, from memory). Third-virial terms are ~0.1 % here.
    const t = 2.0;
    const p = 0.05;
    const b2 = reducedB2(t) * ((2 * Math.PI) / 3);
    const rhoVirial = (-1 + Math.sqrt(1 + (4 * b2 * p) / t)) / (2 * b2);
    const r = runNpt({ reducedTemperature: t, reducedPressure: p, atoms: 500, steps: 12000, seed: 5 });
    expect(r.phase).toBe('fluid');
    expect(Math.abs(r.reducedDensity - rhoVirial)).toBeLessThan(3 * r.stdErr + 0.003 * rhoVirial);
    // And it is measurably not an ideal gas (ρ_ideal = P/T is 3 % lower).
    expect(r.reducedDensity).toBeGreaterThan(p / t);
  });

  it('repeats exactly with the same seed and differs with another; echoes the settings', () => {
    const opts = { reducedTemperature: 1.5, reducedPressure: 2, atoms: 256, steps: 1000, seed: 77 };
    const strip = (r: ReturnType<typeof runNpt>): unknown => ({ ...r, diagnostics: { ...r.diagnostics, wallSeconds: 0 } });
    const a = runNpt(opts);
    const b = runNpt(opts);
    expect(strip(b)).toEqual(strip(a));
    const c = runNpt({ ...opts, seed: 78 });
    expect(c.trace.reducedDensity).not.toEqual(a.trace.reducedDensity);
    expect(a.settings).toMatchObject({ cutoff: 2.5, scheme: 'truncated-tail', atoms: 256, steps: 1000, seed: 77 });
    expect(a.trace.step.length).toBeLessThanOrEqual(500);
    const shifted = runNpt({ ...opts, scheme: 'truncated-shifted', cutoff: 3 });
    expect(shifted.settings).toMatchObject({ cutoff: 3, scheme: 'truncated-shifted' });
  });

  it('reports progress from 0 to 1', () => {
    const seen: Array<{ fraction: number; stage: string }> = [];
    runNpt({ reducedTemperature: 1.5, reducedPressure: 2, atoms: 256, steps: 1000 }, (p) => seen.push(p));
    expect(seen[0].fraction).toBe(0);
    expect(seen[seen.length - 1]).toEqual({ fraction: 1, stage: 'done' });
    for (let i = 1; i < seen.length; i++) expect(seen[i].fraction).toBeGreaterThanOrEqual(seen[i - 1].fraction);
    // 1000 steps hold too few effective samples, so the run is extended (up to its cap) after production.
    expect(new Set(seen.map((p) => p.stage))).toEqual(new Set(['melting', 'tuning', 'production', 'extension', 'analysis', 'done']));
  });

  it('rejects bad options with a RangeError naming the parameter', () => {
    const base = { reducedTemperature: 1, reducedPressure: 1 };
    expect(() => runNpt({ ...base, cutoff: 4.5 })).toThrow(/^cutoff/);
    expect(() => runNpt({ ...base, reducedTemperature: -1 })).toThrow(/reducedTemperature/);
    expect(() => runNpt({ ...base, reducedPressure: Number.NaN })).toThrow(/reducedPressure/);
    expect(() => runNpt({ ...base, reducedPressure: 0 })).toThrow(/reducedPressure must be greater than 0/);
    expect(() => runNpt({ ...base, atoms: 10 })).toThrow(/atoms/);
    expect(() => runNpt({ ...base, steps: 12.5 })).toThrow(/steps/);
    expect(() => runNpt({ ...base, scheme: 'shifted-force' as never })).toThrow(/scheme/);
    expect(() => runNpt({ ...base, seed: -3 })).toThrow(RangeError);
    // 100 atoms of liquid fill a box of edge ≈ 5σ, too small for rc = 4.
    expect(() => runNpt({ ...base, atoms: 100, cutoff: 4 })).toThrow(/atoms/);
  });
});
