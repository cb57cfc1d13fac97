import { z } from 'zod';
import type { Tolerance, ValidationArea } from '../validation/reference-check';

/** GET /api/admin/validation-suite: `rerun=1` runs the registry again instead of answering the cached run. */
export const validationSuiteQuery = z
  .object({
    rerun: z.enum(['0', '1'], { message: 'rerun must be 0 or 1' }).optional(),
  })
  .strict();
export type ValidationSuiteQuery = z.infer<typeof validationSuiteQuery>;

/** One reference check as run on the server: the registry entry with our value and the verdict. */
export interface ValidationCheckResult {
  id: string;
  area: ValidationArea;
  quantity: string;
  unit: string;
  state: string;
  source: string;
  reference: number;
  tolerance: Tolerance;
  /** The tolerance in words ("± 0.0005", "± 3 % (relative)", "between 116 and 122"). */
  toleranceText: string;
  testFile: string;
  ours: number | null;
  difference: number | null;
  passed: boolean;
  durationMs: number;
  error: string | null;
}

/** A check that only the test suite runs (minutes of molecular dynamics), listed with its source and tolerance. */
export interface ValidationTestSuiteOnly {
  id: string;
  area: ValidationArea;
  quantity: string;
  unit: string;
  state: string;
  source: string;
  reference: number;
  tolerance: string;
  testFile: string;
  why: string;
}

export interface ValidationSuiteRun {
  /** When this run started on this server (ISO 8601). */
  ranAt: string;
  /** Package version plus the git commit when the server runs from a checkout. */
  codeVersion: string;
  /** Wall time of the whole run, including pauses that let other requests through. */
  durationMs: number;
  /** True when this answer is the cached run of this process (false right after a run or rerun). */
  cached: boolean;
  summary: { total: number; passed: number; failed: number; testSuiteOnly: number };
  areas: ValidationArea[];
  checks: ValidationCheckResult[];
  testSuiteOnly: ValidationTestSuiteOnly[];
}
