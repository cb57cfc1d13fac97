import type { FitDataset, LjFitOptions, LjFitResult } from '../../../shared/fitting/lj-fit';
import { mdStageFit, type MdRunSummary, type MdStagePoint, type MdStatePoint } from '../../../shared/fitting/md-stage';
import type { MdSettings } from '../../../shared/schemas/simulations';
import type { JobRunEnvironment } from '../../jobs/job-runner';
import { normaliseState, simulationCacheKey, type SimulationInput } from '../simulations/simulations.service';

/**
 * Engine settings of the density fit's simulations when the request names none: 256 atoms and 10 000
 * steps give ρ* to about 0.4 % in a few seconds per state point on one core, so a round of 8 state
 * points takes well under a minute on two workers (measured with `npm run -s bench:fit`).
 */
export const DENSITY_FIT_DEFAULTS = { atoms: 256, steps: 10000, cutoff: 2.5, scheme: 'truncated-tail' as const, seed: 20261201 };

/** Waits for a job, giving up when the fit itself is cancelled or the server stops. */
function waitOrAbort<T>(promise: Promise<T>, signal: AbortSignal): Promise<T> {
  if (signal.aborted) return Promise.reject(signal.reason ?? new Error('aborted'));
  return new Promise((resolve, reject) => {
    const onAbort = () => reject(signal.reason ?? new Error('aborted'));
    signal.addEventListener('abort', onAbort, { once: true });
    promise.then(
      (v) => {
        signal.removeEventListener('abort', onAbort);
        resolve(v);
      },
      (e) => {
        signal.removeEventListener('abort', onAbort);
        reject(e);
      },
    );
  });
}

/**
 * A fit with density data: the equation-of-state stage first (a worker task, deterministic), then the
 * simulation stage started from its parameters, with each NPT run a cached simulation job shared with
 * every other fit that needs the same reduced state.
 */
export async function runDensityFit(env: JobRunEnvironment, payload: { datasets: FitDataset[]; options: LjFitOptions }, settings: MdSettings, createdBy: string | null) {
  const md = { ...DENSITY_FIT_DEFAULTS, ...settings };
  env.progress({ fraction: 0.01, stage: 'equation-of-state stage' });
  // The equation-of-state stage only starts the simulation stage: its profile-χ² curves would be discarded.
  const eos = (await env.runTask('fit', { ...payload, options: { ...payload.options, profiles: false } }, (p) => env.progress({ fraction: 0.01 + 0.09 * p.fraction, stage: `equation-of-state stage: ${p.stage}` }))) as LjFitResult;
  if (eos.status !== 'succeeded') {
    return { ...eos, eosStage: eos, failureReason: `the equation-of-state stage failed, so the simulation stage did not start: ${eos.failureReason ?? 'no result'}` };
  }

  const simulate = async (states: MdStatePoint[]): Promise<MdRunSummary[]> => {
    const jobs = await Promise.all(
      states.map(async (s) => {
        const state = normaliseState({ ...s, ...md });
        const input: SimulationInput = { state };
        return env.jobs.enqueue({ kind: 'simulation', input, seed: state.seed, cacheKey: simulationCacheKey(state), createdBy });
      }),
    );
    const done = await waitOrAbort(Promise.all(jobs.map((j) => env.jobs.waitFor(j.id))), env.signal);
    return done.map((job, i) => {
      if (job.status !== 'succeeded') throw new Error(`simulation ${job.id} at T* = ${states[i].reducedTemperature.toFixed(4)}, P* = ${states[i].reducedPressure.toFixed(4)} ${job.status}: ${job.error ?? 'no result'}`);
      const r = job.result as MdRunSummary;
      return { id: job.id, reused: jobs[i].reused, reducedDensity: r.reducedDensity, stdErr: r.stdErr, dRhoDT: r.dRhoDT, dRhoDP: r.dRhoDP, phase: r.phase };
    });
  };

  const points: MdStagePoint[] = payload.datasets.flatMap((d, datasetIndex) =>
    d.rows.map((r, i) => ({ datasetId: d.id, datasetIndex, kind: d.kind, rowNumber: i + 1, excluded: !!d.excludeRows?.includes(i + 1), temperatureK: r.temperatureK, pressureMPa: r.pressureMPa, value: r.value, uncertainty: r.uncertainty, weight: d.weight ?? 1 })),
  );
  const result = await mdStageFit(points, payload.datasets.map((d) => ({ id: d.id, kind: d.kind })), {
    start: { epsilonK: eos.epsilonK, sigmaAngstrom: eos.sigmaAngstrom },
    bounds: eos.bounds,
    context: { molarMassGPerMol: payload.options.molarMassGPerMol!, quantumCorrection: !!payload.options.quantumCorrection },
    ...(payload.options.fixed?.epsilonK !== undefined ? { held: 'epsilonK' as const } : payload.options.fixed?.sigmaAngstrom !== undefined ? { held: 'sigmaAngstrom' as const } : {}),
    simulate,
    onProgress: (p) => env.progress({ fraction: 0.1 + 0.9 * p.fraction, stage: p.stage }),
  });
  const schemeNote =
    md.scheme === 'truncated-shifted'
      ? `The simulations use the truncated-and-shifted potential (rc = ${md.cutoff}σ); the equation of state describes the full potential, so the two stages fit different models and may differ beyond their uncertainties.`
      : `The simulations use the truncated potential with tail corrections (rc = ${md.cutoff}σ), which mimics the full potential the equation of state describes.`;
  return { ...result, eosStage: eos, mdSettings: md, schemeNote, mdRunCount: result.mdRuns.length, mdRunsReused: result.mdRuns.filter((r) => r.reused).length };
}
