import { describe, expect, it } from 'vitest';
import { chiSquareCdf, chiSquareQuantile, chiSquareTwoSidedPValue, fCdf, fQuantile } from './statistics';

describe('F distribution', () => {
  // Upper 5 % critical values F(ν1, ν2). Rows ν2 = 1..3: table "F Distribution" at atozmath.com/CONM/DistributionTables.aspx
  // (4 decimals; retrieved with the search tool). Rows ν2 = 10, 12, 20: NIST/SEMATECH e-Handbook of Statistical Methods,
  // §1.3.6.7.3 "Upper Critical Values of the F Distribution" (3 decimals; from memory).
  const table: Array<[number, number, number, number]> = [
    [1, 1, 161.4476, 4],
    [2, 1, 199.5, 4],
    [1, 2, 18.5128, 4],
    [2, 2, 19.0, 4],
    [3, 2, 19.1643, 4],
    [10, 2, 19.3959, 4],
    [1, 3, 10.128, 4],
    [2, 3, 9.5521, 4],
    [10, 3, 8.7855, 4],
    [2, 10, 4.103, 3],
    [5, 10, 3.326, 3],
    [10, 10, 2.978, 3],
    [2, 12, 3.885, 3],
    [2, 20, 3.493, 3],
  ];
  it.each(table)('F(0.95; %i, %i) = %f', (d1, d2, expected, decimals) => {
    expect(fQuantile(0.95, d1, d2)).toBeCloseTo(expected, decimals - 1);
    expect(Math.abs(fQuantile(0.95, d1, d2) - expected)).toBeLessThanOrEqual(0.5 * 10 ** -decimals + 1e-9);
  });

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
  // Upper 5 % critical values: NIST/SEMATECH e-Handbook §1.3.6.7.4 "Critical Values of the Chi-Square Distribution" (from memory).
  it.each([
    [1, 3.841],
    [2, 5.991],
    [10, 18.307],
    [30, 43.773],
  ])('χ²(0.95; %i) = %f', (dof, expected) => {
    expect(Math.abs(chiSquareQuantile(0.95, dof) - expected)).toBeLessThanOrEqual(0.0005 + 1e-9);
  });

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
