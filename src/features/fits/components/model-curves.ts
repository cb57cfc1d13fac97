import { posteriorPredictiveBand } from '@shared/fitting/lj-posterior';
import { PROPERTY_MODELS, type FitKind, type PropertyContext } from '@shared/fitting/property-models';

/** Temperatures from a little below to a little above the measured ones, `steps` + 1 of them. */
export function temperatureGrid(temperaturesK: number[], steps = 80): number[] {
  if (!temperaturesK.length) return [];
  const lo = Math.min(...temperaturesK);
  const hi = Math.max(...temperaturesK);
  const span = hi - lo || lo * 0.2;
  const from = Math.max(lo - span * 0.05, 1e-3);
  const to = hi + span * 0.05;
  return Array.from({ length: steps + 1 }, (_, i) => from + ((to - from) * i) / steps);
}

/** Model values on a smooth temperature grid, computed in the browser with the same code the fit used. */
export function modelCurve(
  kind: FitKind,
  temperaturesK: number[],
  epsilonK: number,
  sigmaAngstrom: number,
  context: { molarMassGPerMol?: number; quantumCorrection: boolean },
  steps = 80,
) {
  const points: Array<{ x: number; y: number }> = [];
  for (const t of temperatureGrid(temperaturesK, steps)) {
    try {
      points.push({ x: t, y: PROPERTY_MODELS[kind].evaluate({ temperatureK: t }, epsilonK, sigmaAngstrom, context).value });
    } catch {
      // Outside the model's tabulated range (e.g. collision integrals): leave a gap rather than invent a value.
    }
  }
  return points;
}

/** Every k-th draw, at most `count` of them: the band's edges settle with a couple of hundred draws. */
export function thinDraws<T>(draws: readonly T[], count: number): T[] {
  const stride = Math.max(1, Math.ceil(draws.length / count));
  return draws.filter((_, i) => i % stride === 0);
}

/**
 * The posterior-predictive 95 % band of a kind on the grid: the central 95 % of the model over the posterior draws
 * (the model only, no measurement noise), as points whose y is the upper and `lower` the lower edge.
 */
export function modelBand(
  kind: FitKind,
  temperaturesK: number[],
  draws: ReadonlyArray<{ epsilonK: number; sigmaAngstrom: number }>,
  context: PropertyContext,
  steps = 40,
) {
  const states = temperatureGrid(temperaturesK, steps).map((t) => ({ temperatureK: t }));
  return posteriorPredictiveBand(kind, states, draws, context)
    .filter((b) => Number.isFinite(b.lower95) && Number.isFinite(b.upper95))
    .map((b) => ({ x: b.temperatureK, y: b.upper95, lower: b.lower95 }));
}
