/**
 * Joint confidence region of two fitted parameters, in the linearised (Gauss–Newton) approximation:
 * { b : (b − b̂)ᵀ C⁻¹ (b − b̂) ≤ k }.
 * - Uncertainties taken as relative (C scaled by s² = χ²/ν): k = p·F(p, n−p, 1−α), which is the region
 *   S(b) − S(b̂) ≤ p·s²·F(p, n−p, 1−α) of Draper & Smith, "Applied Regression Analysis", 3rd ed. (1998), §24.5,
 *   and Bates & Watts, "Nonlinear Regression Analysis and Its Applications" (1988), eq. 3.3.
 * - Uncertainties taken as absolute (C unscaled): Δχ² ≤ χ²_p(1−α) (= 5.991 for p = 2, 95 %),
 *   Press et al., "Numerical Recipes", 3rd ed. (2007), §15.6.5.
 */
import { chiSquareQuantile, fQuantile } from './statistics';

export type EllipseMethod = 'scaled-F' | 'unscaled-chi2';

export interface ConfidenceEllipse {
  /** Points on the boundary, as [parameter a, parameter b] pairs, going once round (first point not repeated). */
  points: Array<[number, number]>;
  /** Squared Mahalanobis radius k of the boundary. */
  radiusSquared: number;
  method: EllipseMethod;
  /** Human-readable statement of the criterion used. */
  description: string;
  confidenceLevel: number;
}

/** Boundary of (b − centre)ᵀ C⁻¹ (b − centre) = radiusSquared for a 2×2 covariance C, via its Cholesky factor. */
export function ellipsePoints(
  center: readonly [number, number],
  covariance: readonly (readonly number[])[],
  radiusSquared: number,
  pointCount = 72,
): Array<[number, number]> {
  const [[c11, c12], [c21, c22]] = covariance;
  if (!(c11 > 0) || !(c22 > 0) || Math.abs(c12 - c21) > 1e-9 * Math.sqrt(c11 * c22)) {
    throw new RangeError('ellipsePoints: the covariance must be a symmetric 2×2 matrix with positive diagonal');
  }
  const l11 = Math.sqrt(c11);
  const l21 = c12 / l11;
  const l22sq = c22 - l21 * l21;
  if (!(l22sq > 0)) throw new RangeError('ellipsePoints: the covariance is not positive definite');
  const l22 = Math.sqrt(l22sq);
  const r = Math.sqrt(radiusSquared);
  const points: Array<[number, number]> = [];
  for (let i = 0; i < pointCount; i++) {
    const t = (2 * Math.PI * i) / pointCount;
    const u = r * Math.cos(t);
    const v = r * Math.sin(t);
    points.push([center[0] + l11 * u, center[1] + l21 * u + l22 * v]);
  }
  return points;
}

/**
 * Joint confidence ellipse for a two-parameter fit.
 * With scaling 'reduced-chi2' pass the scaled covariance and the number of points; with 'none' the unscaled one.
 */
export function jointConfidenceEllipse(
  center: readonly [number, number],
  covariance: readonly (readonly number[])[],
  scaling: 'reduced-chi2' | 'none',
  pointCountData: number,
  confidenceLevel = 0.95,
  boundaryPoints = 72,
): ConfidenceEllipse {
  const p = 2;
  if (scaling === 'reduced-chi2') {
    const dof = pointCountData - p;
    if (dof < 1) throw new RangeError(`jointConfidenceEllipse: the F-based region needs n > 2 points, got ${pointCountData}`);
    const f = fQuantile(confidenceLevel, p, dof);
    const radiusSquared = p * f;
    return {
      points: ellipsePoints(center, covariance, radiusSquared, boundaryPoints),
      radiusSquared,
      method: 'scaled-F',
      description: `ΔS ≤ p·F(p, n−p, ${confidenceLevel})·s² with p = 2, n − p = ${dof}, F = ${f.toPrecision(5)} (covariance scaled by the reduced χ²)`,
      confidenceLevel,
    };
  }
  const radiusSquared = chiSquareQuantile(confidenceLevel, p);
  return {
    points: ellipsePoints(center, covariance, radiusSquared, boundaryPoints),
    radiusSquared,
    method: 'unscaled-chi2',
    description: `Δχ² ≤ χ²₂(${confidenceLevel}) = ${radiusSquared.toPrecision(5)} (unscaled covariance, uncertainties taken as absolute)`,
    confidenceLevel,
  };
}
