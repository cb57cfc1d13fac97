/**
 * Registry of the measured properties the Lennard-Jones fit understands, keyed by measurement set kind.
 * Adding a property is one entry here: its model with the analytic gradient in (ε/k_B, σ).
 */
import { densityWithGradient, reducedDensityOf, reducedStateOf } from '../physics/corresponding-states';
import { ljEosDensity } from '../physics/lj-eos';
import { b3WithGradient } from '../physics/third-virial';
import { b2WithGradient } from '../physics/virial';
import { viscosityWithGradient } from '../physics/viscosity';
import type { LjEosModelId } from '../physics/eos/lj-eos-models';
import { saturationPrediction, saturationRangeProblem } from './saturation-properties';

export interface PropertyContext {
  molarMassGPerMol?: number;
  quantumCorrection: boolean;
  /** λr of a Mie λr-6 potential (absent: LJ 12-6); only models with `supportsMie` accept it. */
  repulsiveExponent?: number;
  /** LJ equation of state behind the saturation properties (default Thol 2016; JZG 1993 and KN 1994 for comparison). */
  eosModel?: LjEosModelId;
}

/** Where a model is evaluated: the state point, and the measured value where the model must choose a phase. */
export interface ModelPoint {
  temperatureK: number;
  /** Needed by state functions of T and P (density). */
  pressureMPa?: number;
  /** The measured value, used only to pick the liquid or vapour root of a two-phase state. */
  measured?: number;
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
  /** True when every point needs a pressure. */
  needsPressure: boolean;
  /**
   * k such that, at fixed T and ε, the classical model scales as σ^k (B2 ∝ b0 ∝ σ³; η ∝ σ^−2).
   * The starting-value scan uses it to solve σ for a trial ε in closed form; null if the property has no such scaling.
   */
  sigmaExponent: number | null;
  evaluate(point: ModelPoint, epsilonK: number, sigmaAngstrom: number, context: PropertyContext): PropertyPrediction;
  /**
   * A message when the point lies outside what the model can predict at these parameters (a saturation point at
   * or above the critical temperature), else null. The fit evaluates such points by continuation while it
   * iterates and refuses the result if any remain outside at the final parameters.
   */
  rangeProblem?(point: ModelPoint, epsilonK: number, sigmaAngstrom: number, context: PropertyContext): string | null;
  /** True when the model takes a Mie λr-6 potential (context.repulsiveExponent). */
  supportsMie?: boolean;
}

export const PROPERTY_MODELS = {
  b2: {
    label: 'second virial coefficient B2',
    unit: 'cm3/mol',
    needsMolarMass: false,
    needsPressure: false,
    sigmaExponent: 3,
    supportsMie: true,
    evaluate(point, epsilonK, sigmaAngstrom, context) {
      const quantum =
        context.quantumCorrection && context.molarMassGPerMol !== undefined ? { molarMassGPerMol: context.molarMassGPerMol } : undefined;
      const p =
        context.repulsiveExponent === undefined
          ? b2WithGradient(point.temperatureK, epsilonK, sigmaAngstrom, quantum)
          : b2WithGradient(point.temperatureK, epsilonK, sigmaAngstrom, quantum, { repulsiveExponent: context.repulsiveExponent });
      return { value: p.b2Cm3PerMol, dEpsilonK: p.dB2dEpsilonK, dSigmaAngstrom: p.dB2dSigmaAngstrom };
    },
  },
  viscosity: {
    label: 'dilute-gas viscosity',
    unit: 'uPa s',
    needsMolarMass: true,
    needsPressure: false,
    sigmaExponent: -2,
    supportsMie: true,
    evaluate(point, epsilonK, sigmaAngstrom, context) {
      if (context.molarMassGPerMol === undefined) throw new Error('the viscosity model needs the molar mass');
      const mie = context.repulsiveExponent === undefined ? {} : { repulsiveExponent: context.repulsiveExponent };
      const p = viscosityWithGradient(point.temperatureK, epsilonK, sigmaAngstrom, context.molarMassGPerMol, mie);
      return { value: p.viscosityMicroPaS, dEpsilonK: p.dEtadEpsilonK, dSigmaAngstrom: p.dEtadSigmaAngstrom };
    },
  },
  density: {
    // The equation of state of the full LJ potential (Johnson, Zollweg & Gubbins 1993; lj-eos.ts) at the
    // corresponding state; the simulation stage of a density fit replaces it by molecular dynamics.
    label: 'fluid density (LJ equation of state)',
    unit: 'kg/m3',
    needsMolarMass: true,
    needsPressure: true,
    sigmaExponent: null,
    evaluate(point, epsilonK, sigmaAngstrom, context) {
      if (context.molarMassGPerMol === undefined) throw new Error('the density model needs the molar mass');
      if (point.pressureMPa === undefined) throw new Error('the density model needs the pressure of every point');
      const state = { temperatureK: point.temperatureK, pressureMPa: point.pressureMPa, epsilonK, sigmaAngstrom };
      const reduced = reducedStateOf(state);
      let eos = ljEosDensity(reduced.reducedTemperature, reduced.reducedPressure);
      if (point.measured !== undefined && eos.roots.length > 1) {
        // Two fluid roots (below the critical temperature): the measurement says which phase it is.
        const measuredStar = reducedDensityOf(point.measured, context.molarMassGPerMol, sigmaAngstrom);
        const nearest = eos.roots.reduce((a, b) => (Math.abs(Math.log(b / measuredStar)) < Math.abs(Math.log(a / measuredStar)) ? b : a));
        if (nearest !== eos.reducedDensity)
          eos = ljEosDensity(reduced.reducedTemperature, reduced.reducedPressure, {
            prefer: nearest < eos.reducedDensity ? 'vapour' : 'liquid',
          });
      }
      const g = densityWithGradient(eos, state, context.molarMassGPerMol);
      return { value: g.densityKgPerM3, dEpsilonK: g.dRhodEpsilonK, dSigmaAngstrom: g.dRhodSigmaAngstrom };
    },
  },
  b3: {
    // Classical, pairwise-additive B3 of the LJ 12-6 potential (third-virial.ts).
    label: 'third virial coefficient B3',
    unit: 'cm6/mol2',
    needsMolarMass: false,
    needsPressure: false,
    sigmaExponent: 6,
    evaluate(point, epsilonK, sigmaAngstrom) {
      const p = b3WithGradient(point.temperatureK, epsilonK, sigmaAngstrom);
      return { value: p.b3Cm6PerMol2, dEpsilonK: p.dB3dEpsilonK, dSigmaAngstrom: p.dB3dSigmaAngstrom };
    },
  },
  saturatedLiquidDensity: {
    label: 'saturated liquid density (LJ equation of state, Thol 2016 by default)',
    unit: 'kg/m3',
    needsMolarMass: true,
    needsPressure: false,
    sigmaExponent: -3,
    evaluate(point, epsilonK, sigmaAngstrom, context) {
      return saturationPrediction('liquidDensity', point.temperatureK, epsilonK, sigmaAngstrom, context.molarMassGPerMol, context.eosModel);
    },
    rangeProblem: (point, epsilonK, _sigma, context) => saturationRangeProblem(point.temperatureK, epsilonK, context.eosModel),
  },
  saturatedVapourDensity: {
    label: 'saturated vapour density (LJ equation of state, Thol 2016 by default)',
    unit: 'kg/m3',
    needsMolarMass: true,
    needsPressure: false,
    sigmaExponent: -3,
    evaluate(point, epsilonK, sigmaAngstrom, context) {
      return saturationPrediction('vapourDensity', point.temperatureK, epsilonK, sigmaAngstrom, context.molarMassGPerMol, context.eosModel);
    },
    rangeProblem: (point, epsilonK, _sigma, context) => saturationRangeProblem(point.temperatureK, epsilonK, context.eosModel),
  },
  vapourPressure: {
    label: 'vapour pressure (LJ equation of state, Thol 2016 by default)',
    unit: 'MPa',
    needsMolarMass: false,
    needsPressure: false,
    sigmaExponent: -3,
    evaluate(point, epsilonK, sigmaAngstrom, context) {
      return saturationPrediction(
        'vapourPressure',
        point.temperatureK,
        epsilonK,
        sigmaAngstrom,
        context.molarMassGPerMol,
        context.eosModel,
      );
    },
    rangeProblem: (point, epsilonK, _sigma, context) => saturationRangeProblem(point.temperatureK, epsilonK, context.eosModel),
  },
} satisfies Record<string, PropertyModel>;

export type FitKind = keyof typeof PROPERTY_MODELS;

/** The kinds with a Mie λr-6 model, in words for messages: "B2 and dilute-gas viscosity". */
export const MIE_KINDS_TEXT = 'B2 and dilute-gas viscosity';

export const FIT_KINDS = Object.keys(PROPERTY_MODELS) as FitKind[];

export function isFitKind(kind: unknown): kind is FitKind {
  return typeof kind === 'string' && Object.prototype.hasOwnProperty.call(PROPERTY_MODELS, kind);
}
