/**
 * Saturation properties of an LJ fluid with parameters (ε/k_B, σ) from the Thol et al. (2016) equation of state
 * (shared/physics/eos), by corresponding states: T* = T/ε,
 *   ρ_liq, ρ_vap = ρ*(T*)·M ÷ (N_A σ³),   p_sat = P*(T*)·k_B ε ÷ σ³,
 * with analytic gradients: ∂ρ/∂ε = −scale·(dρ*÷dT*)·T*÷ε, ∂ρ/∂σ = −3ρ/σ,
 * ∂p/∂ε = (k_B÷σ³)(P* − T*·dP*÷dT*), ∂p/∂σ = −3p/σ; the T*-slopes along the saturation curve come from the
 * Clapeyron equation (phase-equilibrium.ts).
 *
 * A point at or above the model's critical temperature has no saturation value. While the fit iterates, such a
 * point is evaluated just below T*c (a flat continuation, so a trial ε is not fatal); `saturationRangeProblem`
 * names the points that are still above T*c at the final parameters, and the fit refuses them.
 */
import { AVOGADRO_PER_MOL, BOLTZMANN_J_PER_K } from '../physics/constants';
import { DEFAULT_LJ_EOS_MODEL, LJ_EOS_MODELS, ljCoexistence, ljCriticalPoint, type LjEosModelId } from '../physics/eos/lj-eos-models';

export type SaturationProperty = 'liquidDensity' | 'vapourDensity' | 'vapourPressure';

/** How far below T*c the continuation sits (relative): close enough to be continuous, far enough for the solver. */
const CONTINUATION_GAP = 1e-4;

export interface SaturationPrediction {
  value: number;
  dEpsilonK: number;
  dSigmaAngstrom: number;
}

export function saturationPrediction(
  property: SaturationProperty,
  temperatureK: number,
  epsilonK: number,
  sigmaAngstrom: number,
  molarMassGPerMol: number | undefined,
  model: LjEosModelId = DEFAULT_LJ_EOS_MODEL,
): SaturationPrediction {
  const tc = ljCriticalPoint(model).reducedTemperature;
  const tStar = temperatureK / epsilonK;
  const clamped = tStar >= tc * (1 - CONTINUATION_GAP);
  const s = ljCoexistence(clamped ? tc * (1 - CONTINUATION_GAP) : tStar, model);
  const sigmaM = sigmaAngstrom * 1e-10;
  if (property === 'vapourPressure') {
    const scaleMPa = (BOLTZMANN_J_PER_K / sigmaM ** 3) * 1e-6;
    const value = scaleMPa * epsilonK * s.saturationPressure;
    const slope = clamped ? 0 : s.dPressureDT;
    return { value, dEpsilonK: scaleMPa * (s.saturationPressure - tStar * slope), dSigmaAngstrom: (-3 * value) / sigmaAngstrom };
  }
  if (molarMassGPerMol === undefined) throw new Error('saturated densities need the molar mass');
  const scale = (molarMassGPerMol * 1e-3) / (AVOGADRO_PER_MOL * sigmaM ** 3);
  const rhoStar = property === 'liquidDensity' ? s.liquidDensity : s.vapourDensity;
  const slope = clamped ? 0 : property === 'liquidDensity' ? s.dLiquidDensityDT : s.dVapourDensityDT;
  const value = scale * rhoStar;
  return { value, dEpsilonK: (scale * slope * -tStar) / epsilonK, dSigmaAngstrom: (-3 * value) / sigmaAngstrom };
}

/** A message when T is at or above the model's critical temperature for this ε, else null. */
export function saturationRangeProblem(temperatureK: number, epsilonK: number, model: LjEosModelId = DEFAULT_LJ_EOS_MODEL): string | null {
  const tc = ljCriticalPoint(model).reducedTemperature;
  if (temperatureK / epsilonK < tc * (1 - CONTINUATION_GAP)) return null;
  return (
    `T = ${temperatureK} K is at or above the critical temperature of the ${LJ_EOS_MODELS[model].label} equation at ε/k_B = ${epsilonK.toFixed(2)} K ` +
    `(T_c = T*c·ε/k_B = ${(tc * epsilonK).toFixed(2)} K, T*c = ${tc.toFixed(4)}): there is no saturated liquid or vapour there`
  );
}
