/**
 * Parameter covariance of a weighted least-squares fit, C = (JᵀWJ)⁻¹, where J is the Jacobian of the
 * weighted residuals r_i = (model_i − measured_i)/u_i (so W is already folded into J).
 * Computed through a singular value decomposition of the column-equilibrated J (ml-matrix) rather than by
 * forming and inverting JᵀJ, which would square the condition number (Björck 1996, "Numerical Methods for
 * Least Squares Problems", §1.4 and §2.7).
 */
import { Matrix, SingularValueDecomposition } from 'ml-matrix';

/** Ratio of smallest to largest singular value of the equilibrated Jacobian below which it is treated as singular. */
export const SINGULAR_VALUE_RATIO_LIMIT = 1e-10;

export interface CovarianceEstimate {
  /** (JᵀWJ)⁻¹: the covariance if the stated uncertainties u_i are absolute. Null when J is singular. */
  unscaled: number[][] | null;
  /** (JᵀWJ)⁻¹ · χ²/ν: the covariance if the uncertainties are only relative. Null when J is singular or ν = 0. */
  scaled: number[][] | null;
  /** Smallest / largest singular value of the column-equilibrated Jacobian (1 = perfectly conditioned). */
  singularValueRatio: number;
  singular: boolean;
}

/** Covariance of the parameters from the weighted-residual Jacobian (n rows × p columns), χ² and degrees of freedom. */
export function covarianceFromJacobian(jacobian: readonly (readonly number[])[], chi2: number, dof: number): CovarianceEstimate {
  const n = jacobian.length;
  const p = n > 0 ? jacobian[0].length : 0;
  if (n === 0 || p === 0) throw new RangeError('covarianceFromJacobian: the Jacobian is empty');
  // Scale each column to unit norm so the singular-value test does not depend on the parameters' units.
  const columnNorms = new Array<number>(p).fill(0);
  for (const row of jacobian) {
    if (row.length !== p) throw new RangeError('covarianceFromJacobian: Jacobian rows differ in length');
    for (let k = 0; k < p; k++) columnNorms[k] += row[k] * row[k];
  }
  for (let k = 0; k < p; k++) columnNorms[k] = Math.sqrt(columnNorms[k]);
  if (n < p || columnNorms.some((norm) => !(norm > 0) || !Number.isFinite(norm))) {
    return { unscaled: null, scaled: null, singularValueRatio: 0, singular: true };
  }
  const scaled = new Matrix(n, p);
  for (let i = 0; i < n; i++) for (let k = 0; k < p; k++) scaled.set(i, k, jacobian[i][k] / columnNorms[k]);
  const svd = new SingularValueDecomposition(scaled, { computeLeftSingularVectors: false });
  const s = svd.diagonal;
  const sMax = Math.max(...s);
  const sMin = Math.min(...s);
  const singularValueRatio = sMax > 0 ? sMin / sMax : 0;
  if (!(singularValueRatio >= SINGULAR_VALUE_RATIO_LIMIT)) {
    return { unscaled: null, scaled: null, singularValueRatio, singular: true };
  }
  // (AᵀA)⁻¹ = V S⁻² Vᵀ for A = J D⁻¹, then C = D⁻¹ (AᵀA)⁻¹ D⁻¹ with D = diag(column norms).
  const v = svd.rightSingularVectors;
  const unscaled: number[][] = [];
  for (let a = 0; a < p; a++) {
    const row: number[] = [];
    for (let b = 0; b < p; b++) {
      let sum = 0;
      for (let k = 0; k < p; k++) sum += (v.get(a, k) * v.get(b, k)) / (s[k] * s[k]);
      row.push(sum / (columnNorms[a] * columnNorms[b]));
    }
    unscaled.push(row);
  }
  const factor = dof > 0 ? chi2 / dof : NaN;
  const scaledCovariance = dof > 0 ? unscaled.map((row) => row.map((c) => c * factor)) : null;
  return { unscaled, scaled: scaledCovariance, singularValueRatio, singular: false };
}

/** Standard errors: square roots of the covariance diagonal. */
export function standardErrorsFromCovariance(covariance: readonly (readonly number[])[]): number[] {
  return covariance.map((row, k) => Math.sqrt(row[k]));
}

/** Correlation matrix ρ_ab = C_ab / √(C_aa C_bb). */
export function correlationFromCovariance(covariance: readonly (readonly number[])[]): number[][] {
  const se = standardErrorsFromCovariance(covariance);
  return covariance.map((row, a) => row.map((c, b) => (a === b ? 1 : c / (se[a] * se[b]))));
}
