import { sql } from 'kysely';
import type { Db, Tx } from '../../db/database';

export async function listSubstances(db: Db | Tx) {
  return db
    .selectFrom('substance')
    .leftJoin('dataset', 'dataset.substanceId', 'substance.id')
    .leftJoin('datasetWithdrawal', 'datasetWithdrawal.datasetId', 'dataset.id')
    .select([
      'substance.id',
      'substance.name',
      'substance.formula',
      'substance.description',
      'substance.molarMassGramsPerMol',
      'substance.createdAt',
      'substance.updatedAt',
      sql<number>`count(dataset.id) filter (where dataset_withdrawal.dataset_id is null)`.as('datasetCount'),
      sql<string | null>`group_concat(distinct case when dataset_withdrawal.dataset_id is null then dataset.property end)`.as('kinds'),
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

export async function findSubstanceByName(db: Db | Tx, name: string) {
  return db.selectFrom('substance').select(['id', 'name']).where(sql`name collate nocase`, '=', name).executeTakeFirst();
}

export async function countDatasetsOf(db: Db | Tx, substanceId: number): Promise<number> {
  const row = await db.selectFrom('dataset').select((eb) => eb.fn.countAll<number>().as('n')).where('substanceId', '=', substanceId).executeTakeFirstOrThrow();
  return Number(row.n);
}
