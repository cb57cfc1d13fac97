/**
 * A gas-phase fit as the worker runs it: the least-squares fit (LJ 12-6, Mie with λr held, or Mie with λr fitted),
 * then what a modeller reads next to it — the Bayesian posterior when asked for, the tension between kinds of data,
 * the next measurements to make and the information criteria for comparing models. Each extra is computed from
 * separately tested code; one that cannot be computed is left out with a warning, never fails the fit.
 */
import { fitLennardJones, type FitMeasurementSet, type LjFitOptions, type LjFitResult } from './lj-fit';
import { ljPosterior, type LjPosterior, type ParameterSetPrior } from './lj-posterior';
import { fitMieWithExponent, informationCriteria, type ModelCriterion } from './mie-fit';
import { rankNextMeasurements, type Suggestion } from './next-measurement';
import { kindTension, type KindTension } from './tension';

export interface GasFitOptions extends LjFitOptions {
  model?: 'lj-12-6' | 'mie';
  fitRepulsiveExponent?: boolean;
  /** `prior`: the Gaussian of a previous set, resolved by the server (server/features/fits/posterior-prior.ts). */
  posterior?: { samples?: number; seed?: number; prior?: ParameterSetPrior };
}

export interface GasFitResult extends LjFitResult {
  posterior?: LjPosterior;
  tension?: KindTension;
  nextMeasurements?: Suggestion[];
  criterion?: ModelCriterion;
}

/** Posterior draws kept on the result for plots (a few hundred keep the stored result small). */
const DRAWS_KEPT = 400;

export function gasPhaseFit(
  measurementSets: FitMeasurementSet[],
  options: GasFitOptions,
  onProgress?: (p: { fraction: number; stage: string }) => void,
): GasFitResult {
  const { model, fitRepulsiveExponent, posterior, ...fitOptions } = options;
  const report = (from: number, to: number) => (p: { fraction: number; stage: string }) =>
    onProgress?.({ fraction: from + (to - from) * p.fraction, stage: p.stage });
  const fit: GasFitResult =
    model === 'mie' && fitRepulsiveExponent
      ? fitMieWithExponent(measurementSets, fitOptions, report(0, 0.6))
      : fitLennardJones(measurementSets, fitOptions, report(0, 0.6));
  if (fit.status !== 'succeeded') return fit;
  const lenient = <T>(what: string, compute: () => T): T | undefined => {
    try {
      return compute();
    } catch (err) {
      fit.warnings.push(`${what} could not be computed: ${(err as Error).message}`);
      return undefined;
    }
  };
  const context = {
    molarMassGPerMol: fitOptions.molarMassGPerMol,
    quantumCorrection: fitOptions.quantumCorrection ?? false,
    ...(fit.repulsiveExponent !== undefined && fit.repulsiveExponent !== 12 ? { repulsiveExponent: fit.repulsiveExponent } : {}),
  };
  const points = fit.perMeasurementSet.reduce((s, d) => s + d.points, 0);
  const free = 2 - fit.heldParameters.length + (fitRepulsiveExponent ? 1 : 0);
  fit.criterion = informationCriteria(
    fit.model === 'mie' ? `Mie ${fitRepulsiveExponent ? 'λr-6 (λr fitted)' : `${fit.repulsiveExponent}-6`}` : 'LJ 12-6',
    fit.chi2,
    points,
    free,
  );
  if (posterior) {
    onProgress?.({ fraction: 0.65, stage: 'sampling the posterior' });
    fit.posterior = lenient('the posterior', () => {
      const p = ljPosterior(measurementSets, { ...fitOptions, repulsiveExponent: fit.repulsiveExponent }, fit, {
        ...posterior,
        drawsReturned: DRAWS_KEPT,
      });
      if (fitRepulsiveExponent)
        p.messages.push(
          `ε and σ were sampled at the best λr = ${fit.repulsiveExponent?.toFixed(2)}; λr itself is not sampled, so these intervals do not include its uncertainty.`,
        );
      return p;
    });
  }
  const kinds = new Set(measurementSets.map((d) => d.kind));
  if (kinds.size > 1) {
    onProgress?.({ fraction: 0.85, stage: 'fitting each kind alone' });
    fit.tension = lenient('the tension between kinds', () => kindTension(measurementSets, { ...fitOptions, restarts: 0 }));
  }
  onProgress?.({ fraction: 0.95, stage: 'ranking the next measurements' });
  fit.nextMeasurements = lenient('the next-measurement ranking', () =>
    rankNextMeasurements(
      fit,
      measurementSets,
      context,
      fit.model === 'mie'
        ? { kinds: ['b2'] }
        : { kinds: (['b2', 'viscosity'] as const).filter((k) => k === 'b2' || context.molarMassGPerMol !== undefined) },
    ),
  );
  onProgress?.({ fraction: 1, stage: 'done' });
  return fit;
}
