import { z } from 'zod';

/** GET /api/admin/validation-suite: `rerun=1` runs the registry again instead of answering the cached run. */
export const validationSuiteQuery = z
  .object({
    rerun: z.enum(['0', '1'], { message: 'rerun must be 0 or 1' }).optional(),
  })
  .strict();
export type ValidationSuiteQuery = z.infer<typeof validationSuiteQuery>;

// The answer (ValidationSuiteRun and its parts) is in shared/contracts/validation-suite.ts.
