/**
 * Thermostatted (and optionally barostatted) MD shared by the NVT and NPT drivers.
 *
 * Thermostat: CSVR (Bussi, Donadio & Parrinello 2007) applied once per velocity-Verlet step.
 * Barostat: Metropolis volume moves in ln V with all positions scaled (Frenkel & Smit, Understanding Molecular
 * Simulation, 2nd ed. 2002, §5.4.2 and Algorithm 11; Chow & Ferguson 1995, Comput. Phys. Commun. 91, 283 and
 * Åqvist et al. 2004, Chem. Phys. Lett. 384, 288 for the MD + MC hybrid). Acceptance
 *   min{1, exp(−β[ΔH_pot + PΔV] + (N + 1) ln(V'/V))},
 * N from scaling the N positions, +1 from drawing ln V uniformly. Velocities are left unchanged: the kinetic part
 * of the NPT weight does not depend on V, and the thermostat keeps it canonical.
 *
 * Hamiltonian. The forces are those of the LJ potential truncated at rc, i.e. the gradient of the truncated-and-
 * shifted potential U_s. For scheme 'truncated-shifted' the sampled Hamiltonian is U_s itself. For 'truncated-tail'
 * it is H_pot = U_s + N·[u_tail(ρ) + u_mf(ρ)], with u_tail the usual tail energy and u_mf = (2π/3)ρ rc³ u(rc) the
 * mean-field value of the shift; both depend on V only, so the MD at fixed V is unchanged, and
 *   −d(N u_tail + N u_mf)/dV = (8π/3)ρ²[(1/3)rc⁻⁹ − rc⁻³] + (8π/3)ρ²[rc⁻⁹ − rc⁻³] = (16π/3)ρ²[(2/3)rc⁻⁹ − rc⁻³] = P_tail,
 * so the ensemble's pressure is the standard truncated-force virial + P_tail — the full-LJ estimate the
 * equations of state are fitted to. Reported energies for this scheme are the usual U_truncated + U_tail.
 */
import { LjSystem, ljPairEnergy, meanFieldShiftPerAtom, tailEnergyPerAtom, tailPressure, type PairSums } from './lj-system';
import { fccLattice } from './lattice';
import { Xoshiro128 } from './rng';
import { assignVelocities } from './velocities';
import { csvrScaleFactor } from './thermostat';
import { globalQ6, localDensityStats, type BondOrder } from './order-parameter';

import type { SimulationCutoffScheme } from '../cutoff-schemes';

export type { SimulationCutoffScheme };

export interface EnsembleSettings {
  atoms: number;
  reducedTemperature: number;
  /** null: constant volume. */
  reducedPressure: number | null;
  initialDensity: number;
  cutoff: number;
  scheme: SimulationCutoffScheme;
  skin: number;
  timestep: number;
  seed: number;
  /** CSVR relaxation time in τ. */
  thermostatTau: number;
  /** MD steps between samples (a multiple of volumeMoveEvery). */
  sampleEvery: number;
  /** MD steps between volume moves. */
  volumeMoveEvery: number;
  /** Initial maximum |Δ ln V| of a volume move. */
  maxLnVolumeStep: number;
  /** λr of a Mie λr-6 pair potential (default 12, LJ 12-6). */
  repulsiveExponent?: number;
}

/** One row per sample; all per-atom quantities in reduced units. */
export class SampleSeries {
  step: number[] = [];
  density: number[] = [];
  volume: number[] = [];
  temperature: number[] = [];
  kinetic: number[] = [];
  /** Reported potential energy per atom (scheme's convention). */
  potentialPerAtom: number[] = [];
  /** Sampled Hamiltonian's potential energy, total (not per atom). */
  hamiltonianPotential: number[] = [];
  /** Instantaneous pressure (scheme's convention, kinetic part from the instantaneous K). */
  pressure: number[] = [];
  /** Pressure with truncated forces only (no tail). */
  pressureTruncated: number[] = [];
  /** Potential per atom, truncated, unshifted, no tail. */
  potentialTruncatedPerAtom: number[] = [];
  q6: number[] = [];
  bondsPerAtom: number[] = [];
  varianceToMean: number[] = [];
  sparseFraction: number[] = [];
  /** K + H_pot − thermostat heat − accepted barostat jumps, per atom: constant up to integration error. */
  conservedPerAtom: number[] = [];
}

export class Ensemble {
  readonly settings: EnsembleSettings;
  readonly system: LjSystem;
  readonly rng: Xoshiro128;
  readonly degreesOfFreedom: number;
  /** Thermostat target: the state's T* except while the start lattice is melted. */
  targetTemperature: number;
  maxLnVolumeStep: number;
  volumeAttempts = 0;
  volumeAccepted = 0;
  stepCount = 0;
  private sums: PairSums;
  private thermostatHeat = 0;
  private barostatJumps = 0;
  private windowAttempts = 0;
  private windowAccepted = 0;
  private lastOrder: BondOrder = { q6: 0, bondsPerAtom: 0 };

  constructor(settings: EnsembleSettings) {
    this.settings = settings;
    this.rng = new Xoshiro128(settings.seed);
    const lattice = fccLattice(settings.atoms, settings.initialDensity);
    this.system = new LjSystem(lattice.positions, lattice.boxLength, settings.cutoff, settings.skin, settings.repulsiveExponent ?? 12);
    assignVelocities(this.system, settings.reducedTemperature, this.rng, 'gaussian');
    this.degreesOfFreedom = 3 * settings.atoms - 3;
    this.targetTemperature = settings.reducedTemperature;
    this.maxLnVolumeStep = settings.maxLnVolumeStep;
    this.system.buildList();
    this.sums = this.system.computeForcesAndEnergy();
  }

  /** Potential energy of the sampled Hamiltonian (total), see the module comment. */
  hamiltonianPotential(sums: PairSums, density: number): number {
    const s = this.system;
    const shifted = sums.potentialTruncated - sums.pairsInside * ljPairEnergy(s.cutoff, s.repulsiveExponent);
    if (this.settings.scheme === 'truncated-shifted') return shifted;
    return (
      shifted +
      s.n * (tailEnergyPerAtom(density, s.cutoff, s.repulsiveExponent) + meanFieldShiftPerAtom(density, s.cutoff, s.repulsiveExponent))
    );
  }

  /** One velocity-Verlet step followed by the CSVR thermostat; `withEnergy` also refreshes the pair sums. */
  step(withEnergy: boolean): void {
    const s = this.system;
    const dt = this.settings.timestep;
    if (s.kickDrift(dt)) s.buildList();
    if (withEnergy) this.sums = s.computeForcesAndEnergy();
    else s.computeForces();
    s.kick(dt);
    const k = s.kineticEnergy();
    const alpha = csvrScaleFactor(k, this.degreesOfFreedom, this.targetTemperature, dt / this.settings.thermostatTau, this.rng);
    const v = s.vel;
    for (let i = 0; i < v.length; i++) v[i] *= alpha;
    this.thermostatHeat += (alpha * alpha - 1) * k;
    this.stepCount++;
  }

  /**
   * Melts the start lattice at constant volume (the target density) and temperature `meltTemperature`: blocks of
   * 100 steps until Q6 falls below `q6Below` (after at least `minSteps`) or `maxSteps` have run; then velocities are
   * drawn afresh at the state's T* and the step count, thermostat heat and barostat jumps start from zero, so the
   * run proper begins from a disordered configuration that cannot carry crystal order into a liquid.
   */
  melt(meltTemperature: number, minSteps: number, maxSteps: number, q6Below: number): { steps: number; q6: number } {
    const s = this.system;
    this.targetTemperature = meltTemperature;
    assignVelocities(s, meltTemperature, this.rng, 'gaussian');
    let steps = 0;
    let q6 = globalQ6(s.pos, s.box, s.nbStart, s.nbList, s.n).q6;
    while (steps < maxSteps) {
      for (let i = 0; i < 100; i++) this.step(false);
      steps += 100;
      if (steps >= minSteps) {
        q6 = globalQ6(s.pos, s.box, s.nbStart, s.nbList, s.n).q6;
        if (q6 < q6Below) break;
      }
    }
    this.targetTemperature = this.settings.reducedTemperature;
    assignVelocities(s, this.settings.reducedTemperature, this.rng, 'gaussian');
    this.sums = s.computeForcesAndEnergy();
    this.stepCount = 0;
    this.thermostatHeat = 0;
    this.barostatJumps = 0;
    return { steps, q6 };
  }

  /** Metropolis volume move in ln V; requires current pair sums. */
  volumeMove(): void {
    const s = this.system;
    const p = this.settings.reducedPressure;
    if (p === null) return;
    const t = this.settings.reducedTemperature;
    const n = s.n;
    const v0 = s.volume;
    const h0 = this.hamiltonianPotential(this.sums, n / v0);
    const lnRatio = this.maxLnVolumeStep * (2 * this.rng.uniform() - 1);
    const v1 = v0 * Math.exp(lnRatio);
    const box1 = Math.cbrt(v1);
    const u = this.rng.uniform();
    this.volumeAttempts++;
    this.windowAttempts++;
    // The minimum image needs the cutoff below half the box; densities below 1e-6 are outside any useful state
    // (both bounds are hard walls in V, so rejecting such proposals keeps detailed balance).
    if (box1 <= 2 * s.cutoff || n / v1 < 1e-6) return;
    s.saveState();
    s.scaleBox(box1 / s.box);
    if (s.needsRebuild()) s.buildList();
    const sums1 = s.computeForcesAndEnergy();
    const h1 = this.hamiltonianPotential(sums1, n / v1);
    const arg = -(h1 - h0 + p * (v1 - v0)) / t + (n + 1) * lnRatio;
    if (arg >= 0 || u < Math.exp(arg)) {
      this.sums = sums1;
      this.barostatJumps += h1 - h0;
      this.volumeAccepted++;
      this.windowAccepted++;
    } else {
      s.restoreState();
    }
  }

  /** Nudges the maximum step towards 40 % acceptance after every 20 attempts (equilibration only). */
  adaptVolumeStep(): void {
    if (this.windowAttempts < 20) return;
    const rate = this.windowAccepted / this.windowAttempts;
    const factor = Math.min(1.5, Math.max(0.5, rate / 0.4));
    this.maxLnVolumeStep = Math.min(0.5, Math.max(1e-5, this.maxLnVolumeStep * factor));
    this.windowAttempts = 0;
    this.windowAccepted = 0;
  }

  /** Appends the current state to `series` (needs pair sums of the current configuration). */
  record(series: SampleSeries): void {
    const s = this.system;
    const n = s.n;
    const v = s.volume;
    const rho = n / v;
    const k = s.kineticEnergy();
    const sums = this.sums;
    const hpot = this.hamiltonianPotential(sums, rho);
    const shiftedTotal = sums.potentialTruncated - sums.pairsInside * ljPairEnergy(s.cutoff, s.repulsiveExponent);
    const tail = this.settings.scheme === 'truncated-tail';
    const pTrunc = (2 * k + sums.virial) / (3 * v);
    series.step.push(this.stepCount);
    series.density.push(rho);
    series.volume.push(v);
    series.kinetic.push(k);
    series.temperature.push((2 * k) / this.degreesOfFreedom);
    series.potentialTruncatedPerAtom.push(sums.potentialTruncated / n);
    series.potentialPerAtom.push(
      tail ? sums.potentialTruncated / n + tailEnergyPerAtom(rho, s.cutoff, s.repulsiveExponent) : shiftedTotal / n,
    );
    series.hamiltonianPotential.push(hpot);
    series.pressureTruncated.push(pTrunc);
    series.pressure.push(tail ? pTrunc + tailPressure(rho, s.cutoff, s.repulsiveExponent) : pTrunc);
    // Q6 every fifth sample (it costs about two force evaluations); the last value is carried in between.
    if (series.q6.length % 5 === 0) this.lastOrder = globalQ6(s.pos, s.box, s.nbStart, s.nbList, n);
    series.q6.push(this.lastOrder.q6);
    series.bondsPerAtom.push(this.lastOrder.bondsPerAtom);
    const ld = localDensityStats(s.pos, s.box, n);
    series.varianceToMean.push(ld.varianceToMean);
    series.sparseFraction.push(ld.sparseFraction);
    series.conservedPerAtom.push((k + hpot - this.thermostatHeat - this.barostatJumps) / n);
  }

  /**
   * Runs `steps` MD steps; every sampleEvery steps: energy evaluation, a volume move (NPT), optional adaptation,
   * and a sample if `series` is given.
   */
  run(steps: number, series: SampleSeries | null, adapt: boolean, onStep?: (done: number) => void): void {
    const every = this.settings.sampleEvery;
    const moveEvery = this.settings.volumeMoveEvery;
    for (let i = 1; i <= steps; i++) {
      const next = this.stepCount + 1;
      const sampleNow = next % every === 0;
      const moveNow = next % moveEvery === 0;
      this.step(sampleNow || moveNow);
      if (moveNow) {
        this.volumeMove();
        if (adapt) this.adaptVolumeStep();
      }
      if (sampleNow && series) this.record(series);
      if (onStep && (i & 255) === 0) onStep(i);
    }
  }
}
