import { describe, expect, it } from 'vitest';
import { curveFitProblem, weightedLeastSquares, type CurveModel } from './least-squares';
import { ellipsePoints, jointConfidenceEllipse } from './ellipse';
import { fQuantile } from './statistics';

// Straight-line data: for a model linear in its parameters the linearised joint region is exact, so on the
// ellipse boundary S(b) − S(b̂) = p·s²·F(p, n−p, 0.95) must hold exactly (Draper & Smith 1998, §24.5;
// Bates & Watts 1988, eq. 3.3).
const x = [0, 1, 2, 3, 4, 5, 6, 7];
const y = [1.2, 2.8, 5.3, 6.9, 9.2, 10.8, 13.1, 15.2];
const line: CurveModel = (xi, b) => ({ value: b[0] + b[1] * xi, gradient: [1, xi] });
const problem = curveFitProblem({ x, y, uncertainty: x.map(() => 1) }, line, ['a', 'b']);
const sumSquares = (b: number[]) => Array.from(problem.evaluate(b).residuals).reduce((s, r) => s + r * r, 0);

describe('joint 95 % confidence ellipse', () => {
  const fit = weightedLeastSquares(problem, { initialParameters: [1, 1] });
  const center: [number, number] = [fit.parameters[0], fit.parameters[1]];

  it('scaled case: every boundary point has ΔS = p·F(p, n−p, 0.95)·s²', () => {
    const ellipse = jointConfidenceEllipse(center, fit.covarianceScaled!, 'reduced-chi2', x.length);
    expect(ellipse.method).toBe('scaled-F');
    expect(ellipse.description).toContain('ΔS ≤ p·F(p, n−p, 0.95)·s²');
    const s2 = fit.chi2 / fit.dof;
    const target = 2 * fQuantile(0.95, 2, x.length - 2) * s2;
    expect(ellipse.points).toHaveLength(72);
    for (const point of ellipse.points) expect(sumSquares(point) - fit.chi2).toBeCloseTo(target, 8);
  });

  it('unscaled case: every boundary point has Δχ² = 5.991 (χ²₂ upper 5 % point, NIST/SEMATECH e-Handbook §1.3.6.7.4, from memory)', () => {
    const ellipse = jointConfidenceEllipse(center, fit.covarianceUnscaled!, 'none', x.length);
    expect(ellipse.method).toBe('unscaled-chi2');
    expect(ellipse.radiusSquared).toBeCloseTo(5.991, 3);
    for (const point of ellipse.points) expect(sumSquares(point) - fit.chi2).toBeCloseTo(ellipse.radiusSquared, 8);
  });

  it('the ellipse reaches ±√k·σ in each parameter (its bounding box)', () => {
    const ellipse = ellipsePoints(
      [0, 0],
      [
        [4, 1.2],
        [1.2, 1],
      ],
      1,
      3600,
    );
    expect(Math.max(...ellipse.map((p) => p[0]))).toBeCloseTo(2, 5);
    expect(Math.max(...ellipse.map((p) => p[1]))).toBeCloseTo(1, 5);
  });

  it('rejects a covariance that is not positive definite and too few points for the F region', () => {
    expect(() =>
      ellipsePoints(
        [0, 0],
        [
          [1, 2],
          [2, 1],
        ],
        1,
      ),
    ).toThrow('ellipsePoints: the covariance is not positive definite');
    expect(() =>
      ellipsePoints(
        [0, 0],
        [
          [-1, 0],
          [0, 1],
        ],
        1,
      ),
    ).toThrow('symmetric 2×2 matrix with positive diagonal');
    expect(() =>
      jointConfidenceEllipse(
        [0, 0],
        [
          [1, 0],
          [0, 1],
        ],
        'reduced-chi2',
        2,
      ),
    ).toThrow('needs n > 2 points, got 2');
  });
});
