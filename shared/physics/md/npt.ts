/**
 * Isothermal–isobaric (NPT) sampling of the LJ 12-6 fluid: CSVR thermostat + Monte Carlo ln V barostat
 * (see ensemble.ts for the Hamiltonian and acceptance rule), automatic equilibration detection (Chodera 2016),
 * fluctuation estimates of the density derivatives and a phase check (Steinhardt Q6, local density spread).
 *
 * Fluctuation formulas (k_B = 1). With the NPT weight exp(−β[K + H_pot + PV])·V^N and ρ = N/V independent of momenta:
 *   ∂⟨ρ⟩/∂β |_P = −Cov(ρ, K + H_pot + PV) = −Cov(ρ, H_pot + PV), and dβ/dT = −1/T², so
 *   (∂⟨ρ⟩/∂T)_P = Cov(ρ, H_conf)/T², H_conf = H_pot + P·V (total, not per atom);
 *   ∂⟨ρ⟩/∂P |_T = −β Cov(ρ, V) ⇒ (∂⟨ρ⟩/∂P)_T = −Cov(ρ, V)/T.
 * Standard errors from the statistical inefficiency of the product series (statistics.ts).
 */
import { SIMULATION_CUTOFF_SCHEMES, type SimulationCutoffScheme } from '../cutoff-schemes';
import { Ensemble, SampleSeries } from './ensemble';
import { guessReducedDensity } from './density-guess';
import { classifyPhase, type Phase } from './order-parameter';
import { blockingStdErr, detectEquilibration, estimateCovariance, estimateMean, slope, statisticalInefficiency } from './statistics';
import { requireInteger, requireNumber } from './validate';
import { encodeFloat64, type RunFrames } from './frames';
import { ljRegionOf } from '../eos/lj-freezing';

/**
 * Default total MD steps (20 % barostat tuning + production): at N = 500 a liquid density comes out with a standard
 * error of about 0.2–0.3 % in about 5 s of one core (measured 0.13–0.19 % with 20000 steps in ~10 CPU-seconds).
 */
export const DEFAULT_NPT_STEPS = 10000;
export const DEFAULT_ATOMS = 500;
export const DEFAULT_CUTOFF = 2.5;
export const DEFAULT_TIMESTEP = 0.005;
export const DEFAULT_SKIN = 0.3;
export const DEFAULT_SEED = 1;
/** CSVR relaxation time (τ): 100 steps of 0.005. */
export const DEFAULT_THERMOSTAT_TAU = 0.5;
/**
 * CSVR relaxation time of the NPT runs: 20 steps. CSVR samples the canonical distribution for any τ (Bussi et al.
 * 2007); a short one lets the enthalpy that goes with a density fluctuation reach the bath sooner, which cut the
 * density's statistical inefficiency by about a third at T* = 1.5, P* = 0.5 (measured with 128 atoms).
 */
export const NPT_THERMOSTAT_TAU = 0.1;
/** MD steps between samples. */
export const DEFAULT_SAMPLE_EVERY = 10;
/** MD steps between volume moves (each costs about one force evaluation). */
export const VOLUME_MOVE_EVERY = 5;
const TRACE_POINTS = 500;
/** A run is extended until it holds this many effectively independent density samples (or reaches its cap). */
export const DEFAULT_MIN_EFFECTIVE_SAMPLES = 50;
/** Default cap on the total steps of an extended run, as a multiple of the requested steps. */
export const DEFAULT_MAX_STEPS_FACTOR = 4;
/** Melting the start lattice: at T* = max(3, T*) for 500–3000 steps, until Q6 < 0.1 (an fcc crystal has 0.575). */
export const MELT = { minReducedTemperature: 3, minSteps: 500, maxSteps: 3000, q6Below: 0.1 } as const;

/**
 * How a run started. 'melted-lattice': an fcc lattice at the starting density, melted at high temperature at that
 * density, then cooled to T* by fresh velocities (a liquid cannot inherit crystal order); 'fcc-lattice': the lattice
 * as it is, for states in the solid region (Kolafa–Nezbeda density beyond the freezing line, eos/lj-freezing.ts).
 */
export type StartedFrom = 'melted-lattice' | 'fcc-lattice';

export interface NptOptions {
  /** T* = k_BT/ε, 0.3 … 10. */
  reducedTemperature: number;
  /** P* = Pσ³/ε, > 0 … 20 (at P* = 0 a vapour would expand without bound). */
  reducedPressure: number;
  /** Number of atoms, 100 … 20000; default 500. */
  atoms?: number;
  /** Total MD steps (barostat tuning = first 20 %, then production); default 10000. */
  steps?: number;
  /** rc/σ, 2 … 4; default 2.5. */
  cutoff?: number;
  /** Default 'truncated-tail'. */
  scheme?: SimulationCutoffScheme;
  /** dt/τ, default 0.005. */
  timestep?: number;
  /** RNG seed (unsigned 32-bit), default 1. */
  seed?: number;
  /** Starting density; default: a van der Waals estimate (density-guess.ts). */
  initialDensity?: number;
  /** λr of a Mie λr-6 fluid, 8 … 36 (default 12, LJ 12-6); the start and density guess still use the 12-6 phase diagram. */
  repulsiveExponent?: number;
  /** 'auto' (default): melted lattice unless the state lies in the solid region, then the fcc lattice. */
  start?: 'auto' | 'melted-lattice' | 'fcc-lattice';
  /** Extend production until this many effective samples of ρ* (default 50; 0 turns extension off). */
  minEffectiveSamples?: number;
  /** Cap on the total steps including extensions; default 4 × steps. */
  maxSteps?: number;
}

export interface PhaseCheck {
  /** Mean global Q6 over the production samples (Steinhardt et al. 1983); ≥ 0.3 means an ordered solid. */
  q6Mean: number;
  /** Q6 of the last sample. */
  q6Last: number;
  /** Mean variance/mean of sub-cell atom counts; > 3 with many sparse cells means vapour + liquid. */
  localDensityVarianceToMean: number;
  /** Mean fraction of sub-cells below half the mean count. */
  sparseCellFraction: number;
  /** Mean number of bonds (< 1.5σ) per atom entering Q6. */
  bondsPerAtom: number;
}

export interface MdTrace {
  step: number[];
  reducedDensity: number[];
  reducedTemperature: number[];
  potentialEnergyPerAtom: number[];
  q6: number[];
}

export interface NptResult {
  /** ⟨ρ*⟩ over the retained production samples. */
  reducedDensity: number;
  /** Standard error of ⟨ρ*⟩ from the statistical inefficiency (Sokal window, statistics.ts). */
  stdErr: number;
  /** Effectively independent density samples in the retained production: samples / statisticalInefficiency. */
  effectiveSamples: number;
  /** Samples per independent density sample (2τ_int). */
  statisticalInefficiency: number;
  startedFrom: StartedFrom;
  /** Plain-words notes: a run that stayed short of the effective samples it wanted, a start that did not melt. */
  warnings: string[];
  phase: Phase;
  /** ⟨U*⟩/N with the scheme's convention (truncated + tail, or shifted). */
  reducedPotentialEnergy: number;
  reducedPotentialEnergyStdErr: number;
  /** ⟨K + U + P·V⟩/N. */
  reducedEnthalpy: number;
  reducedEnthalpyStdErr: number;
  /** ⟨U + P·V⟩/N. */
  reducedConfigurationalEnthalpy: number;
  /** (∂⟨ρ*⟩/∂T*)_P* = Cov(ρ*, H_conf)/T*². */
  dRhoDT: number;
  dRhoDTStdErr: number;
  /** (∂⟨ρ*⟩/∂P*)_T* = −Cov(ρ*, V*)/T*. */
  dRhoDP: number;
  dRhoDPStdErr: number;
  /** Isothermal compressibility κ_T* = (1/ρ)(∂ρ/∂P)_T. */
  isothermalCompressibility: number;
  /** ⟨V*⟩ and Var(V*) with its standard error (isobaric check: Var(V) = ⟨V⟩·T*·κ_T). */
  meanVolume: number;
  volumeVariance: number;
  volumeVarianceStdErr: number;
  settings: {
    reducedTemperature: number;
    reducedPressure: number;
    atoms: number;
    steps: number;
    cutoff: number;
    scheme: SimulationCutoffScheme;
    timestep: number;
    seed: number;
    skin: number;
    thermostatTau: number;
    sampleEvery: number;
    tuningSteps: number;
    initialDensity: number;
    minEffectiveSamples: number;
    maxSteps: number;
  };
  diagnostics: {
    volumeAcceptance: number;
    maxLnVolumeStep: number;
    meanTemperature: number;
    temperatureStdErr: number;
    /** Instantaneous virial pressure averaged over production (should match the set P* within errors). */
    meanPressure: number;
    meanPressureStdErr: number;
    /** Slope of (K + H_pot − thermostat heat − barostat jumps)/N against time: integration error only. */
    conservedEnergyDriftPerAtomPerTime: number;
    /** Index of the first retained production sample (Chodera 2016). */
    equilibrationSample: number;
    /** MD step of that sample. */
    equilibrationStep: number;
    productionSamples: number;
    statisticalInefficiency: number;
    effectiveSamples: number;
    blockingStdErr: number;
    /** Steps run in total (tuning + production + extensions; the melt not counted). */
    totalSteps: number;
    /** Steps spent melting the start lattice (0 for a lattice start) and Q6 at the end of the melt. */
    meltSteps: number;
    meltQ6: number | null;
    listBuilds: number;
    wallSeconds: number;
  };
  orderParameter: PhaseCheck;
  /** At most 500 evenly spaced samples over the whole run. */
  trace: MdTrace;
  /** Retained production frames for reweighting (frames.ts). */
  frames: RunFrames;
}

export type ProgressCallback = (p: { fraction: number; stage: string }) => void;

export function validateScheme(scheme: unknown): SimulationCutoffScheme {
  if (!SIMULATION_CUTOFF_SCHEMES.includes(scheme as SimulationCutoffScheme)) {
    throw new RangeError(`scheme must be one of ${SIMULATION_CUTOFF_SCHEMES.join(', ')}, got ${String(scheme)}`);
  }
  return scheme as SimulationCutoffScheme;
}

export function decimatedTrace(series: SampleSeries): MdTrace {
  const total = series.step.length;
  const stride = Math.max(1, Math.ceil(total / TRACE_POINTS));
  const trace: MdTrace = { step: [], reducedDensity: [], reducedTemperature: [], potentialEnergyPerAtom: [], q6: [] };
  for (let i = 0; i < total; i += stride) {
    trace.step.push(series.step[i]);
    trace.reducedDensity.push(series.density[i]);
    trace.reducedTemperature.push(series.temperature[i]);
    trace.potentialEnergyPerAtom.push(series.potentialPerAtom[i]);
    trace.q6.push(series.q6[i]);
  }
  return trace;
}

/** Phase check over samples [from, to). */
export function phaseCheck(series: SampleSeries, from: number, to: number): { phase: Phase; orderParameter: PhaseCheck } {
  const avg = (x: number[]): number => x.slice(from, to).reduce((a, b) => a + b, 0) / Math.max(1, to - from);
  const orderParameter: PhaseCheck = {
    q6Mean: avg(series.q6),
    q6Last: series.q6[to - 1] ?? 0,
    localDensityVarianceToMean: avg(series.varianceToMean),
    sparseCellFraction: avg(series.sparseFraction),
    bondsPerAtom: avg(series.bondsPerAtom),
  };
  return {
    phase: classifyPhase(
      orderParameter.q6Mean,
      orderParameter.localDensityVarianceToMean,
      orderParameter.sparseCellFraction,
      orderParameter.bondsPerAtom,
    ),
    orderParameter,
  };
}

/**
 * Runs NPT MD from a melted lattice (or the fcc lattice in the solid region, see StartedFrom). Stages reported through
 * onProgress: 'melting', 'tuning' (first 20 % of the steps, volume-move size adapted to ~40 % acceptance),
 * 'production' (fixed move size; equilibration then detected from the density series) and 'extension' while the run
 * is lengthened towards `minEffectiveSamples`. Throws RangeError naming the offending option.
 */
export function runNpt(options: NptOptions, onProgress?: ProgressCallback): NptResult {
  const t = requireNumber('reducedTemperature', options.reducedTemperature, 0.3, 10);
  const p = requireNumber('reducedPressure', options.reducedPressure, 0, 20);
  if (p === 0) throw new RangeError('reducedPressure must be greater than 0 (a vapour at P* = 0 expands without bound)');
  const atoms = requireInteger('atoms', options.atoms ?? DEFAULT_ATOMS, 100, 20000);
  const steps = requireInteger('steps', options.steps ?? DEFAULT_NPT_STEPS, 1000, 1e8);
  const cutoff = requireNumber('cutoff', options.cutoff ?? DEFAULT_CUTOFF, 2, 4);
  const scheme = validateScheme(options.scheme ?? 'truncated-tail');
  const dt = requireNumber('timestep', options.timestep ?? DEFAULT_TIMESTEP, 1e-4, 0.01);
  const seed = requireInteger('seed', options.seed ?? DEFAULT_SEED, 0, 0xffffffff);
  const initialDensity = requireNumber('initialDensity', options.initialDensity ?? guessReducedDensity(t, p), 1e-4, 1.3);
  const repulsiveExponent = requireNumber('repulsiveExponent', options.repulsiveExponent ?? 12, 8, 36);
  const minEff = requireNumber('minEffectiveSamples', options.minEffectiveSamples ?? DEFAULT_MIN_EFFECTIVE_SAMPLES, 0, 1e6);
  const maxSteps = requireInteger('maxSteps', options.maxSteps ?? DEFAULT_MAX_STEPS_FACTOR * steps, steps, 1e9);
  const startChoice = options.start ?? 'auto';
  if (!['auto', 'melted-lattice', 'fcc-lattice'].includes(startChoice)) {
    throw new RangeError(`start must be 'auto', 'melted-lattice' or 'fcc-lattice', got ${String(options.start)}`);
  }
  if (Math.cbrt(atoms / initialDensity) <= 2 * cutoff) {
    throw new RangeError(
      `atoms: ${atoms} atoms at ρ* ≈ ${initialDensity.toFixed(3)} give a box smaller than 2·cutoff; use more atoms or a smaller cutoff`,
    );
  }
  const startedFrom: StartedFrom =
    startChoice === 'auto' ? (ljRegionOf(t, p).region === 'solid' ? 'fcc-lattice' : 'melted-lattice') : startChoice;
  const started = performance.now();
  const tuningSteps = Math.floor(0.2 * steps);
  const ensemble = new Ensemble({
    atoms,
    reducedTemperature: t,
    reducedPressure: p,
    initialDensity,
    cutoff,
    scheme,
    skin: DEFAULT_SKIN,
    timestep: dt,
    seed,
    thermostatTau: NPT_THERMOSTAT_TAU,
    sampleEvery: DEFAULT_SAMPLE_EVERY,
    volumeMoveEvery: VOLUME_MOVE_EVERY,
    maxLnVolumeStep: 0.02,
    ...(repulsiveExponent !== 12 ? { repulsiveExponent } : {}),
  });
  const warnings: string[] = [];
  // Progress never goes back: an extension lengthens the run, so the fraction waits until the steps catch up.
  let shown = 0;
  let planned = steps;
  const report = (stage: string, done: number): void => {
    shown = Math.max(shown, Math.min(0.99, done / planned));
    onProgress?.({ fraction: shown, stage });
  };
  report('melting', 0);
  let melt: { steps: number; q6: number | null } = { steps: 0, q6: null };
  if (startedFrom === 'melted-lattice') {
    const m = ensemble.melt(Math.max(MELT.minReducedTemperature, t), MELT.minSteps, MELT.maxSteps, MELT.q6Below);
    melt = m;
    if (m.q6 >= MELT.q6Below) warnings.push(`the start lattice kept Q6 = ${m.q6.toFixed(2)} after ${m.steps} melting steps`);
  }
  const all = new SampleSeries();
  report('tuning', 0);
  ensemble.run(tuningSteps, all, true, (i) => report('tuning', i));
  const firstProduction = all.step.length;
  const attempts0 = ensemble.volumeAttempts;
  const accepted0 = ensemble.volumeAccepted;
  ensemble.run(steps - tuningSteps, all, false, (i) => report('production', tuningSteps + i));
  let totalSteps = steps;

  // Equilibration detection on the production density series (Chodera 2016). The discard point is the one that
  // maximises N_eff, which favours a low estimate of g; g over the whole production guards against that selection
  // (a transient left in can only make it larger, i.e. the error more cautious). Extend while too few effective samples.
  const analyse = () => {
    const eq = detectEquilibration(all.density.slice(firstProduction));
    const from = firstProduction + eq.t0;
    const to = all.step.length;
    const estimate = estimateMean(all.density, from, to);
    const gWhole = statisticalInefficiency(all.density, firstProduction, to);
    const rho =
      gWhole > estimate.statisticalInefficiency
        ? { ...estimate, statisticalInefficiency: gWhole, stdErr: estimate.stdErr * Math.sqrt(gWhole / estimate.statisticalInefficiency) }
        : estimate;
    return { eq, from, to, rho, effectiveSamples: (to - from) / rho.statisticalInefficiency };
  };
  let a = analyse();
  // A run that froze or split is not lengthened: no fit uses it, and its phase flag is what it has to say.
  const fluid = () => phaseCheck(all, a.from, a.to).phase === 'fluid';
  while (minEff > 0 && a.effectiveSamples < minEff && totalSteps < maxSteps && fluid()) {
    const productionSteps = totalSteps - tuningSteps;
    const wanted = productionSteps * Math.max(0.25, (1.2 * minEff) / Math.max(a.effectiveSamples, 1) - 1);
    const extra = Math.min(maxSteps - totalSteps, Math.ceil(wanted / DEFAULT_SAMPLE_EVERY) * DEFAULT_SAMPLE_EVERY);
    planned = totalSteps + extra;
    const base = totalSteps;
    ensemble.run(extra, all, false, (i) => report('extension', base + i));
    totalSteps += extra;
    a = analyse();
  }
  if (minEff > 0 && a.effectiveSamples < minEff && fluid()) {
    warnings.push(
      `only ${a.effectiveSamples.toFixed(1)} effectively independent density samples (wanted ${minEff}) after the cap of ${maxSteps} steps: the standard error is correspondingly larger and less certain`,
    );
  }
  report('analysis', totalSteps);
  const { eq, from, to, rho } = a;
  const rhoProd = all.density.slice(firstProduction);
  const u = estimateMean(all.potentialPerAtom, from, to);
  const hConf = all.hamiltonianPotential.map((h, i) => h + p * all.volume[i]);
  const enthalpy = all.potentialPerAtom.map((x, i) => x + (all.kinetic[i] + p * all.volume[i]) / atoms);
  const enth = estimateMean(enthalpy, from, to);
  const confEnth = estimateMean(
    all.potentialPerAtom.map((x, i) => x + (p * all.volume[i]) / atoms),
    from,
    to,
  );
  const covRhoH = estimateCovariance(all.density, hConf, from, to);
  const covRhoV = estimateCovariance(all.density, all.volume, from, to);
  const temp = estimateMean(all.temperature, from, to);
  const press = estimateMean(all.pressure, from, to);
  const times = all.step.slice(from, to).map((s) => s * dt);
  const { phase, orderParameter } = phaseCheck(all, from, to);
  const dRhoDP = -covRhoV.mean / t;
  const varV = estimateCovariance(all.volume, all.volume, from, to);
  onProgress?.({ fraction: 1, stage: 'done' });
  return {
    reducedDensity: rho.mean,
    stdErr: rho.stdErr,
    effectiveSamples: a.effectiveSamples,
    statisticalInefficiency: rho.statisticalInefficiency,
    startedFrom,
    warnings,
    phase,
    reducedPotentialEnergy: u.mean,
    reducedPotentialEnergyStdErr: u.stdErr,
    reducedEnthalpy: enth.mean,
    reducedEnthalpyStdErr: enth.stdErr,
    reducedConfigurationalEnthalpy: confEnth.mean,
    dRhoDT: covRhoH.mean / (t * t),
    dRhoDTStdErr: covRhoH.stdErr / (t * t),
    dRhoDP,
    dRhoDPStdErr: covRhoV.stdErr / t,
    isothermalCompressibility: dRhoDP / rho.mean,
    meanVolume: estimateMean(all.volume, from, to).mean,
    volumeVariance: varV.mean,
    volumeVarianceStdErr: varV.stdErr,
    settings: {
      reducedTemperature: t,
      reducedPressure: p,
      atoms,
      steps,
      cutoff,
      scheme,
      timestep: dt,
      seed,
      skin: DEFAULT_SKIN,
      thermostatTau: NPT_THERMOSTAT_TAU,
      sampleEvery: DEFAULT_SAMPLE_EVERY,
      tuningSteps,
      initialDensity,
      minEffectiveSamples: minEff,
      maxSteps,
    },
    diagnostics: {
      volumeAcceptance: (ensemble.volumeAccepted - accepted0) / Math.max(1, ensemble.volumeAttempts - attempts0),
      maxLnVolumeStep: ensemble.maxLnVolumeStep,
      meanTemperature: temp.mean,
      temperatureStdErr: temp.stdErr,
      meanPressure: press.mean,
      meanPressureStdErr: press.stdErr,
      conservedEnergyDriftPerAtomPerTime: slope(times, all.conservedPerAtom.slice(from, to)),
      equilibrationSample: eq.t0,
      equilibrationStep: all.step[from],
      productionSamples: rhoProd.length,
      statisticalInefficiency: rho.statisticalInefficiency,
      effectiveSamples: a.effectiveSamples,
      blockingStdErr: blockingStdErr(all.density, from, to),
      totalSteps,
      meltSteps: melt.steps,
      meltQ6: melt.q6,
      listBuilds: ensemble.system.builds,
      wallSeconds: (performance.now() - started) / 1000,
    },
    orderParameter,
    trace: decimatedTrace(all),
    frames: {
      count: to - from,
      statisticalInefficiency: rho.statisticalInefficiency,
      hamiltonianPotentialBase64: encodeFloat64(all.hamiltonianPotential.slice(from, to)),
      volumeBase64: encodeFloat64(all.volume.slice(from, to)),
    },
  };
}
