import { describe, expect, it } from 'vitest';
import { b2WithGradient } from './virial';
import { b2Interpolated } from './virial-interpolant';

describe('interpolated B2 for samplers', () => {
  it('matches the quadrature of virial.ts to 1e-9 (relative to |B2| + b0) between the nodes, gradient included', () => {
    // Reference: the exact quadrature (virial.ts, itself checked against Hirschfelder, Curtiss & Bird 1954, Table I-B)
    // at points deliberately between the interpolation nodes.
    for (const tStar of [0.3, 0.4137, 0.777, 1.2345, 2.71828, 3.3, 7.9, 23.4, 88.8]) {
      const epsilonK = 150;
      const sigmaAngstrom = 3.7;
      const exact = b2WithGradient(tStar * epsilonK, epsilonK, sigmaAngstrom);
      const fast = b2Interpolated(tStar * epsilonK, epsilonK, sigmaAngstrom);
      const scale = Math.abs(exact.b2Cm3PerMol) + 63.9; // b0 of σ = 3.7 Å is about 63.9 cm³/mol
      expect(Math.abs(fast.b2Cm3PerMol - exact.b2Cm3PerMol) / scale).toBeLessThan(1e-9);
      expect(Math.abs(fast.dB2dEpsilonK - exact.dB2dEpsilonK) / (Math.abs(exact.dB2dEpsilonK) + 1e-3)).toBeLessThan(1e-7);
      expect(Math.abs(fast.dB2dSigmaAngstrom - exact.dB2dSigmaAngstrom) / scale).toBeLessThan(1e-8);
    }
  });

  it('does the same for a Mie 16-6 potential', () => {
    for (const tStar of [0.5, 1.1, 4.4]) {
      const exact = b2WithGradient(tStar * 150, 150, 3.7, undefined, { repulsiveExponent: 16 });
      const fast = b2Interpolated(tStar * 150, 150, 3.7, 16);
      expect(Math.abs(fast.b2Cm3PerMol - exact.b2Cm3PerMol) / (Math.abs(exact.b2Cm3PerMol) + 63.9)).toBeLessThan(1e-9);
    }
  });
});
