import { DENSITY_FIT_DEFAULTS } from '../../../shared/fitting/fit-defaults';
import type { DensityPosteriorOptions } from '../../../shared/fitting/density-posterior';
import { DEFAULT_LJ_BOUNDS, type FitMeasurementSet, type LjFitOptions, type LjFitResult } from '../../../shared/fitting/lj-fit';
import { potentialLabel } from '../../../shared/physics/mie-potential';
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
export async function runDensityFit(
  env: JobRunEnvironment,
  payload: { measurementSets: FitMeasurementSet[]; options: LjFitOptions },
  settings: MdSettings,
  createdBy: string | null,
) {
  const md = { ...DENSITY_FIT_DEFAULTS, ...settings };
  // The posterior is sampled once, by the simulation stage on its reweighted predictions; the starting stage needs none.
  const { posterior, ...fitOptions } = payload.options as LjFitOptions & {
    model?: 'lj-12-6' | 'mie';
    fitRepulsiveExponent?: boolean;
    posterior?: DensityPosteriorOptions;
  };
  const mie = fitOptions.model === 'mie';
  const repulsiveExponent = mie ? (fitOptions.repulsiveExponent ?? 12) : 12;
  const model = potentialLabel(repulsiveExponent);
  // The starting stage (a worker task, deterministic): a repeated fit takes it from memory. Its profile-χ² curves would be discarded.
  const startStage = async (sets: FitMeasurementSet[], options: Record<string, unknown>, label: string): Promise<LjFitResult> => {
    const stagePayload = { measurementSets: sets, options: { ...options, profiles: false } };
    const key = JSON.stringify(stagePayload);
    let r = EOS_STAGE_MEMO.get(key);
    if (!r) {
      r = (await env.runTask('fit', stagePayload, (p) =>
        env.progress({ fraction: 0.01 + 0.09 * p.fraction, stage: `${label}: ${p.stage}` }),
      )) as LjFitResult;
      if (EOS_STAGE_MEMO.size >= 32) EOS_STAGE_MEMO.delete(EOS_STAGE_MEMO.keys().next().value!);
      EOS_STAGE_MEMO.set(key, r);
    }
    return r;
  };
  const notes: string[] = [];
  let eos: LjFitResult | null = null;
  let start: { epsilonK: number; sigmaAngstrom: number };
  let startMethod = 'equation-of-state stage';
  let bounds = fitOptions.bounds ?? DEFAULT_LJ_BOUNDS;
  if (!mie) {
    env.progress({ fraction: 0.01, stage: 'equation-of-state stage' });
    eos = await startStage(payload.measurementSets, fitOptions, 'equation-of-state stage');
    if (eos.status !== 'succeeded') {
      return {
        ...eos,
        eosStage: eos,
        failureReason: `the equation-of-state stage failed, so the simulation stage did not start: ${eos.failureReason ?? 'no result'}`,
      };
    }
    start = { epsilonK: eos.epsilonK, sigmaAngstrom: eos.sigmaAngstrom };
    bounds = eos.bounds;
  } else {
    // The equations of state are of the LJ 12-6 fluid only, so a Mie fit starts elsewhere: from its B2 data, else the
    // given start, else the 12-6 equation-of-state fit of the densities as a corresponding-states guess.
    const b2Sets = payload.measurementSets.filter((d) => d.kind === 'b2');
    const b2 = b2Sets.length ? await startStage(b2Sets, fitOptions, `${model} fit of the B2 data`) : null;
    if (b2 && b2.status === 'succeeded') {
      start = { epsilonK: b2.epsilonK, sigmaAngstrom: b2.sigmaAngstrom };
      startMethod = `${model} fit of the B2 data`;
      notes.push(
        `The simulation stage started from the ${model} fit of the B2 data alone (ε/k_B = ${b2.epsilonK.toFixed(2)} K, σ = ${b2.sigmaAngstrom.toFixed(4)} Å): the equations of state behind the usual starting stage are of the LJ 12-6 fluid only.`,
      );
      eos = b2;
    } else if (fitOptions.start) {
      start = fitOptions.start;
      startMethod = 'the given start values';
      notes.push(
        `The simulation stage started from the given start values (ε/k_B = ${start.epsilonK} K, σ = ${start.sigmaAngstrom} Å)${b2 ? ` because the ${model} fit of the B2 data failed (${b2.failureReason ?? 'no result'})` : ''}: the equations of state behind the usual starting stage are of the LJ 12-6 fluid only.`,
      );
    } else {
      const { model: _m, repulsiveExponent: _r, fitRepulsiveExponent: _f, ...ljOptions } = fitOptions;
      const guess = await startStage(payload.measurementSets, ljOptions, 'corresponding-states guess (LJ 12-6 equation of state)');
      if (guess.status !== 'succeeded') {
        return {
          ...guess,
          eosStage: guess,
          failureReason: `no start for the ${model} simulation stage: no B2 data, no start values, and the LJ 12-6 equation-of-state fit of the densities used as a guess failed (${guess.failureReason ?? 'no result'}); give start values`,
        };
      }
      start = { epsilonK: guess.epsilonK, sigmaAngstrom: guess.sigmaAngstrom };
      startMethod = 'corresponding-states guess: the LJ 12-6 equation-of-state fit of the densities';
      notes.push(
        `The simulation stage started from a corresponding-states guess, the LJ 12-6 equation-of-state fit of the same data (ε/k_B = ${guess.epsilonK.toFixed(2)} K, σ = ${guess.sigmaAngstrom.toFixed(4)} Å); every density of the fit itself comes from ${model} simulations.`,
      );
      eos = guess;
    }
    start = {
      epsilonK: Math.min(Math.max(start.epsilonK, bounds.epsilonK[0]), bounds.epsilonK[1]),
      sigmaAngstrom: Math.min(Math.max(start.sigmaAngstrom, bounds.sigmaAngstrom[0]), bounds.sigmaAngstrom[1]),
    };
    notes.push(
      `Which state points are simulated is judged by the LJ 12-6 phase diagram at the same reduced state (no ${model} freezing line is built in); a run that freezes or splits anyway is left out with a warning.`,
    );
  }

  const simulate = async (states: MdStatePoint[], onRunFinished?: () => void): Promise<MdRunSummary[]> => {
    const jobs = await Promise.all(
      states.map(async (s) => {
        // A Mie run carries its λr in the payload (runNpt builds the Mie kernel) and in its cache key.
        const state = { ...normaliseState({ ...s, ...md }), ...(mie ? { repulsiveExponent } : {}) };
        const input: SimulationInput = { state };
        const cacheKey = mie ? JSON.stringify([simulationCacheKey(state), 'mie', repulsiveExponent]) : simulationCacheKey(state);
        return env.jobs.enqueue({ kind: 'simulation', input, seed: state.seed, cacheKey, createdBy });
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
        if (job.status !== 'succeeded')
          throw new Error(
            `simulation ${job.id} at T* = ${states[i].reducedTemperature.toFixed(4)}, P* = ${states[i].reducedPressure.toFixed(4)} ${job.status}: ${job.error ?? 'no result'}`,
          );
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

  const points: MdStagePoint[] = payload.measurementSets.flatMap((d, measurementSetIndex) =>
    d.rows.map((r, i) => ({
      measurementSetId: d.id,
      measurementSetIndex,
      kind: d.kind,
      rowNumber: i + 1,
      excluded: !!d.excludeRows?.includes(i + 1),
      temperatureK: r.temperatureK,
      pressureMPa: r.pressureMPa,
      value: r.value,
      uncertainty: r.uncertainty,
      weight: d.weight ?? 1,
    })),
  );
  // The reweighting pool is every run this fit asks for, reused ones included (cached by their exact state, engine
  // settings and seed): a repeated fit replays the same rounds from the cache and lands on the same parameters.
  const result = await mdStageFit(
    points,
    payload.measurementSets.map((d) => ({ id: d.id, kind: d.kind })),
    {
      start,
      startMethod,
      bounds,
      context: {
        molarMassGPerMol: payload.options.molarMassGPerMol!,
        quantumCorrection: !!payload.options.quantumCorrection,
        ...(mie && repulsiveExponent !== 12 ? { repulsiveExponent } : {}),
      },
      ...(posterior ? { posterior: { ...posterior, drawsReturned: 400, signal: env.signal } } : {}),
      ...(payload.options.fixed?.epsilonK !== undefined
        ? { held: 'epsilonK' as const }
        : payload.options.fixed?.sigmaAngstrom !== undefined
          ? { held: 'sigmaAngstrom' as const }
          : {}),
      simulate,
      onProgress: (p) => env.progress({ fraction: 0.1 + 0.9 * p.fraction, stage: p.stage }),
    },
  );
  const schemeNote = mie
    ? md.scheme === 'truncated-shifted'
      ? `The simulations use the truncated-and-shifted ${model} potential (rc = ${md.cutoff}σ). ${notes[0]}`
      : `The simulations use the truncated ${model} potential with its own tail corrections (rc = ${md.cutoff}σ), which mimics the full ${model} potential. ${notes[0]}`
    : md.scheme === 'truncated-shifted'
      ? `The simulations use the truncated-and-shifted potential (rc = ${md.cutoff}σ); the equation of state describes the full potential, so the two stages fit different models and may differ beyond their uncertainties.`
      : `The simulations use the truncated potential with tail corrections (rc = ${md.cutoff}σ), which mimics the full potential the equation of state describes.`;
  // A Mie fit's starting fit is no equation-of-state stage: it is kept as `startStage` so no screen compares it as one.
  return {
    ...result,
    ...(eos ? (mie ? { startStage: eos } : { eosStage: eos }) : {}),
    mdSettings: md,
    schemeNote,
    notes,
    mdRunCount: result.mdRuns.length,
    mdRunsReused: result.mdRuns.filter((r) => r.reused).length,
  };
}
