import { describe, expect, it } from 'vitest';
import { convertEpsilon, convertSigma } from './parameter-units';

describe('parameter unit conversions', () => {
  // CODATA 2018 (Tiesinga et al., Rev. Mod. Phys. 93, 025010, 2021): R = 8.314462618… J mol⁻¹ K⁻¹ (exact),
  // k_B/e = 8.617333262… × 10⁻⁵ eV K⁻¹ (exact). Thermochemical calorie 4.184 J (NIST SP 811, 2008, B.8).
  it('converts ε/k_B = 1 K into per-mole and per-particle energies', () => {
    expect(convertEpsilon(1, 'kJ/mol')).toBeCloseTo(8.314462618e-3, 12);
    expect(convertEpsilon(1, 'kcal/mol')).toBeCloseTo(8.314462618e-3 / 4.184, 12);
    expect(convertEpsilon(1, 'eV')).toBeCloseTo(8.617333262e-5, 13);
    expect(convertEpsilon(119.8, 'K')).toBe(119.8);
  });
  it('converts σ from Å to nm (1 Å = 0.1 nm exactly, SI Brochure 9th ed. Table 8)', () => {
    expect(convertSigma(3.405, 'nm')).toBeCloseTo(0.3405, 14);
  });
  // A worked check (from memory, common textbook value): argon ε/k_B = 119.8 K ≈ 0.996 kJ/mol ≈ 0.238 kcal/mol.
  it('gives the familiar argon energies', () => {
    expect(convertEpsilon(119.8, 'kJ/mol')).toBeCloseTo(0.996, 3);
    expect(convertEpsilon(119.8, 'kcal/mol')).toBeCloseTo(0.238, 3);
  });
});
