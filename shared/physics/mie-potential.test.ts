import { describe, expect, it } from 'vitest';
import { mieMinimumPosition, miePrefactor, mieReducedPotential, potentialLabel } from './mie-potential';
import { b2WithGradient, b2ZeroCm3PerMol, reducedB2 } from './virial';

// Reference B2*(T*) = B2/(2πN_Aσ³/3) of the Mie λr-6 potential and ∂B2*/∂λr, computed for this test by an independent
// quadrature: mpmath 1.3.0 (tanh-sinh `mp.quad`, 30 significant digits) of −3∫(e^{−u*/T*} − 1)x² dx over
// [0, 1, x_min, 2x_min, ∞], and `mp.diff` (numerical differentiation at 30 digits) for ∂/∂λr. Script:
//   C = (n/(n−6))(n/6)^(6/(n−6)); f = −3·expm1(−C(x^−n − x^−6)/T)·x²; mp.quad(f, [0, 1, xm, 2xm, inf])
// The 12-6 row agrees with Hirschfelder, Curtiss & Bird (1954), Table I-B (B2*(1) = −2.5381, B2*(5) = 0.2433; from memory).
const REFERENCE: Record<number, Array<[number, number, number]>> = {
  8: [[0.7, -7.014306456209609, 0.983401785026], [1, -3.978412894908942, 0.620667837508], [2, -1.284874654890129, 0.284193479369], [5, -0.03753485807233207, 0.117799959344], [20, 0.3969305795015096, 0.0464582818541]],
  10: [[0.7, -5.56433621990935, 0.536263524904], [1, -3.068801863304489, 0.334352846611], [2, -0.8694619413187904, 0.152396673805], [5, 0.1375790010837311, 0.0655683105352], [20, 0.4721591633840856, 0.0308859531999]],
  12: [[0.7, -4.71003731595488, 0.340852980797], [1, -2.538081336319327, 0.21099183253], [2, -0.6276252881164595, 0.0961632175673], [5, 0.2433435027746588, 0.0428302832089], [20, 0.5253742041723858, 0.0230527801207]],
  16: [[0.7, -3.733545489394112, 0.175517477126], [1, -1.935978690794231, 0.107819331073], [2, -0.35273496946765, 0.0493597523963], [5, 0.3690790698466669, 0.0232598068018], [20, 0.59930897149292, 0.0149347420958]],
  20: [[0.7, -3.183093971473268, 0.108118034656], [1, -1.598479475266587, 0.0661720080197], [2, -0.1978226980111982, 0.030466491162], [5, 0.4435651771925475, 0.01496308941], [20, 0.6497872639571895, 0.01068851346]],
  36: [[0.7, -2.23877535162104, 0.0326399993242], [1, -1.021927859710587, 0.0198895920007], [2, 0.06965426795333967, 0.0093109514166], [5, 0.5805467691309264, 0.00497861594979], [20, 0.7571867737316787, 0.00424460229804]],
};

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
    for (const [n, rows] of Object.entries(REFERENCE)) {
      for (const [tStar, b2Star, dB2dn] of rows) {
        const b0 = b2ZeroCm3PerMol(3.7);
        const p = b2WithGradient(tStar * 150, 150, 3.7, undefined, { repulsiveExponent: Number(n), exponentDerivative: true });
        expect(Math.abs(reducedB2(tStar, Number(n)) - b2Star)).toBeLessThan(1e-11 * (1 + Math.abs(b2Star)));
        expect(Math.abs(p.b2Cm3PerMol / b0 - b2Star)).toBeLessThan(1e-11 * (1 + Math.abs(b2Star)));
        expect(Math.abs((p.dB2dRepulsiveExponent as number) / b0 - dB2dn)).toBeLessThan(1e-9 * (1 + Math.abs(dB2dn)));
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
    expect(() => b2WithGradient(300, 150, 3.7, undefined, { repulsiveExponent: 6 })).toThrow(/repulsiveExponent \(λr\) must be a number from 8 to 36, got 6/);
    expect(() => reducedB2(1, 40)).toThrow(/from 8 to 36/);
  });
});
