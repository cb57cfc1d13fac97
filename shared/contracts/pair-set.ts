/**
 * Contract of a pair set (fitted k_ij, l_ij of two approved parameter sets): the answers of /api/pair-sets (list, detail,
 * create, review) and its stored JSON column (result_json: the cross-virial fit of shared/mixing/cross-virial.ts plus the
 * measurement set version fitted). Built in server/features/pair-sets/pair-sets.view.ts.
 */
import { z } from 'zod';

export const PAIR_SET_STATES = ['in_review', 'approved', 'changes_requested'] as const;
export const pairSetStateSchema = z.enum(PAIR_SET_STATES);
export type PairSetState = z.infer<typeof pairSetStateSchema>;

/** result_json as createPairSet writes it (CrossFitResult + measurementSetVersion); JSON turns a non-finite number into null. */
export const pairSetResultStored = z.strictObject({
  kij: z.number(),
  kijStdErr: z.number().nullable(),
  kijStdErrData: z.number().nullable(),
  kijStdErrPure: z.number().nullable(),
  lij: z.number().nullable(),
  lijStdErr: z.number().nullable(),
  epsilon12K: z.number(),
  epsilon12KStdErr: z.number().nullable(),
  sigma12Angstrom: z.number(),
  sigma12AngstromStdErr: z.number().nullable(),
  chi2: z.number().nullable(),
  dof: z.number(),
  reducedChi2: z.number().nullable(),
  converged: z.boolean(),
  residuals: z.array(
    z.strictObject({
      temperatureK: z.number(),
      measured: z.number(),
      uncertainty: z.number(),
      predicted: z.number(),
      combiningRule: z.number(),
    }),
  ),
  chi2CombiningRule: z.number().nullable(),
  method: z.string(),
  measurementSetVersion: z.number().int(),
});
export type PairSetResult = z.infer<typeof pairSetResultStored>;

const pairMemberView = z.strictObject({
  id: z.number().int(),
  version: z.number().int(),
  substanceId: z.number().int(),
  substanceName: z.string(),
  epsilonK: z.number(),
  sigmaAngstrom: z.number(),
});
const personRef = z.strictObject({ id: z.string(), name: z.string() });

/** A pair set as the API answers it (units in every name). */
export const pairSetView = z.strictObject({
  id: z.number().int(),
  state: pairSetStateSchema,
  setA: pairMemberView,
  setB: pairMemberView,
  measurementSet: z.strictObject({ id: z.number().int(), name: z.string(), version: z.number().int(), versionId: z.number().int() }),
  fitLij: z.boolean(),
  kij: z.number(),
  kijStdErr: z.number().nullable(),
  lij: z.number().nullable(),
  lijStdErr: z.number().nullable(),
  epsilon12K: z.number(),
  epsilon12StdErrK: z.number().nullable(),
  sigma12Angstrom: z.number(),
  sigma12StdErrAngstrom: z.number().nullable(),
  result: pairSetResultStored,
  createdBy: personRef,
  createdAt: z.string(),
  reviewedBy: personRef.nullable(),
  reviewedAt: z.string().nullable(),
  reviewComment: z.string().nullable(),
});
export type PairSetView = z.infer<typeof pairSetView>;
export const pairSetListView = z.strictObject({ pairSets: z.array(pairSetView) });
export type PairSetList = z.infer<typeof pairSetListView>;
