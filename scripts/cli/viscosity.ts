/**
 * `npm run -s cli -- viscosity --epsilon-k E --sigma-angstrom S --molar-mass M --temperatures 200,300 [--higher-order-correction none|kihara]
 *  [--repulsive-exponent 16] --json`
 * Dilute-gas viscosity of a Lennard-Jones 12-6 gas (or a Mie λr-6 gas with --repulsive-exponent), first Chapman–Enskog
 * approximation by default, optionally times Kihara's second-approximation factor (shared/physics/viscosity.ts).
 * Prints { model, repulsiveExponent, rows: [{ temperatureK, viscosityMicroPaS }], higherOrderCorrection }.
 */
import { VISCOSITY_HIGHER_ORDER_CORRECTION, VISCOSITY_KIHARA_CORRECTION, viscosityWithGradient } from '../../shared/physics/viscosity';
import { mapListFlag, parseFlags, positiveNumberFlag, positiveNumberListFlag, repulsiveExponentFlag, requiredFlag } from './_flags';

const USAGE =
  'usage: viscosity --epsilon-k <K> --sigma-angstrom <Å> --molar-mass <g/mol> --temperatures <T1,T2,…> [--higher-order-correction none|kihara] ' +
  '[--repulsive-exponent <8–36>] --json';

/** Printed by `viscosity --help`; the examples use quillgas QG-1 of the invented demo scenario. */
export const HELP = `${USAGE}
Dilute-gas shear viscosity η (µPa·s) in the first Chapman–Enskog approximation, η = (5/16)√(π m k_B T)/(π σ² Ω(2,2)*(T*)).
  --repulsive-exponent       λr of the Mie λr-6 potential, 8–36 (default 12: Lennard-Jones 12-6)
  --higher-order-correction  none (default) or kihara (Kihara's second-approximation factor)
examples (quillgas QG-1 of the Quillmoor demo: ε/k_B = 131.5 K, σ = 3.524 Å, M = 44.62 g/mol):
  npm run -s cli -- viscosity --epsilon-k 131.5 --sigma-angstrom 3.524 --molar-mass 44.62 --temperatures 300,500 --json
  npm run -s cli -- viscosity --epsilon-k 131.5 --sigma-angstrom 3.524 --molar-mass 44.62 --temperatures 300,500 --repulsive-exponent 16 --json
`;

export async function run(argv: string[]): Promise<unknown> {
  const values = parseFlags(
    argv,
    {
      'epsilon-k': { type: 'string' },
      'sigma-angstrom': { type: 'string' },
      'molar-mass': { type: 'string' },
      temperatures: { type: 'string' },
      'higher-order-correction': { type: 'string' },
      'repulsive-exponent': { type: 'string' },
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
  const repulsiveExponent = repulsiveExponentFlag(values['repulsive-exponent']);
  const mie = repulsiveExponent === 12 ? {} : { repulsiveExponent };
  const rows = mapListFlag('temperatures', temperatures, (temperatureK) => {
    const p = viscosityWithGradient(temperatureK, epsilonK, sigmaAngstrom, molarMassGPerMol, { higherOrderCorrection: correction, ...mie });
    return { temperatureK, viscosityMicroPaS: p.viscosityMicroPaS };
  });
  return {
    model: repulsiveExponent === 12 ? 'lj-12-6' : 'mie',
    repulsiveExponent,
    rows,
    higherOrderCorrection: correction === 'kihara' ? VISCOSITY_KIHARA_CORRECTION : VISCOSITY_HIGHER_ORDER_CORRECTION,
  };
}
