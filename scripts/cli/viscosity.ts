/**
 * `npm run -s cli -- viscosity --epsilon-k E --sigma-angstrom S --molar-mass M --temperatures 200,300 [--higher-order-correction none|kihara] --json`
 * Dilute-gas viscosity of a Lennard-Jones 12-6 gas, first Chapman–Enskog approximation by default, optionally
 * times Kihara's second-approximation factor (shared/physics/viscosity.ts).
 * Prints { rows: [{ temperatureK, viscosityMicroPaS }], higherOrderCorrection }.
 */
import { parseArgs } from 'node:util';
import { VISCOSITY_HIGHER_ORDER_CORRECTION, VISCOSITY_KIHARA_CORRECTION, viscosityWithGradient } from '../../shared/physics/viscosity';

const USAGE =
  'usage: viscosity --epsilon-k <K> --sigma-angstrom <Å> --molar-mass <g/mol> --temperatures <T1,T2,…> [--higher-order-correction none|kihara] --json';

/** A flag value as a finite number > 0, or an error that names the flag. */
function positiveFlag(name: string, raw: string | undefined): number {
  if (raw === undefined) throw new Error(`missing required flag --${name}; ${USAGE}`);
  const value = Number(raw);
  if (raw.trim() === '' || !Number.isFinite(value) || value <= 0) {
    throw new Error(`--${name} must be a finite number > 0, got "${raw}"`);
  }
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
        'epsilon-k': { type: 'string' },
        'sigma-angstrom': { type: 'string' },
        'molar-mass': { type: 'string' },
        temperatures: { type: 'string' },
        'higher-order-correction': { type: 'string' },
        json: { type: 'boolean' },
      },
    }));
  } catch (err) {
    throw new Error(`${err instanceof Error ? err.message : String(err)}; ${USAGE}`);
  }
  const epsilonK = positiveFlag('epsilon-k', values['epsilon-k'] as string | undefined);
  const sigmaAngstrom = positiveFlag('sigma-angstrom', values['sigma-angstrom'] as string | undefined);
  const molarMassGPerMol = positiveFlag('molar-mass', values['molar-mass'] as string | undefined);
  const correction = (values['higher-order-correction'] as string | undefined) ?? 'none';
  if (correction !== 'none' && correction !== 'kihara') {
    throw new Error(`--higher-order-correction must be "none" or "kihara", got "${correction}"`);
  }
  const raw = values.temperatures as string | undefined;
  if (raw === undefined) throw new Error(`missing required flag --temperatures; ${USAGE}`);
  const temperatures = raw.split(',').map((s) => {
    const p = s.trim();
    const value = Number(p);
    if (p === '' || !Number.isFinite(value) || value <= 0) {
      throw new Error(`--temperatures must be a comma-separated list of finite numbers > 0, got "${raw}"`);
    }
    return value;
  });
  const rows = temperatures.map((temperatureK) => {
    try {
      const p = viscosityWithGradient(temperatureK, epsilonK, sigmaAngstrom, molarMassGPerMol, { higherOrderCorrection: correction });
      return { temperatureK, viscosityMicroPaS: p.viscosityMicroPaS };
    } catch (err) {
      throw new Error(`--temperatures ${temperatureK}: ${err instanceof Error ? err.message : String(err)}`);
    }
  });
  return { rows, higherOrderCorrection: correction === 'kihara' ? VISCOSITY_KIHARA_CORRECTION : VISCOSITY_HIGHER_ORDER_CORRECTION };
}
