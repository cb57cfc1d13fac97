/**
 * `npm run -s cli -- eos --reduced-temperature T --reduced-pressure P [--prefer liquid|vapour] --json`
 * Density of the full Lennard-Jones fluid from the Johnson–Zollweg–Gubbins (1993) equation of state,
 * in reduced units (σ = ε = m = k_B = 1). Prints { reducedDensity, phase, roots, dRhoDT, dRhoDP, source }.
 */
import { parseArgs } from 'node:util';
import { LJ_EOS_SOURCE, ljEosDensity } from '../../shared/physics/lj-eos';

const USAGE = 'usage: eos --reduced-temperature <T*> --reduced-pressure <P*> [--prefer liquid|vapour] --json';

/** A flag value as a finite number, or an error that names the flag. */
function numberFlag(name: string, raw: string | undefined): number {
  if (raw === undefined) throw new Error(`missing required flag --${name}; ${USAGE}`);
  const value = Number(raw);
  if (raw.trim() === '' || !Number.isFinite(value)) {
    throw new Error(`--${name} must be a finite number, got "${raw}"`);
  }
  return value;
}

export async function run(argv: string[]): Promise<unknown> {
  let values: { 'reduced-temperature'?: string; 'reduced-pressure'?: string; prefer?: string; json?: boolean };
  try {
    ({ values } = parseArgs({
      args: argv,
      strict: true,
      allowPositionals: false,
      options: {
        'reduced-temperature': { type: 'string' },
        'reduced-pressure': { type: 'string' },
        prefer: { type: 'string' },
        json: { type: 'boolean' },
      },
    }));
  } catch (err) {
    throw new Error(`${err instanceof Error ? err.message : String(err)}; ${USAGE}`);
  }

  const reducedTemperature = numberFlag('reduced-temperature', values['reduced-temperature']);
  const reducedPressure = numberFlag('reduced-pressure', values['reduced-pressure']);
  const prefer = values.prefer;
  if (prefer !== undefined && prefer !== 'liquid' && prefer !== 'vapour') {
    throw new Error(`--prefer must be "liquid" or "vapour", got "${prefer}"`);
  }

  let result;
  try {
    result = ljEosDensity(reducedTemperature, reducedPressure, prefer ? { prefer } : {});
  } catch (err) {
    // Name the flag rather than the library parameter.
    const message = err instanceof Error ? err.message : String(err);
    throw new Error(
      message.replace(/^reducedTemperature/, '--reduced-temperature').replace(/^reducedPressure/, '--reduced-pressure'),
    );
  }

  return {
    reducedDensity: result.reducedDensity,
    phase: result.phase,
    roots: result.roots,
    dRhoDT: result.dRhoDT,
    dRhoDP: result.dRhoDP,
    ...(result.note ? { note: result.note } : {}),
    source: LJ_EOS_SOURCE,
  };
}
