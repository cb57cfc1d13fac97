import type { ParameterSetState } from '../../../shared/parameter-sets/transitions';
import type { CutoffScheme } from '../../../shared/physics/cutoff-schemes';
import type { Db, Tx } from '../../db/database';

/** Parameter sets with what the catalog shows beside the values: substance, approval and older versions. */
function catalogQuery(db: Db | Tx) {
  return (
    db
      .selectFrom('parameterSet as ps')
      .innerJoin('substance', 'substance.id', 'ps.substanceId')
      .select([
        'ps.id',
        'ps.substanceId',
        'substance.name as substanceName',
        'substance.formula',
        'substance.molarMassGramsPerMol',
        'ps.scheme',
        'ps.cutoffSigma',
        'ps.version',
        'ps.fitId',
        'ps.model',
        'ps.potential',
        'ps.repulsiveExponent',
        'ps.epsilonK',
        'ps.sigmaAngstrom',
        'ps.epsilonStdErrK',
        'ps.sigmaStdErrAngstrom',
        'ps.correlation',
        'ps.measurementSetsJson',
        'ps.temperatureMinK',
        'ps.temperatureMaxK',
        'ps.pressureMinMpa',
        'ps.pressureMaxMpa',
        'ps.state',
        'ps.createdAt',
      ])
      // The newest approve move (a set is approved once; max keeps the query safe if that ever changes).
      .select((eb) =>
        eb
          .selectFrom('parameterSetTransition as t')
          .select((e) => e.fn.max('t.id').as('tid'))
          .whereRef('t.parameterSetId', '=', 'ps.id')
          .where('t.move', '=', 'approve')
          .as('approveTransitionId'),
      )
      .select((eb) =>
        eb
          .selectFrom('parameterSet as older')
          .select((e) => e.fn.countAll<number>().as('n'))
          .whereRef('older.substanceId', '=', 'ps.substanceId')
          .whereRef('older.scheme', '=', 'ps.scheme')
          .whereRef('older.version', '<', 'ps.version')
          .where('older.state', 'in', ['superseded', 'retired'])
          .as('olderPublished'),
      )
  );
}

export type CatalogRow = Awaited<ReturnType<typeof listCatalogRows>>[number];

export async function listCatalogRows(db: Db | Tx, states: readonly ParameterSetState[]) {
  return catalogQuery(db)
    .where('ps.state', 'in', [...states])
    .orderBy('substance.name')
    .orderBy('ps.scheme')
    .orderBy('ps.version', 'desc')
    .execute();
}

export async function findCatalogRow(db: Db | Tx, id: number) {
  return catalogQuery(db).where('ps.id', '=', id).executeTakeFirst();
}

/** Every version of one substance and scheme in the given states, oldest first. */
export async function versionRows(db: Db | Tx, substanceId: number, scheme: CutoffScheme, states: readonly ParameterSetState[]) {
  return catalogQuery(db)
    .where('ps.substanceId', '=', substanceId)
    .where('ps.scheme', '=', scheme)
    .where('ps.state', 'in', [...states])
    .orderBy('ps.version')
    .execute();
}

/** Who approved, when, and with what comment, by transition ids. */
export async function approvals(db: Db | Tx, transitionIds: number[]) {
  if (!transitionIds.length) return new Map<number, { at: string; actorName: string | null; comment: string | null }>();
  const rows = await db
    .selectFrom('parameterSetTransition as t')
    .leftJoin('user', 'user.id', 't.actorId')
    .select(['t.id', 't.at', 'user.name as actorName', 't.comment'])
    .where('t.id', 'in', transitionIds)
    .execute();
  return new Map(rows.map((r) => [r.id, { at: r.at, actorName: r.actorName, comment: r.comment }]));
}
