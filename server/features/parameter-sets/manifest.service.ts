/**
 * Reproducible by anyone: a parameter set's manifest (the exact measurement-set versions with their SHA-256,
 * weights, left-out rows, every fit option with bounds, starting values and seeds, the code and engine versions,
 * and the result it froze), and a re-run of its fit from that manifest in this process, compared to the last digit.
 * The re-run covers gas-phase fits (B2, viscosity and the other kinds fitted without simulations); a fit with a
 * simulation stage depends on NPT runs and is refused with the reason.
 */
import { gasPhaseFit } from '../../../shared/fitting/gas-fit';
import { RESTART_SEED } from '../../../shared/fitting/lj-fit';
import { POSTERIOR_SEED } from '../../../shared/fitting/posterior';
import type { CurrentUser } from '../../common/auth-middleware';
import { AppError } from '../../common/errors';
import type { Db } from '../../db/database';
import { ENGINE_VERSIONS } from '../../jobs/tasks';
import { storedFitOptions } from '../../../shared/contracts/fit';
import type { ParameterSetManifest, ParameterSetRerun } from '../../../shared/contracts/parameter-set';
import { readStoredJson } from '../../../shared/schemas/old-names';
import { fitPayload, requireFit } from '../fits/fits.service';
import { versionSources } from '../measurement-sets/measurement-sets.repository';
import { requireVisibleSet } from './parameter-sets.service';
import { readMeasurementSetRefs } from './parameter-sets.view';

/** The numbers a re-run must reproduce exactly (paths into the result). */
const COMPARED = [
  'epsilonK',
  'sigmaAngstrom',
  'stdErr.epsilonK',
  'stdErr.sigmaAngstrom',
  'correlation',
  'chi2',
  'dof',
  'iterations',
  'covariance',
  'posterior.epsilonK',
  'posterior.sigmaAngstrom',
  'repulsiveExponent',
] as const;

const at = (o: unknown, path: string): unknown =>
  path.split('.').reduce<unknown>((v, k) => (v && typeof v === 'object' ? (v as Record<string, unknown>)[k] : undefined), o);

/** Paths whose values differ between two results (JSON text compared, so 0.1 + 0.2 and 0.3 differ). */
export function resultDifferences(original: unknown, rerun: unknown): Array<{ field: string; original: unknown; rerun: unknown }> {
  return COMPARED.filter((p) => JSON.stringify(at(original, p)) !== JSON.stringify(at(rerun, p))).map((p) => ({
    field: p,
    original: at(original, p) ?? null,
    rerun: at(rerun, p) ?? null,
  }));
}

async function load(db: Db, id: number, viewer: CurrentUser) {
  const set = await requireVisibleSet(db, id, viewer);
  const fit = await requireFit(db, set.fitId);
  const refs = readMeasurementSetRefs(fit.measurementSetsJson);
  const options = storedFitOptions.parse(readStoredJson(fit.optionsJson));
  const result = fit.resultJson ? readStoredJson(fit.resultJson) : null;
  return { set, fit, refs, options, result };
}

export async function manifestOf(db: Db, id: number, viewer: CurrentUser): Promise<ParameterSetManifest> {
  const { set, fit, refs, options, result } = await load(db, id, viewer);
  const versions = await versionSources(
    db,
    refs.map((r) => r.versionId),
  );
  const byId = new Map(versions.map((v) => [v.id, v]));
  return {
    format: 'epsigma.manifest/1',
    parameterSet: {
      id: set.id,
      version: set.version,
      substanceName: set.substanceName,
      potential: set.potential,
      repulsiveExponent: set.repulsiveExponent,
      epsilonK: set.epsilonK,
      sigmaAngstrom: set.sigmaAngstrom,
      scheme: set.scheme,
      cutoffSigma: set.cutoffSigma,
    },
    fit: {
      id: fit.id,
      number: fit.number,
      model: fit.model,
      createdAt: fit.createdAt,
      codeVersion: fit.codeVersion,
      engineVersion: ENGINE_VERSIONS.fit,
      jobSeed: fit.seed,
    },
    measurementSets: refs.map((r) => ({
      measurementSetId: r.measurementSetId,
      version: r.version,
      name: r.name,
      kind: r.kind,
      weight: r.weight,
      excludeRows: r.excludeRows ?? [],
      rowCount: byId.get(r.versionId)?.rowCount ?? null,
      sha256: byId.get(r.versionId)?.sha256 ?? null,
    })),
    options: { ...options },
    seeds: {
      restartPerturbations: RESTART_SEED,
      posterior: options.posterior ? (options.posterior.seed ?? POSTERIOR_SEED) : null,
      simulations: options.density?.seed ?? null,
    },
    result: result ? Object.fromEntries(COMPARED.map((p) => [p, at(result, p) ?? null])) : null,
    reproducible: options.density
      ? 'no: the fit has a simulation stage; its NPT runs are cached by state and seed but not re-run here'
      : 'yes: GET /api/parameter-sets/:id/rerun repeats the fit from this manifest and compares every number',
  };
}

export async function rerunOf(db: Db, id: number, viewer: CurrentUser): Promise<ParameterSetRerun> {
  const { set, fit, refs, options, result } = await load(db, id, viewer);
  if (options.density || refs.some((r) => r.kind === 'density')) {
    throw new AppError(
      422,
      'not_rerunnable',
      `Fit #${fit.number} behind ${set.substanceName} v${set.version} has a simulation stage; only gas-phase fits are re-run here (its simulations are reproducible by their cached state, settings and seed).`,
    );
  }
  const payload = await fitPayload(db, { measurementSets: refs, options });
  const rerun = gasPhaseFit(payload.measurementSets, payload.options);
  const differences = resultDifferences(result, JSON.parse(JSON.stringify(rerun)));
  return {
    parameterSetId: set.id,
    fitId: fit.id,
    codeVersion: { fit: fit.codeVersion, now: ENGINE_VERSIONS.fit },
    reproduced: differences.length === 0,
    compared: [...COMPARED],
    differences,
    rerun: Object.fromEntries(COMPARED.map((p) => [p, at(rerun, p) ?? null])),
  };
}
