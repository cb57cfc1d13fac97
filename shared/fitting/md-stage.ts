/**
 * The simulation stage of a density fit: Levenberg–Marquardt over (ε/k_B, σ) in which every density prediction
 * comes from NPT runs of the LJ fluid at the reduced states of the data. Since a change of ε and σ is a change of
 * reduced state (T*, P*), the frames of every stored run of the same engine settings predict ⟨ρ*⟩ at nearby states
 * by multistate reweighting (MBAR, ../physics/md/mbar.ts), with the exact derivatives of that prediction as the
 * Jacobian (chain rule in corresponding-states.ts). So:
 *   1. a round asks for new runs only at states no stored run covers (Kish effective sample size below the guard);
 *   2. Levenberg–Marquardt then steps on the reweighted predictions, which are smooth in (ε, σ), for as long as its
 *      trial points stay covered;
 *   3. when the step falls inside the noise, one more round runs at the final point's states to confirm it, and the
 *      stage stops there ('converged') if the step, with those runs included, is still inside the noise — otherwise
 *      it goes on, up to `maxIterations` rounds ('round-limit').
 * Points whose state the equation of state (Kolafa–Nezbeda 1994 with the freezing line, ../physics/eos/lj-freezing.ts)
 * places in the solid region or where it has no fluid root are not simulated; the result says so. A run that freezes or
 * splits anyway leaves its point out, with a warning. The standard error of each prediction (in kg/m³) is added in
 * quadrature to the measurement uncertainty. Runs without stored frames (a test double, an old cached result) still
 * work: their own fluctuation derivatives give one Levenberg–Marquardt step per round.
 * Runs are asked for through an injected `simulate`, so the same code runs against the job queue or a test double.
 * With `posterior`, the converged stage samples the Bayesian posterior of (ε, σ) on the reweighted predictions of its
 * runs (density-posterior.ts), with a short extra round of runs where the sampler's proposals leave their reach.
 */
import { densityWithGradient, massDensityKgPerM3, reducedStateOf } from '../physics/corresponding-states';
import { ljRegionOf } from '../physics/eos/lj-freezing';
import type { RunFrames } from '../physics/md/frames';
import { DEFAULT_MIN_REWEIGHT_SAMPLES, ReweightPool, reweightRunFromFrames, type ReweightRun } from '../physics/md/mbar';
import { covarianceFromJacobian, correlationFromCovariance, standardErrorsFromCovariance } from './covariance';
import { densityPosterior, type DensityPosterior, type DensityPosteriorOptions, type ProposalOutcome } from './density-posterior';
import { jointConfidenceEllipse } from './ellipse';
import { STRONG_CORRELATION, strongCorrelationWarning, type LjMeasurementSetSummary, type LjFitResult, type LjResidual } from './lj-fit';
import { modelValue } from './lj-posterior';
import { PROPERTY_MODELS, type FitKind, type PropertyContext } from './property-models';

export interface MdStatePoint {
  reducedTemperature: number;
  reducedPressure: number;
}

export interface MdRunSummary {
  /** Job id of the run, for links. */
  id: number;
  reused: boolean;
  reducedDensity: number;
  stdErr: number;
  dRhoDT: number;
  dRhoDP: number;
  phase: 'fluid' | 'solid' | 'two-phase';
  /** The run's own state and size; with `frames`, what reweighting needs. */
  reducedTemperature?: number;
  reducedPressure?: number;
  atoms?: number;
  effectiveSamples?: number;
  statisticalInefficiency?: number;
  startedFrom?: string;
  warnings?: string[];
  /** Frames as a task returns them (base64), or already decoded (read back from storage). */
  frames?: RunFrames;
  reweightRun?: ReweightRun;
}

export interface MdStagePoint {
  measurementSetId: string | number;
  measurementSetIndex: number;
  kind: FitKind;
  /** Row number within its measurement set (1-based). */
  rowNumber?: number;
  /** Left out by the modeller: still simulated and predicted, never counted in χ². */
  excluded?: boolean;
  temperatureK: number;
  pressureMPa?: number;
  value: number;
  uncertainty: number;
  weight: number;
}

export interface MdStageOptions {
  start: { epsilonK: number; sigmaAngstrom: number };
  bounds: { epsilonK: [number, number]; sigmaAngstrom: [number, number] };
  context: PropertyContext & { molarMassGPerMol: number };
  /** Hold one parameter at its start value: exact in the result, no standard error, one degree of freedom more. */
  held?: 'epsilonK' | 'sigmaAngstrom';
  /** At most this many rounds of simulations (default 6). */
  maxIterations?: number;
  /** Stop when every parameter moves by less than this many standard errors (default 1: a smaller step is within the simulation noise of the step itself). */
  changeInStandardErrors?: number;
  /** Runs of the same engine settings stored before this fit (reweighting uses them from the start). */
  storedRuns?: ReweightRun[];
  /** Kish effective samples below which a reweighted prediction is refused and a run is asked for (default 20, mbar.ts). */
  minEffectiveSamples?: number;
  /** Runs the states; `onRunFinished` is called as each run ends, for progress. */
  simulate: (states: MdStatePoint[], onRunFinished?: () => void) => Promise<MdRunSummary[]>;
  onProgress?: (p: { fraction: number; stage: string }) => void;
  /** How the start was found, for the result (default 'equation-of-state stage'). */
  startMethod?: string;
  /** Sample the Bayesian posterior of (ε, σ) on the reweighted predictions once the stage has its answer. */
  posterior?: DensityPosteriorOptions;
}

export interface MdIteration {
  iteration: number;
  epsilonK: number;
  sigmaAngstrom: number;
  chi2: number;
  accepted: boolean;
  runs: number;
  reusedRuns: number;
  /** Levenberg–Marquardt steps taken on reweighted predictions in this round. */
  reweightedSteps: number;
  /** Why the round asked for runs: 'start', 'uncovered' (a step left the reach of the stored runs) or 'confirm'. */
  reason: 'start' | 'uncovered' | 'confirm';
  excludedPoints: Array<{ temperatureK: number; pressureMPa?: number; reason: string }>;
}

/** A residual of the simulation stage: with the simulation's standard error (kg/m³), the run behind it, and whether the final round used it. */
export interface MdResidual extends LjResidual {
  modelUncertainty: number;
  simulationId: number | null;
  included: boolean;
  /** Kish effective samples behind the prediction (null for gas-phase points and predictions without frames). */
  effectiveSamples: number | null;
  /** 'reweighted': MBAR over the stored runs; 'run': one run's own averages (no frames); null: no simulation. */
  predictedBy: 'reweighted' | 'run' | null;
}

export interface MdStageResult extends LjFitResult {
  residuals: MdResidual[];
  mdIterations: MdIteration[];
  mdRuns: Array<{
    id: number;
    reused: boolean;
    temperatureK: number;
    pressureMPa: number;
    reducedTemperature: number;
    reducedPressure: number;
    reducedDensity: number;
    stdErr: number;
    phase: string;
    iteration: number;
    effectiveSamples: number | null;
    startedFrom: string | null;
    purpose?: 'posterior';
  }>;
  /** Rounds of simulations (a round: the runs asked for at one point of (ε, σ), then the steps on reweighted predictions). */
  mdRounds: number;
  stoppedBy: 'converged' | 'round-limit';
  newRuns: number;
  reusedRuns: number;
  /** Predictions of a state made by reweighting alone (no run at that state), summed over every step of the stage. */
  reweightedPoints: number;
  phaseWarnings: string[];
  stoppingRule: string;
  /** The Bayesian posterior on the reweighted predictions, when asked for. */
  posterior?: DensityPosterior;
}

interface Prediction {
  reducedDensity: number;
  stdErr: number;
  dRhoDT: number;
  dRhoDP: number;
  effectiveSamples: number | null;
  by: 'reweighted' | 'run';
  runId: number | null;
  /** True when no run sits at this very state. */
  reweightedOnly: boolean;
}

interface Evaluation {
  epsilonK: number;
  sigmaAngstrom: number;
  residuals: number[];
  jacobian: number[][];
  predicted: number[];
  modelUncertainty: number[];
  included: boolean[];
  runIds: Array<number | null>;
  effectiveSamples: Array<number | null>;
  predictedBy: Array<'reweighted' | 'run' | null>;
  chi2: number;
  excluded: MdIteration['excludedPoints'];
  /** Density points whose state no prediction reaches (they need runs). */
  uncovered: number[];
  reweightedOnly: number;
}

const stateKey = (s: MdStatePoint) => `${s.reducedTemperature.toPrecision(10)}|${s.reducedPressure.toPrecision(10)}`;

/** Everything the stage knows about runs: frames for reweighting, and runs without frames by their exact state. */
class RunBook {
  readonly pool: ReweightPool;
  readonly direct = new Map<string, MdRunSummary>();
  readonly frozen = new Map<string, MdRunSummary>();
  /** Every run with frames, by id (the pool's own list is private). */
  readonly reweightRuns = new Map<number, ReweightRun>();

  constructor(
    stored: ReweightRun[],
    readonly minEffectiveSamples: number,
  ) {
    this.pool = new ReweightPool(stored, minEffectiveSamples);
    for (const r of stored) this.reweightRuns.set(r.id, r);
  }

  add(state: MdStatePoint, run: MdRunSummary): void {
    const key = stateKey(state);
    if (run.phase !== 'fluid') {
      this.frozen.set(key, run);
      return;
    }
    this.direct.set(key, run);
    let reweightRun: ReweightRun | null = null;
    if (run.reweightRun && run.reweightRun.volume.length > 0) reweightRun = run.reweightRun;
    else if (run.frames && run.frames.count > 0) {
      reweightRun = reweightRunFromFrames(
        run.id,
        {
          reducedTemperature: run.reducedTemperature ?? state.reducedTemperature,
          reducedPressure: run.reducedPressure ?? state.reducedPressure,
          atoms: run.atoms ?? 0,
        },
        run.frames,
      );
    }
    if (reweightRun && !this.pool.has(run.id)) {
      this.pool.add(reweightRun);
      this.reweightRuns.set(run.id, reweightRun);
    }
  }

  /** A prediction at the state, or null when neither reweighting nor a run at this state reaches it. */
  predict(state: MdStatePoint): Prediction | null {
    const direct = this.direct.get(stateKey(state));
    const r = this.pool.size ? this.pool.predict(state) : null;
    if (r && r.ok) {
      return {
        reducedDensity: r.reducedDensity,
        stdErr: r.stdErr,
        dRhoDT: r.dRhoDT,
        dRhoDP: r.dRhoDP,
        effectiveSamples: r.effectiveSamples,
        by: 'reweighted',
        runId: direct?.id ?? r.runs.reduce((a, b) => (b.weight > a.weight ? b : a)).id,
        reweightedOnly: !direct,
      };
    }
    // A run at this very state is used even below the reweighting guard: it is the best there is (its own error says how good).
    if (direct) {
      return {
        reducedDensity: direct.reducedDensity,
        stdErr: direct.stdErr,
        dRhoDT: direct.dRhoDT,
        dRhoDP: direct.dRhoDP,
        effectiveSamples: direct.effectiveSamples ?? null,
        by: 'run',
        runId: direct.id,
        reweightedOnly: false,
      };
    }
    return null;
  }
}

function densityStates(points: MdStagePoint[], epsilonK: number, sigmaAngstrom: number): Map<number, MdStatePoint> {
  const out = new Map<number, MdStatePoint>();
  points.forEach((p, i) => {
    if (p.kind === 'density')
      out.set(i, reducedStateOf({ temperatureK: p.temperatureK, pressureMPa: p.pressureMPa!, epsilonK, sigmaAngstrom }));
  });
  return out;
}

const regionMemo = new Map<string, string | null>();

/** Why a density point's state is not simulated at all (solid region, no fluid root), or null. Remembered per state. */
function regionProblem(state: MdStatePoint): string | null {
  const key = stateKey(state);
  let problem = regionMemo.get(key);
  if (problem === undefined) {
    const r = ljRegionOf(state.reducedTemperature, state.reducedPressure);
    problem = r.region === 'fluid' ? null : (r.reason ?? r.region);
    if (regionMemo.size > 10_000) regionMemo.clear();
    regionMemo.set(key, problem);
  }
  return problem;
}

function evaluate(
  points: MdStagePoint[],
  epsilonK: number,
  sigmaAngstrom: number,
  options: MdStageOptions,
  book: RunBook,
  leftOut: Map<number, string>,
): Evaluation {
  const states = densityStates(points, epsilonK, sigmaAngstrom);
  const residuals: number[] = [];
  const jacobian: number[][] = [];
  const predicted: number[] = [];
  const modelUncertainty: number[] = [];
  const included: boolean[] = [];
  const runIds: Array<number | null> = [];
  const effectiveSamples: Array<number | null> = [];
  const predictedBy: Array<'reweighted' | 'run' | null> = [];
  const excluded: MdIteration['excludedPoints'] = [];
  const uncovered: number[] = [];
  let reweightedOnly = 0;
  const leave = (p: MdStagePoint, reason: string | null, value = Number.NaN, u = Number.NaN) => {
    if (reason) excluded.push({ temperatureK: p.temperatureK, pressureMPa: p.pressureMPa, reason });
    residuals.push(0);
    jacobian.push([0, 0]);
    predicted.push(value);
    modelUncertainty.push(u);
    included.push(false);
  };
  points.forEach((p, i) => {
    if (p.kind !== 'density') {
      const m = PROPERTY_MODELS[p.kind].evaluate(
        { temperatureK: p.temperatureK, pressureMPa: p.pressureMPa, measured: p.value },
        epsilonK,
        sigmaAngstrom,
        options.context,
      );
      const scale = p.excluded ? 0 : p.weight / p.uncertainty;
      residuals.push((m.value - p.value) * scale);
      jacobian.push([m.dEpsilonK * scale, m.dSigmaAngstrom * scale]);
      predicted.push(m.value);
      modelUncertainty.push(0);
      included.push(!p.excluded);
      runIds.push(null);
      effectiveSamples.push(null);
      predictedBy.push(null);
      return;
    }
    const reducedState = states.get(i)!;
    const problem = leftOut.get(i) ?? regionProblem(reducedState);
    const frozen = book.frozen.get(stateKey(reducedState));
    const pred = problem || frozen ? null : book.predict(reducedState);
    runIds.push(pred?.runId ?? frozen?.id ?? null);
    effectiveSamples.push(pred?.effectiveSamples ?? null);
    predictedBy.push(pred?.by ?? null);
    if (problem) return leave(p, problem);
    if (frozen) return leave(p, frozen.phase === 'solid' ? 'the run froze into an ordered solid' : 'the run split into vapour and liquid');
    if (!pred) {
      uncovered.push(i);
      return leave(p, null);
    }
    if (pred.reweightedOnly) reweightedOnly++;
    const state = { temperatureK: p.temperatureK, pressureMPa: p.pressureMPa!, epsilonK, sigmaAngstrom };
    const g = densityWithGradient(pred, state, options.context.molarMassGPerMol);
    const uModel = densityWithGradient(
      { reducedDensity: pred.stdErr, dRhoDT: 0, dRhoDP: 0 },
      state,
      options.context.molarMassGPerMol,
    ).densityKgPerM3;
    if (p.excluded) return leave(p, null, g.densityKgPerM3, uModel);
    const ratio = g.densityKgPerM3 / p.value;
    if (ratio < 0.5 || ratio > 2) {
      // The simulated fluid is in another phase than the sample (e.g. the data say liquid, the run says gas):
      // no small change of ε and σ bridges that, so the point is reported and left out rather than averaged in.
      return leave(
        p,
        `the simulated fluid (${g.densityKgPerM3.toFixed(1)} kg/m³) is in another phase than the measured one (${p.value} kg/m³)`,
        g.densityKgPerM3,
        uModel,
      );
    }
    const u = Math.hypot(p.uncertainty, uModel);
    const scale = p.weight / u;
    residuals.push((g.densityKgPerM3 - p.value) * scale);
    jacobian.push([g.dRhodEpsilonK * scale, g.dRhodSigmaAngstrom * scale]);
    predicted.push(g.densityKgPerM3);
    modelUncertainty.push(uModel);
    included.push(true);
  });
  const chi2 = residuals.reduce((s, r) => s + r * r, 0);
  return {
    epsilonK,
    sigmaAngstrom,
    residuals,
    jacobian,
    predicted,
    modelUncertainty,
    included,
    runIds,
    effectiveSamples,
    predictedBy,
    chi2,
    excluded,
    uncovered,
    reweightedOnly,
  };
}

/**
 * The log likelihood of density-posterior.ts at (ε, σ) from the pool alone: the points the fit counted, each density
 * with the variance of its measurement plus that of its reweighted prediction (and ln v, since that one varies), the
 * other kinds with their models (interpolated B2 as in the gas-phase posterior). Refused where a state is out of reach
 * or an included point leaves the fluid or the sample's phase.
 */
function posteriorOutcome(
  points: MdStagePoint[],
  epsilonK: number,
  sigmaAngstrom: number,
  options: MdStageOptions,
  book: RunBook,
  pools: PointPools,
  includedAtFit: readonly boolean[],
  s2: number,
): ProposalOutcome {
  let sum = 0;
  const M = options.context.molarMassGPerMol;
  for (let i = 0; i < points.length; i++) {
    if (!includedAtFit[i]) continue;
    const p = points[i];
    if (p.kind !== 'density') {
      const r =
        ((modelValue(
          p.kind,
          { temperatureK: p.temperatureK, pressureMPa: p.pressureMPa, measured: p.value },
          epsilonK,
          sigmaAngstrom,
          options.context,
        ) -
          p.value) *
          p.weight) /
        p.uncertainty;
      sum += (r * r) / s2;
      continue;
    }
    const state = reducedStateOf({ temperatureK: p.temperatureK, pressureMPa: p.pressureMPa!, epsilonK, sigmaAngstrom });
    if (regionProblem(state) || book.frozen.has(stateKey(state))) return { refused: 'phase' };
    const pred = pools.predict(i, state);
    if (!pred.ok) return { refused: 'uncovered' };
    const rho = massDensityKgPerM3(pred.reducedDensity, M, sigmaAngstrom);
    const ratio = rho / p.value;
    if (ratio < 0.5 || ratio > 2) return { refused: 'phase' };
    const uModel = massDensityKgPerM3(pred.stdErr, M, sigmaAngstrom);
    const v = (p.uncertainty * p.uncertainty + uModel * uModel) / (p.weight * p.weight);
    sum += (rho - p.value) ** 2 / (s2 * v) + Math.log(v);
  }
  return Number.isFinite(sum) ? { logLikelihood: -0.5 * sum } : { refused: 'uncovered' };
}

/**
 * One MBAR pool per density point for the sampler, which asks for tens of thousands of predictions: the runs made for
 * that point plus every run carrying weight (share > 10⁻³) at its state at the fit's answer. Runs of the other points'
 * states carry no weight there, so the estimate is the same MBAR estimate over the runs that matter, at a fraction of
 * the cost of weighting every frame of the stage.
 */
class PointPools {
  private readonly pools = new Map<number, ReweightPool>();
  /**
   * Points whose runs carry fewer effective samples than the guard even at the fit's own state (the stage then used
   * the run itself): their guard is half of what they carry there, so the walkers can start; said in the result.
   */
  readonly lowered = new Map<number, { guard: number; effectiveSamples: number }>();

  constructor(
    private readonly book: RunBook,
    private readonly runsOfPoint: Map<number, Set<number>>,
    private readonly finalStates: Map<number, MdStatePoint>,
  ) {}

  /** Forget the pools (after new runs). */
  reset(): void {
    this.pools.clear();
    this.lowered.clear();
  }

  predict(i: number, state: MdStatePoint): ReturnType<ReweightPool['predict']> {
    let pool = this.pools.get(i);
    if (!pool) {
      const ids = new Set(this.runsOfPoint.get(i) ?? []);
      const at = this.finalStates.get(i);
      const whole = at && this.book.pool.size ? this.book.pool.predict(at) : null;
      if (whole && 'runs' in whole) for (const r of whole.runs) ids.add(r.id);
      const runs = [...ids].map((id) => this.book.reweightRuns.get(id)).filter((r): r is ReweightRun => !!r);
      pool = new ReweightPool(runs, this.book.minEffectiveSamples);
      const own = at && pool.size ? pool.predict(at) : null;
      if (own && !own.ok && own.effectiveSamples >= 2) {
        const guard = Math.max(1, own.effectiveSamples / 2);
        this.lowered.set(i, { guard, effectiveSamples: own.effectiveSamples });
        pool = new ReweightPool(runs, guard);
      }
      this.pools.set(i, pool);
    }
    return pool.predict(state);
  }
}

const PARAMETER_NAMES = ['epsilonK', 'sigmaAngstrom'] as const;

/** The Jacobian's columns of the free parameters. */
function freeColumns(jacobian: number[][], heldIndex: number | null): number[][] {
  return heldIndex === null ? jacobian : jacobian.map((row) => [row[1 - heldIndex]]);
}

/** A free parameter's covariance back in (ε, σ), zero for the held one. */
function embedCovariance(m: number[][] | null, heldIndex: number | null): number[][] | null {
  if (!m || heldIndex === null) return m;
  const out = [
    [0, 0],
    [0, 0],
  ];
  out[1 - heldIndex][1 - heldIndex] = m[0][0];
  return out;
}

function embedStdErr(se: number[], heldIndex: number | null, heldValue: number): number[] {
  if (heldIndex === null) return se;
  const out = [heldValue, heldValue];
  out[1 - heldIndex] = se[0];
  return out;
}

/** Solves the 2×2 damped normal equations (JᵀJ + λ·diag JᵀJ) δ = −Jᵀr; with a held parameter, the 1×1 equation of the other. */
function lmStep(e: Evaluation, lambda: number, heldIndex: number | null = null): [number, number] {
  let a = 0,
    b = 0,
    d = 0,
    g0 = 0,
    g1 = 0;
  e.jacobian.forEach(([j0, j1], i) => {
    a += j0 * j0;
    b += j0 * j1;
    d += j1 * j1;
    g0 += j0 * e.residuals[i];
    g1 += j1 * e.residuals[i];
  });
  if (heldIndex === 0) return [0, d > 0 ? -g1 / (d * (1 + lambda)) : 0];
  if (heldIndex === 1) return [a > 0 ? -g0 / (a * (1 + lambda)) : 0, 0];
  const A = a * (1 + lambda);
  const D = d * (1 + lambda);
  const det = A * D - b * b;
  if (!(Math.abs(det) > 0)) return [0, 0];
  return [(-D * g0 + b * g1) / det, (b * g0 - A * g1) / det];
}

const clamp = (x: number, [lo, hi]: [number, number]) => Math.min(Math.max(x, lo), hi);

export async function mdStageFit(
  points: MdStagePoint[],
  measurementSets: Array<{ id: string | number; kind: FitKind }>,
  options: MdStageOptions,
): Promise<MdStageResult> {
  const maxIterations = options.maxIterations ?? 6;
  const heldIndex = options.held ? PARAMETER_NAMES.indexOf(options.held) : null;
  const freeCount = heldIndex === null ? 2 : 1;
  const tolerance = options.changeInStandardErrors ?? 1;
  const report = (fraction: number, stage: string) => options.onProgress?.({ fraction, stage });
  const book = new RunBook(options.storedRuns ?? [], options.minEffectiveSamples ?? DEFAULT_MIN_REWEIGHT_SAMPLES);
  /** Density points left out for good: a run at their state froze or split. */
  const leftOut = new Map<number, string>();
  const iterations: MdIteration[] = [];
  const allRuns: MdStageResult['mdRuns'] = [];
  let newRuns = 0;
  let reusedRuns = 0;
  let reweightedPoints = 0;
  let lambda = 1e-3;
  let theta = { ...options.start };
  let reason: MdIteration['reason'] = 'start';
  let stoppedBy: MdStageResult['stoppedBy'] = 'round-limit';
  let stoppingRule = `stopped after ${maxIterations} rounds of simulations without the parameters settling below ${tolerance} standard errors`;
  let current: Evaluation | null = null;
  // Progress: round r fills [start(r), start(r + 1)), halves that shrink, so the bar never waits for a round limit.
  const roundStart = (r: number) => 0.05 + 0.9 * (1 - 0.5 ** (r - 1));
  const describe = (t: { epsilonK: number; sigmaAngstrom: number }) =>
    `ε/k_B = ${t.epsilonK.toFixed(2)} K, σ = ${t.sigmaAngstrom.toFixed(4)} Å`;
  const runsOfPoint = new Map<number, Set<number>>();
  /** Runs the wanted states, adds them to the book and the record; a run that froze or split leaves its point out (not for the posterior's runs). */
  const runAt = async (
    wanted: Array<[number, MdStatePoint]>,
    iteration: number,
    onFinished: (finished: number) => void,
    purpose?: 'posterior',
  ): Promise<MdRunSummary[]> => {
    let finished = 0;
    const runs = wanted.length
      ? await options.simulate(
          wanted.map(([, st]) => st),
          () => onFinished(++finished),
        )
      : [];
    runs.forEach((r, k) => {
      const [i, st] = wanted[k];
      book.add(st, r);
      if (r.phase !== 'fluid' && !purpose)
        leftOut.set(i, r.phase === 'solid' ? 'the run froze into an ordered solid' : 'the run split into vapour and liquid');
      if (r.reused) reusedRuns++;
      else newRuns++;
      if (!runsOfPoint.has(i)) runsOfPoint.set(i, new Set());
      runsOfPoint.get(i)!.add(r.id);
      const p = points[i];
      allRuns.push({
        id: r.id,
        reused: r.reused,
        temperatureK: p.temperatureK,
        pressureMPa: p.pressureMPa!,
        ...st,
        reducedDensity: r.reducedDensity,
        stdErr: r.stdErr,
        phase: r.phase,
        iteration,
        effectiveSamples: r.effectiveSamples ?? null,
        startedFrom: r.startedFrom ?? null,
        ...(purpose ? { purpose } : {}),
      });
    });
    return runs;
  };
  const stepAndErrors = (e: Evaluation) => {
    const [d0, d1] = lmStep(e, lambda, heldIndex);
    const cov = covarianceFromJacobian(
      freeColumns(e.jacobian, heldIndex),
      e.chi2,
      Math.max(1, e.included.filter(Boolean).length - freeCount),
    );
    // The noise of the step itself: the standard errors from the stated and simulation uncertainties alone. (Scaled by
    // the reduced χ² they grow with the misfit, so a start far from the minimum would look converged.)
    const se = embedStdErr(cov.unscaled ? standardErrorsFromCovariance(cov.unscaled) : [Infinity, Infinity], heldIndex, Infinity);
    return { d0, d1, small: Math.abs(d0) < tolerance * se[0] && Math.abs(d1) < tolerance * se[1] };
  };
  rounds: for (let round = 1; round <= maxIterations; round++) {
    const lo = roundStart(round);
    const hi = roundStart(round + 1);
    // 1. Runs where reweighting cannot reach, or (confirm) at every state of this point that has no run of its own.
    const wanted: Array<[number, MdStatePoint]> = [];
    const seen = new Set<string>();
    for (const [i, st] of densityStates(points, theta.epsilonK, theta.sigmaAngstrom)) {
      const key = stateKey(st);
      if (leftOut.has(i) || seen.has(key) || book.direct.has(key) || book.frozen.has(key) || regionProblem(st)) continue;
      if (reason === 'confirm' || !book.predict(st)) {
        wanted.push([i, st]);
        seen.add(key);
      }
    }
    const why = { start: 'first runs', uncovered: 'states beyond the reach of the stored runs', confirm: 'confirming the final point' }[
      reason
    ];
    report(lo, `simulation round ${round} (${why}): ${wanted.length} NPT run(s) at ${describe(theta)}`);
    const runs = await runAt(wanted, round, (finished) => {
      report(
        lo + ((hi - lo) * 0.8 * finished) / wanted.length,
        `simulation round ${round} (${why}): ${finished} of ${wanted.length} run(s) finished`,
      );
    });
    const roundReason = reason;
    // 2. Levenberg–Marquardt on the predictions the stored runs give, while its trial points stay within their reach.
    let e = evaluate(points, theta.epsilonK, theta.sigmaAngstrom, options, book, leftOut);
    reweightedPoints += e.reweightedOnly;
    if (e.uncovered.length)
      throw new Error(`the simulation stage has no prediction at ${e.uncovered.length} state(s) although their runs finished`);
    let steps = 0;
    let converged = false;
    for (let guard = 0; guard < 200; guard++) {
      const { d0, d1, small } = stepAndErrors(e);
      if (small || lambda > 1e8) {
        // Inside the noise (or no step improves χ² any more): done if every state has a run of its own, else confirm.
        if (e.reweightedOnly === 0) {
          converged = true;
          stoppedBy = 'converged';
          stoppingRule = `converged: the next step (Δε = ${d0.toExponential(2)} K, Δσ = ${d1.toExponential(2)} Å) is below ${tolerance} standard errors of each parameter, with runs at every state of the final point`;
        } else reason = 'confirm';
        break;
      }
      let moved = false;
      let covered = false;
      for (const f of [1, 0.5, 0.25]) {
        const trialTheta = {
          epsilonK: clamp(e.epsilonK + f * d0, options.bounds.epsilonK),
          sigmaAngstrom: clamp(e.sigmaAngstrom + f * d1, options.bounds.sigmaAngstrom),
        };
        const trial = evaluate(points, trialTheta.epsilonK, trialTheta.sigmaAngstrom, options, book, leftOut);
        if (trial.uncovered.length) continue;
        covered = true;
        reweightedPoints += trial.reweightedOnly;
        if (trial.chi2 < e.chi2) {
          e = trial;
          theta = trialTheta;
          lambda = Math.max(lambda / 10, 1e-7);
          moved = true;
          steps++;
        } else lambda *= 10;
        break;
      }
      if (!covered) {
        // The step leaves the reach of every stored run: the next round runs there.
        theta = {
          epsilonK: clamp(e.epsilonK + d0, options.bounds.epsilonK),
          sigmaAngstrom: clamp(e.sigmaAngstrom + d1, options.bounds.sigmaAngstrom),
        };
        reason = 'uncovered';
        break;
      }
      void moved;
    }
    iterations.push({
      iteration: round,
      epsilonK: e.epsilonK,
      sigmaAngstrom: e.sigmaAngstrom,
      chi2: e.chi2,
      accepted: true,
      runs: runs.length,
      reusedRuns: runs.filter((r) => r.reused).length,
      reweightedSteps: steps,
      reason: roundReason,
      excludedPoints: e.excluded,
    });
    current = e;
    report(hi, `simulation round ${round} done: ${describe(e)}, χ² = ${e.chi2.toFixed(2)}`);
    if (converged) break rounds;
  }
  report(0.97, 'summarising');
  const final = current!;
  const nIncluded = final.included.filter(Boolean).length;
  const dof = nIncluded - freeCount;
  const cov = covarianceFromJacobian(freeColumns(final.jacobian, heldIndex), final.chi2, Math.max(dof, 1));
  const covariance = embedCovariance(cov.scaled ?? cov.unscaled, heldIndex);
  const stdErr: Array<number | null> = covariance ? standardErrorsFromCovariance(covariance) : [null, null];
  if (heldIndex !== null) stdErr[heldIndex] = null;
  const residuals: MdResidual[] = points.map((p, i) => ({
    measurementSetIndex: p.measurementSetIndex,
    measurementSetId: p.measurementSetId,
    kind: p.kind,
    temperatureK: p.temperatureK,
    ...(p.pressureMPa !== undefined ? { pressureMPa: p.pressureMPa } : {}),
    rowNumber: p.rowNumber ?? i + 1,
    excluded: !!p.excluded,
    measured: p.value,
    uncertainty: p.uncertainty,
    predicted: final.predicted[i],
    // A point left out by the modeller shows where it would lie; it is not in χ².
    residual: p.excluded
      ? ((final.predicted[i] - p.value) * p.weight) / Math.hypot(p.uncertainty, final.modelUncertainty[i])
      : final.residuals[i],
    relativeDeviationPercent: p.value !== 0 ? (100 * (final.predicted[i] - p.value)) / p.value : null,
    modelUncertainty: final.modelUncertainty[i],
    simulationId: final.runIds[i],
    included: final.included[i],
    effectiveSamples: final.effectiveSamples[i],
    predictedBy: final.predictedBy[i],
  }));
  const perMeasurementSet: LjMeasurementSetSummary[] = measurementSets.map((d, index) => {
    const mine = residuals.filter((r) => r.measurementSetIndex === index && r.included);
    const rel = mine.filter((r) => r.relativeDeviationPercent !== null);
    return {
      measurementSetId: d.id,
      kind: d.kind,
      points: residuals.filter((r) => r.measurementSetIndex === index && !r.excluded).length,
      excludedPoints: residuals.filter((r) => r.measurementSetIndex === index && r.excluded).length,
      rms: mine.length ? Math.sqrt(mine.reduce((s, r) => s + (r.predicted - r.measured) ** 2, 0) / mine.length) : NaN,
      aadPercent: rel.length ? rel.reduce((s, r) => s + Math.abs(r.relativeDeviationPercent!), 0) / rel.length : null,
      chi2: mine.reduce((s, r) => s + r.residual * r.residual, 0),
    };
  });
  // Points left out (frozen, split, or in another phase than the sample) are reported, never quietly averaged away.
  const phaseWarnings: string[] = [];
  for (const it of iterations)
    for (const x of it.excludedPoints)
      phaseWarnings.push(
        `Round ${it.iteration}: the point at ${x.temperatureK.toFixed(2)} K, ${x.pressureMPa?.toFixed(3)} MPa was left out because ${x.reason}.`,
      );
  const warnings = [...phaseWarnings];
  if (stoppedBy !== 'converged') warnings.push(stoppingRule);
  const hitBounds: string[] = [];
  if (final.epsilonK <= options.bounds.epsilonK[0] || final.epsilonK >= options.bounds.epsilonK[1]) hitBounds.push('epsilonK');
  if (final.sigmaAngstrom <= options.bounds.sigmaAngstrom[0] || final.sigmaAngstrom >= options.bounds.sigmaAngstrom[1])
    hitBounds.push('sigmaAngstrom');
  let ellipse95: LjFitResult['ellipse95'] = null;
  if (covariance && dof > 0 && heldIndex === null) {
    const e = jointConfidenceEllipse([final.epsilonK, final.sigmaAngstrom], covariance, cov.scaled ? 'reduced-chi2' : 'none', nIncluded);
    ellipse95 = { points: e.points.map(([x, y]) => ({ epsilonK: x, sigmaAngstrom: y })), method: e.method, description: e.description };
  }
  const correlation = covariance && heldIndex === null ? correlationFromCovariance(covariance)[0][1] : null;
  const strongCorrelation = correlation !== null && Math.abs(correlation) > STRONG_CORRELATION;
  if (strongCorrelation) warnings.push(strongCorrelationWarning(correlation));
  const excludedByModeller = points.filter((p) => p.excluded).length;
  if (excludedByModeller)
    warnings.push(
      `${excludedByModeller} point(s) were left out by the modeller: they are shown with their predictions but not counted in χ²`,
    );
  warnings.push(
    `No profile-χ² curves for the simulation stage: every point of a curve would need its own rounds of simulations; the intervals are the linearised ones${options.posterior ? ', with the posterior’s beside them' : ''}.`,
  );
  const result: MdStageResult = {
    status: dof >= 0 ? 'succeeded' : 'failed',
    converged: dof >= 0,
    heldParameters: heldIndex === null ? [] : [PARAMETER_NAMES[heldIndex]],
    strongCorrelation,
    profiles: { epsilonK: null, sigmaAngstrom: null },
    ...(dof < 0 ? { failureReason: 'fewer usable points than parameters after leaving out frozen or split state points' } : {}),
    epsilonK: final.epsilonK,
    sigmaAngstrom: final.sigmaAngstrom,
    stdErr: { epsilonK: stdErr[0] ?? null, sigmaAngstrom: stdErr[1] ?? null },
    correlation,
    chi2: final.chi2,
    dof,
    reducedChi2: dof > 0 ? final.chi2 / dof : null,
    covariance: covariance ?? null,
    covarianceUnscaled: cov.unscaled ?? null,
    covarianceScaling: cov.scaled ? 'reduced-chi2' : 'none',
    iterations: iterations.length,
    convergence: stoppedBy === 'converged' ? 'parameter-change' : 'max-iterations',
    warnings,
    hitBounds,
    start: { ...options.start, method: options.startMethod ?? 'equation-of-state stage' },
    bounds: options.bounds,
    residuals,
    perMeasurementSet,
    ellipse95,
    restartsTried: 0,
    quantumCorrection: options.context.quantumCorrection,
    mdIterations: iterations,
    mdRounds: iterations.length,
    stoppedBy,
    newRuns,
    reusedRuns,
    reweightedPoints,
    mdRuns: allRuns,
    phaseWarnings,
    stoppingRule,
    ...(options.context.repulsiveExponent !== undefined && options.context.repulsiveExponent !== 12
      ? { model: 'mie' as const, repulsiveExponent: options.context.repulsiveExponent }
      : {}),
  };
  if (options.posterior && result.status === 'succeeded' && covariance) {
    report(0.97, 'sampling the posterior on the reweighted predictions');
    const free = PARAMETER_NAMES.filter((_, k) => k !== heldIndex);
    const s2 = cov.scaled && dof > 0 && final.chi2 > 0 ? final.chi2 / dof : 1;
    const includedAtFit = [...final.included];
    const pools = new PointPools(book, runsOfPoint, densityStates(points, final.epsilonK, final.sigmaAngstrom));
    let extraRound = iterations.length;
    try {
      result.posterior = await densityPosterior(
        {
          free,
          estimate: { epsilonK: final.epsilonK, sigmaAngstrom: final.sigmaAngstrom },
          stdErr: result.stdErr,
          covariance: cov.scaled ?? cov.unscaled,
          bounds: options.bounds,
          noiseScale: s2,
          evaluate: (epsilonK, sigmaAngstrom) => posteriorOutcome(points, epsilonK, sigmaAngstrom, options, book, pools, includedAtFit, s2),
          extend: async (at) => {
            extraRound++;
            const wanted: Array<[number, MdStatePoint]> = [];
            const seen = new Set<string>();
            for (const t of at) {
              for (const [i, st] of densityStates(points, t.epsilonK, t.sigmaAngstrom)) {
                const key = stateKey(st);
                if (!includedAtFit[i] || seen.has(key) || book.direct.has(key) || book.frozen.has(key) || regionProblem(st)) continue;
                seen.add(key);
                wanted.push([i, st]);
              }
            }
            report(0.97, `posterior: ${wanted.length} extra NPT run(s) where the sampler's proposals left the reach of the runs`);
            const runs = await runAt(
              wanted,
              extraRound,
              (n) => report(0.97, `posterior: ${n} of ${wanted.length} extra run(s) finished`),
              'posterior',
            );
            pools.reset();
            return runs.length;
          },
        },
        options.posterior,
      );
      if (pools.lowered.size) {
        const list = [...pools.lowered].map(
          ([i, l]) => `${points[i].temperatureK.toFixed(2)} K, ${points[i].pressureMPa?.toFixed(3)} MPa (${l.effectiveSamples.toFixed(1)})`,
        );
        result.posterior.messages.push(
          `At ${list.length} point(s) the runs carry fewer than ${book.minEffectiveSamples} effective samples even at the fit's own state: ${list.join('; ')}. There the sampler accepts reweighting down to half of that; longer runs (more steps) would make those predictions firmer.`,
        );
      }
      if (stoppedBy !== 'converged')
        result.posterior.messages.push(
          'The simulation stage stopped at its round limit, not converged: the posterior was sampled around its last point, which may not be the optimum.',
        );
      result.newRuns = newRuns;
      result.reusedRuns = reusedRuns;
    } catch (err) {
      warnings.push(`the posterior could not be computed: ${(err as Error).message}`);
    }
  }
  report(1, 'done');
  return result;
}
