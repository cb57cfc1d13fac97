import { PROPERTY_MODELS, type FitKind } from '@shared/fitting/property-models';

/** Model values on a smooth temperature grid, computed in the browser with the same code the fit used. */
export function modelCurve(kind: FitKind, temperaturesK: number[], epsilonK: number, sigmaAngstrom: number, context: { molarMassGPerMol?: number; quantumCorrection: boolean }, steps = 80) {
  if (!temperaturesK.length) return [];
  const lo = Math.min(...temperaturesK);
  const hi = Math.max(...temperaturesK);
  const span = hi - lo || lo * 0.2;
  const from = Math.max(lo - span * 0.05, 1e-3);
  const to = hi + span * 0.05;
  const points: Array<{ x: number; y: number }> = [];
  for (let i = 0; i <= steps; i++) {
    const t = from + ((to - from) * i) / steps;
    try {
      points.push({ x: t, y: PROPERTY_MODELS[kind].evaluate({ temperatureK: t }, epsilonK, sigmaAngstrom, context).value });
    } catch {
      // Outside the model's tabulated range (e.g. collision integrals): leave a gap rather than invent a value.
    }
  }
  return points;
}
