/**
 * `npm run -s cli -- viscosity --epsilon-k E --sigma-angstrom S --molar-mass M --temperatures 200,300 [--higher-order-correction none|kihara] --json`
 * Dilute-gas viscosity of a Lennard-Jones 12-6 gas, first Chapman–Enskog approximation by default, optionally
 * times Kihara's second-approximation factor (shared/physics/viscosity.ts).
 * Prints { rows: [{ temperatureK, viscosityMicroPaS }], higherOrderCorrection }.
 */
import { VISCOSITY_HIGHER_ORDER_CORRECTION, VISCOSITY_KIHARA_CORRECTION, viscosityWithGradient } from '../../shared/physics/viscosity';
import { mapListFlag, parseFlags, positiveNumberFlag, positiveNumberListFlag, requiredFlag } from './_flags';

const USAGE =
  'usage: viscosity --epsilon-k <K> --sigma-angstrom <Å> --molar-mass <g/mol> --temperatures <T1,T2,…> [--higher-order-correction none|kihara] --json';

export async function run(argv: string[]): Promise<unknown> {
  const values = parseFlags(
    argv,
    {
      'epsilon-k': { type: 'string' },
      'sigma-angstrom': { type: 'string' },
      'molar-mass': { type: 'string' },
      temperatures: { type: 'string' },
      'higher-order-correction': { type: 'string' },
      json: { type: 'boolean' },
    },
    USAGE,
  );
  const epsilonK = positiveNumberFlag('epsilon-k', requiredFlag('epsilon-k', values['epsilon-k'], USAGE));
  const sigmaAngstrom = positiveNumberFlag('sigma-angstrom', requiredFlag('sigma-angstrom', values['sigma-angstrom'], USAGE));
  const molarMassGPerMol = positiveNumberFlag('molar-mass', requiredFlag('molar-mass', values['molar-mass'], USAGE));
  const correction = values['higher-order-correction'] ?? 'none';
  if (correction !== 'none' && correction !== 'kihara') {
    throw new Error(`--higher-order-correction must be "none" or "kihara", got "${correction}"`);
  }
  const temperatures = positiveNumberListFlag('temperatures', requiredFlag('temperatures', values.temperatures, USAGE));
  const rows = mapListFlag('temperatures', temperatures, (temperatureK) => {
    const p = viscosityWithGradient(temperatureK, epsilonK, sigmaAngstrom, molarMassGPerMol, { higherOrderCorrection: correction });
    return { temperatureK, viscosityMicroPaS: p.viscosityMicroPaS };
  });
  return { rows, higherOrderCorrection: correction === 'kihara' ? VISCOSITY_KIHARA_CORRECTION : VISCOSITY_HIGHER_ORDER_CORRECTION };
}
