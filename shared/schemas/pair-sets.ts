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

// The pair set's answer (PairSetView) and its states are in shared/contracts/pair-set.ts.
