import { z } from 'zod';
import { acceptOldFields } from './old-names';

/** POST /api/pair-sets: fit k_ij (and l_ij with fitLij) to a B12 measurement set with two approved parameter sets fixed. */
export const pairSetCreateBody = z.object({
  parameterSetIds: z
    .array(z.number().int().positive())
    .length(2, 'give exactly two approved parameter sets')
    .refine((ids) => ids[0] !== ids[1], 'the two parameter sets must differ'),
  measurementSetId: z.number().int().positive(),
  fitLij: z.boolean().optional(),
});
acceptOldFields(pairSetCreateBody, [['datasetId', 'measurementSetId']]); // vocabulary: keep (the old name, still accepted)
export type PairSetCreateBody = z.infer<typeof pairSetCreateBody>;

export const pairSetReviewBody = z.object({
  decision: z.enum(['approve', 'request-changes']),
  comment: z.string().trim().max(2000).optional(),
});

export const pairSetListQuery = z.object({
  state: z.enum(['in_review', 'approved', 'changes_requested']).optional(),
});

export type PairSetState = 'in_review' | 'approved' | 'changes_requested';

/** A pair set as the API returns it (units in every name). */
export interface PairSetView {
  id: number;
  state: PairSetState;
  setA: { id: number; version: number; substanceId: number; substanceName: string; epsilonK: number; sigmaAngstrom: number };
  setB: { id: number; version: number; substanceId: number; substanceName: string; epsilonK: number; sigmaAngstrom: number };
  measurementSet: { id: number; name: string; version: number; versionId: number };
  fitLij: boolean;
  kij: number;
  kijStdErr: number | null;
  lij: number | null;
  lijStdErr: number | null;
  epsilon12K: number;
  epsilon12StdErrK: number | null;
  sigma12Angstrom: number;
  sigma12StdErrAngstrom: number | null;
  result: unknown;
  createdBy: { id: string; name: string };
  createdAt: string;
  reviewedBy: { id: string; name: string } | null;
  reviewedAt: string | null;
  reviewComment: string | null;
}
