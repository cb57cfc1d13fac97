/**
 * Registry of the measured properties the Lennard-Jones fit understands, keyed by dataset kind.
 * Adding a property (e.g. density) is one entry here: its model with the analytic gradient in (ε/k_B, σ).
 */
import { b2WithGradient } from '../physics/virial';
import { viscosityWithGradient } from '../physics/viscosity';

export interface PropertyContext {
  molarMassGPerMol?: number;
  quantumCorrection: boolean;
}

export interface PropertyPrediction {
  value: number;
  dEpsilonK: number;
  dSigmaAngstrom: number;
}

export interface PropertyModel {
  /** Name shown in messages, with the unit of `value`. */
  label: string;
  unit: string;
  /** True when the model cannot be evaluated without the molar mass. */
  needsMolarMass: boolean;
  /**
   * k such that, at fixed T and ε, the classical model scales as σ^k (B2 ∝ b0 ∝ σ³; η ∝ σ^−2).
   * The starting-value scan uses it to solve σ for a trial ε in closed form; null if the property has no such scaling.
   */
  sigmaExponent: number | null;
  evaluate(temperatureK: number, epsilonK: number, sigmaAngstrom: number, context: PropertyContext): PropertyPrediction;
}

export const PROPERTY_MODELS = {
  b2: {
    label: 'second virial coefficient B2',
    unit: 'cm3/mol',
    needsMolarMass: false,
    sigmaExponent: 3,
    evaluate(temperatureK, epsilonK, sigmaAngstrom, context) {
      const quantum = context.quantumCorrection && context.molarMassGPerMol !== undefined ? { molarMassGPerMol: context.molarMassGPerMol } : undefined;
      const point = b2WithGradient(temperatureK, epsilonK, sigmaAngstrom, quantum);
      return { value: point.b2Cm3PerMol, dEpsilonK: point.dB2dEpsilonK, dSigmaAngstrom: point.dB2dSigmaAngstrom };
    },
  },
  viscosity: {
    label: 'dilute-gas viscosity',
    unit: 'uPa s',
    needsMolarMass: true,
    sigmaExponent: -2,
    evaluate(temperatureK, epsilonK, sigmaAngstrom, context) {
      if (context.molarMassGPerMol === undefined) throw new Error('the viscosity model needs the molar mass');
      const point = viscosityWithGradient(temperatureK, epsilonK, sigmaAngstrom, context.molarMassGPerMol);
      return { value: point.viscosityMicroPaS, dEpsilonK: point.dEtadEpsilonK, dSigmaAngstrom: point.dEtadSigmaAngstrom };
    },
  },
} satisfies Record<string, PropertyModel>;

export type FitKind = keyof typeof PROPERTY_MODELS;

export const FIT_KINDS = Object.keys(PROPERTY_MODELS) as FitKind[];

export function isFitKind(kind: unknown): kind is FitKind {
  return typeof kind === 'string' && Object.prototype.hasOwnProperty.call(PROPERTY_MODELS, kind);
}
