import type { Generated } from 'kysely';

export type PairSetState = 'in_review' | 'approved' | 'changes_requested';

export interface PairSetTable {
  id: Generated<number>;
  /** The two approved parameter sets, lower id first. */
  firstSetId: number;
  secondSetId: number;
  /** The B12 measurement-set version fitted. */
  measurementSetVersionId: number;
  fitLij: number;
  kij: number;
  kijStdErr: number | null;
  lij: number | null;
  lijStdErr: number | null;
  epsilon12K: number;
  epsilon12StdErrK: number | null;
  sigma12Angstrom: number;
  sigma12StdErrAngstrom: number | null;
  resultJson: string;
  state: PairSetState;
  createdBy: string;
  createdAt: string;
  reviewedBy: string | null;
  reviewedAt: string | null;
  reviewComment: string | null;
}
