import type { Insertable, Selectable, Updateable } from 'kysely';
import type { Db, Tx } from '../../db/database';
import type { PairSetState, PairSetTable } from './pair-sets.table';

export type PairSetRow = Selectable<PairSetTable>;

/** A parameter set with its substance's name and the values a pair fit holds fixed. */
export async function pairMemberOf(db: Db | Tx, id: number) {
  return db
    .selectFrom('parameterSet')
    .innerJoin('substance', 'substance.id', 'parameterSet.substanceId')
    .select([
      'parameterSet.id',
      'parameterSet.version',
      'parameterSet.state',
      'parameterSet.substanceId',
      'substance.name as substanceName',
      'parameterSet.epsilonK',
      'parameterSet.sigmaAngstrom',
      'parameterSet.epsilonStdErrK',
      'parameterSet.sigmaStdErrAngstrom',
      'parameterSet.correlation',
    ])
    .where('parameterSet.id', '=', id)
    .executeTakeFirst();
}
export type PairMember = NonNullable<Awaited<ReturnType<typeof pairMemberOf>>>;

/** A measurement set with its withdrawal, if any: what a pair fit checks before using it. */
export async function measurementSetForPair(db: Db | Tx, id: number) {
  return db
    .selectFrom('measurementSet')
    .leftJoin('measurementSetWithdrawal', 'measurementSetWithdrawal.measurementSetId', 'measurementSet.id')
    .select([
      'measurementSet.id',
      'measurementSet.name',
      'measurementSet.kind',
      'measurementSet.substanceId',
      'measurementSetWithdrawal.withdrawnAt',
    ])
    .where('measurementSet.id', '=', id)
    .executeTakeFirst();
}

export async function latestVersionOf(db: Db | Tx, measurementSetId: number) {
  return db
    .selectFrom('measurementSetVersion')
    .select(['id', 'version'])
    .where('measurementSetId', '=', measurementSetId)
    .orderBy('version', 'desc')
    .executeTakeFirstOrThrow();
}

/** The measurement set version a pair set was fitted to, with its set's id and name. */
export async function fittedVersionOf(db: Db | Tx, versionId: number) {
  return db
    .selectFrom('measurementSetVersion')
    .innerJoin('measurementSet', 'measurementSet.id', 'measurementSetVersion.measurementSetId')
    .select(['measurementSet.id', 'measurementSet.name', 'measurementSetVersion.version'])
    .where('measurementSetVersion.id', '=', versionId)
    .executeTakeFirstOrThrow();
}

/** A person's display name; their id when the person is gone. */
export async function personName(db: Db | Tx, id: string): Promise<string> {
  return (await db.selectFrom('user').select('name').where('id', '=', id).executeTakeFirst())?.name ?? id;
}

export async function insertPairSet(db: Db | Tx, values: Insertable<PairSetTable>): Promise<number> {
  return (await db.insertInto('pairSet').values(values).returning('id').executeTakeFirstOrThrow()).id;
}

export async function findPairSet(db: Db | Tx, id: number): Promise<PairSetRow | undefined> {
  return db.selectFrom('pairSet').selectAll().where('id', '=', id).executeTakeFirst();
}

/** Pair sets newest first, optionally of one state. */
export async function pairSetRows(db: Db | Tx, state?: PairSetState): Promise<PairSetRow[]> {
  let q = db.selectFrom('pairSet').selectAll().orderBy('id', 'desc');
  if (state) q = q.where('state', '=', state);
  return q.execute();
}

export async function updatePairSet(db: Db | Tx, id: number, values: Updateable<PairSetTable>): Promise<void> {
  await db.updateTable('pairSet').set(values).where('id', '=', id).execute();
}

/** Approved pair sets whose two sets are both among `setIds`, newest first. */
export async function approvedPairRows(db: Db | Tx, setIds: readonly number[]): Promise<PairSetRow[]> {
  return db
    .selectFrom('pairSet')
    .selectAll()
    .where('state', '=', 'approved')
    .where('firstSetId', 'in', [...setIds])
    .where('secondSetId', 'in', [...setIds])
    .orderBy('id', 'desc')
    .execute();
}
