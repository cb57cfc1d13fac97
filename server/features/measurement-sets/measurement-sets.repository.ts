import type { Db, Tx } from '../../db/database';

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
    .select(['measurementSetWithdrawal.withdrawnAt', 'measurementSetWithdrawal.reason as withdrawnReason', 'measurementSetWithdrawal.withdrawnBy'])
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
  return db.selectFrom('measurementSetVersion').selectAll().where('measurementSetId', '=', measurementSetId).where('version', '=', version).executeTakeFirst();
}

export async function rowsOfVersion(db: Db | Tx, measurementSetVersionId: number) {
  return db.selectFrom('measurementRow').selectAll().where('measurementSetVersionId', '=', measurementSetVersionId).orderBy('position').execute();
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
      eb('measurementSetVersion.version', '=', selectFrom('measurementSetVersion as v2').select((e) => e.fn.max('v2.version').as('m')).whereRef('v2.measurementSetId', '=', 'measurementSet.id')),
    );
  if (substanceId !== undefined) q = q.where('measurementSet.substanceId', '=', substanceId);
  return q.orderBy('measurementSet.kind').orderBy('measurementSet.name').execute();
}
