import type { Db, Tx } from '../../db/database';

const VERSION_COLUMNS = [
  'datasetVersion.id',
  'datasetVersion.datasetId',
  'datasetVersion.version',
  'datasetVersion.sha256',
  'datasetVersion.originalFilename',
  'datasetVersion.source',
  'datasetVersion.doi',
  'datasetVersion.method',
  'datasetVersion.notes',
  'datasetVersion.defaultRelativeUncertainty',
  'datasetVersion.delimiter',
  'datasetVersion.decimal',
  'datasetVersion.columnsJson',
  'datasetVersion.rowCount',
  'datasetVersion.uploadedBy',
  'datasetVersion.uploadedAt',
] as const;

export async function findDataset(db: Db | Tx, id: number) {
  return db
    .selectFrom('dataset')
    .leftJoin('datasetWithdrawal', 'datasetWithdrawal.datasetId', 'dataset.id')
    .selectAll('dataset')
    .select(['datasetWithdrawal.withdrawnAt', 'datasetWithdrawal.reason as withdrawnReason', 'datasetWithdrawal.withdrawnBy'])
    .where('dataset.id', '=', id)
    .executeTakeFirst();
}

export async function listVersions(db: Db | Tx, datasetId: number) {
  return db
    .selectFrom('datasetVersion')
    .innerJoin('user', 'user.id', 'datasetVersion.uploadedBy')
    .select([...VERSION_COLUMNS, 'user.name as uploadedByName'])
    .where('datasetVersion.datasetId', '=', datasetId)
    .orderBy('datasetVersion.version', 'desc')
    .execute();
}

export async function latestVersionNumber(db: Db | Tx, datasetId: number): Promise<number> {
  const row = await db
    .selectFrom('datasetVersion')
    .select((eb) => eb.fn.max('version').as('v'))
    .where('datasetId', '=', datasetId)
    .executeTakeFirst();
  return Number(row?.v ?? 0);
}

export async function findVersionRow(db: Db | Tx, datasetId: number, version: number) {
  return db.selectFrom('datasetVersion').selectAll().where('datasetId', '=', datasetId).where('version', '=', version).executeTakeFirst();
}

export async function rowsOfVersion(db: Db | Tx, datasetVersionId: number) {
  return db.selectFrom('measurementRow').selectAll().where('datasetVersionId', '=', datasetVersionId).orderBy('position').execute();
}

/** Every dataset of a substance with its newest version's summary. */
export async function listDatasetsOfSubstance(db: Db | Tx, substanceId?: number) {
  let q = db
    .selectFrom('dataset')
    .innerJoin('datasetVersion', 'datasetVersion.datasetId', 'dataset.id')
    .innerJoin('substance', 'substance.id', 'dataset.substanceId')
    .leftJoin('datasetWithdrawal', 'datasetWithdrawal.datasetId', 'dataset.id')
    .select([
      'dataset.id',
      'dataset.substanceId',
      'substance.name as substanceName',
      'dataset.property',
      'dataset.name',
      'dataset.createdAt',
      'datasetVersion.version',
      'datasetVersion.id as versionId',
      'datasetVersion.rowCount',
      'datasetVersion.source',
      'datasetVersion.doi',
      'datasetVersion.uploadedAt',
      'datasetVersion.sha256',
      'datasetWithdrawal.withdrawnAt',
    ])
    .where(({ eb, selectFrom }) =>
      eb('datasetVersion.version', '=', selectFrom('datasetVersion as v2').select((e) => e.fn.max('v2.version').as('m')).whereRef('v2.datasetId', '=', 'dataset.id')),
    );
  if (substanceId !== undefined) q = q.where('dataset.substanceId', '=', substanceId);
  return q.orderBy('dataset.property').orderBy('dataset.name').execute();
}
