/**
 * `npm run -s cli -- eos --reduced-temperature T --reduced-pressure P [--prefer liquid|vapour] --json`
 * Density of the full Lennard-Jones fluid from the Johnson–Zollweg–Gubbins (1993) equation of state,
 * in reduced units (σ = ε = m = k_B = 1). Prints { reducedDensity, phase, roots, dRhoDT, dRhoDP, source }.
 */
import { LJ_EOS_SOURCE, ljEosDensity } from '../../shared/physics/lj-eos';
import { errorMessage, finiteNumberFlag, parseFlags, requiredFlag } from './_flags';

const USAGE = 'usage: eos --reduced-temperature <T*> --reduced-pressure <P*> [--prefer liquid|vapour] --json';

export async function run(argv: string[]): Promise<unknown> {
  const values = parseFlags(
    argv,
    {
      'reduced-temperature': { type: 'string' },
      'reduced-pressure': { type: 'string' },
      prefer: { type: 'string' },
      json: { type: 'boolean' },
    },
    USAGE,
  );

  const reducedTemperature = finiteNumberFlag('reduced-temperature', requiredFlag('reduced-temperature', values['reduced-temperature'], USAGE));
  const reducedPressure = finiteNumberFlag('reduced-pressure', requiredFlag('reduced-pressure', values['reduced-pressure'], USAGE));
  const prefer = values.prefer;
  if (prefer !== undefined && prefer !== 'liquid' && prefer !== 'vapour') {
    throw new Error(`--prefer must be "liquid" or "vapour", got "${prefer}"`);
  }

  let result;
  try {
    result = ljEosDensity(reducedTemperature, reducedPressure, prefer ? { prefer } : {});
  } catch (err) {
    // Name the flag rather than the library parameter.
    throw new Error(
      errorMessage(err).replace(/^reducedTemperature/, '--reduced-temperature').replace(/^reducedPressure/, '--reduced-pressure'),
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
