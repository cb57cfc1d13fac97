import { describe, expect, it } from 'vitest';
import { reducedB2 } from '../virial';
import { LJ_EOS_MODEL_IDS, ljCoexistence, ljStableDensity } from './lj-eos-models';
import { AboveCriticalError } from './phase-equilibrium';
import { THOL_2016, tholCoexistence, tholCriticalPoint, tholDensity, tholPressure } from './thol-2016';
import { COEXISTENCE_CHECKS, THOL_CHECKS } from '../../validation/checks/eos-checks';
import { itPassesReferenceChecks } from '../../validation/reference-check-tests';

describe('Thol et al. (2016) LJ equation of state', () => {
  // Thol et al., J. Phys. Chem. Ref. Data 45, 023101 (2016) state the critical point of their equation as
  // T*c = 1.32, ρ*c = 0.31, p*c = 0.13 (the reducing values of eq. 3 are set to it): registry entries thol.critical.*.
  itPassesReferenceChecks(THOL_CHECKS);

  it('reproduces the exact B2 of the LJ potential in the dilute limit', () => {
    // Z − 1 → b0 B2* ρ as ρ → 0 (Hirschfelder, Curtiss & Bird 1954, eq. 3.1-2); B2* by quadrature (virial.ts).
    for (const t of [1, 2, 5]) {
      const rho = 1e-7;
      const b2FromEos = (tholPressure(rho, t) / (rho * t) - 1) / rho / ((2 * Math.PI) / 3);
      expect(Math.abs(b2FromEos - reducedB2(t))).toBeLessThan(5e-3);
    }
  });

  describe('matches NIST SRSW vapour–liquid coexistence of the LJ fluid', () => {
    // NIST Standard Reference Simulation Website, Lennard-Jones fluid, TMMC vapour–liquid coexistence with the
    // potential cut at 3σ plus analytic long-range corrections (close to the full potential Thol describe), T* = 0.70:
    // ρ*vap = 1.996e-3, ρ*liq = 0.8437, p*sat = 1.370e-3; T* = 1.0: ρ*liq ≈ 0.70 and p*sat ≈ 0.025 (from memory).
    // Registry entries coexistence.thol.*.
    itPassesReferenceChecks(COEXISTENCE_CHECKS.filter((c) => c.id.startsWith('coexistence.thol.')));
  });

  it('solves equal pressure and chemical potential right up to the critical point without the trivial root', () => {
    const c = tholCriticalPoint();
    for (const t of [0.65, 0.8, 1.0, 1.2, 1.3, 1.315, 1.319]) {
      const s = tholCoexistence(t);
      const f = THOL_2016;
      expect(Math.abs(f.pressure(s.liquidDensity, t) - s.saturationPressure)).toBeLessThan(1e-12);
      expect(Math.abs(f.pressure(s.vapourDensity, t) - s.saturationPressure)).toBeLessThan(1e-12);
      expect(Math.abs(f.chemicalPotential(s.liquidDensity, t) - f.chemicalPotential(s.vapourDensity, t))).toBeLessThan(1e-10);
      // A spurious solution would have ρ_liq = ρ_vap; the real ones straddle ρ*c (common practice, no source).
      expect(s.liquidDensity).toBeGreaterThan(c.reducedDensity);
      expect(s.vapourDensity).toBeLessThan(c.reducedDensity);
      expect(s.liquidDensity - s.vapourDensity).toBeGreaterThan(0.05);
    }
  });

  it('gives Clapeyron slopes of the saturation curve that match central differences', () => {
    for (const t of [0.8, 1.25]) {
      const s = tholCoexistence(t);
      const h = 1e-5;
      const up = tholCoexistence(t + h);
      const down = tholCoexistence(t - h);
      expect(s.dPressureDT).toBeCloseTo((up.saturationPressure - down.saturationPressure) / (2 * h), 6);
      expect(s.dLiquidDensityDT).toBeCloseTo((up.liquidDensity - down.liquidDensity) / (2 * h), 5);
      expect(s.dVapourDensityDT).toBeCloseTo((up.vapourDensity - down.vapourDensity) / (2 * h), 5);
    }
  });

  it('refuses saturation at or above its critical temperature with a clear message', () => {
    expect(() => tholCoexistence(1.33)).toThrow(AboveCriticalError);
    expect(() => tholCoexistence(1.33)).toThrow(
      /at or above the critical temperature of the thol2016 equation of state \(T\*c = 1\.3200\)/,
    );
  });

  it('returns the stable root at (T*, P*) and says which it chose', () => {
    // At T* = 0.9 the saturation pressure is ≈ 0.0118, so P* = 0.01 is a stable vapour (the liquid root is metastable)
    // and P* = 0.1 a stable liquid (common practice, no source: the phase of lower chemical potential is stable).
    const v = tholDensity(0.9, 0.01);
    expect(v.phase).toBe('vapour');
    expect(v.chosen).toBe('stable');
    expect(v.roots.map((r) => r.phase)).toEqual(['vapour', 'liquid']);
    expect(v.note).toMatch(/stable vapour root.*liquid root is metastable/);
    const forced = tholDensity(0.9, 0.01, 'liquid');
    expect(forced.phase).toBe('liquid');
    expect(forced.stablePhase).toBe('vapour');
    expect(tholDensity(0.9, 0.1).phase).toBe('liquid');
    expect(tholDensity(2.0, 0.5).phase).toBe('supercritical');
  });
});

describe('LJ equation-of-state selector', () => {
  describe('finds each model’s own critical point', () => {
    // JZG 1993 report T*c = 1.313, ρ*c = 0.310 for their equation; KN 1994 report T*c ≈ 1.34 (both from memory).
    // Registry entries coexistence.selector.*.
    itPassesReferenceChecks(COEXISTENCE_CHECKS.filter((c) => c.id.startsWith('coexistence.selector.')));
  });

  it('gives coexistence from all three equations that agree within their fit accuracy at T* = 0.9', () => {
    const ref = ljCoexistence(0.9, 'thol2016');
    for (const id of LJ_EOS_MODEL_IDS) {
      const c = ljCoexistence(0.9, id);
      expect(Math.abs(c.liquidDensity - ref.liquidDensity) / ref.liquidDensity).toBeLessThan(0.005);
      expect(Math.abs(c.saturationPressure - ref.saturationPressure) / ref.saturationPressure).toBeLessThan(0.03);
      expect(ljStableDensity(0.9, 0.01, id).phase).toBe('vapour');
    }
  });
});
