/**
 * `npm run -s cli -- md --reduced-temperature T --reduced-pressure P [--atoms N] [--steps S] [--cutoff RC]
 *   [--scheme truncated-tail|truncated-shifted] [--seed K] [--trace] --json`
 * NPT molecular dynamics of the Lennard-Jones 12-6 fluid in reduced units (σ = ε = m = k_B = 1), see
 * shared/physics/md/npt.ts. Prints the NptResult without the trace (add --trace to include it).
 */
import { parseArgs } from 'node:util';
import { runNpt, type NptOptions } from '../../shared/physics/md/npt';

const USAGE =
  'usage: md --reduced-temperature <T*> --reduced-pressure <P*> [--atoms N] [--steps S] [--cutoff RC] ' +
  '[--scheme truncated-tail|truncated-shifted] [--seed K] [--trace] --json';

/** Maps the driver's option names to the flags in error messages. */
const FLAG_OF: Record<string, string> = {
  reducedTemperature: '--reduced-temperature',
  reducedPressure: '--reduced-pressure',
  atoms: '--atoms',
  steps: '--steps',
  cutoff: '--cutoff',
  scheme: '--scheme',
  seed: '--seed',
};

function numberFlag(name: string, raw: string | undefined, required: boolean): number | undefined {
  if (raw === undefined) {
    if (required) throw new Error(`missing required flag --${name}; ${USAGE}`);
    return undefined;
  }
  const value = Number(raw);
  if (raw.trim() === '' || !Number.isFinite(value)) throw new Error(`--${name} must be a finite number, got "${raw}"`);
  return value;
}

export async function run(argv: string[]): Promise<unknown> {
  let values: Record<string, string | boolean | undefined>;
  try {
    ({ values } = parseArgs({
      args: argv,
      strict: true,
      allowPositionals: false,
      options: {
        'reduced-temperature': { type: 'string' },
        'reduced-pressure': { type: 'string' },
        atoms: { type: 'string' },
        steps: { type: 'string' },
        cutoff: { type: 'string' },
        scheme: { type: 'string' },
        seed: { type: 'string' },
        trace: { type: 'boolean' },
        json: { type: 'boolean' },
      },
    }));
  } catch (err) {
    throw new Error(`${err instanceof Error ? err.message : String(err)}; ${USAGE}`);
  }
  const str = (k: string): string | undefined => values[k] as string | undefined;
  const scheme = str('scheme');
  if (scheme !== undefined && scheme !== 'truncated-tail' && scheme !== 'truncated-shifted') {
    throw new Error(`--scheme must be "truncated-tail" or "truncated-shifted", got "${scheme}"`);
  }
  const options: NptOptions = {
    reducedTemperature: numberFlag('reduced-temperature', str('reduced-temperature'), true) as number,
    reducedPressure: numberFlag('reduced-pressure', str('reduced-pressure'), true) as number,
    atoms: numberFlag('atoms', str('atoms'), false),
    steps: numberFlag('steps', str('steps'), false),
    cutoff: numberFlag('cutoff', str('cutoff'), false),
    scheme,
    seed: numberFlag('seed', str('seed'), false),
  };
  let result;
  try {
    result = runNpt(options);
  } catch (err) {
    const message = err instanceof Error ? err.message : String(err);
    const param = /^(\w+)/.exec(message)?.[1] ?? '';
    throw new Error(FLAG_OF[param] ? message.replace(param, FLAG_OF[param]) : message);
  }
  if (values.trace) return result;
  const { trace: _trace, ...rest } = result;
  return rest;
}
