import { sql, type Insertable, type Updateable } from 'kysely';
import { normaliseSubstanceName } from '../../../shared/schemas/measurements';
import type { Db, Tx } from '../../db/database';
import type { SubstanceTable } from './substances.table';

export async function listSubstances(db: Db | Tx) {
  return db
    .selectFrom('substance')
    .leftJoin('measurementSet', 'measurementSet.substanceId', 'substance.id')
    .leftJoin('measurementSetWithdrawal', 'measurementSetWithdrawal.measurementSetId', 'measurementSet.id')
    .select([
      'substance.id',
      'substance.name',
      'substance.formula',
      'substance.description',
      'substance.molarMassGramsPerMol',
      'substance.createdAt',
      'substance.updatedAt',
      sql<number>`count(measurement_set.id) filter (where measurement_set_withdrawal.measurement_set_id is null)`.as('measurementSetCount'),
      sql<
        string | null
      >`group_concat(distinct case when measurement_set_withdrawal.measurement_set_id is null then measurement_set.kind end)`.as('kinds'),
    ])
    .groupBy('substance.id')
    .orderBy('substance.name')
    .execute();
}

export async function findSubstance(db: Db | Tx, id: number) {
  return db
    .selectFrom('substance')
    .innerJoin('user', 'user.id', 'substance.createdBy')
    .selectAll('substance')
    .select(['user.name as createdByName'])
    .where('substance.id', '=', id)
    .executeTakeFirst();
}

/**
 * The substance whose name is the same once both are normalised (NFKC, one space, trimmed) and case is ignored,
 * so "quillgas\u00a0QG-1" and "Quillgas QG-1" are one name. Compared here rather than in SQL, whose NOCASE
 * folds ASCII only and knows no Unicode normal forms (older rows may predate normalisation).
 */
export async function findSubstanceByName(db: Db | Tx, name: string) {
  const key = (n: string) => normaliseSubstanceName(n).toLocaleLowerCase('en');
  const wanted = key(name);
  const rows = await db.selectFrom('substance').select(['id', 'name']).execute();
  return rows.find((r) => key(r.name) === wanted);
}

export async function countMeasurementSetsOf(db: Db | Tx, substanceId: number): Promise<number> {
  const row = await db
    .selectFrom('measurementSet')
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .where('substanceId', '=', substanceId)
    .executeTakeFirstOrThrow();
  return Number(row.n);
}

export async function insertSubstance(tx: Tx, values: Insertable<SubstanceTable>) {
  return tx.insertInto('substance').values(values).returningAll().executeTakeFirstOrThrow();
}

export async function updateSubstance(tx: Tx, id: number, changes: Updateable<SubstanceTable>) {
  return tx.updateTable('substance').set(changes).where('id', '=', id).returningAll().executeTakeFirstOrThrow();
}
