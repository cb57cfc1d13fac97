import { describe, expect, it } from 'vitest';
import { guessReducedDensity } from './density-guess';

describe('guessReducedDensity', () => {
  it('starts in the stable phase on either side of the saturation pressure at T* = 0.75', () => {
    // LJ vapour pressure at T* = 0.75 is ≈ 0.003 for the full potential (Johnson, Zollweg & Gubbins 1993, Table 11,
    // from memory): P* = 0.01 is a compressed liquid (ρ* ≈ 0.82), P* = 0.001 a dilute vapour (ρ* ≈ P/T = 0.0013).
    expect(guessReducedDensity(0.75, 0.01)).toBeGreaterThan(0.75);
    expect(guessReducedDensity(0.75, 0.001)).toBeLessThan(0.002);
  });

  it('falls back to a dense van der Waals root below the EOS fit range', () => {
    // JZG 1993 fitted 0.7 ≤ T* ≤ 6; at T* = 0.3 the start must still be condensed, not a spurious polynomial root.
    expect(guessReducedDensity(0.3, 0.5)).toBeGreaterThan(0.8);
  });
});
