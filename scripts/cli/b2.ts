/**
 * `npm run -s cli -- b2 --epsilon-k E --sigma-angstrom S --temperatures 100,200,300 [--molar-mass M --quantum] [--repulsive-exponent 16] --json`
 * Second virial coefficient of the Lennard-Jones 12-6 potential (or the Mie λr-6 potential with --repulsive-exponent)
 * by quadrature (shared/physics/virial.ts), optionally with the first-order Wigner–Kirkwood quantum correction.
 * Prints { model, repulsiveExponent, rows: [{ temperatureK, b2Cm3PerMol }] }.
 */
import { b2WithGradient } from '../../shared/physics/virial';
import { mapListFlag, parseFlags, positiveNumberFlag, positiveNumberListFlag, repulsiveExponentFlag, requiredFlag } from './_flags';

const USAGE =
  'usage: b2 --epsilon-k <K> --sigma-angstrom <Å> --temperatures <T1,T2,…> [--molar-mass <g/mol> --quantum] [--repulsive-exponent <8–36>] --json';

export async function run(argv: string[]): Promise<unknown> {
  const values = parseFlags(
    argv,
    {
      'epsilon-k': { type: 'string' },
      'sigma-angstrom': { type: 'string' },
      temperatures: { type: 'string' },
      'molar-mass': { type: 'string' },
      quantum: { type: 'boolean' },
      'repulsive-exponent': { type: 'string' },
      json: { type: 'boolean' },
    },
    USAGE,
  );
  const epsilonK = positiveNumberFlag('epsilon-k', requiredFlag('epsilon-k', values['epsilon-k'], USAGE));
  const sigmaAngstrom = positiveNumberFlag('sigma-angstrom', requiredFlag('sigma-angstrom', values['sigma-angstrom'], USAGE));
  const temperatures = positiveNumberListFlag('temperatures', requiredFlag('temperatures', values.temperatures, USAGE));
  const quantum = values.quantum === true;
  if (quantum && values['molar-mass'] === undefined) throw new Error('--quantum needs --molar-mass <g/mol>');
  if (!quantum && values['molar-mass'] !== undefined) throw new Error('--molar-mass is only used with --quantum');
  const molarMassGPerMol = quantum ? positiveNumberFlag('molar-mass', values['molar-mass']) : undefined;
  const repulsiveExponent = repulsiveExponentFlag(values['repulsive-exponent']);

  const rows = mapListFlag('temperatures', temperatures, (temperatureK) => {
    const p = b2WithGradient(temperatureK, epsilonK, sigmaAngstrom, molarMassGPerMol ? { molarMassGPerMol } : undefined, {
      repulsiveExponent,
    });
    return { temperatureK, b2Cm3PerMol: p.b2Cm3PerMol };
  });
  return { model: repulsiveExponent === 12 ? 'lj-12-6' : 'mie', repulsiveExponent, rows };
}
