/**
 * What every export reads: a parameter set as the lead maps it from the database, and the CSV's display units.
 * Its own file, so the format writers and the dispatcher (parameter-set-export.ts) import it without a circle.
 */
import type { CutoffScheme } from '../physics/cutoff-schemes';
import type { EnergyUnit, LengthUnit } from '../physics/parameter-units';

export interface ExportableParameterSet {
  id: number;
  version: number;
  substance: { id: number; name: string; formula?: string | null; molarMassGPerMol: number };
  /** 'mie' for a Mie λr-6 set (with repulsiveExponent); 'lj-12-6' otherwise. */
  model: 'lj-12-6' | 'mie';
  /** λr of a Mie set (absent or 12: LJ 12-6). */
  repulsiveExponent?: number;
  epsilonK: number;
  sigmaAngstrom: number;
  stdErr: { epsilonK: number | null; sigmaAngstrom: number | null };
  /** Correlation coefficient of the ε and σ estimates from the fit covariance. */
  correlation: number | null;
  scheme: CutoffScheme;
  /** rc/σ for the truncated schemes; null for the full potential. */
  cutoffSigma: number | null;
  validity: { temperatureMinK: number; temperatureMaxK: number; pressureMinMPa?: number | null; pressureMaxMPa?: number | null };
  approvedAt: string | null;
  approvedBy: string | null;
  state: string;
  fitId: number;
  measurementSets: Array<{ id: number; version: number; kind: string; name: string; source?: string | null; doi?: string | null }>;
}

/**
 * Display units for the CSV export (extra columns next to the canonical K and Å ones). JSON always carries
 * every unit; the engine fragments always use the engine's own units, so these options do not touch them.
 */
export interface ExportOptions {
  energyUnit?: EnergyUnit;
  lengthUnit?: LengthUnit;
}
