/**
 * Canonical (NVT) MD with the CSVR thermostat (Bussi, Donadio & Parrinello 2007), for comparisons with
 * published NVT data (NIST SRSW) and for checks of the canonical kinetic-energy distribution.
 */
import type { SimulationCutoffScheme } from '../cutoff-schemes';
import { Ensemble, SampleSeries } from './ensemble';
import { detectEquilibration, estimateCovariance, estimateMean } from './statistics';
import { requireInteger, requireNumber } from './validate';
import {
  DEFAULT_ATOMS,
  DEFAULT_CUTOFF,
  DEFAULT_SAMPLE_EVERY,
  DEFAULT_SEED,
  DEFAULT_SKIN,
  DEFAULT_THERMOSTAT_TAU,
  DEFAULT_TIMESTEP,
  VOLUME_MOVE_EVERY,
  decimatedTrace,
  phaseCheck,
  validateScheme,
  type MdTrace,
  type PhaseCheck,
  type ProgressCallback,
} from './npt';
import type { Phase } from './order-parameter';

export interface NvtOptions {
  /** T* = k_BT/ε, 0.3 … 10. */
  reducedTemperature: number;
  /** ρ* = ρσ³, 1e-4 … 1.3. */
  reducedDensity: number;
  /** Default 500. */
  atoms?: number;
  /** Total MD steps, default 20000; the first 20 % are discarded before equilibration detection. */
  steps?: number;
  /** Default 2.5. */
  cutoff?: number;
  /** Default 'truncated-tail'. */
  scheme?: SimulationCutoffScheme;
  /** Default 0.005. */
  timestep?: number;
  /** Default 1. */
  seed?: number;
  /** CSVR relaxation time, default 0.5 τ. */
  thermostatTau?: number;
}

export interface NvtResult {
  reducedDensity: number;
  /** ⟨U⟩/N in the scheme's convention (truncated + tail, or shifted). */
  reducedPotentialEnergy: number;
  reducedPotentialEnergyStdErr: number;
  /** ⟨U_truncated⟩/N without the tail correction. */
  reducedPotentialEnergyTruncated: number;
  /** ⟨P⟩ in the scheme's convention (virial + tail, or virial only). */
  reducedPressure: number;
  reducedPressureStdErr: number;
  /** Virial pressure without the tail correction. */
  reducedPressureTruncated: number;
  meanTemperature: number;
  /** Var(K) over the retained samples and its canonical value (Nf/2)·T² for Nf = 3N − 3. */
  kineticEnergyVariance: number;
  kineticEnergyVarianceStdErr: number;
  kineticEnergyVarianceCanonical: number;
  phase: Phase;
  orderParameter: PhaseCheck;
  settings: {
    reducedTemperature: number;
    atoms: number;
    steps: number;
    cutoff: number;
    scheme: SimulationCutoffScheme;
    timestep: number;
    seed: number;
    thermostatTau: number;
  };
  diagnostics: {
    equilibrationSample: number;
    productionSamples: number;
    statisticalInefficiency: number;
    listBuilds: number;
    wallSeconds: number;
  };
  trace: MdTrace;
}

export function runNvt(options: NvtOptions, onProgress?: ProgressCallback): NvtResult {
  const t = requireNumber('reducedTemperature', options.reducedTemperature, 0.3, 10);
  const rho = requireNumber('reducedDensity', options.reducedDensity, 1e-4, 1.3);
  const atoms = requireInteger('atoms', options.atoms ?? DEFAULT_ATOMS, 100, 20000);
  const steps = requireInteger('steps', options.steps ?? 20000, 1000, 1e8);
  const cutoff = requireNumber('cutoff', options.cutoff ?? DEFAULT_CUTOFF, 2, 4);
  const scheme = validateScheme(options.scheme ?? 'truncated-tail');
  const dt = requireNumber('timestep', options.timestep ?? DEFAULT_TIMESTEP, 1e-4, 0.01);
  const seed = requireInteger('seed', options.seed ?? DEFAULT_SEED, 0, 0xffffffff);
  const tau = requireNumber('thermostatTau', options.thermostatTau ?? DEFAULT_THERMOSTAT_TAU, 0.01, 100);
  if (Math.cbrt(atoms / rho) <= 2 * cutoff) {
    throw new RangeError(`atoms: the box for ${atoms} atoms at ρ* = ${rho} is smaller than 2·cutoff; use more atoms`);
  }
  const started = performance.now();
  const ensemble = new Ensemble({
    atoms,
    reducedTemperature: t,
    reducedPressure: null,
    initialDensity: rho,
    cutoff,
    scheme,
    skin: DEFAULT_SKIN,
    timestep: dt,
    seed,
    thermostatTau: tau,
    sampleEvery: DEFAULT_SAMPLE_EVERY,
    volumeMoveEvery: VOLUME_MOVE_EVERY,
    maxLnVolumeStep: 0,
  });
  const burnIn = Math.floor(0.2 * steps);
  onProgress?.({ fraction: 0, stage: 'melting' });
  ensemble.run(burnIn, null, false, (i) => onProgress?.({ fraction: i / steps, stage: 'melting' }));
  const series = new SampleSeries();
  ensemble.run(steps - burnIn, series, false, (i) => onProgress?.({ fraction: (burnIn + i) / steps, stage: 'production' }));
  const eq = detectEquilibration(series.potentialPerAtom);
  const from = eq.t0;
  const to = series.step.length;
  const u = estimateMean(series.potentialPerAtom, from, to);
  const p = estimateMean(series.pressure, from, to);
  const nf = 3 * atoms - 3;
  const kVar = estimateCovariance(series.kinetic, series.kinetic, from, to);
  const { phase, orderParameter } = phaseCheck(series, from, to);
  onProgress?.({ fraction: 1, stage: 'done' });
  return {
    reducedDensity: rho,
    reducedPotentialEnergy: u.mean,
    reducedPotentialEnergyStdErr: u.stdErr,
    reducedPotentialEnergyTruncated: estimateMean(series.potentialTruncatedPerAtom, from, to).mean,
    reducedPressure: p.mean,
    reducedPressureStdErr: p.stdErr,
    reducedPressureTruncated: estimateMean(series.pressureTruncated, from, to).mean,
    meanTemperature: estimateMean(series.temperature, from, to).mean,
    kineticEnergyVariance: kVar.mean,
    kineticEnergyVarianceStdErr: kVar.stdErr,
    kineticEnergyVarianceCanonical: 0.5 * nf * t * t,
    phase,
    orderParameter,
    settings: { reducedTemperature: t, atoms, steps, cutoff, scheme, timestep: dt, seed, thermostatTau: tau },
    diagnostics: {
      equilibrationSample: eq.t0,
      productionSamples: to,
      statisticalInefficiency: eq.statisticalInefficiency,
      listBuilds: ensemble.system.builds,
      wallSeconds: (performance.now() - started) / 1000,
    },
    trace: decimatedTrace(series),
  };
}
