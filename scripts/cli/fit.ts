/**
 * `npm run -s cli -- fit --data FILE.csv [--data FILE2.csv ...] [--molar-mass M] [--quantum] [--restarts N]
 *   [--atoms N --steps S --cutoff RC --scheme truncated-tail|truncated-shifted --seed K] --json`
 * Fits Lennard-Jones (ε/k_B, σ) to uploaded-format measurement CSVs (B2, viscosity or density, one property
 * per file; headers such as "T (K),B2 (cm3/mol),u(B2) (cm3/mol)", "T (K),eta (uPa s)" or "T (K),P (MPa),rho (kg/m3)").
 * With density data the equation-of-state stage is followed by the simulation stage: NPT runs in worker
 * threads (WORKERS, default cores − 1), cached for the duration of the command.
 * Prints { status, epsilonK, sigmaAngstrom, stdErr, correlation, chi2, dof, reducedChi2, convergence, deBoerParameter, deBoerParameterStdErr, warnings }
 * plus { eosStage, mdRuns, mdIterations } for density fits.
 * Mie λr-6 (B2 data): `--model mie --repulsive-exponent 16` holds λr, `--model mie --fit-repulsive-exponent` fits it
 * (adds { model, repulsiveExponent[, repulsiveExponentProfile] }). `--posterior [--samples N]` adds
 * { posterior: { epsilonK: { median, lower95, upper95 }, sigmaAngstrom: {…}, correlation, diagnostics, messages } }
 * (ensemble sampler with a fixed seed, shared/fitting/lj-posterior.ts; with density data, on the simulation stage's reweighted
 * runs with `coverage`, shared/fitting/density-posterior.ts).
 */
import { readFileSync } from 'node:fs';
import os from 'node:os';
import { fitLennardJones, type FitMeasurementSet, type LjFitResult } from '../../shared/fitting/lj-fit';
import { mdStageFit, type MdRunSummary, type MdStatePoint } from '../../shared/fitting/md-stage';
import { DENSITY_FIT_DEFAULTS } from '../../server/features/fits/density-fit';
import { normaliseState, simulationCacheKey } from '../../server/features/simulations/simulations.service';
import { createWorkerPool } from '../../server/jobs/worker-pool';
import type { NptResult } from '../../shared/physics/md/npt';
import { isFitKind } from '../../shared/fitting/property-models';
import { parseMeasurementCsv } from '../../shared/measurements/parse-measurement-csv';
import { rowValueAndUncertainty } from '../../shared/measurements/property-kinds';
import { errorMessage, missingFlagError, parseFlags, positiveNumberFlag, repulsiveExponentFlag } from './_flags';
import { fitMieWithExponent } from '../../shared/fitting/mie-fit';
import { ljPosterior } from '../../shared/fitting/lj-posterior';
import type { SimulationCutoffScheme } from '../../shared/physics/cutoff-schemes';

const USAGE =
  'usage: fit --data <file.csv> [--data <file2.csv> ...] [--molar-mass <g/mol>] [--quantum] [--restarts <n>] [--model lj-12-6|mie [--repulsive-exponent <8–36> | --fit-repulsive-exponent]] [--posterior [--samples <n>]] [--atoms <n> --steps <n> --cutoff <rc/σ> --scheme truncated-tail|truncated-shifted --seed <k>] --json';

/** Reads one CSV through the shared upload parser; throws with every problem it reports. */
function loadMeasurementSet(path: string, molarMassGPerMol: number | undefined): FitMeasurementSet {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (err) {
    throw new Error(`cannot read --data ${path}: ${errorMessage(err)}`, { cause: err });
  }
  const parsed = parseMeasurementCsv(text, molarMassGPerMol !== undefined ? { molarMassGPerMol } : {});
  if (!parsed.ok) {
    throw new Error(`${path}: ${parsed.problems.map((p) => p.message).join(' | ')}`);
  }
  const kind = parsed.kind;
  if (!isFitKind(kind)) throw new Error(`${path}: holds ${String(kind)} data, which the Lennard-Jones fit does not use`);
  return {
    id: path,
    kind,
    label: path,
    rows: parsed.rows.map((row) => {
      const { value, uncertainty } = rowValueAndUncertainty(row);
      return { temperatureK: row.temperatureK, ...(row.kind === 'density' ? { pressureMPa: row.pressureMPa } : {}), value, uncertainty };
    }),
  };
}

export async function run(argv: string[]): Promise<unknown> {
  const values = parseFlags(
    argv,
    {
      data: { type: 'string', multiple: true },
      'molar-mass': { type: 'string' },
      quantum: { type: 'boolean' },
      restarts: { type: 'string' },
      json: { type: 'boolean' },
      atoms: { type: 'string' },
      steps: { type: 'string' },
      cutoff: { type: 'string' },
      scheme: { type: 'string' },
      seed: { type: 'string' },
      model: { type: 'string' },
      'repulsive-exponent': { type: 'string' },
      'fit-repulsive-exponent': { type: 'boolean' },
      posterior: { type: 'boolean' },
      samples: { type: 'string' },
    },
    USAGE,
  );
  const files = values.data ?? [];
  if (files.length === 0) throw missingFlagError('data', USAGE);
  const molarMassGPerMol = positiveNumberFlag('molar-mass', values['molar-mass'], 'a positive number');
  let restarts: number | undefined;
  if (values.restarts !== undefined) {
    restarts = Number(values.restarts);
    if (!Number.isInteger(restarts) || restarts < 0) throw new Error(`--restarts must be a non-negative integer, got "${values.restarts}"`);
  }
  const measurementSets = files.map((file) => loadMeasurementSet(file, molarMassGPerMol));
  if (values.quantum && molarMassGPerMol === undefined)
    throw new Error('--quantum needs --molar-mass (the quantum correction depends on the molecular mass)');
  if (measurementSets.some((d) => d.kind === 'viscosity') && molarMassGPerMol === undefined) {
    throw new Error('viscosity data need --molar-mass (the Chapman–Enskog viscosity depends on the molecular mass)');
  }
  if (measurementSets.some((d) => d.kind === 'density') && molarMassGPerMol === undefined) {
    throw new Error('density data need --molar-mass (mass density = reduced density × M / (N_A σ³))');
  }
  const model = values.model ?? 'lj-12-6';
  if (model !== 'lj-12-6' && model !== 'mie') throw new Error(`--model must be lj-12-6 or mie, got "${model}"`);
  const fitExponent = values['fit-repulsive-exponent'] === true;
  if (model === 'lj-12-6' && (values['repulsive-exponent'] !== undefined || fitExponent))
    throw new Error('--repulsive-exponent and --fit-repulsive-exponent need --model mie');
  if (model === 'mie' && (values['repulsive-exponent'] === undefined) === !fitExponent)
    throw new Error('--model mie needs either --repulsive-exponent <8–36> (held) or --fit-repulsive-exponent (fitted), not both');
  const repulsiveExponent = repulsiveExponentFlag(values['repulsive-exponent']);
  let samples: number | undefined;
  if (values.samples !== undefined) {
    samples = Number(values.samples);
    if (!values.posterior) throw new Error('--samples is only used with --posterior');
    if (!Number.isInteger(samples) || samples < 100 || samples > 100000)
      throw new Error(`--samples must be a whole number from 100 to 100000, got "${values.samples}"`);
  }
  const hasDensity = measurementSets.some((d) => d.kind === 'density');
  if (model === 'mie' && hasDensity)
    throw new Error('the command line runs density fits with LJ 12-6 only; a Mie density fit runs through the API (POST /api/fits)');
  const options = {
    molarMassGPerMol,
    quantumCorrection: values.quantum ?? false,
    ...(restarts !== undefined ? { restarts } : {}),
    ...(model === 'mie' && !fitExponent ? { repulsiveExponent } : {}),
  };
  const fit = model === 'mie' && fitExponent ? fitMieWithExponent(measurementSets, options) : fitLennardJones(measurementSets, options);
  if (!hasDensity) {
    const extra: Record<string, unknown> = {};
    if (model === 'mie') {
      extra.model = fit.model;
      extra.repulsiveExponent = fit.repulsiveExponent;
      if ('repulsiveExponentProfile' in fit) extra.repulsiveExponentProfile = fit.repulsiveExponentProfile;
    }
    if (values.posterior && fit.status === 'succeeded') {
      const post = ljPosterior(measurementSets, { ...options, repulsiveExponent: fit.repulsiveExponent }, fit, {
        ...(samples !== undefined ? { samples } : {}),
        drawsReturned: 0,
      });
      const pick = (p: typeof post.epsilonK) => ({ median: p.median, lower95: p.lower95, upper95: p.upper95 });
      extra.posterior = {
        epsilonK: pick(post.epsilonK),
        sigmaAngstrom: pick(post.sigmaAngstrom),
        correlation: post.correlation,
        linearised: post.linearised,
        diagnostics: post.diagnostics,
        likelihood: post.likelihood,
        priors: post.priors,
        messages:
          'repulsiveExponentProfile' in fit
            ? [
                ...post.messages,
                `ε and σ were sampled at the best λr = ${fit.repulsiveExponent?.toFixed(2)}; λr itself is not sampled, so these intervals do not include its uncertainty.`,
              ]
            : post.messages,
      };
    }
    return summary(fit, extra);
  }
  if (!measurementSets.some((d) => d.kind === 'density') || fit.status !== 'succeeded')
    return summary(fit, measurementSets.some((d) => d.kind === 'density') ? { eosStage: summary(fit) } : {});
  return densityStage(
    measurementSets,
    fit,
    molarMassGPerMol!,
    values,
    values.posterior ? { ...(samples !== undefined ? { samples } : {}) } : undefined,
  );
}

/** The simulation stage, with the worker pool and an in-command cache of runs by reduced state and settings. */
async function densityStage(
  measurementSets: FitMeasurementSet[],
  eos: LjFitResult,
  molarMassGPerMol: number,
  values: { atoms?: string; steps?: string; cutoff?: string; scheme?: string; seed?: string },
  posterior?: { samples?: number },
) {
  const intFlag = (name: string, raw: string | undefined, lo: number, hi: number) => {
    if (raw === undefined) return undefined;
    const v = Number(raw);
    if (!Number.isInteger(v) || v < lo || v > hi) throw new Error(`--${name} must be a whole number from ${lo} to ${hi}, got "${raw}"`);
    return v;
  };
  const cutoff = values.cutoff === undefined ? undefined : Number(values.cutoff);
  if (cutoff !== undefined && !(cutoff >= 2 && cutoff <= 4))
    throw new Error(`--cutoff must be between 2 and 4 (rc/σ), got "${values.cutoff}"`);
  if (values.scheme !== undefined && values.scheme !== 'truncated-tail' && values.scheme !== 'truncated-shifted')
    throw new Error(`--scheme must be truncated-tail or truncated-shifted, got "${values.scheme}"`);
  const md = {
    ...DENSITY_FIT_DEFAULTS,
    ...(intFlag('atoms', values.atoms, 108, 20000) !== undefined ? { atoms: Number(values.atoms) } : {}),
    ...(intFlag('steps', values.steps, 1000, 2_000_000) !== undefined ? { steps: Number(values.steps) } : {}),
    ...(cutoff !== undefined ? { cutoff } : {}),
    ...(values.scheme ? { scheme: values.scheme as SimulationCutoffScheme } : {}),
    ...(intFlag('seed', values.seed, 0, 2 ** 32 - 1) !== undefined ? { seed: Number(values.seed) } : {}),
  };
  const pool = createWorkerPool(Number(process.env.WORKERS) || Math.max(1, os.availableParallelism() - 1));
  const cache = new Map<string, Promise<NptResult>>();
  let runs = 0;
  let reused = 0;
  try {
    const simulate = (states: MdStatePoint[], onRunFinished?: () => void): Promise<MdRunSummary[]> =>
      Promise.all(
        states.map(async (s) => {
          const state = normaliseState({ ...s, ...md });
          const key = simulationCacheKey(state);
          const hit = cache.has(key);
          if (hit) reused++;
          else cache.set(key, pool.run('simulation', state, () => {}) as Promise<NptResult>);
          const r = await cache.get(key)!;
          runs++;
          onRunFinished?.();
          // Frames and settings go along, so the stage reweights them to nearby states (shared/physics/md/mbar.ts).
          return {
            id: runs,
            reused: hit,
            reducedDensity: r.reducedDensity,
            stdErr: r.stdErr,
            dRhoDT: r.dRhoDT,
            dRhoDP: r.dRhoDP,
            phase: r.phase,
            ...r.settings,
            effectiveSamples: r.effectiveSamples,
            startedFrom: r.startedFrom,
            frames: r.frames,
          };
        }),
      );
    const points = measurementSets.flatMap((d, measurementSetIndex) =>
      d.rows.map((r) => ({
        measurementSetId: d.id,
        measurementSetIndex,
        kind: d.kind,
        temperatureK: r.temperatureK,
        pressureMPa: r.pressureMPa,
        value: r.value,
        uncertainty: r.uncertainty,
        weight: d.weight ?? 1,
      })),
    );
    const result = await mdStageFit(
      points,
      measurementSets.map((d) => ({ id: d.id, kind: d.kind })),
      {
        start: { epsilonK: eos.epsilonK, sigmaAngstrom: eos.sigmaAngstrom },
        bounds: eos.bounds,
        context: { molarMassGPerMol, quantumCorrection: eos.quantumCorrection },
        simulate,
        // The posterior on the reweighted predictions of the stage's runs (shared/fitting/density-posterior.ts).
        ...(posterior ? { posterior: { ...posterior, drawsReturned: 0 } } : {}),
      },
    );
    const post = result.posterior;
    const pick = (p: NonNullable<typeof post>['epsilonK']) => ({ median: p.median, lower95: p.lower95, upper95: p.upper95 });
    return summary(result, {
      eosStage: summary(eos),
      mdRuns: cache.size,
      mdRunsReused: reused,
      mdSettings: md,
      mdIterations: result.mdIterations.map((i) => ({
        iteration: i.iteration,
        epsilonK: i.epsilonK,
        sigmaAngstrom: i.sigmaAngstrom,
        chi2: i.chi2,
        accepted: i.accepted,
        reason: i.reason,
        reweightedSteps: i.reweightedSteps,
      })),
      mdRounds: result.mdRounds,
      stoppedBy: result.stoppedBy,
      newRuns: result.newRuns,
      reusedRuns: result.reusedRuns,
      reweightedPoints: result.reweightedPoints,
      effectiveSamples: result.residuals.filter((r) => r.kind === 'density').map((r) => r.effectiveSamples),
      stoppingRule: result.stoppingRule,
      ...(post
        ? {
            posterior: {
              epsilonK: pick(post.epsilonK),
              sigmaAngstrom: pick(post.sigmaAngstrom),
              correlation: post.correlation,
              linearised: post.linearised,
              diagnostics: post.diagnostics,
              coverage: post.coverage,
              likelihood: post.likelihood,
              priors: post.priors,
              messages: post.messages,
            },
          }
        : {}),
    });
  } finally {
    await pool.close();
  }
}

function summary(fit: LjFitResult, extra: Record<string, unknown> = {}) {
  return {
    status: fit.status,
    ...(fit.failureReason ? { failureReason: fit.failureReason } : {}),
    epsilonK: fit.epsilonK,
    sigmaAngstrom: fit.sigmaAngstrom,
    stdErr: fit.stdErr,
    correlation: fit.correlation,
    chi2: fit.chi2,
    dof: fit.dof,
    reducedChi2: fit.reducedChi2,
    convergence: fit.convergence,
    // Λ* = h/(σ√(mε)) whenever B2 or viscosity data and the molar mass are given (null otherwise).
    deBoerParameter: fit.deBoerParameter ?? null,
    deBoerParameterStdErr: fit.deBoerParameterStdErr ?? null,
    warnings: fit.warnings,
    ...extra,
  };
}
