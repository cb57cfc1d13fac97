import type { FitMeasurementSet, LjFitOptions } from '../../../shared/fitting/lj-fit';
import { isFitKind, MIE_KINDS_TEXT, PROPERTY_MODELS, type PropertyModel } from '../../../shared/fitting/property-models';
import type { CreateFitBody } from '../../../shared/schemas/fits';
import { PROPERTY_KINDS, type PropertyKind } from '../../../shared/measurements/property-kinds';
import type { JobQueue } from '../../jobs/job-runner';
import type { CurrentUser } from '../../common/auth-middleware';
import { AppError, notFound } from '../../common/errors';
import type { Db } from '../../db/database';
import type { JobKind } from '../../jobs/job-runner';

/** What starting a fit uses: the database, the job queue and the code version recorded on the fit. */
export interface FitDeps {
  db: Db;
  jobs: JobQueue;
  codeVersion: string;
}
import { recordAudit } from '../audit/audit.service';
import { findMeasurementSet, findVersionRow, latestVersionNumber } from '../measurement-sets/measurement-sets.repository';
import { loadVersionForFit } from '../measurement-sets/measurement-sets.service';
import { findSubstance } from '../substances/substances.repository';
import type { MdSettings } from '../../../shared/schemas/simulations';
import { DENSITY_FIT_DEFAULTS, runDensityFit } from './density-fit';
import { recordFitOutcome } from './fit-outcome';
import { resolvePosteriorPrior } from './posterior-prior';
import { findFit, insertFit, listFitRowsOfSubstance, nextFitNumber } from './fits.repository';
import { toFitListItemView } from './fits.view';

// Kept here for the importers of fits.service (parameter sets, scripts); the homes are fits.repository.ts and fits.view.ts.
export { findFit } from './fits.repository';
export { toFitView } from './fits.view';
import type { MeasurementSetRef } from '../../../shared/contracts/measurement-set-ref';

/** The exact measurement set versions a fit used, frozen on the fit row (contract: shared/contracts/measurement-set-ref.ts). */
export type FitMeasurementSetRef = MeasurementSetRef;

export interface FitJobInput {
  measurementSets: FitMeasurementSetRef[];
  options: LjFitOptions;
  /** Engine settings of the simulation stage; present when the fit has density data. */
  density?: MdSettings;
  createdBy?: string;
}

/** The worker payload, read from the frozen references: rows come from the immutable versions. */
export async function fitPayload(db: Db, input: FitJobInput) {
  const measurementSets: FitMeasurementSet[] = [];
  for (const ref of input.measurementSets) {
    const rows = await loadVersionForFit(db, ref.versionId);
    measurementSets.push({
      id: ref.measurementSetId,
      version: ref.version,
      kind: ref.kind as FitMeasurementSet['kind'],
      weight: ref.weight,
      label: ref.name,
      ...(ref.excludeRows?.length ? { excludeRows: ref.excludeRows } : {}),
      rows: rows.map((r) => ({
        temperatureK: r.temperatureK,
        ...(r.pressureMPa !== null ? { pressureMPa: r.pressureMPa } : {}),
        value: r.value,
        uncertainty: r.uncertainty,
      })),
    });
  }
  return { measurementSets, options: input.options };
}

/**
 * Gas-phase fits are one worker task. Fits with densities orchestrate: an equation-of-state stage, then
 * rounds of NPT simulations as jobs of their own (cached and shared), from the main thread.
 */
export const fitJobKind: JobKind = {
  async run(env, input: FitJobInput, job) {
    try {
      const payload = await fitPayload(env.db, input);
      const result = !input.measurementSets.some((d) => d.kind === 'density')
        ? await env.runTask('fit', payload, env.progress)
        : await runDensityFit(env, payload, input.density ?? {}, input.createdBy ?? null);
      await recordFitOutcome(env.db, job.id, result as { status?: string; failureReason?: string }, null);
      return result;
    } catch (err) {
      // A cancelled fit is audited by the cancel route; anything else that stops it is a failure the author hears of.
      if (!env.signal.aborted)
        await recordFitOutcome(env.db, job.id, null, err instanceof Error ? err.message : String(err)).catch(() => undefined);
      throw err;
    }
  },
};

/** Checks the request against the database, freezes the measurement set versions and queues the fit. */
export async function createFit(ctx: FitDeps, actor: CurrentUser, body: CreateFitBody) {
  const substance = await findSubstance(ctx.db, body.substanceId);
  if (!substance)
    throw new AppError(422, 'unknown_substance', `Substance ${body.substanceId} does not exist.`, [
      { field: 'substanceId', message: 'no such substance' },
    ]);
  const refs: FitMeasurementSetRef[] = [];
  for (const [i, wanted] of body.measurementSets.entries()) {
    const field = `measurementSets.${i}.id`;
    const measurementSet = await findMeasurementSet(ctx.db, wanted.id);
    if (!measurementSet || measurementSet.substanceId !== substance.id)
      throw new AppError(422, 'unknown_measurement_set', `Measurement set ${wanted.id} does not belong to ${substance.name}.`, [
        { field, message: 'not a measurement set of this substance' },
      ]);
    if (measurementSet.withdrawnAt)
      throw new AppError(422, 'measurement_set_withdrawn', `Measurement set "${measurementSet.name}" was withdrawn and cannot be fitted.`, [
        { field, message: 'withdrawn' },
      ]);
    // Every stored kind has a model today; a kind added to the upload before the fit learns it is refused here.
    const kind: string = measurementSet.kind;
    if (!isFitKind(kind)) {
      throw new AppError(
        422,
        'kind_not_fittable',
        `Measurement set "${measurementSet.name}" holds ${PROPERTY_KINDS[kind as PropertyKind].label}, which this fit does not take.`,
        [{ field, message: `kind ${kind} not supported by the fit` }],
      );
    }
    const version = wanted.version ?? (await latestVersionNumber(ctx.db, measurementSet.id));
    const versionRow = await findVersionRow(ctx.db, measurementSet.id, Number(version));
    if (!versionRow)
      throw new AppError(422, 'unknown_version', `Measurement set "${measurementSet.name}" has no version ${version}.`, [
        { field: `measurementSets.${i}.version`, message: 'no such version' },
      ]);
    const unknownRows = (wanted.excludeRows ?? []).filter((r) => r > versionRow.rowCount);
    if (unknownRows.length) {
      throw new AppError(
        422,
        'unknown_row',
        `Measurement set "${measurementSet.name}" v${versionRow.version} has rows 1 to ${versionRow.rowCount}; there is no row ${unknownRows.join(', ')} to leave out.`,
        unknownRows.map((r) => ({
          field: `measurementSets.${i}.excludeRows`,
          row: r,
          message: `no row ${r} (rows 1 to ${versionRow.rowCount})`,
        })),
      );
    }
    const excludeRows = [...(wanted.excludeRows ?? [])].sort((a, b) => a - b);
    refs.push({
      measurementSetId: measurementSet.id,
      version: versionRow.version,
      versionId: versionRow.id,
      kind: measurementSet.kind,
      name: measurementSet.name,
      weight: wanted.weight ?? 1,
      ...(excludeRows.length ? { excludeRows, ...(wanted.excludeReason ? { excludeReason: wanted.excludeReason } : {}) } : {}),
    });
  }
  // Leaving rows out must leave enough to fit: refused here, naming the field, rather than as a failed job.
  const counted = await Promise.all(
    refs.map(async (r) => Number((await findVersionRow(ctx.db, r.measurementSetId, r.version))!.rowCount) - (r.excludeRows?.length ?? 0)),
  );
  const free = body.fixed && Object.keys(body.fixed).length ? 1 : 2;
  const left = counted.reduce((a, b) => a + b, 0);
  if (refs.some((r) => r.excludeRows?.length) && left < Math.max(free, 2)) {
    throw new AppError(
      422,
      'too_few_points',
      `Leaving out these rows leaves ${left} point(s) for ${free} free parameter(s); the fit needs at least ${Math.max(free, 2)}.`,
      [{ field: 'measurementSets', message: 'too few rows left in the fit' }],
    );
  }
  const { density, ...fitOptions } = body.options ?? {};
  if (fitOptions.model === 'mie') {
    // Only kinds with a Mie model (B2 and viscosity today) can be fitted with a Mie potential; say which set is not.
    refs.forEach((ref, i) => {
      // Densities go through the simulation stage with the Mie kernel at the held λr; fitting λr there is refused.
      if (ref.kind === 'density') {
        if (fitOptions.fitRepulsiveExponent) {
          throw new AppError(
            422,
            'mie_density_needs_held_exponent',
            `Measurement set "${ref.name}" holds densities, which a Mie fit takes only with λr held: the simulation stage runs at one λr. Give repulsiveExponent instead of fitRepulsiveExponent.`,
            [{ field: 'options.fitRepulsiveExponent', message: 'λr cannot be fitted with density data; hold it' }],
          );
        }
        return;
      }
      if (isFitKind(ref.kind) && !(PROPERTY_MODELS[ref.kind] as PropertyModel).supportsMie) {
        throw new AppError(
          422,
          'kind_not_mie',
          `Measurement set "${ref.name}" holds ${PROPERTY_KINDS[ref.kind].label}, which has no Mie λr-6 model yet; a Mie fit takes ${MIE_KINDS_TEXT} data, and densities with λr held.`,
          [{ field: `measurementSets.${i}.id`, message: `no Mie model for ${ref.kind}` }],
        );
      }
    });
  }
  // A prior from a previous set is resolved now and frozen with the options (values and covariance), so a re-run uses the same numbers.
  if (fitOptions.posterior?.prior)
    fitOptions.posterior = {
      ...fitOptions.posterior,
      prior: await resolvePosteriorPrior(ctx.db, fitOptions.posterior.prior.parameterSetId, fitOptions),
    };
  const options: LjFitOptions = {
    ...fitOptions,
    ...(body.fixed && Object.keys(body.fixed).length ? { fixed: body.fixed } : {}),
    molarMassGPerMol: substance.molarMassGramsPerMol,
  };
  const hasDensity = refs.some((r) => r.kind === 'density');
  const input: FitJobInput = {
    measurementSets: refs,
    options,
    ...(hasDensity ? { density: { ...DENSITY_FIT_DEFAULTS, ...density } } : {}),
    createdBy: actor.id,
  };
  const now = new Date().toISOString();
  return ctx.db.transaction().execute(async (tx) => {
    const number = await nextFitNumber(tx, substance.id);
    const job = await ctx.jobs.enqueue({ kind: 'fit', input, seed: 0, createdBy: actor.id }, tx);
    const fitId = await insertFit(tx, {
      substanceId: substance.id,
      number,
      jobId: job.id,
      model: fitOptions.model ?? 'lj-12-6',
      measurementSetsJson: JSON.stringify(refs),
      optionsJson: JSON.stringify({ ...options, ...(input.density ? { density: input.density } : {}) }),
      codeVersion: ctx.codeVersion,
      createdBy: actor.id,
      createdAt: now,
    });
    await recordAudit(tx, {
      actor,
      action: 'fit.started',
      targetType: 'fit',
      targetId: fitId,
      summary: `${actor.email} started Fit #${number} of ${substance.name} on ${refs.map((r) => `${r.name} v${r.version}${r.excludeRows ? ` without row${r.excludeRows.length > 1 ? 's' : ''} ${r.excludeRows.join(', ')}` : ''}`).join(', ')}${heldSummary(options.fixed)}`,
      after: { measurementSets: refs, options },
    });
    return { id: fitId, number, jobId: job.id };
  });
}

const heldSummary = (fixed: LjFitOptions['fixed']) =>
  fixed?.epsilonK !== undefined
    ? `, ε/k_B held at ${fixed.epsilonK} K`
    : fixed?.sigmaAngstrom !== undefined
      ? `, σ held at ${fixed.sigmaAngstrom} Å`
      : '';

export async function listFitsOfSubstance(db: Db, substanceId: number) {
  return (await listFitRowsOfSubstance(db, substanceId)).map(toFitListItemView);
}

export async function requireFit(db: Db, id: number) {
  const row = await findFit(db, id);
  if (!row) throw notFound(`Fit ${id}`);
  return row;
}
