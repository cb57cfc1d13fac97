/**
 * Contract of GET /api/admin/validation-suite: the registry of reference checks (shared/validation) as run by this
 * server, with the checks only the test suite runs. Built in server/features/validation-suite/validation-suite.view.ts.
 */
import { z } from 'zod';
import { VALIDATION_AREAS } from '../validation/reference-check';

export const validationAreaSchema = z.enum(VALIDATION_AREAS);

/** absolute: |ours − reference| < value; relative: |ours − reference|/|reference| < value; range: lower < ours < upper. */
export const toleranceSchema = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('absolute'), value: z.number() }),
  z.strictObject({ kind: z.literal('relative'), value: z.number() }),
  z.strictObject({ kind: z.literal('range'), lower: z.number(), upper: z.number() }),
]);

/** One reference check as run on the server: the registry entry with our value and the verdict. */
export const validationCheckResultView = z.strictObject({
  id: z.string(),
  area: validationAreaSchema,
  quantity: z.string(),
  unit: z.string(),
  state: z.string(),
  source: z.string(),
  reference: z.number(),
  tolerance: toleranceSchema,
  /** The tolerance in words ("± 0.0005", "± 3 % (relative)", "between 116 and 122"). */
  toleranceText: z.string(),
  testFile: z.string(),
  ours: z.number().nullable(),
  difference: z.number().nullable(),
  passed: z.boolean(),
  durationMs: z.number(),
  error: z.string().nullable(),
});
export type ValidationCheckResult = z.infer<typeof validationCheckResultView>;

/** A check that only the test suite runs (minutes of molecular dynamics), listed with its source and tolerance. */
export const validationTestSuiteOnlyView = z.strictObject({
  id: z.string(),
  area: validationAreaSchema,
  quantity: z.string(),
  unit: z.string(),
  state: z.string(),
  source: z.string(),
  reference: z.number(),
  tolerance: z.string(),
  testFile: z.string(),
  why: z.string(),
});
export type ValidationTestSuiteOnly = z.infer<typeof validationTestSuiteOnlyView>;

export const validationSuiteRunView = z.strictObject({
  /** When this run started on this server (ISO 8601). */
  ranAt: z.string(),
  /** Package version plus the git commit when the server runs from a checkout. */
  codeVersion: z.string(),
  /** Wall time of the whole run, including pauses that let other requests through. */
  durationMs: z.number(),
  /** True when this answer is the cached run of this process (false right after a run or rerun). */
  cached: z.boolean(),
  summary: z.strictObject({ total: z.number().int(), passed: z.number().int(), failed: z.number().int(), testSuiteOnly: z.number().int() }),
  areas: z.array(validationAreaSchema),
  checks: z.array(validationCheckResultView),
  testSuiteOnly: z.array(validationTestSuiteOnlyView),
});
export type ValidationSuiteRun = z.infer<typeof validationSuiteRunView>;
