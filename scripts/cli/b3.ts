/**
 * `npm run -s cli -- b3 --reduced-temperatures 0.8,1,2 --json`
 * Third virial coefficient of the Lennard-Jones 12-6 fluid by direct quadrature (shared/physics/third-virial.ts).
 * Prints { rows: [{ reducedTemperature, b3Reduced, dB3ReducedDT }] } with b3Reduced = B3/b0², b0 = 2πN_Aσ³/3;
 * with --epsilon-k and --sigma-angstrom the rows also carry temperatureK and b3Cm6PerMol2.
 */
import { b2ZeroCm3PerMol } from '../../shared/physics/virial';
import { reducedB3WithDerivative } from '../../shared/physics/third-virial';
import { mapListFlag, parseFlags, positiveNumberFlag, positiveNumberListFlag, requiredFlag } from './_flags';

const USAGE = 'usage: b3 --reduced-temperatures <T1*,T2*,…> [--epsilon-k <K> --sigma-angstrom <Å>] --json';

export const B3_SOURCE =
  'B3 = −(N_A²/3)∫∫ f12 f13 f23 dr2 dr3 (Hirschfelder, Curtiss & Bird 1954, eq. 3.6-4) by direct Gauss–Legendre quadrature in bipolar coordinates; pairwise-additive, classical';

export async function run(argv: string[]): Promise<unknown> {
  const values = parseFlags(
    argv,
    {
      'reduced-temperatures': { type: 'string' },
      'epsilon-k': { type: 'string' },
      'sigma-angstrom': { type: 'string' },
      json: { type: 'boolean' },
    },
    USAGE,
  );
  const temperatures = positiveNumberListFlag(
    'reduced-temperatures',
    requiredFlag('reduced-temperatures', values['reduced-temperatures'], USAGE),
  );
  const epsilonK = positiveNumberFlag('epsilon-k', values['epsilon-k']);
  const sigmaAngstrom = positiveNumberFlag('sigma-angstrom', values['sigma-angstrom']);
  if ((epsilonK === undefined) !== (sigmaAngstrom === undefined)) throw new Error(`--epsilon-k and --sigma-angstrom go together; ${USAGE}`);
  const rows = mapListFlag('reduced-temperatures', temperatures, (reducedTemperature) => {
    const [b3Reduced, dB3ReducedDT] = reducedB3WithDerivative(reducedTemperature);
    if (epsilonK === undefined || sigmaAngstrom === undefined) return { reducedTemperature, b3Reduced, dB3ReducedDT };
    const b0 = b2ZeroCm3PerMol(sigmaAngstrom);
    return { reducedTemperature, b3Reduced, dB3ReducedDT, temperatureK: reducedTemperature * epsilonK, b3Cm6PerMol2: b0 * b0 * b3Reduced };
  });
  return { rows, source: B3_SOURCE };
}
