import type { ParameterSetState } from '../../../shared/parameter-sets/transitions';
import type { CutoffScheme } from '../../../shared/physics/cutoff-schemes';
import type { Insertable } from 'kysely';
import type { Db, Tx } from '../../db/database';
import type { ParameterSetTable, ParameterSetTransitionTable } from './parameter-sets.table';

const SET_COLUMNS = [
  'parameterSet.id',
  'parameterSet.substanceId',
  'substance.name as substanceName',
  'parameterSet.scheme',
  'parameterSet.cutoffSigma',
  'parameterSet.version',
  'parameterSet.fitId',
  'fit.number as fitNumber',
  'fit.createdBy as fitCreatedBy',
  'parameterSet.revisionOf',
  'parameterSet.model',
  'parameterSet.potential',
  'parameterSet.repulsiveExponent',
  'parameterSet.epsilonK',
  'parameterSet.sigmaAngstrom',
  'parameterSet.epsilonStdErrK',
  'parameterSet.sigmaStdErrAngstrom',
  'parameterSet.correlation',
  'parameterSet.measurementSetsJson',
  'parameterSet.temperatureMinK',
  'parameterSet.temperatureMaxK',
  'parameterSet.pressureMinMpa',
  'parameterSet.pressureMaxMpa',
  'parameterSet.rationale',
  'parameterSet.state',
  'parameterSet.createdBy',
  'author.name as createdByName',
  'author.email as createdByEmail',
  'parameterSet.createdAt',
  'parameterSet.updatedAt',
] as const;

function baseQuery(db: Db | Tx) {
  return db
    .selectFrom('parameterSet')
    .innerJoin('substance', 'substance.id', 'parameterSet.substanceId')
    .innerJoin('fit', 'fit.id', 'parameterSet.fitId')
    .innerJoin('user as author', 'author.id', 'parameterSet.createdBy')
    .select(SET_COLUMNS)
    .select((eb) =>
      eb.selectFrom('parameterSet as rev').select('rev.id').whereRef('rev.revisionOf', '=', 'parameterSet.id').as('revisedBy'),
    );
}

export type ParameterSetRow = NonNullable<Awaited<ReturnType<typeof findParameterSet>>>;

export async function findParameterSet(db: Db | Tx, id: number) {
  return baseQuery(db).where('parameterSet.id', '=', id).executeTakeFirst();
}

export async function listParameterSets(db: Db | Tx, filter: { substanceId?: number; states?: readonly ParameterSetState[] } = {}) {
  let q = baseQuery(db);
  if (filter.substanceId !== undefined) q = q.where('parameterSet.substanceId', '=', filter.substanceId);
  if (filter.states) q = q.where('parameterSet.state', 'in', [...filter.states]);
  return q.orderBy('substance.name').orderBy('parameterSet.scheme').orderBy('parameterSet.version', 'desc').execute();
}

/** Sets in review that the reviewer neither drafted nor fitted (four-eyes), oldest submission first. */
export async function listReviewQueue(db: Db | Tx, reviewerId: string) {
  return baseQuery(db)
    .select((eb) =>
      eb
        .selectFrom('parameterSetTransition as t')
        .select((e) => e.fn.max('t.at').as('at'))
        .whereRef('t.parameterSetId', '=', 'parameterSet.id')
        .where('t.toState', '=', 'in_review')
        .as('submittedAt'),
    )
    .where('parameterSet.state', '=', 'in_review')
    .where('parameterSet.createdBy', '!=', reviewerId)
    .where('fit.createdBy', '!=', reviewerId)
    .orderBy('submittedAt')
    .execute();
}

export async function nextVersion(tx: Tx, substanceId: number, scheme: CutoffScheme): Promise<number> {
  const row = await tx
    .selectFrom('parameterSet')
    .select((eb) => eb.fn.max('version').as('v'))
    .where('substanceId', '=', substanceId)
    .where('scheme', '=', scheme)
    .executeTakeFirst();
  return Number(row?.v ?? 0) + 1;
}

/** Approved sets of one substance and scheme (normally one), newest first. */
/** Approved sets of a substance and scheme; with `potential`, of that potential only (a Mie set never supersedes a 12-6 one). */
export async function approvedOf(db: Db | Tx, substanceId: number, scheme: CutoffScheme, potential?: 'lj-12-6' | 'mie') {
  return baseQuery(db)
    .where('parameterSet.substanceId', '=', substanceId)
    .where('parameterSet.scheme', '=', scheme)
    .$if(potential !== undefined, (q) => q.where('parameterSet.potential', '=', potential!))
    .where('parameterSet.state', '=', 'approved')
    .orderBy('parameterSet.version', 'desc')
    .execute();
}

export async function historyOf(db: Db | Tx, parameterSetId: number) {
  return db
    .selectFrom('parameterSetTransition as t')
    .leftJoin('user', 'user.id', 't.actorId')
    .select(['t.id', 't.move', 't.fromState', 't.toState', 't.actorId', 'user.name as actorName', 't.comment', 't.at'])
    .where('t.parameterSetId', '=', parameterSetId)
    .orderBy('t.id')
    .execute();
}

export async function commentsOf(db: Db | Tx, parameterSetId: number) {
  return db
    .selectFrom('parameterSetComment as c')
    .innerJoin('user', 'user.id', 'c.authorId')
    .select(['c.id', 'c.authorId', 'user.name as authorName', 'c.body', 'c.createdAt'])
    .where('c.parameterSetId', '=', parameterSetId)
    .orderBy('c.id')
    .execute();
}

export async function emailOf(db: Db | Tx, userId: string): Promise<string | null> {
  const row = await db.selectFrom('user').select('email').where('id', '=', userId).where('active', '=', 1).executeTakeFirst();
  return row?.email ?? null;
}

export async function insertParameterSet(tx: Tx, values: Insertable<ParameterSetTable>): Promise<number> {
  const { id } = await tx.insertInto('parameterSet').values(values).returning('id').executeTakeFirstOrThrow();
  return id;
}

/** One row of the append-only history; a trigger refuses a state change without it. */
export async function insertTransition(tx: Tx, values: Insertable<ParameterSetTransitionTable>) {
  await tx.insertInto('parameterSetTransition').values(values).execute();
}

export async function updateParameterSet(
  tx: Tx,
  id: number,
  values: Partial<
    Pick<
      ParameterSetTable,
      'state' | 'rationale' | 'temperatureMinK' | 'temperatureMaxK' | 'pressureMinMpa' | 'pressureMaxMpa' | 'updatedAt'
    >
  >,
) {
  await tx.updateTable('parameterSet').set(values).where('id', '=', id).execute();
}

export async function insertComment(
  tx: Tx,
  values: { parameterSetId: number; authorId: string; body: string; createdAt: string },
): Promise<number> {
  const { id } = await tx.insertInto('parameterSetComment').values(values).returning('id').executeTakeFirstOrThrow();
  return id;
}
