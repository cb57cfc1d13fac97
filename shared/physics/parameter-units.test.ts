import { describe, expect, it } from 'vitest';
import { convertEpsilon } from './parameter-units';
import { UNIT_CHECKS } from '../validation/checks/material-checks';
import { itPassesReferenceChecks } from '../validation/reference-check-tests';

describe('parameter unit conversions', () => {
  // CODATA 2018 (Tiesinga et al., Rev. Mod. Phys. 93, 025010, 2021): R = 8.314462618… J mol⁻¹ K⁻¹ (exact),
  // k_B/e = 8.617333262… × 10⁻⁵ eV K⁻¹ (exact). Thermochemical calorie 4.184 J (NIST SP 811, 2008, B.8).
  // ε/k_B = 1 K in kJ/mol, kcal/mol and eV, σ from Å to nm (1 Å = 0.1 nm exactly, SI Brochure 9th ed. Table 8) and the
  // familiar argon energies (119.8 K ≈ 0.996 kJ/mol ≈ 0.238 kcal/mol, from memory): registry entries.
  itPassesReferenceChecks(UNIT_CHECKS.filter((c) => c.testFile === 'shared/physics/parameter-units.test.ts'));
  it('keeps ε in K as it is', () => {
    expect(convertEpsilon(119.8, 'K')).toBe(119.8);
  });
});
