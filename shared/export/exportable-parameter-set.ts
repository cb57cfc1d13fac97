/**
 * What every export reads: a parameter set as the lead maps it from the database, and the CSV's display units.
 * Its own file, so the format writers and the dispatcher (parameter-set-export.ts) import it without a circle.
 */
import type { EnergyUnit, LengthUnit } from '../physics/parameter-units';

/** The set every exporter reads: the z.infer type of its contract. */
export type { ExportableParameterSet } from '../contracts/exportable-parameter-set';

/**
 * Display units for the CSV export (extra columns next to the canonical K and Å ones). JSON always carries
 * every unit; the engine fragments always use the engine's own units, so these options do not touch them.
 */
export interface ExportOptions {
  energyUnit?: EnergyUnit;
  lengthUnit?: LengthUnit;
}
