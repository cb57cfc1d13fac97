/**
 * MD speed benchmark: the LJ-melt state (fcc, ρ* = 0.8442, T* = 1.44 uniform initial velocities,
 * rc = 2.5σ, skin 0.3σ, dt = 0.005, NVE), the same state and list semantics as
 * /work/shared/bench/ljmd-reference.c so that ../shared/bench/compare.sh compares like with like.
 * Usage: npm run -s bench:md -- [--atoms N] [--steps S] [--repulsive-exponent 16] [--json]
 * (--repulsive-exponent runs the Mie λr-6 kernel on the same state, for comparing its speed with the 12-6 one.)
 */
import { parseArgs } from 'node:util';
import { runNve } from '../shared/physics/md/nve';

const { values } = parseArgs({
  options: {
    atoms: { type: 'string', default: '4000' },
    steps: { type: 'string', default: '1000' },
    seed: { type: 'string', default: '12345' },
    'repulsive-exponent': { type: 'string', default: '12' },
    json: { type: 'boolean', default: false },
  },
  strict: true,
});

function positiveInteger(flag: string, text: string): number {
  const v = Number(text);
  if (!Number.isInteger(v) || v <= 0) throw new Error(`--${flag} must be a positive integer, got "${text}"`);
  return v;
}

function repulsiveExponentFlag(text: string): number {
  const v = Number(text);
  if (!(v >= 8 && v <= 36)) throw new Error(`--repulsive-exponent must be a number from 8 to 36, got "${text}"`);
  return v;
}

const atoms = positiveInteger('atoms', values.atoms);
const steps = positiveInteger('steps', values.steps);
// CPU time of the whole run (all threads of this process), a steadier figure than wall time on a shared machine.
const cpu0 = process.cpuUsage();
const r = runNve({
  atoms,
  steps,
  reducedDensity: 0.8442,
  reducedTemperature: 1.44,
  cutoff: 2.5,
  skin: 0.3,
  timestep: 0.005,
  seed: positiveInteger('seed', values.seed),
  velocityDistribution: 'uniform',
  repulsiveExponent: repulsiveExponentFlag(values['repulsive-exponent']),
});
const cpu1 = process.cpuUsage(cpu0);
const cpuSeconds = (cpu1.user + cpu1.system) / 1e6;
const out = {
  atoms: r.atoms,
  steps: r.steps,
  repulsiveExponent: Number(values['repulsive-exponent']),
  atomStepsPerSecond: r.atomStepsPerSecond,
  energyDriftPerAtom: r.energyDriftPerAtom,
  wallSeconds: r.wallSeconds,
  cpuSeconds,
  atomStepsPerCpuSecond: (r.atoms * r.steps) / cpuSeconds,
  listBuilds: r.listBuilds,
  initialPotentialTruncatedPerAtom: r.initial.potentialTruncatedPerAtom,
  initialPressureTruncated: r.initial.pressureTruncated,
  finalTemperature: r.final.temperature,
};
if (values.json) {
  process.stdout.write(`${JSON.stringify(out)}\n`);
} else {
  process.stdout.write(
    `${Number(values['repulsive-exponent']) === 12 ? 'LJ 12-6' : `Mie ${values['repulsive-exponent']}-6`} melt NVE: N=${r.atoms} steps=${r.steps} ${(r.atomStepsPerSecond / 1e6).toFixed(3)} M atom-steps/s ` +
      `(${r.wallSeconds.toFixed(3)} s, ${r.listBuilds} list builds), energy drift ${r.energyDriftPerAtom.toExponential(3)} per atom, ` +
      `step-0 PE ${r.initial.potentialTruncatedPerAtom.toFixed(7)} P ${r.initial.pressureTruncated.toFixed(7)}\n`,
  );
}
