/**
 * Cross second virial coefficient B12(T) of two LJ 12-6 species and the fit of the combining-rule corrections
 *   ε12 = (1 − k_ij) √(ε1 ε2),   σ12 = (1 − l_ij) (σ1 + σ2)/2
 * to measured B12 with both pure parameter sets held fixed. B12 is the B2 integral of the 1–2 pair potential
 * (the mixture B = Σ x_i x_j B_ij; Hirschfelder, Curtiss & Bird 1954, §3.7, from memory), so
 *   B12(T) = b0(σ12) B2*(T/ε12),  b0(σ) = 2πN_Aσ³/3.
 *
 * Uncertainty of k_ij (and l_ij): the least-squares covariance from the B12 data, plus the pure sets' own
 * uncertainty carried through the fit: with the fitted θ = θ(p) at the optimum, dθ/dp = −(JᵀWJ)⁻¹JᵀW ∂r/∂p
 * (implicit-function theorem, first order), and cov_pure(θ) = (dθ/dp) Σ_p (dθ/dp)ᵀ with Σ_p block-diagonal
 * over the two independent pure sets (each with its own ε–σ correlation). The two add (common practice, no source).
 */
import { weightedLeastSquares, type WeightedResidualProblem } from '../fitting/least-squares';
import { b2WithGradient } from '../physics/virial';

export interface PureSetParameters {
  epsilonK: number;
  sigmaAngstrom: number;
  /** Standard errors of the approved set (null or absent: taken as exact). */
  stdErr?: { epsilonK: number | null; sigmaAngstrom: number | null } | null;
  /** Correlation of ε and σ in that set (absent: 0). */
  correlation?: number | null;
}

export interface CrossParameters {
  epsilon12K: number;
  sigma12Angstrom: number;
}

export function crossParameters(a: PureSetParameters, b: PureSetParameters, kij: number, lij = 0): CrossParameters {
  return {
    epsilon12K: (1 - kij) * Math.sqrt(a.epsilonK * b.epsilonK),
    sigma12Angstrom: ((1 - lij) * (a.sigmaAngstrom + b.sigmaAngstrom)) / 2,
  };
}

/** B12 in cm³/mol at T for given k_ij, l_ij; throws RangeError when ε12 ≤ 0 or σ12 ≤ 0. */
export function crossB2(temperatureK: number, a: PureSetParameters, b: PureSetParameters, kij: number, lij = 0): number {
  const { epsilon12K, sigma12Angstrom } = crossParameters(a, b, kij, lij);
  if (!(epsilon12K > 0) || !(sigma12Angstrom > 0))
    throw new RangeError(`k_ij = ${kij}, l_ij = ${lij} give ε12 = ${epsilon12K} K, σ12 = ${sigma12Angstrom} Å; both must be > 0`);
  return b2WithGradient(temperatureK, epsilon12K, sigma12Angstrom).b2Cm3PerMol;
}

/** B12 and its partial derivatives in (k, l) and in the pure parameters (ε1, σ1, ε2, σ2). */
function b12Derivatives(
  t: number,
  a: PureSetParameters,
  b: PureSetParameters,
  k: number,
  l: number,
): { value: number; dk: number; dl: number; dPure: number[] } {
  const { epsilon12K: e12, sigma12Angstrom: s12 } = crossParameters(a, b, k, l);
  if (!(e12 > 0) || !(s12 > 0)) throw new RangeError(`k_ij = ${k}, l_ij = ${l} give ε12 = ${e12} K, σ12 = ${s12} Å; both must be > 0`);
  const g = b2WithGradient(t, e12, s12);
  const root = Math.sqrt(a.epsilonK * b.epsilonK);
  return {
    value: g.b2Cm3PerMol,
    dk: g.dB2dEpsilonK * -root,
    dl: g.dB2dSigmaAngstrom * (-(a.sigmaAngstrom + b.sigmaAngstrom) / 2),
    // dε12/dε1 = ε12/(2ε1), dσ12/dσ1 = (1 − l)/2, likewise for 2.
    dPure: [
      g.dB2dEpsilonK * (e12 / (2 * a.epsilonK)),
      g.dB2dSigmaAngstrom * ((1 - l) / 2),
      g.dB2dEpsilonK * (e12 / (2 * b.epsilonK)),
      g.dB2dSigmaAngstrom * ((1 - l) / 2),
    ],
  };
}

export interface B12Row {
  temperatureK: number;
  b12Cm3PerMol: number;
  uB12Cm3PerMol: number;
}

export interface CrossFitResult {
  kij: number;
  kijStdErr: number | null;
  /** Part of the standard error from the B12 data alone, and from the two pure sets alone. */
  kijStdErrData: number | null;
  kijStdErrPure: number | null;
  lij: number | null;
  lijStdErr: number | null;
  epsilon12K: number;
  epsilon12KStdErr: number | null;
  sigma12Angstrom: number;
  sigma12AngstromStdErr: number | null;
  chi2: number;
  dof: number;
  reducedChi2: number | null;
  converged: boolean;
  residuals: Array<{ temperatureK: number; measured: number; uncertainty: number; predicted: number; combiningRule: number }>;
  /** Σ[(B12_rule − measured)/u]² with k_ij = l_ij = 0: how much the fitted pair set improves on the Lorentz–Berthelot rule. */
  chi2CombiningRule: number;
  method: string;
}

export class CrossFitInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'CrossFitInputError';
  }
}

function pureCovariance(p: PureSetParameters): number[][] {
  const se = p.stdErr?.epsilonK ?? 0;
  const ss = p.stdErr?.sigmaAngstrom ?? 0;
  const r = p.correlation ?? 0;
  return [
    [se * se, r * se * ss],
    [r * se * ss, ss * ss],
  ];
}

/** Fits k_ij (and l_ij when `fitLij`) to B12 rows with both pure sets fixed; uncertainties of the pure sets propagated. */
export function fitCrossInteraction(
  a: PureSetParameters,
  b: PureSetParameters,
  rows: readonly B12Row[],
  options: { fitLij?: boolean } = {},
): CrossFitResult {
  for (const [name, p] of [
    ['first pure set', a],
    ['second pure set', b],
  ] as const) {
    if (!(p.epsilonK > 0) || !(p.sigmaAngstrom > 0) || !Number.isFinite(p.epsilonK) || !Number.isFinite(p.sigmaAngstrom)) {
      throw new CrossFitInputError(
        `${name}: epsilonK and sigmaAngstrom must be finite numbers > 0, got ${p.epsilonK} K, ${p.sigmaAngstrom} Å`,
      );
    }
  }
  const fitLij = options.fitLij ?? false;
  const nParams = fitLij ? 2 : 1;
  if (rows.length < nParams) throw new CrossFitInputError(`too few B12 points: ${rows.length} for ${nParams} parameter(s)`);
  rows.forEach((r, i) => {
    if (!(r.temperatureK > 0) || !Number.isFinite(r.b12Cm3PerMol) || !(r.uB12Cm3PerMol > 0)) {
      throw new CrossFitInputError(
        `B12 row ${i + 1}: temperatureK and uB12Cm3PerMol must be > 0 and b12Cm3PerMol finite, got T = ${r.temperatureK}, B12 = ${r.b12Cm3PerMol}, u = ${r.uB12Cm3PerMol}`,
      );
    }
  });
  const at = (theta: readonly number[]) => ({ k: theta[0], l: fitLij ? theta[1] : 0 });
  const problem: WeightedResidualProblem = {
    parameterNames: fitLij ? ['kij', 'lij'] : ['kij'],
    pointCount: rows.length,
    evaluate(theta) {
      const { k, l } = at(theta);
      const residuals: number[] = [];
      const jacobian: number[][] = [];
      for (const r of rows) {
        const d = b12Derivatives(r.temperatureK, a, b, k, l);
        residuals.push((d.value - r.b12Cm3PerMol) / r.uB12Cm3PerMol);
        jacobian.push(fitLij ? [d.dk / r.uB12Cm3PerMol, d.dl / r.uB12Cm3PerMol] : [d.dk / r.uB12Cm3PerMol]);
      }
      return { residuals, jacobian };
    },
  };
  const fit = weightedLeastSquares(problem, {
    initialParameters: fitLij ? [0, 0] : [0],
    lowerBounds: fitLij ? [-1, -0.5] : [-1],
    upperBounds: fitLij ? [0.9, 0.5] : [0.9],
    maxIterations: 200,
  });
  const { k, l } = at(fit.parameters);
  // Sensitivity of θ to the pure parameters: dθ/dp = −(JᵀJ)⁻¹ Jᵀ (∂r/∂p), all in weighted residual units.
  const J = fit.jacobian;
  const dRdP = rows.map((r) => b12Derivatives(r.temperatureK, a, b, k, l).dPure.map((x) => x / r.uB12Cm3PerMol));
  const jtj = Array.from({ length: nParams }, (_, i) =>
    Array.from({ length: nParams }, (_, j) => J.reduce((s, row) => s + row[i] * row[j], 0)),
  );
  const inv = invertSmall(jtj);
  let covPure: number[][] | null = null;
  if (inv) {
    const jtdr = Array.from({ length: nParams }, (_, i) =>
      Array.from({ length: 4 }, (_, c) => J.reduce((s, row, n) => s + row[i] * dRdP[n][c], 0)),
    );
    const sens = inv.map((row) => Array.from({ length: 4 }, (_, c) => -row.reduce((s, v, m) => s + v * jtdr[m][c], 0)));
    const ca = pureCovariance(a);
    const cb = pureCovariance(b);
    const sigmaP = [
      [ca[0][0], ca[0][1], 0, 0],
      [ca[1][0], ca[1][1], 0, 0],
      [0, 0, cb[0][0], cb[0][1]],
      [0, 0, cb[1][0], cb[1][1]],
    ];
    covPure = Array.from({ length: nParams }, (_, i) =>
      Array.from({ length: nParams }, (_, j) =>
        sens[i].reduce((s, si, p) => s + si * sigmaP[p].reduce((t, spq, q) => t + spq * sens[j][q], 0), 0),
      ),
    );
  }
  const covData = fit.covariance;
  const cov = covData && covPure ? covData.map((row, i) => row.map((v, j) => v + covPure![i][j])) : covData;
  const se = (m: number[][] | null, i: number) => (m && m[i][i] >= 0 ? Math.sqrt(m[i][i]) : null);
  const root = Math.sqrt(a.epsilonK * b.epsilonK);
  const half = (a.sigmaAngstrom + b.sigmaAngstrom) / 2;
  const cross = crossParameters(a, b, k, l);
  // ε12 and σ12 errors: through k (and l) and directly through the pure parameters (first order; the direct pure part
  // of ε12 is added to the k part assuming no correlation between them, a small overstatement when they correlate).
  const sePure = (p: PureSetParameters) => ({ e: p.stdErr?.epsilonK ?? 0, s: p.stdErr?.sigmaAngstrom ?? 0 });
  const ea = sePure(a);
  const eb = sePure(b);
  const kSe = se(cov, 0);
  const e12Direct = cross.epsilon12K * Math.sqrt((ea.e / (2 * a.epsilonK)) ** 2 + (eb.e / (2 * b.epsilonK)) ** 2);
  const s12Direct = (1 - l) * 0.5 * Math.sqrt(ea.s ** 2 + eb.s ** 2);
  const lSe = fitLij ? se(cov, 1) : null;
  const residuals = rows.map((r) => ({
    temperatureK: r.temperatureK,
    measured: r.b12Cm3PerMol,
    uncertainty: r.uB12Cm3PerMol,
    predicted: crossB2(r.temperatureK, a, b, k, l),
    combiningRule: crossB2(r.temperatureK, a, b, 0, 0),
  }));
  return {
    kij: k,
    kijStdErr: kSe,
    kijStdErrData: se(covData, 0),
    kijStdErrPure: se(covPure, 0),
    lij: fitLij ? l : null,
    lijStdErr: lSe,
    epsilon12K: cross.epsilon12K,
    epsilon12KStdErr: kSe === null ? null : Math.sqrt((root * kSe) ** 2 + e12Direct ** 2),
    sigma12Angstrom: cross.sigma12Angstrom,
    sigma12AngstromStdErr: fitLij ? (lSe === null ? null : Math.sqrt((half * lSe) ** 2 + s12Direct ** 2)) : s12Direct,
    chi2: fit.chi2,
    dof: fit.dof,
    reducedChi2: fit.reducedChi2,
    converged: fit.convergence === 'parameter-change',
    residuals,
    chi2CombiningRule: residuals.reduce((s, r) => s + ((r.combiningRule - r.measured) / r.uncertainty) ** 2, 0),
    method:
      `weighted least squares of B12 = b0(σ12) B2*(T/ε12) with ε12 = (1 − k_ij)√(ε1ε2)` +
      (fitLij ? `, σ12 = (1 − l_ij)(σ1 + σ2)/2` : `, σ12 = (σ1 + σ2)/2`) +
      `; pure sets held fixed, their standard errors propagated to first order; data part scaled by reduced χ²`,
  };
}

function invertSmall(m: number[][]): number[][] | null {
  if (m.length === 1) return m[0][0] > 0 ? [[1 / m[0][0]]] : null;
  const [[p, q], [r, s]] = m;
  const det = p * s - q * r;
  if (!(Math.abs(det) > 0)) return null;
  return [
    [s / det, -q / det],
    [-r / det, p / det],
  ];
}
