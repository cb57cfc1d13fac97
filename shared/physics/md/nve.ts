/**
 * Microcanonical (NVE) run with velocity Verlet (Swope, Andersen, Berens & Wilson 1982,
 * J. Chem. Phys. 76, 637): the benchmark and the energy-conservation check.
 */
import { fccLattice } from './lattice';
import { LjSystem, ljPairEnergy, tailEnergyPerAtom, tailPressure } from './lj-system';
import { assignVelocities } from './velocities';
import { Xoshiro128 } from './rng';
import { requireInteger, requireNumber } from './validate';

export interface NveOptions {
  /** Number of atoms (default 4000 would be the benchmark; no default here: required). */
  atoms: number;
  /** MD steps. */
  steps: number;
  /** Number density ρσ³. */
  reducedDensity: number;
  /** Initial temperature k_BT/ε, with 3N − 3 degrees of freedom. */
  reducedTemperature: number;
  /** Cutoff rc/σ, default 2.5. */
  cutoff?: number;
  /** Verlet skin/σ, default 0.3. */
  skin?: number;
  /** Time step in τ = σ√(m/ε), default 0.005. */
  timestep?: number;
  /** RNG seed for the initial velocities, default 12345. */
  seed?: number;
  /** Initial velocity distribution, default 'uniform' (as the LJ-melt benchmark). */
  velocityDistribution?: 'uniform' | 'gaussian';
  /** Steps between energy evaluations, default 100. */
  thermoEvery?: number;
  /** λr of a Mie λr-6 pair potential, default 12 (LJ 12-6). */
  repulsiveExponent?: number;
}

export interface NveThermo {
  /** Potential energy per atom, truncated at rc, no tail correction. */
  potentialTruncatedPerAtom: number;
  /** Potential energy per atom with the tail correction. */
  potentialPerAtom: number;
  /** Total energy per atom (kinetic + potential with tail). */
  totalEnergyPerAtom: number;
  /** Kinetic + shifted potential per atom: the quantity velocity Verlet conserves with truncated forces. */
  conservedEnergyPerAtom: number;
  /** Instantaneous temperature 2K/(3N − 3). */
  temperature: number;
  /** Virial pressure without tail correction. */
  pressureTruncated: number;
  /** Virial pressure plus tail correction. */
  pressure: number;
}

export interface NveResult {
  atoms: number;
  steps: number;
  cutoff: number;
  skin: number;
  timestep: number;
  reducedDensity: number;
  /** N·steps / wall time of the step loop. */
  atomStepsPerSecond: number;
  wallSeconds: number;
  /** Final − initial conserved energy per atom (kinetic + shifted potential). */
  energyDriftPerAtom: number;
  /** Least-squares slope of the conserved energy per atom, per unit reduced time. */
  energyDriftSlopePerAtomPerTime: number;
  /** Largest − smallest conserved energy per atom over the thermo samples. */
  energyRangePerAtom: number;
  listBuilds: number;
  initial: NveThermo;
  final: NveThermo;
}

function thermo(system: LjSystem, sums: { potentialTruncated: number; virial: number; pairsInside: number }): NveThermo {
  const n = system.n;
  const rho = system.density;
  const ke = system.kineticEnergy();
  const uTrunc = sums.potentialTruncated / n;
  const u = uTrunc + tailEnergyPerAtom(rho, system.cutoff, system.repulsiveExponent);
  const pTrunc = (2 * ke + sums.virial) / (3 * system.volume);
  return {
    potentialTruncatedPerAtom: uTrunc,
    potentialPerAtom: u,
    totalEnergyPerAtom: ke / n + u,
    conservedEnergyPerAtom: (ke + sums.potentialTruncated - sums.pairsInside * ljPairEnergy(system.cutoff, system.repulsiveExponent)) / n,
    temperature: (2 * ke) / (3 * n - 3),
    pressureTruncated: pTrunc,
    pressure: pTrunc + tailPressure(rho, system.cutoff, system.repulsiveExponent),
  };
}

/** Runs NVE from an fcc lattice; see NveOptions for defaults. */
export function runNve(options: NveOptions): NveResult {
  const atoms = requireInteger('atoms', options.atoms, 32, 1_000_000);
  const steps = requireInteger('steps', options.steps, 1, 1e9);
  const rho = requireNumber('reducedDensity', options.reducedDensity, 1e-6, 1.5);
  const t0 = requireNumber('reducedTemperature', options.reducedTemperature, 1e-3, 100);
  const cutoff = requireNumber('cutoff', options.cutoff ?? 2.5, 2, 4);
  const skin = requireNumber('skin', options.skin ?? 0.3, 0.05, 2);
  const dt = requireNumber('timestep', options.timestep ?? 0.005, 1e-5, 0.02);
  const seed = requireInteger('seed', options.seed ?? 12345, 0, 0xffffffff);
  const every = requireInteger('thermoEvery', options.thermoEvery ?? 100, 1, 1e9);
  const repulsiveExponent = requireNumber('repulsiveExponent', options.repulsiveExponent ?? 12, 8, 36);
  const lattice = fccLattice(atoms, rho);
  if (lattice.boxLength <= 2 * cutoff) {
    throw new RangeError(`atoms: box edge ${lattice.boxLength.toFixed(3)}σ must exceed twice the cutoff; use more atoms`);
  }
  const system = new LjSystem(lattice.positions, lattice.boxLength, cutoff, skin, repulsiveExponent);
  assignVelocities(system, t0, new Xoshiro128(seed), options.velocityDistribution ?? 'uniform');
  system.buildList();
  const first = thermo(system, system.computeForcesAndEnergy());
  const builds0 = system.builds;
  let sn = 1;
  let st = 0;
  let se = first.conservedEnergyPerAtom;
  let stt = 0;
  let ste = 0;
  let eMin = se;
  let eMax = se;
  let last = first;
  const tStart = performance.now();
  for (let step = 1; step <= steps; step++) {
    if (system.kickDrift(dt)) system.buildList();
    if (step % every === 0 || step === steps) {
      // Positions do not change in the second half kick, so the pair sums stay valid for thermo().
      const sums = system.computeForcesAndEnergy();
      system.kick(dt);
      last = thermo(system, sums);
      const t = step * dt;
      const e = last.conservedEnergyPerAtom;
      sn++;
      st += t;
      se += e;
      stt += t * t;
      ste += t * e;
      if (e < eMin) eMin = e;
      if (e > eMax) eMax = e;
    } else {
      system.computeForces();
      system.kick(dt);
    }
  }
  const wall = (performance.now() - tStart) / 1000;
  const denom = sn * stt - st * st;
  return {
    atoms,
    steps,
    cutoff,
    skin,
    timestep: dt,
    reducedDensity: rho,
    atomStepsPerSecond: (atoms * steps) / wall,
    wallSeconds: wall,
    energyDriftPerAtom: last.conservedEnergyPerAtom - first.conservedEnergyPerAtom,
    energyDriftSlopePerAtomPerTime: denom > 0 ? (sn * ste - st * se) / denom : 0,
    energyRangePerAtom: eMax - eMin,
    listBuilds: system.builds - builds0,
    initial: first,
    final: last,
  };
}
