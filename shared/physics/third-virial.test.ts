import { describe, expect, it } from 'vitest';
import { b3WithGradient, ljMayerFunction, reducedB3, reducedB3OfMayer, reducedB3WithDerivative } from './third-virial';
import { b2ZeroCm3PerMol } from './virial';
import { B3_CHECKS } from '../validation/checks/virial-checks';
import { itPassesReferenceChecks } from '../validation/reference-check-tests';

describe('third virial coefficient B3', () => {
  // The hard-sphere value (5/8) b0² (Boltzmann 1899), C*(1.00) = 0.4297 and the maximum of 0.59–0.60 between T* = 1.2
  // and 1.3 (Hirschfelder, Curtiss & Bird 1954, Appendix Table I-C, from memory): registry entries b3.*
  // (shared/validation/checks/virial-checks.ts).
  itPassesReferenceChecks(B3_CHECKS);

  it('turns negative below T* ≈ 0.9', () => {
    // Same table (from memory): C* is negative at T* = 0.8.
    expect(reducedB3(0.8)).toBeLessThan(0);
  });

  it('follows the soft-sphere law B3 ∝ T^(−1/2) at very high T*', () => {
    // For u = ε(σ/r)^12 alone, dimensional analysis gives B3 ∝ T^(−3·2/12) exactly (common practice, no source);
    // the r^−6 attraction still shifts the local slope by a few per cent at T* ~ 1000.
    const slope = Math.log(reducedB3(8000) / reducedB3(2000)) / Math.log(4);
    expect(slope).toBeGreaterThan(-0.5);
    expect(slope).toBeLessThan(-0.45);
  });

  it('gives dB3*/dT* that matches a central difference', () => {
    for (const t of [0.7, 1.0, 2.5]) {
      const [, d] = reducedB3WithDerivative(t);
      const h = 1e-4 * t;
      const fd = (reducedB3(t + h) - reducedB3(t - h)) / (2 * h);
      expect(Math.abs(d - fd)).toBeLessThan(1e-5 * Math.max(1, Math.abs(d)));
    }
  });

  it('converges: doubling the quadrature points changes B3* by less than 1e-5', () => {
    const bp = [0, 0.4, 0.55, 0.7, 0.85, 0.92, 0.97, 1.02, 1.07, 1.12246, 1.18, 1.26, 1.36, 1.5, 1.7, 2, 2.5, 3.2, 4.2, 5.6, 7.5, 10, 14];
    for (const t of [0.6, 1.3, 50]) {
      const fine = reducedB3OfMayer(ljMayerFunction(t), { breakpoints: bp, pointsPerPanel: 24 })[0];
      expect(Math.abs(reducedB3(t) - fine)).toBeLessThan(1e-5 * Math.max(1, Math.abs(fine)));
    }
  });

  it('scales to cm6/mol2 with b0² and has the analytic gradient', () => {
    const p = b3WithGradient(200, 150, 3.8);
    const b0 = b2ZeroCm3PerMol(3.8);
    expect(p.b3Cm6PerMol2).toBeCloseTo(b0 * b0 * reducedB3(200 / 150), 8);
    const he = 1e-4 * 150;
    const fdE = (b3WithGradient(200, 150 + he, 3.8).b3Cm6PerMol2 - b3WithGradient(200, 150 - he, 3.8).b3Cm6PerMol2) / (2 * he);
    expect(p.dB3dEpsilonK).toBeCloseTo(fdE, 3);
    expect(p.dB3dSigmaAngstrom).toBeCloseTo((6 * p.b3Cm6PerMol2) / 3.8, 8);
  });

  it('refuses a reduced temperature outside its range, naming it', () => {
    expect(() => reducedB3(0.1)).toThrow(/T\* = 0.1 is outside/);
    expect(() => b3WithGradient(-1, 100, 3)).toThrow(/temperatureK/);
  });
});

describe('B3 interpolation table', () => {
  it('agrees with direct quadrature between its nodes', () => {
    for (const t of [0.3123, 0.517, 0.953, 1.2345, 3.21, 77.7]) {
      const direct = reducedB3OfMayer(ljMayerFunction(t))[0];
      expect(Math.abs(reducedB3(t) - direct)).toBeLessThan(2e-6 * Math.max(1, Math.abs(direct)));
    }
  });
});
