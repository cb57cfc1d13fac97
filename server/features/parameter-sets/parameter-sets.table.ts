import type { Generated } from 'kysely';
import type { Move, ParameterSetState } from '../../../shared/parameter-sets/transitions';
import type { CutoffScheme } from '../../../shared/physics/cutoff-schemes';

/** A parameter set; every column but state, rationale, validity and updatedAt is frozen by trigger. */
export interface ParameterSetTable {
  id: Generated<number>;
  substanceId: number;
  scheme: CutoffScheme;
  /** Cutoff radius in units of σ for the truncated schemes; null for the full potential. */
  cutoffSigma: number | null;
  version: number;
  fitId: number;
  revisionOf: number | null;
  model: 'lj-12-6';
  /** The pair potential: 'lj-12-6' or 'mie' (Mie λr-6, with repulsiveExponent). */
  potential: Generated<'lj-12-6' | 'mie'>;
  /** λr: 12 for LJ 12-6. */
  repulsiveExponent: Generated<number>;
  epsilonK: number;
  sigmaAngstrom: number;
  epsilonStdErrK: number | null;
  sigmaStdErrAngstrom: number | null;
  correlation: number | null;
  /** The fit's exact measurement set versions (FitMeasurementSetRef[]), copied at creation. */
  measurementSetsJson: string;
  temperatureMinK: number;
  temperatureMaxK: number;
  pressureMinMpa: number | null;
  pressureMaxMpa: number | null;
  rationale: string;
  state: ParameterSetState;
  createdBy: string;
  createdAt: string;
  updatedAt: string;
}

/** Append-only history: one row per move (`create` opens it with fromState null). */
export interface ParameterSetTransitionTable {
  id: Generated<number>;
  parameterSetId: number;
  move: Move | 'create';
  fromState: ParameterSetState | null;
  toState: ParameterSetState;
  /** null when the system made the move (supersede). */
  actorId: string | null;
  comment: string | null;
  at: string;
}

export interface ParameterSetCommentTable {
  id: Generated<number>;
  parameterSetId: number;
  authorId: string;
  body: string;
  createdAt: string;
}
