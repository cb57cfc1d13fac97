/**
 * `npm run -s cli -- md --reduced-temperature T --reduced-pressure P [--atoms N] [--steps S] [--cutoff RC]
 *   [--scheme truncated-tail|truncated-shifted] [--seed K] [--trace] --json`
 * NPT molecular dynamics of the Lennard-Jones 12-6 fluid in reduced units (σ = ε = m = k_B = 1), see
 * shared/physics/md/npt.ts. Prints the NptResult without the trace (add --trace to include it) and without the
 * per-frame data kept for reweighting; `effectiveSamples`, `statisticalInefficiency` and `startedFrom` say how much
 * independent data the run holds and how it started (a fluid state from a melted lattice).
 */
import { runNpt, type NptOptions } from '../../shared/physics/md/npt';
import { errorMessage, finiteNumberFlag, parseFlags, requiredFlag } from './_flags';

const USAGE =
  'usage: md --reduced-temperature <T*> --reduced-pressure <P*> [--atoms N] [--steps S] [--cutoff RC] ' +
  '[--scheme truncated-tail|truncated-shifted] [--seed K] [--repulsive-exponent 8–36] [--trace] --json';

/** Maps the driver's option names to the flags in error messages. */
const FLAG_OF: Record<string, string> = {
  reducedTemperature: '--reduced-temperature',
  reducedPressure: '--reduced-pressure',
  atoms: '--atoms',
  steps: '--steps',
  cutoff: '--cutoff',
  scheme: '--scheme',
  seed: '--seed',
  repulsiveExponent: '--repulsive-exponent',
};

export async function run(argv: string[]): Promise<unknown> {
  const values = parseFlags(
    argv,
    {
      'reduced-temperature': { type: 'string' },
      'reduced-pressure': { type: 'string' },
      atoms: { type: 'string' },
      steps: { type: 'string' },
      cutoff: { type: 'string' },
      scheme: { type: 'string' },
      seed: { type: 'string' },
      'repulsive-exponent': { type: 'string' },
      trace: { type: 'boolean' },
      json: { type: 'boolean' },
    },
    USAGE,
  );
  const scheme = values.scheme;
  if (scheme !== undefined && scheme !== 'truncated-tail' && scheme !== 'truncated-shifted') {
    throw new Error(`--scheme must be "truncated-tail" or "truncated-shifted", got "${scheme}"`);
  }
  const options: NptOptions = {
    reducedTemperature: finiteNumberFlag('reduced-temperature', requiredFlag('reduced-temperature', values['reduced-temperature'], USAGE)),
    reducedPressure: finiteNumberFlag('reduced-pressure', requiredFlag('reduced-pressure', values['reduced-pressure'], USAGE)),
    atoms: finiteNumberFlag('atoms', values.atoms),
    steps: finiteNumberFlag('steps', values.steps),
    cutoff: finiteNumberFlag('cutoff', values.cutoff),
    scheme,
    seed: finiteNumberFlag('seed', values.seed),
    ...(values['repulsive-exponent'] !== undefined
      ? { repulsiveExponent: finiteNumberFlag('repulsive-exponent', values['repulsive-exponent']) }
      : {}),
  };
  let result;
  try {
    result = runNpt(options);
  } catch (err) {
    const message = errorMessage(err);
    const param = /^(\w+)/.exec(message)?.[1] ?? '';
    throw new Error(FLAG_OF[param] ? message.replace(param, FLAG_OF[param]) : message, { cause: err });
  }
  const { frames: _frames, ...withTrace } = result;
  if (values.trace) return withTrace;
  const { trace: _trace, ...rest } = withTrace;
  return rest;
}
