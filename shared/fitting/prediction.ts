/**
 * Properties predicted by a parameter set at a consumer's own state points, with the uncertainty propagated from
 * the set's covariance to first order, var(f) = gᵀ C g with g = (∂f/∂ε, ∂f/∂σ) the models' analytic gradients
 * (JCGM 100:2008, "Guide to the expression of uncertainty in measurement", §5.1.2), and, where posterior draws exist,
 * the central 95 % of the model over the draws instead (no linearisation).
 * States outside the set's validity range are marked, never silently extrapolated.
 */
import { Z_95, posteriorPredictiveBand } from './lj-posterior';
import { PROPERTY_MODELS, type FitKind, type PropertyContext } from './property-models';

export interface PredictionState {
  temperatureK: number;
  /** Needed for densities. */
  pressureMPa?: number;
}

export interface PredictionSet {
  epsilonK: number;
  sigmaAngstrom: number;
  /** [[εε, εσ], [σε, σσ]] in K and Å. */
  covariance: number[][];
  validity?: { temperatureK?: [number, number]; pressureMPa?: [number, number] };
  /** Posterior draws, when the set has a posterior. */
  draws?: ReadonlyArray<{ epsilonK: number; sigmaAngstrom: number }>;
}

export interface Prediction {
  kind: FitKind;
  unit: string;
  temperatureK: number;
  pressureMPa?: number;
  value: number;
  /** First-order propagated standard uncertainty from the covariance. */
  standardError: number;
  lower95: number;
  upper95: number;
  /** How the 95 % interval was obtained. */
  intervalMethod: 'linearised covariance' | 'posterior draws';
  outsideValidity: boolean;
  /** Plain-words note when the state lies outside the validity range. */
  note?: string;
}

/** One property at each state, with its propagated uncertainty and a validity mark. */
export function predictWithUncertainty(
  kind: FitKind,
  states: readonly PredictionState[],
  set: PredictionSet,
  context: PropertyContext,
): Prediction[] {
  const model = PROPERTY_MODELS[kind];
  const c = set.covariance;
  const band = set.draws && set.draws.length >= 40 ? posteriorPredictiveBand(kind, states, set.draws, context) : null;
  return states.map((state, i) => {
    if (!(state.temperatureK > 0)) throw new RangeError(`state ${i + 1}: temperatureK must be positive, got ${state.temperatureK}`);
    if (model.needsPressure && !(Number(state.pressureMPa) > 0))
      throw new RangeError(`state ${i + 1}: the ${model.label} needs a positive pressureMPa`);
    const p = model.evaluate(state, set.epsilonK, set.sigmaAngstrom, context);
    const g = [p.dEpsilonK, p.dSigmaAngstrom];
    const variance = g[0] * g[0] * c[0][0] + 2 * g[0] * g[1] * c[0][1] + g[1] * g[1] * c[1][1];
    const standardError = Math.sqrt(Math.max(0, variance));
    const reasons: string[] = [];
    const t = set.validity?.temperatureK;
    if (t && (state.temperatureK < t[0] || state.temperatureK > t[1]))
      reasons.push(`${state.temperatureK} K lies outside the validity range ${t[0]}–${t[1]} K`);
    const pr = set.validity?.pressureMPa;
    if (pr && state.pressureMPa !== undefined && (state.pressureMPa < pr[0] || state.pressureMPa > pr[1]))
      reasons.push(`${state.pressureMPa} MPa lies outside the validity range ${pr[0]}–${pr[1]} MPa`);
    const fromDraws = band?.[i];
    const useDraws = fromDraws !== undefined && Number.isFinite(fromDraws.lower95) && Number.isFinite(fromDraws.upper95);
    return {
      kind,
      unit: model.unit,
      temperatureK: state.temperatureK,
      ...(state.pressureMPa !== undefined ? { pressureMPa: state.pressureMPa } : {}),
      value: p.value,
      standardError,
      lower95: useDraws ? fromDraws.lower95 : p.value - Z_95 * standardError,
      upper95: useDraws ? fromDraws.upper95 : p.value + Z_95 * standardError,
      intervalMethod: useDraws ? 'posterior draws' : 'linearised covariance',
      outsideValidity: reasons.length > 0,
      ...(reasons.length
        ? {
            note: `Extrapolated: ${reasons.join('; ')}. The set was not fitted there and its uncertainty does not cover the model's own error.`,
          }
        : {}),
    };
  });
}
