import { describe, expect, it } from 'vitest';
import { freezingLiquidDensity, ljRegionOf } from './lj-freezing';
import { expectReferenceCheck } from '../../validation/reference-check-tests';
import { referenceCheckById } from '../../validation/reference-checks';

describe('LJ freezing line (Mastny & de Pablo 2007, eq. 21)', () => {
  it('puts the liquid at the triple point where simulations find it', () => {
    // Liquid density at the triple point: ρ*_l ≈ 0.845 at T*_tp ≈ 0.69 (Agrawal & Kofke 1995, Mol. Phys. 85, 43, and
    // Mastny & de Pablo 2007 alike, from memory): registry entry freezing.triple-point-liquid.
    expectReferenceCheck(referenceCheckById('freezing.triple-point-liquid'));
    // Along the freezing line the liquid gets denser with temperature (common practice, no source).
    expect(freezingLiquidDensity(1.0)).toBeGreaterThan(freezingLiquidDensity(0.8));
    expect(freezingLiquidDensity(2.0)).toBeGreaterThan(freezingLiquidDensity(1.0));
    // At high temperature the soft-sphere scaling ρ ∝ T^{1/4} takes over (Hoover et al. 1970): ρ β^{1/4} → 0.90735.
    expect(freezingLiquidDensity(1e4) * 1e-4 ** 0.25).toBeCloseTo(0.90735 - 0.2712e-4, 4);
    expect(() => freezingLiquidDensity(-1)).toThrow(/reducedTemperature/);
  });

  it('sorts states into fluid, solid and no fluid root', () => {
    // Stable liquids near the triple line (the states of the issue) and a supercritical fluid.
    expect(ljRegionOf(0.85, 0.1).region).toBe('fluid');
    expect(ljRegionOf(0.75, 0.05).region).toBe('fluid');
    expect(ljRegionOf(1.5, 0.5).region).toBe('fluid');
    // Below the triple-point temperature a dense state is solid; above it, beyond the freezing density too. At T* = 1
    // the melting pressure is about 6–7 (Agrawal & Kofke 1995, from memory), so P* = 8 is solid and P* = 1 fluid.
    const deep = ljRegionOf(0.6, 8);
    expect(deep.region).toBe('solid');
    expect(deep.reason).toMatch(/triple-point/);
    expect(ljRegionOf(1.0, 8).region).toBe('solid');
    expect(ljRegionOf(1.0, 1).region).toBe('fluid');
    // A dilute vapour below the triple point is still a fluid.
    expect(ljRegionOf(0.6, 1e-4).region).toBe('fluid');
  });
});
