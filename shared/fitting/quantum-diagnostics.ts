/**
 * Quantum diagnostics of a fit for light gases: the de Boer parameter Λ* of the fitted (ε, σ) with its standard
 * error, and warnings when quantum effects on B2 are not negligible at the data's temperatures:
 * - the first-order Wigner–Kirkwood term is no longer small: more than BREAKDOWN_FRACTION of
 *   max(|B2_classical|, 0.1·b0) (the floor keeps the test meaningful near the Boyle temperature, where B2 → 0) —
 *   e.g. a helium-like gas at 20 K, where the first-order term exceeds |B2| itself: the expansion has broken down;
 * - a classical fit (no quantum correction) is biased: the Feynman–Hibbs B2 (quantum-b2.ts) differs from the
 *   classical B2 by more than the stated uncertainty of a point (a neon-like gas at low temperature).
 * The fractions are choices of ours (common practice, no source), stated in the messages.
 */
import { deBoerParameterWithError, quantumB2 } from '../physics/quantum-b2';

/** First-order term above this fraction of max(|B2_cl|, 0.1·b0) counts as "no longer small". */
export const BREAKDOWN_FRACTION = 0.5;

export interface QuantumDiagnosticPoint {
  kind: string;
  temperatureK: number;
  uncertainty: number;
}

export interface QuantumDiagnostics {
  /** Λ* = h/(σ√(mε)) of the fitted parameters; null without molar mass or without B2/viscosity data. */
  deBoerParameter: number | null;
  deBoerParameterStdErr: number | null;
  warnings: string[];
}

const fmt = (x: number, digits = 3) => Number(x.toPrecision(digits)).toString();

export function quantumDiagnostics(
  points: readonly QuantumDiagnosticPoint[],
  fitted: { epsilonK: number; sigmaAngstrom: number; covariance: number[][] | null },
  molarMassGPerMol: number | undefined,
  quantumCorrection: boolean,
): QuantumDiagnostics {
  const relevant = points.filter((p) => p.kind === 'b2' || p.kind === 'viscosity');
  if (molarMassGPerMol === undefined || relevant.length === 0 || !(fitted.epsilonK > 0) || !(fitted.sigmaAngstrom > 0)) {
    return { deBoerParameter: null, deBoerParameterStdErr: null, warnings: [] };
  }
  const { value, stdErr } = deBoerParameterWithError(fitted.epsilonK, fitted.sigmaAngstrom, molarMassGPerMol, fitted.covariance);
  const warnings: string[] = [];
  const b2Points = relevant.filter((p) => p.kind === 'b2');
  let breakdown: { t: number; first: number; classical: number } | null = null;
  let bias: { t: number; shift: number; u: number } | null = null;
  const b0 = (2 * Math.PI * 6.02214076e23 * (fitted.sigmaAngstrom * 1e-8) ** 3) / 3;
  for (const p of b2Points) {
    let q;
    try {
      q = quantumB2(p.temperatureK, fitted.epsilonK, fitted.sigmaAngstrom, molarMassGPerMol);
    } catch {
      continue;
    }
    const scale = Math.max(Math.abs(q.classicalCm3PerMol), 0.1 * b0);
    if (Math.abs(q.firstOrderCm3PerMol) > BREAKDOWN_FRACTION * scale && (!breakdown || p.temperatureK < breakdown.t)) {
      breakdown = { t: p.temperatureK, first: q.firstOrderCm3PerMol, classical: q.classicalCm3PerMol };
    }
    const shift = q.feynmanHibbsCm3PerMol - q.classicalCm3PerMol;
    if (
      !quantumCorrection &&
      Math.abs(shift) > p.uncertainty &&
      (!bias || Math.abs(shift) / p.uncertainty > Math.abs(bias.shift) / bias.u)
    ) {
      bias = { t: p.temperatureK, shift, u: p.uncertainty };
    }
  }
  if (breakdown) {
    warnings.push(
      `quantum expansion has broken down: at T = ${breakdown.t} K the first-order quantum correction to B2 (${fmt(breakdown.first)} cm³/mol) is more than ` +
        `${BREAKDOWN_FRACTION * 100} % of |B2| (classical ${fmt(breakdown.classical)} cm³/mol, Λ* = ${fmt(value)}); neither the classical nor the corrected LJ B2 is reliable there`,
    );
  }
  if (bias) {
    warnings.push(
      `classical fit is biased by quantum effects: at T = ${bias.t} K the Feynman–Hibbs B2 differs from the classical one by ${fmt(bias.shift)} cm³/mol, ` +
        `${fmt(Math.abs(bias.shift) / bias.u, 2)}× the point's uncertainty (Λ* = ${fmt(value)}); fit with the quantum correction`,
    );
  }
  return { deBoerParameter: value, deBoerParameterStdErr: stdErr, warnings };
}
