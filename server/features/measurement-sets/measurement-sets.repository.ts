import type { Insertable } from 'kysely';
import type { Db, Tx } from '../../db/database';
import type { MeasurementRowTable, MeasurementSetTable, MeasurementSetVersionTable } from './measurement-sets.table';

const VERSION_COLUMNS = [
  'measurementSetVersion.id',
  'measurementSetVersion.measurementSetId',
  'measurementSetVersion.version',
  'measurementSetVersion.sha256',
  'measurementSetVersion.originalFilename',
  'measurementSetVersion.source',
  'measurementSetVersion.doi',
  'measurementSetVersion.method',
  'measurementSetVersion.notes',
  'measurementSetVersion.defaultRelativeUncertainty',
  'measurementSetVersion.delimiter',
  'measurementSetVersion.decimal',
  'measurementSetVersion.columnsJson',
  'measurementSetVersion.rowCount',
  'measurementSetVersion.uploadedBy',
  'measurementSetVersion.uploadedAt',
] as const;

export async function findMeasurementSet(db: Db | Tx, id: number) {
  return db
    .selectFrom('measurementSet')
    .leftJoin('measurementSetWithdrawal', 'measurementSetWithdrawal.measurementSetId', 'measurementSet.id')
    .selectAll('measurementSet')
    .select([
      'measurementSetWithdrawal.withdrawnAt',
      'measurementSetWithdrawal.reason as withdrawnReason',
      'measurementSetWithdrawal.withdrawnBy',
    ])
    .where('measurementSet.id', '=', id)
    .executeTakeFirst();
}

export async function listVersions(db: Db | Tx, measurementSetId: number) {
  return db
    .selectFrom('measurementSetVersion')
    .innerJoin('user', 'user.id', 'measurementSetVersion.uploadedBy')
    .select([...VERSION_COLUMNS, 'user.name as uploadedByName'])
    .where('measurementSetVersion.measurementSetId', '=', measurementSetId)
    .orderBy('measurementSetVersion.version', 'desc')
    .execute();
}

export async function latestVersionNumber(db: Db | Tx, measurementSetId: number): Promise<number> {
  const row = await db
    .selectFrom('measurementSetVersion')
    .select((eb) => eb.fn.max('version').as('v'))
    .where('measurementSetId', '=', measurementSetId)
    .executeTakeFirst();
  return Number(row?.v ?? 0);
}

export async function findVersionRow(db: Db | Tx, measurementSetId: number, version: number) {
  return db
    .selectFrom('measurementSetVersion')
    .selectAll()
    .where('measurementSetId', '=', measurementSetId)
    .where('version', '=', version)
    .executeTakeFirst();
}

export async function rowsOfVersion(db: Db | Tx, measurementSetVersionId: number) {
  return db
    .selectFrom('measurementRow')
    .selectAll()
    .where('measurementSetVersionId', '=', measurementSetVersionId)
    .orderBy('position')
    .execute();
}

/** Every measurement set of a substance with its newest version's summary. */
export async function listMeasurementSetsOfSubstance(db: Db | Tx, substanceId?: number) {
  let q = db
    .selectFrom('measurementSet')
    .innerJoin('measurementSetVersion', 'measurementSetVersion.measurementSetId', 'measurementSet.id')
    .innerJoin('substance', 'substance.id', 'measurementSet.substanceId')
    .leftJoin('measurementSetWithdrawal', 'measurementSetWithdrawal.measurementSetId', 'measurementSet.id')
    .select([
      'measurementSet.id',
      'measurementSet.substanceId',
      'substance.name as substanceName',
      'measurementSet.kind',
      'measurementSet.name',
      'measurementSet.createdAt',
      'measurementSetVersion.version',
      'measurementSetVersion.id as versionId',
      'measurementSetVersion.rowCount',
      'measurementSetVersion.source',
      'measurementSetVersion.doi',
      'measurementSetVersion.uploadedAt',
      'measurementSetVersion.sha256',
      'measurementSetWithdrawal.withdrawnAt',
    ])
    .where(({ eb, selectFrom }) =>
      eb(
        'measurementSetVersion.version',
        '=',
        selectFrom('measurementSetVersion as v2')
          .select((e) => e.fn.max('v2.version').as('m'))
          .whereRef('v2.measurementSetId', '=', 'measurementSet.id'),
      ),
    );
  if (substanceId !== undefined) q = q.where('measurementSet.substanceId', '=', substanceId);
  return q.orderBy('measurementSet.kind').orderBy('measurementSet.name').execute();
}

export async function insertWithdrawal(
  tx: Tx,
  values: { measurementSetId: number; withdrawnBy: string; withdrawnAt: string; reason: string },
) {
  await tx.insertInto('measurementSetWithdrawal').values(values).execute();
}

/** The display name of a person (an author named in a refusal). */
export async function personName(db: Db | Tx, personId: string): Promise<string | undefined> {
  return (await db.selectFrom('user').select('name').where('id', '=', personId).executeTakeFirst())?.name;
}

export async function insertMeasurementSet(tx: Tx, values: Insertable<MeasurementSetTable>): Promise<number> {
  return (await tx.insertInto('measurementSet').values(values).returning('id').executeTakeFirstOrThrow()).id;
}

export async function insertVersion(tx: Tx, values: Insertable<MeasurementSetVersionTable>): Promise<number> {
  return (await tx.insertInto('measurementSetVersion').values(values).returning('id').executeTakeFirstOrThrow()).id;
}

/** Inserts in chunks: SQLite limits bound parameters per statement. */
export async function insertRows(tx: Tx, values: Insertable<MeasurementRowTable>[]) {
  for (let i = 0; i < values.length; i += 200)
    await tx
      .insertInto('measurementRow')
      .values(values.slice(i, i + 200))
      .execute();
}

/** Source, citation and checksum of measurement set versions, by version id (the data behind a fit or a parameter set). */
export async function versionSources(db: Db | Tx, versionIds: readonly number[]) {
  if (!versionIds.length) return [];
  return db
    .selectFrom('measurementSetVersion')
    .select(['id', 'source', 'doi', 'method', 'rowCount', 'sha256'])
    .where('id', 'in', [...versionIds])
    .execute();
}

/** Lowest and highest pressure (MPa) among the rows of some versions; null when none has a pressure. */
export async function pressureSpanOfVersions(
  db: Db | Tx,
  versionIds: readonly number[],
): Promise<{ lo: number | null; hi: number | null }> {
  if (!versionIds.length) return { lo: null, hi: null };
  const p = await db
    .selectFrom('measurementRow')
    .select((eb) => [eb.fn.min('pressureMpa').as('lo'), eb.fn.max('pressureMpa').as('hi')])
    .where('measurementSetVersionId', 'in', [...versionIds])
    .executeTakeFirst();
  return { lo: p?.lo != null ? Number(p.lo) : null, hi: p?.hi != null ? Number(p.hi) : null };
}
