import type { Insertable } from 'kysely';
import { PUBLISHED_STATES } from '../../../shared/parameter-sets/transitions';
import type { Db, Tx } from '../../db/database';
import type { FitTable } from './fits.table';

/** A fit with its job, substance and author. */
export async function findFit(db: Db | Tx, id: number) {
  return db
    .selectFrom('fit')
    .innerJoin('job', 'job.id', 'fit.jobId')
    .innerJoin('substance', 'substance.id', 'fit.substanceId')
    .innerJoin('user', 'user.id', 'fit.createdBy')
    .select([
      'fit.id',
      'fit.number',
      'fit.substanceId',
      'substance.name as substanceName',
      'fit.model',
      'fit.measurementSetsJson',
      'fit.optionsJson',
      'fit.codeVersion',
      'fit.createdAt',
      'fit.createdBy',
      'user.name as createdByName',
      'job.id as jobId',
      'job.status',
      'job.progress',
      'job.stage',
      'job.resultJson',
      'job.error',
      'job.startedAt',
      'job.finishedAt',
      'job.seed',
    ])
    .where('fit.id', '=', id)
    .executeTakeFirst();
}
export type FitRow = NonNullable<Awaited<ReturnType<typeof findFit>>>;

/** A substance's fits, newest first, with what their list shows. */
export async function listFitRowsOfSubstance(db: Db | Tx, substanceId: number) {
  return db
    .selectFrom('fit')
    .innerJoin('job', 'job.id', 'fit.jobId')
    .innerJoin('user', 'user.id', 'fit.createdBy')
    .select([
      'fit.id',
      'fit.number',
      'fit.createdAt',
      'user.name as createdByName',
      'fit.measurementSetsJson',
      'job.status',
      'job.progress',
      'job.resultJson',
    ])
    .where('fit.substanceId', '=', substanceId)
    .orderBy('fit.number', 'desc')
    .execute();
}
export type FitListRow = Awaited<ReturnType<typeof listFitRowsOfSubstance>>[number];

/** True when an approved, superseded or retired parameter set was drafted from the fit. */
export async function backsPublishedSet(db: Db | Tx, fitId: number): Promise<boolean> {
  const row = await db
    .selectFrom('parameterSet')
    .select('id')
    .where('fitId', '=', fitId)
    .where('state', 'in', [...PUBLISHED_STATES])
    .executeTakeFirst();
  return row !== undefined;
}

/** The next fit number of a substance (1 for its first fit); call inside the transaction that inserts the fit. */
export async function nextFitNumber(tx: Tx, substanceId: number): Promise<number> {
  const last = await tx
    .selectFrom('fit')
    .select((eb) => eb.fn.max('number').as('n'))
    .where('substanceId', '=', substanceId)
    .executeTakeFirst();
  return Number(last?.n ?? 0) + 1;
}

export async function insertFit(tx: Tx, values: Insertable<FitTable>): Promise<number> {
  return (await tx.insertInto('fit').values(values).returning('id').executeTakeFirstOrThrow()).id;
}
