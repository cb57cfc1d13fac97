import { pairSetResultStored, type PairSetView } from '../../../shared/contracts/pair-set';
import { readStoredJson } from '../../../shared/schemas/old-names';
import type { fittedVersionOf, PairMember, PairSetRow } from './pair-sets.repository';

/** What a pair set's view names besides its own row: its two sets, the fitted version and the people. */
export interface PairSetRelated {
  setA: PairMember;
  setB: PairMember;
  measurementSet: Awaited<ReturnType<typeof fittedVersionOf>>;
  createdBy: { id: string; name: string };
  reviewedBy: { id: string; name: string } | null;
}

const member = (s: PairMember) => ({
  id: s.id,
  version: s.version,
  substanceId: s.substanceId,
  substanceName: s.substanceName,
  epsilonK: s.epsilonK,
  sigmaAngstrom: s.sigmaAngstrom,
});

/** One pair set as the API shows it; result_json is parsed with its contract (after renaming old keys). */
export function toPairSetView(r: PairSetRow, related: PairSetRelated): PairSetView {
  return {
    id: r.id,
    state: r.state,
    setA: member(related.setA),
    setB: member(related.setB),
    measurementSet: { ...related.measurementSet, versionId: r.measurementSetVersionId },
    fitLij: r.fitLij === 1,
    kij: r.kij,
    kijStdErr: r.kijStdErr,
    lij: r.lij,
    lijStdErr: r.lijStdErr,
    epsilon12K: r.epsilon12K,
    epsilon12StdErrK: r.epsilon12StdErrK,
    sigma12Angstrom: r.sigma12Angstrom,
    sigma12StdErrAngstrom: r.sigma12StdErrAngstrom,
    result: pairSetResultStored.parse(readStoredJson(r.resultJson)),
    createdBy: related.createdBy,
    createdAt: r.createdAt,
    reviewedBy: related.reviewedBy,
    reviewedAt: r.reviewedAt,
    reviewComment: r.reviewComment,
  };
}
