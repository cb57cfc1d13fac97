/**
 * Pair sets: k_ij (and optionally l_ij) fitted to a B12 measurement set with two approved parameter sets held fixed
 * (shared/mixing/cross-virial.ts), then reviewed by a reviewer who is not the author. Approved pair sets replace the
 * combining rule for their pair on the Mixtures page and in every mixture export (see `approvedPairsFor`).
 */
import type { FittedPair } from '../../../shared/mixing/combining-rules';
import { fitCrossInteraction } from '../../../shared/mixing/cross-virial';
import type { PairSetCreateBody, PairSetView } from '../../../shared/schemas/pair-sets';
import type { CurrentUser } from '../../common/auth-middleware';
import { AppError, conflict, notFound, unprocessable } from '../../common/errors';
import type { Db, Tx } from '../../db/database';
import { recordAudit } from '../audit/audit.service';
import { loadVersionForFit } from '../measurement-sets/measurement-sets.service';
import type { PairSetState } from './pair-sets.table';
import { readStoredJson } from '../../../shared/schemas/old-names';

async function setOf(db: Db | Tx, id: number) {
  return db
    .selectFrom('parameterSet')
    .innerJoin('substance', 'substance.id', 'parameterSet.substanceId')
    .select(['parameterSet.id', 'parameterSet.version', 'parameterSet.state', 'parameterSet.substanceId', 'substance.name as substanceName', 'parameterSet.epsilonK', 'parameterSet.sigmaAngstrom', 'parameterSet.epsilonStdErrK', 'parameterSet.sigmaStdErrAngstrom', 'parameterSet.correlation'])
    .where('parameterSet.id', '=', id)
    .executeTakeFirst();
}

export async function createPairSet(db: Db, actor: CurrentUser, body: PairSetCreateBody): Promise<PairSetView> {
  const [idA, idB] = [...body.parameterSetIds].sort((x, y) => x - y);
  return db.transaction().execute(async (tx) => {
    const sets = [await setOf(tx, idA), await setOf(tx, idB)];
    sets.forEach((s, k) => {
      const field = `parameterSetIds.${body.parameterSetIds.indexOf(k === 0 ? idA : idB)}`;
      if (!s) throw unprocessable(`Parameter set ${k === 0 ? idA : idB} was not found.`, [{ field, message: 'no such parameter set' }]);
      if (s.state !== 'approved') throw unprocessable(`Parameter set ${s.id} is ${s.state.replace('_', ' ')}; a pair set needs two approved sets.`, [{ field, message: `state ${s.state}, not approved` }]);
    });
    const [a, b] = sets as NonNullable<(typeof sets)[number]>[];
    if (a.substanceId === b.substanceId) throw unprocessable('Both parameter sets belong to the same substance; a pair needs two substances.', [{ field: 'parameterSetIds', message: 'same substance' }]);
    const measurementSet = await tx
      .selectFrom('measurementSet')
      .leftJoin('measurementSetWithdrawal', 'measurementSetWithdrawal.measurementSetId', 'measurementSet.id')
      .select(['measurementSet.id', 'measurementSet.name', 'measurementSet.kind', 'measurementSet.substanceId', 'measurementSetWithdrawal.withdrawnAt'])
      .where('measurementSet.id', '=', body.measurementSetId)
      .executeTakeFirst();
    if (!measurementSet) throw unprocessable(`Measurement set ${body.measurementSetId} was not found.`, [{ field: 'measurementSetId', message: 'no such measurement set' }]);
    if (measurementSet.kind !== 'b12') throw unprocessable(`Measurement set "${measurementSet.name}" holds ${measurementSet.kind} data; a pair set is fitted to cross second virial coefficients (B12).`, [{ field: 'measurementSetId', message: `kind ${measurementSet.kind}, not b12` }]);
    if (measurementSet.withdrawnAt) throw unprocessable(`Measurement set "${measurementSet.name}" was withdrawn.`, [{ field: 'measurementSetId', message: 'withdrawn' }]);
    if (measurementSet.substanceId !== a.substanceId && measurementSet.substanceId !== b.substanceId) {
      throw unprocessable(`Measurement set "${measurementSet.name}" belongs to neither substance of the pair.`, [{ field: 'measurementSetId', message: 'not a measurement set of either substance' }]);
    }
    const version = await tx.selectFrom('measurementSetVersion').select(['id', 'version']).where('measurementSetId', '=', measurementSet.id).orderBy('version', 'desc').executeTakeFirstOrThrow();
    const rows = await loadVersionForFit(tx, version.id);
    const pure = (s: typeof a) => ({ epsilonK: s.epsilonK, sigmaAngstrom: s.sigmaAngstrom, stdErr: { epsilonK: s.epsilonStdErrK, sigmaAngstrom: s.sigmaStdErrAngstrom }, correlation: s.correlation });
    let result;
    try {
      result = fitCrossInteraction(pure(a), pure(b), rows.map((r) => ({ temperatureK: r.temperatureK, b12Cm3PerMol: r.value, uB12Cm3PerMol: r.uncertainty })), { fitLij: body.fitLij ?? false });
    } catch (err) {
      throw unprocessable(`The pair-set fit cannot run: ${err instanceof Error ? err.message : String(err)}`, [{ field: 'measurementSetId', message: 'fit input refused' }]);
    }
    if (!result.converged) throw new AppError(422, 'fit_failed', 'The k_ij fit did not converge; check the B12 table.', [{ field: 'measurementSetId', message: 'fit did not converge' }]);
    const now = new Date().toISOString();
    const row = await tx
      .insertInto('pairSet')
      .values({
        firstSetId: a.id,
        secondSetId: b.id,
        measurementSetVersionId: version.id,
        fitLij: body.fitLij ? 1 : 0,
        kij: result.kij,
        kijStdErr: result.kijStdErr,
        lij: result.lij,
        lijStdErr: result.lijStdErr,
        epsilon12K: result.epsilon12K,
        epsilon12StdErrK: result.epsilon12KStdErr,
        sigma12Angstrom: result.sigma12Angstrom,
        sigma12StdErrAngstrom: result.sigma12AngstromStdErr,
        resultJson: JSON.stringify({ ...result, measurementSetVersion: version.version }),
        state: 'in_review',
        createdBy: actor.id,
        createdAt: now,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    await recordAudit(tx, {
      actor,
      action: 'pairSet.submitted',
      targetType: 'pair_set',
      targetId: row.id,
      summary: `${actor.email} fitted k_ij = ${result.kij.toFixed(4)} ± ${result.kijStdErr?.toFixed(4) ?? '?'} for ${a.substanceName} + ${b.substanceName} and sent it to review`,
      after: { firstSetId: a.id, secondSetId: b.id, measurementSetVersionId: version.id, kij: result.kij, kijStdErr: result.kijStdErr, lij: result.lij },
    });
    return (await pairSetView(tx, row.id))!;
  });
}

export async function pairSetView(db: Db | Tx, id: number): Promise<PairSetView | null> {
  const r = await db.selectFrom('pairSet').selectAll().where('id', '=', id).executeTakeFirst();
  if (!r) return null;
  return toView(db, r);
}

async function toView(db: Db | Tx, r: Awaited<ReturnType<typeof rowsQuery>>[number]): Promise<PairSetView> {
  const [a, b] = [await setOf(db, r.firstSetId), await setOf(db, r.secondSetId)];
  const ds = await db.selectFrom('measurementSetVersion').innerJoin('measurementSet', 'measurementSet.id', 'measurementSetVersion.measurementSetId').select(['measurementSet.id', 'measurementSet.name', 'measurementSetVersion.version']).where('measurementSetVersion.id', '=', r.measurementSetVersionId).executeTakeFirstOrThrow();
  const person = async (id: string | null) => (id ? { id, name: (await db.selectFrom('user').select('name').where('id', '=', id).executeTakeFirst())?.name ?? id } : null);
  const brief = (s: NonNullable<typeof a>) => ({ id: s.id, version: s.version, substanceId: s.substanceId, substanceName: s.substanceName, epsilonK: s.epsilonK, sigmaAngstrom: s.sigmaAngstrom });
  return {
    id: r.id,
    state: r.state,
    setA: brief(a!),
    setB: brief(b!),
    measurementSet: { id: ds.id, name: ds.name, version: ds.version, versionId: r.measurementSetVersionId },
    fitLij: r.fitLij === 1,
    kij: r.kij,
    kijStdErr: r.kijStdErr,
    lij: r.lij,
    lijStdErr: r.lijStdErr,
    epsilon12K: r.epsilon12K,
    epsilon12StdErrK: r.epsilon12StdErrK,
    sigma12Angstrom: r.sigma12Angstrom,
    sigma12StdErrAngstrom: r.sigma12StdErrAngstrom,
    result: readStoredJson(r.resultJson) as unknown,
    createdBy: (await person(r.createdBy))!,
    createdAt: r.createdAt,
    reviewedBy: await person(r.reviewedBy),
    reviewedAt: r.reviewedAt,
    reviewComment: r.reviewComment,
  };
}

function rowsQuery(db: Db | Tx, state?: PairSetState) {
  let q = db.selectFrom('pairSet').selectAll().orderBy('id', 'desc');
  if (state) q = q.where('state', '=', state);
  return q.execute();
}

export async function listPairSets(db: Db, state?: PairSetState): Promise<PairSetView[]> {
  const rows = await rowsQuery(db, state);
  const out: PairSetView[] = [];
  for (const r of rows) out.push(await toView(db, r));
  return out;
}

/** Approve or send back a pair set in review; never the author's own (four eyes). */
export async function reviewPairSet(db: Db, actor: CurrentUser, id: number, decision: 'approve' | 'request-changes', comment: string | undefined): Promise<PairSetView> {
  return db.transaction().execute(async (tx) => {
    const r = await tx.selectFrom('pairSet').selectAll().where('id', '=', id).executeTakeFirst();
    if (!r) throw notFound(`Pair set ${id}`);
    if (r.state !== 'in_review') throw conflict(`Pair set ${id} is ${r.state.replace('_', ' ')}, not in review.`);
    if (r.createdBy === actor.id) throw new AppError(403, 'four_eyes', 'A pair set is reviewed by someone other than its author.');
    if (decision === 'request-changes' && !comment) throw new AppError(400, 'validation_failed', 'Say what should change.', [{ field: 'comment', message: 'required when requesting changes' }]);
    const state = decision === 'approve' ? 'approved' : 'changes_requested';
    const now = new Date().toISOString();
    await tx.updateTable('pairSet').set({ state, reviewedBy: actor.id, reviewedAt: now, reviewComment: comment ?? null }).where('id', '=', id).execute();
    await recordAudit(tx, {
      actor,
      action: decision === 'approve' ? 'pairSet.approved' : 'pairSet.changes_requested',
      targetType: 'pair_set',
      targetId: id,
      summary: `${actor.email} ${decision === 'approve' ? 'approved' : 'requested changes to'} pair set ${id} (k_ij = ${r.kij.toFixed(4)})`,
      before: { state: r.state },
      after: { state, comment: comment ?? null },
    });
    return (await pairSetView(tx, id))!;
  });
}

/** The newest approved pair set of each pair among the given parameter sets, for the Mixtures page and exports. */
export async function approvedPairsFor(db: Db | Tx, setIds: readonly number[]): Promise<FittedPair[]> {
  if (setIds.length < 2) return [];
  const rows = await db
    .selectFrom('pairSet')
    .selectAll()
    .where('state', '=', 'approved')
    .where('firstSetId', 'in', [...setIds])
    .where('secondSetId', 'in', [...setIds])
    .orderBy('id', 'desc')
    .execute();
  const seen = new Set<string>();
  const out: FittedPair[] = [];
  for (const r of rows) {
    const key = `${r.firstSetId}-${r.secondSetId}`;
    if (seen.has(key)) continue;
    seen.add(key);
    out.push({ pairSetId: r.id, setIdA: r.firstSetId, setIdB: r.secondSetId, kij: r.kij, kijStdErr: r.kijStdErr, lij: r.lij, epsilonK: r.epsilon12K, sigmaAngstrom: r.sigma12Angstrom, epsilonStdErrK: r.epsilon12StdErrK, sigmaStdErrAngstrom: r.sigma12StdErrAngstrom });
  }
  return out;
}
