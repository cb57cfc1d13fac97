import { describe, expect, it } from 'vitest';
import { mieMinimumPosition, miePrefactor, mieReducedPotential, potentialLabel } from './mie-potential';
import { b2WithGradient, b2ZeroCm3PerMol, reducedB2 } from './virial';
import { MIE_B2_CHECKS } from '../validation/checks/virial-checks';
import { expectReferenceCheck } from '../validation/reference-check-tests';

// Reference B2* and ∂B2*/∂λr from an independent 30-digit mpmath quadrature: MIE_B2_CHECKS in
// shared/validation/checks/virial-checks.ts (the table, the script and the 12-6 row's agreement with HCB 1954 are there).

describe('Mie λr-6 potential', () => {
  it('has its minimum −ε at r_min = (λr/6)^(1/(λr−6)) σ and C(12) = 4 (Lafitte et al. 2013, eq. 2)', () => {
    for (const n of [8, 12, 16, 23.5, 36]) {
      const xm = mieMinimumPosition(n);
      expect(mieReducedPotential(xm, n)).toBeCloseTo(-1, 12);
      expect(mieReducedPotential(1, n)).toBe(0);
      expect(mieReducedPotential(xm * 1.001, n)).toBeGreaterThan(-1);
      expect(mieReducedPotential(xm * 0.999, n)).toBeGreaterThan(-1);
    }
    expect(miePrefactor(12)).toBe(4);
    // C(15) ≈ 2.9625 (Potoff & Bernard-Brunel 2009 use λr 12–18; value from the formula, checked by hand).
    expect(miePrefactor(15)).toBeCloseTo((15 / 9) * Math.pow(15 / 6, 6 / 9), 14);
    expect(potentialLabel(12)).toBe('LJ 12-6');
    expect(potentialLabel(16)).toBe('Mie 16-6');
  });

  it('B2* and ∂B2*/∂λr match an independent 30-digit quadrature for λr = 8 to 36', () => {
    expect(MIE_B2_CHECKS).toHaveLength(60);
    for (const check of MIE_B2_CHECKS) {
      // reducedB2 for B2*, b2WithGradient for ∂B2*/∂λr (the registry's computations); B2 also through the dimensional path.
      expectReferenceCheck(check);
      if (check.kind === 'b2') {
        const b0 = b2ZeroCm3PerMol(3.7);
        const p = b2WithGradient(check.reducedTemperature * 150, 150, 3.7, undefined, { repulsiveExponent: check.repulsiveExponent });
        expect(Math.abs(p.b2Cm3PerMol / b0 - check.reference)).toBeLessThan(1e-11 * (1 + Math.abs(check.reference)));
      }
    }
  });

  it('λr = 12 takes the 12-6 code path: identical numbers to the last bit', () => {
    for (const t of [80, 150, 400, 2000]) {
      const plain = b2WithGradient(t, 150, 3.7);
      const mie = b2WithGradient(t, 150, 3.7, undefined, { repulsiveExponent: 12 });
      expect(mie).toEqual(plain);
      expect(Object.is(mie.b2Cm3PerMol, plain.b2Cm3PerMol)).toBe(true);
      const q = b2WithGradient(t, 150, 3.7, { molarMassGPerMol: 20.2 }, { repulsiveExponent: 12 });
      expect(q).toEqual(b2WithGradient(t, 150, 3.7, { molarMassGPerMol: 20.2 }));
    }
  });

  it('rejects λr outside 8–36 naming the parameter', () => {
    expect(() => b2WithGradient(300, 150, 3.7, undefined, { repulsiveExponent: 6 })).toThrow(
      /repulsiveExponent \(λr\) must be a number from 8 to 36, got 6/,
    );
    expect(() => reducedB2(1, 40)).toThrow(/from 8 to 36/);
  });
});
