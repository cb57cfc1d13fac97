/**
 * `npm run -s cli -- collision --reduced-temperatures 0.5,1,2 --json`
 * Reduced collision integrals Ω(1,1)* and Ω(2,2)* of the Lennard-Jones 12-6 potential, interpolated from the
 * table computed from the classical definition (shared/physics/collision-integrals.ts).
 * Prints { rows: [{ reducedTemperature, omega11, omega22 }] }.
 */
import { omega11, omega22 } from '../../shared/physics/collision-integrals';
import { mapListFlag, parseFlags, positiveNumberListFlag, requiredFlag } from './_flags';

const USAGE = 'usage: collision --reduced-temperatures <T1*,T2*,…> --json';

export async function run(argv: string[]): Promise<unknown> {
  const values = parseFlags(argv, { 'reduced-temperatures': { type: 'string' }, json: { type: 'boolean' } }, USAGE);
  const reducedTemperatures = positiveNumberListFlag(
    'reduced-temperatures',
    requiredFlag('reduced-temperatures', values['reduced-temperatures'], USAGE),
  );
  const rows = mapListFlag('reduced-temperatures', reducedTemperatures, (reducedTemperature) => ({
    reducedTemperature,
    omega11: omega11(reducedTemperature),
    omega22: omega22(reducedTemperature),
  }));
  return { rows };
}
