/**
 * The equations of state of the full Lennard-Jones 12-6 fluid that Epsigma knows, selectable by id:
 * Thol et al. (2016), the reference (the default everywhere), and for comparison Johnson–Zollweg–Gubbins
 * (1993) and Kolafa–Nezbeda (1994). Each is wrapped as `EosFunctions` so one set of solvers
 * (phase-equilibrium.ts) gives the critical point, coexistence and the stable density for all three.
 */
import {
  LJ_EOS_SOURCE,
  ljEosCompressibilityDerivative,
  ljEosInternalEnergy,
  ljEosPressure,
  ljEosResidualHelmholtz,
  ljEosThermalPressureCoefficient,
} from '../lj-eos';
import {
  KOLAFA_NEZBEDA_1994_SOURCE,
  knChemicalPotential,
  knInternalEnergy,
  knPressure,
  knPressureDerivatives,
} from './kolafa-nezbeda-1994';
import {
  findCriticalPoint,
  solveCoexistence,
  solveDensity,
  type Coexistence,
  type CriticalPoint,
  type EosFunctions,
  type StableDensity,
} from './phase-equilibrium';
import { THOL_2016, THOL_2016_SOURCE } from './thol-2016';

export type LjEosModelId = 'thol2016' | 'jzg1993' | 'kn1994';

export const LJ_EOS_MODEL_IDS: readonly LjEosModelId[] = ['thol2016', 'jzg1993', 'kn1994'];

export const DEFAULT_LJ_EOS_MODEL: LjEosModelId = 'thol2016';

export interface LjEosModel {
  id: LjEosModelId;
  label: string;
  source: string;
  functions: EosFunctions;
}

const JZG_1993: EosFunctions = {
  id: 'jzg1993',
  // The MBWR polynomial turns over above ρ* ≈ 1.09 at low T* (an artefact); the liquid-branch scan starts
  // below its top and skips the falling part.
  maxDensity: 1.25,
  pressure: ljEosPressure,
  dPdRho: ljEosCompressibilityDerivative,
  dPdT: ljEosThermalPressureCoefficient,
  chemicalPotential: (rho, t) => t * Math.log(rho) + ljEosResidualHelmholtz(rho, t) + ljEosPressure(rho, t) / rho,
  residualEnergy: ljEosInternalEnergy,
};

const KN_1994: EosFunctions = {
  id: 'kn1994',
  maxDensity: 1.25,
  pressure: knPressure,
  dPdRho: (rho, t) => knPressureDerivatives(rho, t).dPdRho,
  dPdT: (rho, t) => knPressureDerivatives(rho, t).dPdT,
  chemicalPotential: knChemicalPotential,
  residualEnergy: knInternalEnergy,
};

export const LJ_EOS_MODELS: Record<LjEosModelId, LjEosModel> = {
  thol2016: { id: 'thol2016', label: 'Thol et al. (2016)', source: THOL_2016_SOURCE, functions: THOL_2016 },
  jzg1993: { id: 'jzg1993', label: 'Johnson, Zollweg & Gubbins (1993)', source: LJ_EOS_SOURCE, functions: JZG_1993 },
  kn1994: { id: 'kn1994', label: 'Kolafa & Nezbeda (1994)', source: KOLAFA_NEZBEDA_1994_SOURCE, functions: KN_1994 },
};

export function isLjEosModelId(x: unknown): x is LjEosModelId {
  return typeof x === 'string' && (LJ_EOS_MODEL_IDS as readonly string[]).includes(x);
}

const criticalPoints = new Map<LjEosModelId, CriticalPoint>();

/** Critical point of the chosen equation (computed once per model). */
export function ljCriticalPoint(model: LjEosModelId = DEFAULT_LJ_EOS_MODEL): CriticalPoint {
  let c = criticalPoints.get(model);
  if (!c) {
    c = findCriticalPoint(LJ_EOS_MODELS[model].functions);
    criticalPoints.set(model, c);
  }
  return c;
}

const coexistenceCache = new Map<string, Coexistence>();

/**
 * Vapour–liquid coexistence at T* (AboveCriticalError at or above the model's T*c). Cached per model and T*:
 * a fit asks for the same temperatures for the liquid density, the vapour density and the vapour pressure.
 */
export function ljCoexistence(reducedTemperature: number, model: LjEosModelId = DEFAULT_LJ_EOS_MODEL): Coexistence {
  const key = `${model}:${reducedTemperature}`;
  const hit = coexistenceCache.get(key);
  if (hit) return hit;
  const c = solveCoexistence(LJ_EOS_MODELS[model].functions, reducedTemperature, ljCriticalPoint(model));
  if (coexistenceCache.size > 5000) coexistenceCache.clear();
  coexistenceCache.set(key, c);
  return c;
}

/** Density at (T*, P*): the stable root unless `prefer` names a phase. */
export function ljStableDensity(
  reducedTemperature: number,
  reducedPressure: number,
  model: LjEosModelId = DEFAULT_LJ_EOS_MODEL,
  prefer?: 'liquid' | 'vapour',
): StableDensity {
  return solveDensity(LJ_EOS_MODELS[model].functions, reducedTemperature, reducedPressure, ljCriticalPoint(model), prefer);
}
