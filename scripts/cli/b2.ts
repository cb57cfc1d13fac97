/**
 * `npm run -s cli -- b2 --epsilon-k E --sigma-angstrom S --temperatures 100,200,300 [--molar-mass M --quantum] --json`
 * Second virial coefficient of the Lennard-Jones 12-6 potential by quadrature (shared/physics/virial.ts),
 * optionally with the first-order Wigner–Kirkwood quantum correction. Prints { rows: [{ temperatureK, b2Cm3PerMol }] }.
 */
import { parseArgs } from 'node:util';
import { b2WithGradient } from '../../shared/physics/virial';

const USAGE =
  'usage: b2 --epsilon-k <K> --sigma-angstrom <Å> --temperatures <T1,T2,…> [--molar-mass <g/mol> --quantum] --json';

/** A flag value as a finite number > 0, or an error that names the flag. */
function positiveFlag(name: string, raw: string | undefined): number {
  if (raw === undefined) throw new Error(`missing required flag --${name}; ${USAGE}`);
  const value = Number(raw);
  if (raw.trim() === '' || !Number.isFinite(value) || value <= 0) {
    throw new Error(`--${name} must be a finite number > 0, got "${raw}"`);
  }
  return value;
}

/** A comma-separated list of finite numbers > 0, or an error that names the flag. */
function positiveListFlag(name: string, raw: string | undefined): number[] {
  if (raw === undefined) throw new Error(`missing required flag --${name}; ${USAGE}`);
  const parts = raw.split(',').map((s) => s.trim());
  return parts.map((p) => {
    const value = Number(p);
    if (p === '' || !Number.isFinite(value) || value <= 0) {
      throw new Error(`--${name} must be a comma-separated list of finite numbers > 0, got "${raw}"`);
    }
    return value;
  });
}

export async function run(argv: string[]): Promise<unknown> {
  let values: Record<string, string | boolean | undefined>;
  try {
    ({ values } = parseArgs({
      args: argv,
      strict: true,
      allowPositionals: false,
      options: {
        'epsilon-k': { type: 'string' },
        'sigma-angstrom': { type: 'string' },
        temperatures: { type: 'string' },
        'molar-mass': { type: 'string' },
        quantum: { type: 'boolean' },
        json: { type: 'boolean' },
      },
    }));
  } catch (err) {
    throw new Error(`${err instanceof Error ? err.message : String(err)}; ${USAGE}`);
  }
  const epsilonK = positiveFlag('epsilon-k', values['epsilon-k'] as string | undefined);
  const sigmaAngstrom = positiveFlag('sigma-angstrom', values['sigma-angstrom'] as string | undefined);
  const temperatures = positiveListFlag('temperatures', values.temperatures as string | undefined);
  const quantum = values.quantum === true;
  if (quantum && values['molar-mass'] === undefined) throw new Error('--quantum needs --molar-mass <g/mol>');
  if (!quantum && values['molar-mass'] !== undefined) throw new Error('--molar-mass is only used with --quantum');
  const molarMassGPerMol = quantum ? positiveFlag('molar-mass', values['molar-mass'] as string | undefined) : undefined;

  const rows = temperatures.map((temperatureK) => {
    try {
      const p = b2WithGradient(temperatureK, epsilonK, sigmaAngstrom, molarMassGPerMol ? { molarMassGPerMol } : undefined);
      return { temperatureK, b2Cm3PerMol: p.b2Cm3PerMol };
    } catch (err) {
      throw new Error(`--temperatures ${temperatureK}: ${err instanceof Error ? err.message : String(err)}`);
    }
  });
  return { rows };
}
