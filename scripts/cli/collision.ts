/**
 * `npm run -s cli -- collision --reduced-temperatures 0.5,1,2 [--repulsive-exponent 16] --json`
 * Reduced collision integrals Ω(1,1)* and Ω(2,2)* of the Lennard-Jones 12-6 potential, interpolated from the
 * table computed from the classical definition (shared/physics/collision-integrals.ts), or of the Mie λr-6 potential
 * with --repulsive-exponent (shared/physics/mie-collision-integrals.ts; 12 is the 12-6 table itself).
 * Prints { model, repulsiveExponent, rows: [{ reducedTemperature, omega11, omega22 }] }.
 */
import { omega11, omega22 } from '../../shared/physics/collision-integrals';
import { mieCollisionIntegrals } from '../../shared/physics/mie-collision-integrals';
import { mapListFlag, parseFlags, positiveNumberListFlag, repulsiveExponentFlag, requiredFlag } from './_flags';

const USAGE = 'usage: collision --reduced-temperatures <T1*,T2*,…> [--repulsive-exponent <8–36>] --json';

/** Printed by `collision --help`; the examples use quillgas QG-1 of the invented demo scenario (ε/k_B = 131.5 K). */
export const HELP = `${USAGE}
Reduced collision integrals Ω(1,1)* and Ω(2,2)* (1 for rigid spheres of diameter σ) from the classical deflection angle,
interpolated from precomputed tables; T* = T/(ε/k_B) from 0.2 to 400.
  --reduced-temperatures  comma-separated T* values
  --repulsive-exponent    λr of the Mie λr-6 potential, 8–36 (default 12: Lennard-Jones 12-6)
examples (quillgas QG-1 of the Quillmoor demo, ε/k_B = 131.5 K, so 300 K and 600 K are T* = 2.281 and 4.563):
  npm run -s cli -- collision --reduced-temperatures 2.281,4.563 --json
  npm run -s cli -- collision --reduced-temperatures 2.281,4.563 --repulsive-exponent 16 --json
`;

export async function run(argv: string[]): Promise<unknown> {
  const values = parseFlags(
    argv,
    { 'reduced-temperatures': { type: 'string' }, 'repulsive-exponent': { type: 'string' }, json: { type: 'boolean' } },
    USAGE,
  );
  const repulsiveExponent = repulsiveExponentFlag(values['repulsive-exponent']);
  const reducedTemperatures = positiveNumberListFlag(
    'reduced-temperatures',
    requiredFlag('reduced-temperatures', values['reduced-temperatures'], USAGE),
  );
  const rows = mapListFlag('reduced-temperatures', reducedTemperatures, (reducedTemperature) => {
    if (repulsiveExponent === 12) return { reducedTemperature, omega11: omega11(reducedTemperature), omega22: omega22(reducedTemperature) };
    const m = mieCollisionIntegrals(reducedTemperature, repulsiveExponent);
    return { reducedTemperature, omega11: m.omega11, omega22: m.omega22 };
  });
  return { model: repulsiveExponent === 12 ? 'lj-12-6' : 'mie', repulsiveExponent, rows };
}
