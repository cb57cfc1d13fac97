import { DEFAULT_ATOMS, DEFAULT_CUTOFF, DEFAULT_NPT_STEPS, DEFAULT_SEED, DEFAULT_TIMESTEP } from '../../../shared/physics/md/npt';
import { reducedStateOf } from '../../../shared/physics/corresponding-states';
import type { CreateSimulationBody, MdSettings, SimulationsFromMeasurementSetBody } from '../../../shared/schemas/simulations';
import { CUTOFF_SCHEME_LABELS, type CutoffScheme } from '../../../shared/physics/cutoff-schemes';
import type { CurrentUser } from '../../common/auth-middleware';
import { AppError, notFound } from '../../common/errors';
import type { Db } from '../../db/database';
import type { JobKind, JobQueue } from '../../jobs/job-runner';
import type { SimulationInput, SimulationOrigin } from '../../../shared/contracts/simulation';
import { recordAudit } from '../audit/audit.service';
import { findMeasurementSet, findVersionRow, latestVersionNumber, rowsOfVersion } from '../measurement-sets/measurement-sets.repository';
import { storeSimulationFrames } from './simulation-frames';
import { listSimulationJobs } from './simulations.repository';
import { toSimulationView } from './simulations.view';

/** What starting runs uses: the database (audit, measurement sets) and the job queue. */
export interface SimulationDeps {
  db: Db;
  jobs: JobQueue;
}

// The stored input of a simulation job is part of its contract (shared/contracts/simulation.ts).
export type { SimulationInput, SimulationOrigin } from '../../../shared/contracts/simulation';

/** Every setting that changes the trajectory, with defaults filled in, so equal requests have equal keys. */
export function normaliseState(state: { reducedTemperature: number; reducedPressure: number } & MdSettings): SimulationInput['state'] {
  return {
    reducedTemperature: Number(state.reducedTemperature.toPrecision(10)),
    reducedPressure: Number(state.reducedPressure.toPrecision(10)),
    atoms: state.atoms ?? DEFAULT_ATOMS,
    steps: state.steps ?? DEFAULT_NPT_STEPS,
    cutoff: state.cutoff ?? DEFAULT_CUTOFF,
    scheme: state.scheme ?? 'truncated-tail',
    timestep: DEFAULT_TIMESTEP,
    seed: state.seed ?? DEFAULT_SEED,
  };
}

export const simulationCacheKey = (state: SimulationInput['state']) =>
  JSON.stringify([
    state.reducedTemperature,
    state.reducedPressure,
    state.atoms,
    state.steps,
    state.cutoff,
    state.scheme,
    state.timestep,
    state.seed,
  ]);

export const simulationJobKind: JobKind = {
  toPayload: (_db: Db, input: SimulationInput) => input.state,
  // The run's frames go into simulation_frames; the job row keeps the summary.
  storeResult: storeSimulationFrames,
};

export async function createSimulation(ctx: SimulationDeps, actor: CurrentUser, body: CreateSimulationBody, origin?: SimulationOrigin) {
  const state = normaliseState(body);
  const input: SimulationInput = { state, ...(origin ? { origin } : {}) };
  const job = await ctx.jobs.enqueue({
    kind: 'simulation',
    input,
    seed: state.seed,
    cacheKey: simulationCacheKey(state),
    createdBy: actor.id,
  });
  if (!job.reused) {
    await recordAudit(ctx.db, {
      actor,
      action: 'simulation.started',
      targetType: 'job',
      targetId: job.id,
      summary: `${actor.email} started an NPT run at T* = ${state.reducedTemperature}, P* = ${state.reducedPressure} (${state.atoms} atoms, ${state.steps} steps, ${CUTOFF_SCHEME_LABELS[state.scheme as CutoffScheme] ?? state.scheme} at r_c = ${state.cutoff} σ)`,
    });
  }
  return { id: job.id, reused: job.reused, state };
}

/** Maps measured density rows to reduced states with trial ε, σ and queues one run per row. */
export async function createSimulationsFromMeasurementSet(
  ctx: SimulationDeps,
  actor: CurrentUser,
  body: SimulationsFromMeasurementSetBody,
) {
  const measurementSet = await findMeasurementSet(ctx.db, body.measurementSetId);
  if (!measurementSet) throw notFound(`Measurement set ${body.measurementSetId}`);
  if (measurementSet.kind !== 'density')
    throw new AppError(422, 'not_density', `Simulations start from density sets; "${measurementSet.name}" holds ${measurementSet.kind}.`, [
      { field: 'measurementSetId', message: 'not a density set' },
    ]);
  const version = body.version ?? (await latestVersionNumber(ctx.db, measurementSet.id));
  const versionRow = await findVersionRow(ctx.db, measurementSet.id, Number(version));
  if (!versionRow) throw notFound(`Version ${version} of measurement set ${measurementSet.id}`);
  const rows = await rowsOfVersion(ctx.db, versionRow.id);
  const chosen = body.rows ? rows.filter((r) => body.rows!.includes(r.fileRow)) : rows;
  const missing = (body.rows ?? []).filter((n) => !rows.some((r) => r.fileRow === n));
  if (missing.length)
    throw new AppError(
      422,
      'unknown_rows',
      `Rows ${missing.join(', ')} are not in version ${versionRow.version} of "${measurementSet.name}".`,
      [{ field: 'rows', message: `no rows ${missing.join(', ')}` }],
    );
  const runs = [];
  for (const r of chosen) {
    const reduced = reducedStateOf({
      temperatureK: r.temperatureK,
      pressureMPa: r.pressureMpa!,
      epsilonK: body.epsilonK,
      sigmaAngstrom: body.sigmaAngstrom,
    });
    if (reduced.reducedTemperature < 0.3 || reduced.reducedTemperature > 10 || reduced.reducedPressure > 20) {
      throw new AppError(
        422,
        'state_out_of_range',
        `Row ${r.fileRow} maps to T* = ${reduced.reducedTemperature.toFixed(3)}, P* = ${reduced.reducedPressure.toFixed(3)}, outside the engine's range (0.3 ≤ T* ≤ 10, P* ≤ 20).`,
        [{ field: 'rows', row: r.fileRow, message: 'reduced state out of range' }],
      );
    }
    const origin: SimulationOrigin = {
      substanceId: measurementSet.substanceId,
      measurementSetId: measurementSet.id,
      version: versionRow.version,
      fileRow: r.fileRow,
      temperatureK: r.temperatureK,
      pressureMPa: r.pressureMpa!,
      densityKgPerM3: r.value,
      epsilonK: body.epsilonK,
      sigmaAngstrom: body.sigmaAngstrom,
    };
    runs.push(await createSimulation(ctx, actor, { ...body, ...reduced }, origin));
  }
  return { runs };
}

export async function listSimulations(db: Db, limit = 200) {
  return (await listSimulationJobs(db, limit)).map((row) => toSimulationView(row, { withTrace: false }));
}
