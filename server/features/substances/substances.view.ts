import type { Substance, SubstanceListItem } from '../../../shared/contracts/substance';
import type { SubstanceTable } from './substances.table';
import type { listSubstances } from './substances.repository';

/** The one place a substance row becomes its API names (shared/contracts/substance.ts): molarMassGramsPerMol → molarMassGPerMol. */
export const toSubstanceView = (
  s: Pick<SubstanceTable, 'name' | 'formula' | 'description' | 'molarMassGramsPerMol' | 'createdAt' | 'updatedAt'> & { id: number },
): Substance => ({
  id: s.id,
  name: s.name,
  formula: s.formula,
  description: s.description,
  molarMassGPerMol: s.molarMassGramsPerMol,
  createdAt: s.createdAt,
  updatedAt: s.updatedAt,
});

/** A list entry; the count and kinds of measurement sets only for roles that may read them. */
export function toSubstanceListItemView(
  s: Awaited<ReturnType<typeof listSubstances>>[number],
  withMeasurementSets: boolean,
): SubstanceListItem {
  if (!withMeasurementSets) return toSubstanceView(s);
  return {
    ...toSubstanceView(s),
    measurementSetCount: Number(s.measurementSetCount),
    kinds: s.kinds ? (s.kinds.split(',').sort() as SubstanceListItem['kinds']) : [],
  };
}
