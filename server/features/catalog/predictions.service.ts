/**
 * GET /api/parameter-sets/:id/predictions: B2, dilute-gas viscosity or density predicted by an approved (or
 * superseded) set at the reader's own states, with the uncertainty propagated from the set's covariance
 * (shared/fitting/prediction.ts) — or from the posterior draws of its fit when the fit sampled one — and a mark
 * where a state lies outside the set's validity range.
 */
import { predictWithUncertainty } from '../../../shared/fitting/prediction';
import { MIE_KINDS_TEXT, PROPERTY_MODELS } from '../../../shared/fitting/property-models';
import type { PredictionQuery } from '../../../shared/schemas/catalog';
import type { CurrentUser } from '../../common/auth-middleware';
import { AppError } from '../../common/errors';
import type { Db } from '../../db/database';
import { requireFit } from '../fits/fits.service';
import { exportableSet } from './catalog.service';
import { readStoredJson } from '../../../shared/schemas/old-names';

export async function predictionsOfSet(db: Db, id: number, viewer: CurrentUser, query: PredictionQuery) {
  const set = await exportableSet(db, id, viewer);
  const n = set.repulsiveExponent ?? 12;
  const model = PROPERTY_MODELS[query.kind];
  if (n !== 12 && !(model as { supportsMie?: boolean }).supportsMie) {
    throw new AppError(
      422,
      'kind_not_mie',
      `Parameter set ${id} is a Mie ${n}-6 set; Epsigma has no ${model.label} model for Mie potentials yet (${MIE_KINDS_TEXT} only).`,
      [{ field: 'kind', message: `no Mie model for ${query.kind}` }],
    );
  }
  const { epsilonK: se, sigmaAngstrom: ss } = set.stdErr;
  if (se == null || ss == null)
    throw new AppError(
      422,
      'no_uncertainty',
      `Parameter set ${id} has no standard errors (a held parameter), so no uncertainty can be propagated.`,
      [{ field: 'id', message: 'no covariance' }],
    );
  const rho = set.correlation ?? 0;
  const covariance = [
    [se * se, rho * se * ss],
    [rho * se * ss, ss * ss],
  ];
  const fit = await requireFit(db, set.fitId);
  const result = fit.resultJson ? readStoredJson(fit.resultJson) : null;
  const draws: Array<{ epsilonK: number; sigmaAngstrom: number }> | undefined = result?.posterior?.draws;
  const states = query.temperaturesK.map((temperatureK, i) => ({
    temperatureK,
    ...(query.pressuresMPa ? { pressureMPa: query.pressuresMPa[i] } : {}),
  }));
  const context = {
    molarMassGPerMol: set.substance.molarMassGPerMol,
    quantumCorrection: false,
    ...(n !== 12 ? { repulsiveExponent: n } : {}),
  };
  let predictions;
  try {
    predictions = predictWithUncertainty(
      query.kind,
      states,
      {
        epsilonK: set.epsilonK,
        sigmaAngstrom: set.sigmaAngstrom,
        covariance,
        draws,
        validity: {
          temperatureK: [set.validity.temperatureMinK, set.validity.temperatureMaxK],
          ...(set.validity.pressureMinMPa != null && set.validity.pressureMaxMPa != null
            ? { pressureMPa: [set.validity.pressureMinMPa, set.validity.pressureMaxMPa] as [number, number] }
            : {}),
        },
      },
      context,
    );
  } catch (err) {
    throw new AppError(422, 'cannot_predict', `The ${model.label} cannot be predicted at these states: ${(err as Error).message}`, [
      { field: 'temperaturesK', message: (err as Error).message },
    ]);
  }
  return {
    parameterSetId: set.id,
    version: set.version,
    substanceName: set.substance.name,
    potential: n === 12 ? ('lj-12-6' as const) : ('mie' as const),
    repulsiveExponent: n,
    kind: query.kind,
    unit: model.unit,
    method: draws?.length
      ? 'central 95 % of the model over the posterior draws of the fit; standard error by first-order propagation of the covariance'
      : 'first-order propagation of the covariance (JCGM 100:2008 §5.1.2); 95 % interval = value ± 1.96 standard errors',
    predictions,
  };
}
