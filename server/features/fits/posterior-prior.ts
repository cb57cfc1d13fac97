import type { ParameterSetPrior } from '../../../shared/fitting/lj-posterior';
import { potentialLabel } from '../../../shared/physics/mie-potential';
import { AppError } from '../../common/errors';
import type { Db } from '../../db/database';
import { findParameterSet } from '../parameter-sets/parameter-sets.repository';

const FIELD = 'options.posterior.prior.parameterSetId';

/** States whose values a prior may rest on: reviewed and published (a superseded set was approved once). */
const PRIOR_STATES = ['approved', 'superseded'] as const;

/**
 * The Gaussian prior of `options.posterior.prior`: the set's ε and σ as the mean, its standard errors and correlation
 * as the covariance. Refused (422, naming the field) when the set does not exist, is not approved or superseded, is of
 * another model (potential or λr) than the fit, or has no standard error for one of the two.
 */
export async function resolvePosteriorPrior(
  db: Db,
  parameterSetId: number,
  fit: { model?: 'lj-12-6' | 'mie'; repulsiveExponent?: number; fitRepulsiveExponent?: boolean },
): Promise<ParameterSetPrior> {
  const set = await findParameterSet(db, parameterSetId);
  const refuse = (code: string, message: string, detail: string): never => {
    throw new AppError(422, code, message, [{ field: FIELD, message: detail }]);
  };
  if (!set)
    return refuse(
      'unknown_parameter_set',
      `Parameter set ${parameterSetId} does not exist, so it cannot give the prior.`,
      'no such parameter set',
    );
  const name = `${set.substanceName} ${potentialLabel(set.repulsiveExponent)} set v${set.version}`;
  if (!(PRIOR_STATES as readonly string[]).includes(set.state)) {
    refuse(
      'prior_not_approved',
      `${name} is ${set.state.replace('_', ' ')}: a prior must come from an approved (or superseded) set.`,
      `the set is ${set.state.replace('_', ' ')}, not approved or superseded`,
    );
  }
  const model = fit.model ?? 'lj-12-6';
  if (set.potential !== model) {
    refuse(
      'prior_model_mismatch',
      `${name} is a ${potentialLabel(set.repulsiveExponent)} set and this fit is ${model === 'mie' ? 'a Mie' : 'an LJ 12-6'} fit: a prior must come from a set of the same model.`,
      'the set is of another model',
    );
  }
  if (model === 'mie' && (fit.fitRepulsiveExponent || fit.repulsiveExponent !== set.repulsiveExponent)) {
    refuse(
      'prior_model_mismatch',
      `${name} has λr = ${set.repulsiveExponent}; ε and σ of another λr are not the same parameters, so the fit must hold λr at ${set.repulsiveExponent} to use it as a prior.`,
      `the set has λr = ${set.repulsiveExponent}`,
    );
  }
  const se = [set.epsilonStdErrK, set.sigmaStdErrAngstrom];
  if (!(se[0]! > 0) || !(se[1]! > 0)) {
    refuse(
      'prior_without_uncertainty',
      `${name} has no standard error for ${!(se[0]! > 0) ? 'ε/k_B' : 'σ'} (it was held in its fit), so it gives no Gaussian prior.`,
      'the set has no standard error for one parameter',
    );
  }
  const r = set.correlation ?? 0;
  const c = r * se[0]! * se[1]!;
  return {
    parameterSetId: set.id,
    label: `${name} (${set.state})`,
    epsilonK: set.epsilonK,
    sigmaAngstrom: set.sigmaAngstrom,
    covariance: [
      [se[0]! ** 2, c],
      [c, se[1]! ** 2],
    ],
  };
}
