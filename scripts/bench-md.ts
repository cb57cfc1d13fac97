/**
 * MD speed benchmark: the LJ-melt state (fcc, ρ* = 0.8442, T* = 1.44 uniform initial velocities,
 * rc = 2.5σ, skin 0.3σ, dt = 0.005, NVE), the same state and list semantics as
 * /work/shared/bench/ljmd-reference.c so that ../shared/bench/compare.sh compares like with like.
 * Usage: npm run -s bench:md -- [--atoms N] [--steps S] [--repulsive-exponent 16] [--repeats R] [--json]
 * (--repulsive-exponent runs the Mie λr-6 kernel on the same state, for comparing its speed with the 12-6 one;
 * --repeats runs the same benchmark R times in this process and reports the median, with every run and the load average,
 * since one run on a shared machine says little.)
 */
import { loadavg } from 'node:os';
import { parseArgs } from 'node:util';
import { mieKernelFor } from '../shared/physics/md/mie-kernels';
import { runNve, type NveResult } from '../shared/physics/md/nve';

const { values } = parseArgs({
  options: {
    atoms: { type: 'string', default: '4000' },
    steps: { type: 'string', default: '1000' },
    seed: { type: 'string', default: '12345' },
    'repulsive-exponent': { type: 'string', default: '12' },
    repeats: { type: 'string', default: '1' },
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
const repeats = positiveInteger('repeats', values.repeats);
const repulsiveExponent = repulsiveExponentFlag(values['repulsive-exponent']);
// Which pair loop runs: the 12-6 one, a Mie power chain (integer λr) or the Mie table (shared/physics/md/mie-kernels.ts).
const kernel = repulsiveExponent === 12 ? '12-6' : `mie-${mieKernelFor(repulsiveExponent).method}`;
const median = (xs: number[]) => {
  const sorted = [...xs].sort((a, b) => a - b);
  const m = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[m] : 0.5 * (sorted[m - 1] + sorted[m]);
};

const runs: { r: NveResult; cpuSeconds: number; loadAverage1m: number }[] = [];
for (let k = 0; k < repeats; k++) {
  const loadAverage1m = loadavg()[0];
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
    repulsiveExponent,
  });
  const cpu1 = process.cpuUsage(cpu0);
  runs.push({ r, cpuSeconds: (cpu1.user + cpu1.system) / 1e6, loadAverage1m });
}
// Every run is the same trajectory; only the timings differ. With one run the medians are that run's figures.
const r = runs[0].r;
const cpuSeconds = median(runs.map((x) => x.cpuSeconds));
const out = {
  atoms: r.atoms,
  steps: r.steps,
  repulsiveExponent,
  kernel,
  repeats,
  atomStepsPerSecond: median(runs.map((x) => x.r.atomStepsPerSecond)),
  energyDriftPerAtom: r.energyDriftPerAtom,
  wallSeconds: median(runs.map((x) => x.r.wallSeconds)),
  cpuSeconds,
  atomStepsPerCpuSecond: median(runs.map((x) => (x.r.atoms * x.r.steps) / x.cpuSeconds)),
  ...(repeats > 1 ? { atomStepsPerCpuSecondRuns: runs.map((x) => (x.r.atoms * x.r.steps) / x.cpuSeconds) } : {}),
  loadAverage1m: runs.map((x) => x.loadAverage1m),
  listBuilds: r.listBuilds,
  initialPotentialTruncatedPerAtom: r.initial.potentialTruncatedPerAtom,
  initialPressureTruncated: r.initial.pressureTruncated,
  finalTemperature: r.final.temperature,
};
if (values.json) {
  process.stdout.write(`${JSON.stringify(out)}\n`);
} else {
  process.stdout.write(
    `${repulsiveExponent === 12 ? 'LJ 12-6' : `Mie ${repulsiveExponent}-6 (${kernel})`} melt NVE: N=${r.atoms} steps=${r.steps} ` +
      `${(out.atomStepsPerSecond / 1e6).toFixed(3)} M atom-steps/s, ${(out.atomStepsPerCpuSecond / 1e6).toFixed(3)} M per CPU-second` +
      `${repeats > 1 ? ` (median of ${repeats})` : ''} (${out.wallSeconds.toFixed(3)} s, ${r.listBuilds} list builds, ` +
      `load ${out.loadAverage1m.map((x) => x.toFixed(1)).join(' ')}), energy drift ${r.energyDriftPerAtom.toExponential(3)} per atom, ` +
      `step-0 PE ${r.initial.potentialTruncatedPerAtom.toFixed(7)} P ${r.initial.pressureTruncated.toFixed(7)}\n`,
  );
}
