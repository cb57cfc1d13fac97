/**
 * Quantum effects on the second virial coefficient of light LJ gases (helium, hydrogen, neon).
 *
 * The de Boer parameter Λ* = h/(σ√(mε)) (de Boer, Physica 14, 139, 1948) measures them: about 2.7 for ⁴He,
 * 1.7 for H₂, 0.59 for Ne and 0.19 for Ar (Hirschfelder, Curtiss & Bird 1954, §6.5; from memory).
 *
 * Beyond the first-order Wigner–Kirkwood term (virial.ts), B2 is evaluated here with the quadratic
 * Feynman–Hibbs effective potential (R. P. Feynman and A. R. Hibbs, Quantum Mechanics and Path Integrals,
 * McGraw-Hill 1965, §10-3; the pair form with the reduced mass μ = m/2 as used e.g. by Sesé, Mol. Phys. 85, 931, 1995):
 *   u_FH(r) = u(r) + ħ²/(24 μ kT) [u''(r) + 2u'(r)/r],
 * in reduced units u*_FH = u* + Λ*²/(48π² T*) (u*'' + 2u*'/x), and the classical B2 integral of u_FH. Expanded
 * to first order in Λ*² this gives exactly the Wigner–Kirkwood term b0 Λ*² B_I* (integration by parts; tested);
 * unlike the truncated series it stays bounded when Λ*²/T* is not small, so the difference between the two is a
 * measure of how far the expansion can be trusted. Exchange (symmetry) effects, important for helium below
 * about 10 K, are in neither.
 */
import { ANGSTROM_M, AVOGADRO_PER_MOL, BOLTZMANN_J_PER_K, PLANCK_J_S } from './constants';
import { integrateVector, type QuadratureOptions } from './quadrature';

const X_MIN = Math.pow(2, 1 / 6);
const QUAD: QuadratureOptions = { relativeTolerance: 1e-12, absoluteTolerance: 1e-14, maxSubintervals: 400 };

/** de Boer parameter Λ* = h/(σ√(mε)), m = M/N_A, ε = k_B·(ε/k_B). */
export function deBoerParameter(epsilonK: number, sigmaAngstrom: number, molarMassGPerMol: number): number {
  for (const [name, v] of [
    ['epsilonK', epsilonK],
    ['sigmaAngstrom', sigmaAngstrom],
    ['molarMassGPerMol', molarMassGPerMol],
  ] as const) {
    if (!(v > 0) || !Number.isFinite(v)) throw new RangeError(`${name} must be a finite number > 0 (got ${String(v)})`);
  }
  const massKg = (molarMassGPerMol * 1e-3) / AVOGADRO_PER_MOL;
  return PLANCK_J_S / (sigmaAngstrom * ANGSTROM_M * Math.sqrt(massKg * BOLTZMANN_J_PER_K * epsilonK));
}

/**
 * Λ* and its standard error from those of ε and σ (first-order propagation: ∂ln Λ* ÷ ∂ln σ = −1,
 * ∂ln Λ* ÷ ∂ln ε = −1/2); covariance [[εε, εσ], [σε, σσ]] or null.
 */
export function deBoerParameterWithError(
  epsilonK: number,
  sigmaAngstrom: number,
  molarMassGPerMol: number,
  covariance: number[][] | null,
): { value: number; stdErr: number | null } {
  const value = deBoerParameter(epsilonK, sigmaAngstrom, molarMassGPerMol);
  if (!covariance) return { value, stdErr: null };
  const ge = -0.5 / epsilonK;
  const gs = -1 / sigmaAngstrom;
  const varLn = ge * ge * covariance[0][0] + gs * gs * covariance[1][1] + 2 * ge * gs * covariance[0][1];
  return { value, stdErr: varLn >= 0 ? value * Math.sqrt(varLn) : null };
}

/**
 * [B2*, ∂B2* ÷ ∂T*, ∂B2* ÷ ∂(Λ*²)] with the Feynman–Hibbs potential; B2* = −3∫(e^{−φ} − 1)x² dx,
 * φ = u* ÷ T* + Λ*² g(x) ÷ (48π² T*²), g = u*'' + 2u*' ÷ x = (24/x²)(22w² − 5w), w = x^−6.
 */
export function reducedFeynmanHibbsB2(tStar: number, lambdaStarSquared: number): [number, number, number] {
  if (!(tStar > 0) || !Number.isFinite(tStar)) throw new RangeError(`tStar must be a finite number > 0 (got ${String(tStar)})`);
  if (!(lambdaStarSquared >= 0) || !Number.isFinite(lambdaStarSquared))
    throw new RangeError(`lambdaStarSquared must be a finite number ≥ 0 (got ${String(lambdaStarSquared)})`);
  const c = lambdaStarSquared / (48 * Math.PI * Math.PI);
  const invT = 1 / tStar;
  const integrand = (x: number): number[] => {
    const x2 = x * x;
    const w = Math.pow(x, -6);
    const u = 4 * w * (w - 1);
    const g = (24 / x2) * (22 * w * w - 5 * w);
    const phi = u * invT + c * g * invT * invT;
    if (!Number.isFinite(phi) || phi > 700) return [3 * x2, 0, 0];
    const e = Math.exp(-phi);
    const dPhiDT = -u * invT * invT - 2 * c * g * invT * invT * invT;
    const dPhiDL = (g * invT * invT) / (48 * Math.PI * Math.PI);
    return [-3 * Math.expm1(-phi) * x2, 3 * e * dPhiDT * x2, 3 * e * dPhiDL * x2];
  };
  // Split where the integrand changes character; the tail maps x = x_min/t onto (0, 1].
  const inner = integrateVector(integrand, 0, 1, 3, QUAD, [0.5, 0.8, 0.9]);
  const well = integrateVector(integrand, 1, X_MIN, 3, QUAD);
  const tail = integrateVector((t) => integrand(X_MIN / t).map((v) => (v * X_MIN) / (t * t)), 0, 1, 3, QUAD);
  if (!inner.converged || !well.converged || !tail.converged)
    throw new Error(`Feynman–Hibbs B2 quadrature did not reach its tolerance at tStar = ${tStar}`);
  return [0, 1, 2].map((k) => inner.values[k] + well.values[k] + tail.values[k]) as [number, number, number];
}

export interface QuantumB2Point {
  /** Classical B2, cm³/mol. */
  classicalCm3PerMol: number;
  /** First-order Wigner–Kirkwood term b0 Λ*² B_I*, cm³/mol. */
  firstOrderCm3PerMol: number;
  /** B2 with the Feynman–Hibbs effective potential, cm³/mol. */
  feynmanHibbsCm3PerMol: number;
}

/** b0 = 2πN_Aσ³/3 in cm³/mol for σ in Å. */
function b0Cm3PerMol(sigmaAngstrom: number): number {
  const sigmaCm = sigmaAngstrom * ANGSTROM_M * 100;
  return ((2 * Math.PI * AVOGADRO_PER_MOL) / 3) * sigmaCm ** 3;
}

/**
 * Classical, first-order and Feynman–Hibbs B2 at one temperature. The first-order term is the derivative of the
 * Feynman–Hibbs B2 in Λ*² at Λ*² = 0 (the identity the file header states), so it is taken from the same integral.
 */
export function quantumB2(temperatureK: number, epsilonK: number, sigmaAngstrom: number, molarMassGPerMol: number): QuantumB2Point {
  const lambda = deBoerParameter(epsilonK, sigmaAngstrom, molarMassGPerMol);
  const tStar = temperatureK / epsilonK;
  const b0 = b0Cm3PerMol(sigmaAngstrom);
  const [classical, , slope] = reducedFeynmanHibbsB2(tStar, 0);
  const [fh] = reducedFeynmanHibbsB2(tStar, lambda * lambda);
  return { classicalCm3PerMol: b0 * classical, firstOrderCm3PerMol: b0 * lambda * lambda * slope, feynmanHibbsCm3PerMol: b0 * fh };
}
