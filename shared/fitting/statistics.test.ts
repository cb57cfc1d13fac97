import { describe, expect, it } from 'vitest';
import { chiSquareCdf, chiSquareQuantile, chiSquareTwoSidedPValue, fCdf, fQuantile } from './statistics';
import { STATISTICS_CHECKS } from '../validation/checks/statistics-checks';
import { itPassesReferenceChecks } from '../validation/reference-check-tests';

describe('F distribution', () => {
  // Upper 5 % critical values F(ν1, ν2) to half a unit of the table's last decimal. Rows ν2 = 1..3: table "F Distribution"
  // at atozmath.com/CONM/DistributionTables.aspx (4 decimals; retrieved with the search tool). Rows ν2 = 10, 12, 20:
  // NIST/SEMATECH e-Handbook of Statistical Methods, §1.3.6.7.3 (3 decimals; from memory). Registry entries statistics.f95.*.
  itPassesReferenceChecks(STATISTICS_CHECKS.filter((c) => c.id.startsWith('statistics.f95.')));

  it('for ν1 = 2 matches the closed form F = (ν2/2)(α^(−2/ν2) − 1) (from the CDF 1 − (1 + 2x/ν2)^(−ν2/2); Johnson, Kotz & Balakrishnan 1995, ch. 27)', () => {
    for (const d2 of [1, 4, 12, 57, 300]) {
      const exact = (d2 / 2) * (0.05 ** (-2 / d2) - 1);
      expect(fQuantile(0.95, 2, d2) / exact - 1).toBeLessThan(1e-10);
      expect(fCdf(exact, 2, d2)).toBeCloseTo(0.95, 12);
    }
  });

  it('rejects bad probabilities and degrees of freedom', () => {
    expect(() => fQuantile(1, 2, 3)).toThrow('probability must lie strictly between 0 and 1, got 1');
    expect(() => fQuantile(0.95, 0, 3)).toThrow('d1 must be a positive finite number, got 0');
    expect(() => fCdf(1, 2, -3)).toThrow('d2 must be a positive finite number, got -3');
  });
});

describe('χ² distribution', () => {
  // Upper 5 % critical values: NIST/SEMATECH e-Handbook §1.3.6.7.4 "Critical Values of the Chi-Square Distribution"
  // (from memory), to half a unit of the third decimal. Registry entries statistics.chi2-95.*.
  itPassesReferenceChecks(STATISTICS_CHECKS.filter((c) => c.id.startsWith('statistics.chi2-95.')));

  it('for ν = 2 matches the closed form −2 ln α (the exponential distribution)', () => {
    expect(chiSquareQuantile(0.95, 2)).toBeCloseTo(-2 * Math.log(0.05), 10);
    expect(chiSquareCdf(3, 2)).toBeCloseTo(1 - Math.exp(-1.5), 13);
  });

  it('two-sided p-value is 1 at the median and small far out in either tail', () => {
    const median = chiSquareQuantile(0.5, 12);
    expect(chiSquareTwoSidedPValue(median, 12)).toBeCloseTo(1, 8);
    expect(chiSquareTwoSidedPValue(chiSquareQuantile(0.995, 12), 12)).toBeCloseTo(0.01, 8);
    expect(chiSquareTwoSidedPValue(chiSquareQuantile(0.001, 12), 12)).toBeCloseTo(0.002, 8);
  });
});
