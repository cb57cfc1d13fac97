import type { Generated } from 'kysely';

export interface SubstanceTable {
  id: Generated<number>;
  name: string;
  formula: string | null;
  description: string | null;
  molarMassGramsPerMol: number;
  createdBy: string;
  createdAt: string;
  updatedAt: string;
}
