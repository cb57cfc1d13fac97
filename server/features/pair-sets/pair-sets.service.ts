/**
 * Pair sets: k_ij (and optionally l_ij) fitted to a B12 measurement set with two approved parameter sets held fixed
 * (shared/mixing/cross-virial.ts), then reviewed by a reviewer who is not the author. Approved pair sets replace the
 * combining rule for their pair on the Mixtures page and in every mixture export (see `approvedPairsFor`).
 */
import type { FittedPair } from '../../../shared/mixing/combining-rules';
import { fitCrossInteraction } from '../../../shared/mixing/cross-virial';
import type { PairSetView } from '../../../shared/contracts/pair-set';
import type { PairSetCreateBody } from '../../../shared/schemas/pair-sets';
import type { CurrentUser } from '../../common/auth-middleware';
import { AppError, conflict, notFound, unprocessable } from '../../common/errors';
import type { Db, Tx } from '../../db/database';
import { recordAudit } from '../audit/audit.service';
import { loadVersionForFit } from '../measurement-sets/measurement-sets.service';
import {
  approvedPairRows,
  findPairSet,
  fittedVersionOf,
  insertPairSet,
  latestVersionOf,
  measurementSetForPair,
  pairMemberOf,
  pairSetRows,
  personName,
  updatePairSet,
  type PairSetRow,
} from './pair-sets.repository';
import type { PairSetState } from './pair-sets.table';
import { toPairSetView } from './pair-sets.view';

export async function createPairSet(db: Db, actor: CurrentUser, body: PairSetCreateBody): Promise<PairSetView> {
  const [idA, idB] = [...body.parameterSetIds].sort((x, y) => x - y);
  return db.transaction().execute(async (tx) => {
    const sets = [await pairMemberOf(tx, idA), await pairMemberOf(tx, idB)];
    sets.forEach((s, k) => {
      const field = `parameterSetIds.${body.parameterSetIds.indexOf(k === 0 ? idA : idB)}`;
      if (!s) throw unprocessable(`Parameter set ${k === 0 ? idA : idB} was not found.`, [{ field, message: 'no such parameter set' }]);
      if (s.state !== 'approved')
        throw unprocessable(`Parameter set ${s.id} is ${s.state.replace('_', ' ')}; a pair set needs two approved sets.`, [
          { field, message: `state ${s.state}, not approved` },
        ]);
    });
    const [a, b] = sets as NonNullable<(typeof sets)[number]>[];
    if (a.substanceId === b.substanceId)
      throw unprocessable('Both parameter sets belong to the same substance; a pair needs two substances.', [
        { field: 'parameterSetIds', message: 'same substance' },
      ]);
    const measurementSet = await measurementSetForPair(tx, body.measurementSetId);
    if (!measurementSet)
      throw unprocessable(`Measurement set ${body.measurementSetId} was not found.`, [
        { field: 'measurementSetId', message: 'no such measurement set' },
      ]);
    if (measurementSet.kind !== 'b12')
      throw unprocessable(
        `Measurement set "${measurementSet.name}" holds ${measurementSet.kind} data; a pair set is fitted to cross second virial coefficients (B12).`,
        [{ field: 'measurementSetId', message: `kind ${measurementSet.kind}, not b12` }],
      );
    if (measurementSet.withdrawnAt)
      throw unprocessable(`Measurement set "${measurementSet.name}" was withdrawn.`, [{ field: 'measurementSetId', message: 'withdrawn' }]);
    if (measurementSet.substanceId !== a.substanceId && measurementSet.substanceId !== b.substanceId) {
      throw unprocessable(`Measurement set "${measurementSet.name}" belongs to neither substance of the pair.`, [
        { field: 'measurementSetId', message: 'not a measurement set of either substance' },
      ]);
    }
    const version = await latestVersionOf(tx, measurementSet.id);
    const rows = await loadVersionForFit(tx, version.id);
    const pure = (s: typeof a) => ({
      epsilonK: s.epsilonK,
      sigmaAngstrom: s.sigmaAngstrom,
      stdErr: { epsilonK: s.epsilonStdErrK, sigmaAngstrom: s.sigmaStdErrAngstrom },
      correlation: s.correlation,
    });
    let result;
    try {
      result = fitCrossInteraction(
        pure(a),
        pure(b),
        rows.map((r) => ({ temperatureK: r.temperatureK, b12Cm3PerMol: r.value, uB12Cm3PerMol: r.uncertainty })),
        { fitLij: body.fitLij ?? false },
      );
    } catch (err) {
      throw unprocessable(`The pair-set fit cannot run: ${err instanceof Error ? err.message : String(err)}`, [
        { field: 'measurementSetId', message: 'fit input refused' },
      ]);
    }
    if (!result.converged)
      throw new AppError(422, 'fit_failed', 'The k_ij fit did not converge; check the B12 table.', [
        { field: 'measurementSetId', message: 'fit did not converge' },
      ]);
    const now = new Date().toISOString();
    const pairSetId = await insertPairSet(tx, {
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
    });
    await recordAudit(tx, {
      actor,
      action: 'pairSet.submitted',
      targetType: 'pair_set',
      targetId: pairSetId,
      summary: `${actor.email} fitted k_ij = ${result.kij.toFixed(4)} ± ${result.kijStdErr?.toFixed(4) ?? '?'} for ${a.substanceName} + ${b.substanceName} and sent it to review`,
      after: {
        firstSetId: a.id,
        secondSetId: b.id,
        measurementSetVersionId: version.id,
        kij: result.kij,
        kijStdErr: result.kijStdErr,
        lij: result.lij,
      },
    });
    return (await pairSetView(tx, pairSetId))!;
  });
}

export async function pairSetView(db: Db | Tx, id: number): Promise<PairSetView | null> {
  const r = await findPairSet(db, id);
  if (!r) return null;
  return toView(db, r);
}

/** A row with what its view names (its two sets, the fitted version, the people), as the API shows it. */
async function toView(db: Db | Tx, r: PairSetRow): Promise<PairSetView> {
  const person = async (id: string | null) => (id ? { id, name: await personName(db, id) } : null);
  return toPairSetView(r, {
    setA: (await pairMemberOf(db, r.firstSetId))!,
    setB: (await pairMemberOf(db, r.secondSetId))!,
    measurementSet: await fittedVersionOf(db, r.measurementSetVersionId),
    createdBy: (await person(r.createdBy))!,
    reviewedBy: await person(r.reviewedBy),
  });
}

export async function listPairSets(db: Db, state?: PairSetState): Promise<PairSetView[]> {
  const rows = await pairSetRows(db, state);
  const out: PairSetView[] = [];
  for (const r of rows) out.push(await toView(db, r));
  return out;
}

/** Approve or send back a pair set in review; never the author's own (four eyes). */
export async function reviewPairSet(
  db: Db,
  actor: CurrentUser,
  id: number,
  decision: 'approve' | 'request-changes',
  comment: string | undefined,
): Promise<PairSetView> {
  return db.transaction().execute(async (tx) => {
    const r = await findPairSet(tx, id);
    if (!r) throw notFound(`Pair set ${id}`);
    if (r.state !== 'in_review') throw conflict(`Pair set ${id} is ${r.state.replace('_', ' ')}, not in review.`);
    if (r.createdBy === actor.id) throw new AppError(403, 'four_eyes', 'A pair set is reviewed by someone other than its author.');
    if (decision === 'request-changes' && !comment)
      throw new AppError(400, 'validation_failed', 'Say what should change.', [
        { field: 'comment', message: 'required when requesting changes' },
      ]);
    const state = decision === 'approve' ? 'approved' : 'changes_requested';
    const now = new Date().toISOString();
    await updatePairSet(tx, id, { state, reviewedBy: actor.id, reviewedAt: now, reviewComment: comment ?? null });
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
  const rows = await approvedPairRows(db, setIds);
  const seen = new Set<string>();
  const out: FittedPair[] = [];
  for (const r of rows) {
    const key = `${r.firstSetId}-${r.secondSetId}`;
    if (seen.has(key)) continue;
    seen.add(key);
    out.push({
      pairSetId: r.id,
      setIdA: r.firstSetId,
      setIdB: r.secondSetId,
      kij: r.kij,
      kijStdErr: r.kijStdErr,
      lij: r.lij,
      epsilonK: r.epsilon12K,
      sigmaAngstrom: r.sigma12Angstrom,
      epsilonStdErrK: r.epsilon12StdErrK,
      sigmaStdErrAngstrom: r.sigma12StdErrAngstrom,
    });
  }
  return out;
}
