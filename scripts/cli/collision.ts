/**
 * `npm run -s cli -- collision --reduced-temperatures 0.5,1,2 --json`
 * Reduced collision integrals Ω(1,1)* and Ω(2,2)* of the Lennard-Jones 12-6 potential, interpolated from the
 * table computed from the classical definition (shared/physics/collision-integrals.ts).
 * Prints { rows: [{ reducedTemperature, omega11, omega22 }] }.
 */
import { parseArgs } from 'node:util';
import { omega11, omega22 } from '../../shared/physics/collision-integrals';

const USAGE = 'usage: collision --reduced-temperatures <T1*,T2*,…> --json';

export async function run(argv: string[]): Promise<unknown> {
  let values: { 'reduced-temperatures'?: string; json?: boolean };
  try {
    ({ values } = parseArgs({
      args: argv,
      strict: true,
      allowPositionals: false,
      options: { 'reduced-temperatures': { type: 'string' }, json: { type: 'boolean' } },
    }));
  } catch (err) {
    throw new Error(`${err instanceof Error ? err.message : String(err)}; ${USAGE}`);
  }
  const raw = values['reduced-temperatures'];
  if (raw === undefined) throw new Error(`missing required flag --reduced-temperatures; ${USAGE}`);
  const reducedTemperatures = raw.split(',').map((s) => {
    const p = s.trim();
    const value = Number(p);
    if (p === '' || !Number.isFinite(value) || value <= 0) {
      throw new Error(`--reduced-temperatures must be a comma-separated list of finite numbers > 0, got "${raw}"`);
    }
    return value;
  });
  const rows = reducedTemperatures.map((reducedTemperature) => {
    try {
      return { reducedTemperature, omega11: omega11(reducedTemperature), omega22: omega22(reducedTemperature) };
    } catch (err) {
      throw new Error(`--reduced-temperatures ${reducedTemperature}: ${err instanceof Error ? err.message : String(err)}`);
    }
  });
  return { rows };
}
