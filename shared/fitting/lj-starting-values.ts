/**
 * Automatic starting values for the Lennard-Jones fit.
 * - B2 data that change sign: the Boyle temperature T_B (linear interpolation between the bracketing points)
 *   gives ε/k_B = T_B / T*_B (T*_B ≈ 3.42 for LJ 12-6; Hirschfelder, Curtiss & Bird 1954, §3.6).
 * - For any trial ε, σ follows in closed form: at fixed T and ε every registered property scales as σ^k
 *   (B2 = b0(σ)·B2*(T/ε) with b0 ∝ σ³; η ∝ σ^−2), so s = σ^k is a weighted linear least-squares estimate
 *   (for one B2 point this is inverting b0 = B2/B2*(T*) at that point).
 * - A log-spaced scan in ε picks the trial (ε, σ(ε)) with the lowest χ²; the Boyle estimate joins the scan.
 */
import { boyleReducedTemperature } from '../physics/virial';
import { PROPERTY_MODELS, type FitKind, type PropertyContext } from './property-models';

export interface StartPoint {
  kind: FitKind;
  temperatureK: number;
  pressureMPa?: number;
  value: number;
  /** Effective uncertainty u / weight. */
  uncertainty: number;
}

export interface LjStart {
  epsilonK: number;
  sigmaAngstrom: number;
  /** Approximate χ² at the start (classical scaling model). */
  chi2: number;
  method: string;
}

export interface LjBounds {
  epsilonK: [number, number];
  sigmaAngstrom: [number, number];
}

const SCAN_POINTS = 41;

/** Boyle temperature from B2 points that change sign, or null. */
export function boyleTemperatureFromB2(points: readonly StartPoint[]): number | null {
  const b2 = points.filter((p) => p.kind === 'b2').sort((a, b) => a.temperatureK - b.temperatureK);
  for (let i = 1; i < b2.length; i++) {
    const a = b2[i - 1];
    const b = b2[i];
    if (a.value < 0 && b.value >= 0) {
      return a.temperatureK + ((b.temperatureK - a.temperatureK) * -a.value) / (b.value - a.value);
    }
  }
  return null;
}

/** Best σ for a trial ε and its χ² (classical σ^k scaling), or null if no positive σ fits. */
function sigmaForEpsilon(
  points: readonly StartPoint[],
  epsilonK: number,
  context: PropertyContext,
  bounds: LjBounds,
): { sigmaAngstrom: number; chi2: number } | null {
  const classical: PropertyContext = { ...context, quantumCorrection: false };
  const kinds = [...new Set(points.map((p) => p.kind))];
  // Per point: A_i = model at σ = 1, so that value ≈ A_i σ^k.
  const unit: Array<{ point: StartPoint; a: number; k: number }> = [];
  for (const point of points) {
    const k = PROPERTY_MODELS[point.kind].sigmaExponent;
    if (k === null) continue;
    try {
      unit.push({ point, a: PROPERTY_MODELS[point.kind].evaluate({ temperatureK: point.temperatureK }, epsilonK, 1, classical).value, k });
    } catch {
      return null; // ε outside the model's range for these temperatures
    }
  }
  const chi2At = (sigma: number) => unit.reduce((s, { point, a, k }) => s + ((a * sigma ** k - point.value) / point.uncertainty) ** 2, 0);
  const candidates: number[] = [];
  for (const kind of kinds) {
    const rows = unit.filter((u) => u.point.kind === kind);
    if (rows.length === 0) continue;
    let num = 0;
    let den = 0;
    for (const { point, a } of rows) {
      const w = 1 / (point.uncertainty * point.uncertainty);
      num += w * a * point.value;
      den += w * a * a;
    }
    const s = num / den;
    if (s > 0 && Number.isFinite(s)) candidates.push(s ** (1 / rows[0].k));
  }
  if (candidates.length > 1) candidates.push(Math.exp(candidates.reduce((s, c) => s + Math.log(c), 0) / candidates.length));
  const unscaled = points.filter((p) => PROPERTY_MODELS[p.kind].sigmaExponent === null);
  let best: { sigmaAngstrom: number; chi2: number } | null = null;
  if (unscaled.length) {
    // Properties without a σ^k scaling (densities from the equation of state): minimise the full χ² over σ.
    // Scaling kinds through their cheap σ^k form, the others through their full model.
    const fullChi2 = (sigma: number) => {
      let sum = chi2At(sigma);
      for (const p of unscaled) {
        try {
          const v = PROPERTY_MODELS[p.kind].evaluate(
            { temperatureK: p.temperatureK, pressureMPa: p.pressureMPa, measured: p.value },
            epsilonK,
            sigma,
            classical,
          ).value;
          sum += ((v - p.value) / p.uncertainty) ** 2;
        } catch {
          return Infinity; // no fluid state of the model at this (ε, σ)
        }
      }
      return sum;
    };
    // Gas-phase data, when present, already place σ within ±25 %: search there only.
    const lo = candidates.length ? Math.max(bounds.sigmaAngstrom[0], Math.min(...candidates) / 1.25) : bounds.sigmaAngstrom[0];
    const hi = candidates.length ? Math.min(bounds.sigmaAngstrom[1], Math.max(...candidates) * 1.25) : bounds.sigmaAngstrom[1];
    const sigma = goldenSectionLog(fullChi2, lo, Math.max(hi, lo * 1.01));
    const chi2 = fullChi2(sigma);
    return Number.isFinite(chi2) ? { sigmaAngstrom: sigma, chi2 } : null;
  }
  for (const raw of candidates) {
    const sigma = Math.min(Math.max(raw, bounds.sigmaAngstrom[0]), bounds.sigmaAngstrom[1]);
    const chi2 = chi2At(sigma);
    if (Number.isFinite(chi2) && (!best || chi2 < best.chi2)) best = { sigmaAngstrom: sigma, chi2 };
  }
  return best;
}

/**
 * Minimum of f on [lo, hi] searched in ln x: a coarse scan first (the χ² surface of densities has flat
 * infinite stretches where the model has no fluid state), then golden-section refinement around the best node.
 */
function goldenSectionLog(f: (x: number) => number, lo: number, hi: number): number {
  const nodes = 16;
  let bestI = 0;
  let bestF = Infinity;
  const at = (i: number) => lo * (hi / lo) ** (i / (nodes - 1));
  for (let i = 0; i < nodes; i++) {
    const v = f(at(i));
    if (v < bestF) [bestF, bestI] = [v, i];
  }
  let a = Math.log(at(Math.max(0, bestI - 1)));
  let b = Math.log(at(Math.min(nodes - 1, bestI + 1)));
  const g = (Math.sqrt(5) - 1) / 2;
  let c = b - g * (b - a);
  let d = a + g * (b - a);
  let fc = f(Math.exp(c));
  let fd = f(Math.exp(d));
  for (let k = 0; k < 18; k++) {
    if (fc < fd) {
      [b, d, fd] = [d, c, fc];
      c = b - g * (b - a);
      fc = f(Math.exp(c));
    } else {
      [a, c, fc] = [c, d, fd];
      d = a + g * (b - a);
      fd = f(Math.exp(d));
    }
  }
  return Math.exp((a + b) / 2);
}

/** Starting (ε, σ) for the fit: Boyle estimate and a log-spaced ε scan, σ solved per ε; the lowest χ² wins. */
export function estimateLjStart(points: readonly StartPoint[], context: PropertyContext, bounds: LjBounds): LjStart | null {
  const temperatures = points.map((p) => p.temperatureK);
  const tMin = Math.min(...temperatures);
  const tMax = Math.max(...temperatures);
  // Plausible ε put the data between T* ≈ 0.3 and T* ≈ 100.
  let lo = Math.max(bounds.epsilonK[0], tMax / 100);
  let hi = Math.min(bounds.epsilonK[1], tMin / 0.3);
  if (!(lo < hi)) [lo, hi] = bounds.epsilonK;
  const trials: Array<{ epsilonK: number; method: string }> = [];
  // Without a closed form in σ (densities) each trial costs a 1-D search, so the ε grid is coarser.
  const scanPoints = points.some((p) => PROPERTY_MODELS[p.kind].sigmaExponent === null) ? 21 : SCAN_POINTS;
  for (let i = 0; i < scanPoints; i++)
    trials.push({ epsilonK: lo * (hi / lo) ** (i / (scanPoints - 1)), method: 'epsilon scan with sigma solved per epsilon' });
  const boyleK = boyleTemperatureFromB2(points);
  if (boyleK !== null) {
    const epsilonK = boyleK / boyleReducedTemperature();
    if (epsilonK >= bounds.epsilonK[0] && epsilonK <= bounds.epsilonK[1]) {
      trials.unshift({
        epsilonK,
        method: `Boyle temperature ${boyleK.toPrecision(4)} K from the B2 sign change, sigma from the B2 magnitude`,
      });
    }
  }
  let best: LjStart | null = null;
  for (const trial of trials) {
    const solved = sigmaForEpsilon(points, trial.epsilonK, context, bounds);
    if (solved && (!best || solved.chi2 < best.chi2))
      best = { epsilonK: trial.epsilonK, sigmaAngstrom: solved.sigmaAngstrom, chi2: solved.chi2, method: trial.method };
  }
  return best;
}
