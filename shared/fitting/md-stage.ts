/**
 * The simulation stage of a density fit: Levenberg–Marquardt iterations over (ε/k_B, σ) in which every
 * density prediction is an NPT run at the corresponding reduced state, and the Jacobian of a density comes
 * from the fluctuation derivatives of ρ* with respect to T* (at fixed P*) and to P* (at fixed T*) of that same run, by the chain rule
 * (corresponding-states.ts), not from finite differences of noisy averages. Gas-phase properties keep
 * their analytic models. The MD standard error of each prediction is added in quadrature to the
 * measurement uncertainty, so the weights and the reported standard errors include the simulation noise.
 * Runs are asked for through an injected `simulate`, so the same code runs against the job queue or a test double.
 */
import { densityWithGradient, reducedStateOf } from '../physics/corresponding-states';
import { covarianceFromJacobian, correlationFromCovariance, standardErrorsFromCovariance } from './covariance';
import { jointConfidenceEllipse } from './ellipse';
import { STRONG_CORRELATION, strongCorrelationWarning, type LjDatasetSummary, type LjFitResult, type LjResidual } from './lj-fit';
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
}

export interface MdStagePoint {
  datasetId: string | number;
  datasetIndex: number;
  kind: FitKind;
  /** Row number within its dataset (1-based). */
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
  simulate: (states: MdStatePoint[]) => Promise<MdRunSummary[]>;
  onProgress?: (p: { fraction: number; stage: string }) => void;
}

export interface MdIteration {
  iteration: number;
  epsilonK: number;
  sigmaAngstrom: number;
  chi2: number;
  accepted: boolean;
  runs: number;
  reusedRuns: number;
  excludedPoints: Array<{ temperatureK: number; pressureMPa?: number; reason: string }>;
}

/** A residual of the simulation stage: with the simulation's standard error (kg/m³), the run behind it, and whether the final round used it. */
export interface MdResidual extends LjResidual {
  modelUncertainty: number;
  simulationId: number | null;
  included: boolean;
}

export interface MdStageResult extends LjFitResult {
  residuals: MdResidual[];
  mdIterations: MdIteration[];
  mdRuns: Array<{ id: number; reused: boolean; temperatureK: number; pressureMPa: number; reducedTemperature: number; reducedPressure: number; reducedDensity: number; stdErr: number; phase: string; iteration: number }>;
  phaseWarnings: string[];
  stoppingRule: string;
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
  chi2: number;
  excluded: MdIteration['excludedPoints'];
  runs: MdRunSummary[];
}

async function evaluate(points: MdStagePoint[], epsilonK: number, sigmaAngstrom: number, options: MdStageOptions): Promise<Evaluation> {
  const densityIdx = points.map((p, i) => (p.kind === 'density' ? i : -1)).filter((i) => i >= 0);
  const states = densityIdx.map((i) => reducedStateOf({ temperatureK: points[i].temperatureK, pressureMPa: points[i].pressureMPa!, epsilonK, sigmaAngstrom }));
  const runs = states.length ? await options.simulate(states) : [];
  const residuals: number[] = [];
  const jacobian: number[][] = [];
  const predicted: number[] = [];
  const modelUncertainty: number[] = [];
  const included: boolean[] = [];
  const runIds: Array<number | null> = [];
  const excluded: MdIteration['excludedPoints'] = [];
  points.forEach((p, i) => {
    if (p.kind !== 'density') {
      const m = PROPERTY_MODELS[p.kind].evaluate({ temperatureK: p.temperatureK, pressureMPa: p.pressureMPa, measured: p.value }, epsilonK, sigmaAngstrom, options.context);
      const scale = p.excluded ? 0 : p.weight / p.uncertainty;
      residuals.push((m.value - p.value) * scale);
      jacobian.push([m.dEpsilonK * scale, m.dSigmaAngstrom * scale]);
      predicted.push(m.value);
      modelUncertainty.push(0);
      included.push(!p.excluded);
      runIds.push(null);
      return;
    }
    const run = runs[densityIdx.indexOf(i)];
    runIds.push(run.id);
    const state = { temperatureK: p.temperatureK, pressureMPa: p.pressureMPa!, epsilonK, sigmaAngstrom };
    const g = densityWithGradient(run, state, options.context.molarMassGPerMol);
    const uModel = densityWithGradient({ reducedDensity: run.stdErr, dRhoDT: 0, dRhoDP: 0 }, state, options.context.molarMassGPerMol).densityKgPerM3;
    predicted.push(g.densityKgPerM3);
    modelUncertainty.push(uModel);
    if (p.excluded) {
      // Left out by the modeller: simulated so its prediction can be shown, never counted.
      residuals.push(0);
      jacobian.push([0, 0]);
      included.push(false);
      return;
    }
    if (run.phase !== 'fluid') {
      // A frozen or split state point says nothing about the fluid density: leave it out of this iteration.
      excluded.push({ temperatureK: p.temperatureK, pressureMPa: p.pressureMPa, reason: run.phase === 'solid' ? 'the run froze into an ordered solid' : 'the run split into vapour and liquid' });
      residuals.push(0);
      jacobian.push([0, 0]);
      included.push(false);
      return;
    }
    const ratio = g.densityKgPerM3 / p.value;
    if (ratio < 0.5 || ratio > 2) {
      // The simulated fluid is in another phase than the sample (e.g. the data say liquid, the run says gas):
      // no small change of ε and σ bridges that, so the point is reported and left out rather than averaged in.
      excluded.push({ temperatureK: p.temperatureK, pressureMPa: p.pressureMPa, reason: `the simulated fluid (${g.densityKgPerM3.toFixed(1)} kg/m³) is in another phase than the measured one (${p.value} kg/m³)` });
      residuals.push(0);
      jacobian.push([0, 0]);
      included.push(false);
      return;
    }
    const u = Math.hypot(p.uncertainty, uModel);
    const scale = p.weight / u;
    residuals.push((g.densityKgPerM3 - p.value) * scale);
    jacobian.push([g.dRhodEpsilonK * scale, g.dRhodSigmaAngstrom * scale]);
    included.push(true);
  });
  const chi2 = residuals.reduce((s, r) => s + r * r, 0);
  return { epsilonK, sigmaAngstrom, residuals, jacobian, predicted, modelUncertainty, included, runIds, chi2, excluded, runs };
}

const PARAMETER_NAMES = ['epsilonK', 'sigmaAngstrom'] as const;

/** The Jacobian's columns of the free parameters. */
function freeColumns(jacobian: number[][], heldIndex: number | null): number[][] {
  return heldIndex === null ? jacobian : jacobian.map((row) => [row[1 - heldIndex]]);
}

/** A free parameter's covariance back in (ε, σ), zero for the held one. */
function embedCovariance(m: number[][] | null, heldIndex: number | null): number[][] | null {
  if (!m || heldIndex === null) return m;
  const out = [[0, 0], [0, 0]];
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
  let a = 0, b = 0, d = 0, g0 = 0, g1 = 0;
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

export async function mdStageFit(points: MdStagePoint[], datasets: Array<{ id: string | number; kind: FitKind }>, options: MdStageOptions): Promise<MdStageResult> {
  const maxIterations = options.maxIterations ?? 6;
  const heldIndex = options.held ? PARAMETER_NAMES.indexOf(options.held) : null;
  const freeCount = heldIndex === null ? 2 : 1;
  const tolerance = options.changeInStandardErrors ?? 1;
  const report = (fraction: number, stage: string) => options.onProgress?.({ fraction, stage });
  const iterations: MdIteration[] = [];
  const allRuns: MdStageResult['mdRuns'] = [];
  let lambda = 1e-3;
  let current: Evaluation | null = null;
  let theta = { ...options.start };
  let stoppingRule = `stopped after ${maxIterations} rounds of simulations without the parameters settling below ${tolerance} standard errors`;
  let converged = false;
  for (let it = 1; it <= maxIterations; it++) {
    report(0.05 + (0.9 * (it - 1)) / maxIterations, `simulation round ${it} of at most ${maxIterations}: ${points.filter((p) => p.kind === 'density').length} NPT runs at ε/k_B = ${theta.epsilonK.toFixed(2)} K, σ = ${theta.sigmaAngstrom.toFixed(4)} Å`);
    const trial = await evaluate(points, theta.epsilonK, theta.sigmaAngstrom, options);
    trial.runs.forEach((r, k) => {
      const idx = points.map((p, i) => (p.kind === 'density' ? i : -1)).filter((i) => i >= 0)[k];
      const s = reducedStateOf({ temperatureK: points[idx].temperatureK, pressureMPa: points[idx].pressureMPa!, epsilonK: theta.epsilonK, sigmaAngstrom: theta.sigmaAngstrom });
      allRuns.push({ id: r.id, reused: r.reused, temperatureK: points[idx].temperatureK, pressureMPa: points[idx].pressureMPa!, ...s, reducedDensity: r.reducedDensity, stdErr: r.stdErr, phase: r.phase, iteration: it });
    });
    // The χ² of a trial carries simulation noise (about √(2n) from the weights); a step is kept unless it is clearly worse.
    const n = trial.included.filter(Boolean).length;
    const accepted = !current || trial.chi2 <= current.chi2 + 2 * Math.sqrt(2 * n);
    iterations.push({ iteration: it, epsilonK: theta.epsilonK, sigmaAngstrom: theta.sigmaAngstrom, chi2: trial.chi2, accepted, runs: trial.runs.length, reusedRuns: trial.runs.filter((r) => r.reused).length, excludedPoints: trial.excluded });
    if (accepted) {
      current = trial;
      lambda = Math.max(lambda / 10, 1e-6);
    } else {
      lambda *= 10;
    }
    const base = current!;
    const [d0, d1] = lmStep(base, lambda, heldIndex);
    const cov = covarianceFromJacobian(freeColumns(base.jacobian, heldIndex), base.chi2, Math.max(1, base.included.filter(Boolean).length - freeCount));
    // The statistical uncertainty the result will report: the larger of the stated-uncertainty and the
    // reduced-χ²-scaled standard errors (the scaled ones vanish for noise-free data).
    const seUnscaled = embedStdErr(cov.unscaled ? standardErrorsFromCovariance(cov.unscaled) : [Infinity, Infinity], heldIndex, Infinity);
    const seScaled = embedStdErr(cov.scaled ? standardErrorsFromCovariance(cov.scaled) : [0, 0], heldIndex, 0);
    const se = seUnscaled.map((u, k) => Math.max(u, seScaled[k]));
    if (accepted && Math.abs(d0) < tolerance * se[0] && Math.abs(d1) < tolerance * se[1]) {
      converged = true;
      stoppingRule = `converged: the next step (Δε = ${d0.toExponential(2)} K, Δσ = ${d1.toExponential(2)} Å) is below ${tolerance} standard errors of each parameter`;
      break;
    }
    theta = { epsilonK: clamp(base.epsilonK + d0, options.bounds.epsilonK), sigmaAngstrom: clamp(base.sigmaAngstrom + d1, options.bounds.sigmaAngstrom) };
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
    datasetIndex: p.datasetIndex,
    datasetId: p.datasetId,
    kind: p.kind,
    temperatureK: p.temperatureK,
    ...(p.pressureMPa !== undefined ? { pressureMPa: p.pressureMPa } : {}),
    rowNumber: p.rowNumber ?? i + 1,
    excluded: !!p.excluded,
    measured: p.value,
    uncertainty: p.uncertainty,
    predicted: final.predicted[i],
    // A point left out by the modeller shows where it would lie; it is not in χ².
    residual: p.excluded ? ((final.predicted[i] - p.value) * p.weight) / Math.hypot(p.uncertainty, final.modelUncertainty[i]) : final.residuals[i],
    relativeDeviationPercent: p.value !== 0 ? (100 * (final.predicted[i] - p.value)) / p.value : null,
    modelUncertainty: final.modelUncertainty[i],
    simulationId: final.runIds[i],
    included: final.included[i],
  }));
  const perDataset: LjDatasetSummary[] = datasets.map((d, index) => {
    const mine = residuals.filter((r) => r.datasetIndex === index && r.included);
    const rel = mine.filter((r) => r.relativeDeviationPercent !== null);
    return {
      datasetId: d.id,
      kind: d.kind,
      points: residuals.filter((r) => r.datasetIndex === index && !r.excluded).length,
      excludedPoints: residuals.filter((r) => r.datasetIndex === index && r.excluded).length,
      rms: mine.length ? Math.sqrt(mine.reduce((s, r) => s + (r.predicted - r.measured) ** 2, 0) / mine.length) : NaN,
      aadPercent: rel.length ? rel.reduce((s, r) => s + Math.abs(r.relativeDeviationPercent!), 0) / rel.length : null,
      chi2: mine.reduce((s, r) => s + r.residual * r.residual, 0),
    };
  });
  // Points left out (frozen, split, or in another phase than the sample) are reported, never quietly averaged away.
  const phaseWarnings: string[] = [];
  for (const it of iterations) for (const x of it.excludedPoints) phaseWarnings.push(`Round ${it.iteration}: the point at ${x.temperatureK.toFixed(2)} K, ${x.pressureMPa?.toFixed(3)} MPa was left out because ${x.reason}.`);
  const warnings = [...phaseWarnings];
  if (!converged) warnings.push(stoppingRule);
  const hitBounds: string[] = [];
  if (final.epsilonK <= options.bounds.epsilonK[0] || final.epsilonK >= options.bounds.epsilonK[1]) hitBounds.push('epsilonK');
  if (final.sigmaAngstrom <= options.bounds.sigmaAngstrom[0] || final.sigmaAngstrom >= options.bounds.sigmaAngstrom[1]) hitBounds.push('sigmaAngstrom');
  let ellipse95: LjFitResult['ellipse95'] = null;
  if (covariance && dof > 0 && heldIndex === null) {
    const e = jointConfidenceEllipse([final.epsilonK, final.sigmaAngstrom], covariance, cov.scaled ? 'reduced-chi2' : 'none', nIncluded);
    ellipse95 = { points: e.points.map(([x, y]) => ({ epsilonK: x, sigmaAngstrom: y })), method: e.method, description: e.description };
  }
  const correlation = covariance && heldIndex === null ? correlationFromCovariance(covariance)[0][1] : null;
  const strongCorrelation = correlation !== null && Math.abs(correlation) > STRONG_CORRELATION;
  if (strongCorrelation) warnings.push(strongCorrelationWarning(correlation));
  const excludedByModeller = points.filter((p) => p.excluded).length;
  if (excludedByModeller) warnings.push(`${excludedByModeller} point(s) were left out by the modeller: they are shown with their predictions but not counted in χ²`);
  warnings.push('No profile-χ² curves for the simulation stage: every point of a curve would need its own rounds of simulations; the intervals are the linearised ones.');
  report(1, 'done');
  return {
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
    convergence: converged ? 'parameter-change' : 'max-iterations',
    warnings,
    hitBounds,
    start: { ...options.start, method: 'equation-of-state stage' },
    bounds: options.bounds,
    residuals,
    perDataset,
    ellipse95,
    restartsTried: 0,
    quantumCorrection: options.context.quantumCorrection,
    mdIterations: iterations,
    mdRuns: allRuns,
    phaseWarnings,
    stoppingRule,
  };
}
