import { DENSITY_FIT_DEFAULTS } from '../../../shared/fitting/fit-defaults';
import type { FitDataset, LjFitOptions, LjFitResult } from '../../../shared/fitting/lj-fit';
import { mdStageFit, type MdRunSummary, type MdStagePoint, type MdStatePoint } from '../../../shared/fitting/md-stage';
import type { MdSettings } from '../../../shared/schemas/simulations';
import type { JobRunEnvironment } from '../../jobs/job-runner';
import { normaliseState, simulationCacheKey, type SimulationInput } from '../simulations/simulations.service';
import { loadRunFrames, storeSimulationFrames } from '../simulations/simulation-frames';

/** Engine settings of the density fit's simulations when the request names none (shared with the fit form and the CLI). */
export { DENSITY_FIT_DEFAULTS };

/** Equation-of-state stage results of the last fits in this process, by payload (the task is deterministic). */
const EOS_STAGE_MEMO = new Map<string, LjFitResult>();

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
  // The equation-of-state stage is a deterministic function of its payload: a repeated fit takes it from memory.
  const eosPayload = { ...payload, options: { ...payload.options, profiles: false } };
  const eosKey = JSON.stringify(eosPayload);
  let eos = EOS_STAGE_MEMO.get(eosKey);
  if (!eos) {
    eos = (await env.runTask('fit', eosPayload, (p) => env.progress({ fraction: 0.01 + 0.09 * p.fraction, stage: `equation-of-state stage: ${p.stage}` }))) as LjFitResult;
    if (EOS_STAGE_MEMO.size >= 32) EOS_STAGE_MEMO.delete(EOS_STAGE_MEMO.keys().next().value!);
    EOS_STAGE_MEMO.set(eosKey, eos);
  }
  if (eos.status !== 'succeeded') {
    return { ...eos, eosStage: eos, failureReason: `the equation-of-state stage failed, so the simulation stage did not start: ${eos.failureReason ?? 'no result'}` };
  }

  const simulate = async (states: MdStatePoint[], onRunFinished?: () => void): Promise<MdRunSummary[]> => {
    const jobs = await Promise.all(
      states.map(async (s) => {
        const state = normaliseState({ ...s, ...md });
        const input: SimulationInput = { state };
        return env.jobs.enqueue({ kind: 'simulation', input, seed: state.seed, cacheKey: simulationCacheKey(state), createdBy });
      }),
    );
    const finished = jobs.map((j) =>
      env.jobs.waitFor(j.id).then((job) => {
        onRunFinished?.();
        return job;
      }),
    );
    const done = await waitOrAbort(Promise.all(finished), env.signal);
    return Promise.all(
      done.map(async (job, i) => {
        if (job.status !== 'succeeded') throw new Error(`simulation ${job.id} at T* = ${states[i].reducedTemperature.toFixed(4)}, P* = ${states[i].reducedPressure.toFixed(4)} ${job.status}: ${job.error ?? 'no result'}`);
        // Frames still inside a result (a runner that did not store them) are stored now; then read back decoded.
        if ((job.result as { frames?: unknown } | null)?.frames) await storeSimulationFrames(env.db, job.id, job.result);
        const r = job.result as MdRunSummary & { settings?: { reducedTemperature: number; reducedPressure: number; atoms: number } };
        const reweightRun = await loadRunFrames(env.db, job.id);
        return {
          id: job.id,
          reused: jobs[i].reused,
          reducedDensity: r.reducedDensity,
          stdErr: r.stdErr,
          dRhoDT: r.dRhoDT,
          dRhoDP: r.dRhoDP,
          phase: r.phase,
          reducedTemperature: r.settings?.reducedTemperature,
          reducedPressure: r.settings?.reducedPressure,
          atoms: r.settings?.atoms,
          effectiveSamples: r.effectiveSamples,
          statisticalInefficiency: r.statisticalInefficiency,
          startedFrom: r.startedFrom,
          warnings: r.warnings,
          ...(reweightRun ? { reweightRun } : {}),
        };
      }),
    );
  };

  const points: MdStagePoint[] = payload.datasets.flatMap((d, datasetIndex) =>
    d.rows.map((r, i) => ({ datasetId: d.id, datasetIndex, kind: d.kind, rowNumber: i + 1, excluded: !!d.excludeRows?.includes(i + 1), temperatureK: r.temperatureK, pressureMPa: r.pressureMPa, value: r.value, uncertainty: r.uncertainty, weight: d.weight ?? 1 })),
  );
  // The reweighting pool is every run this fit asks for, reused ones included (cached by their exact state, engine
  // settings and seed): a repeated fit replays the same rounds from the cache and lands on the same parameters.
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
