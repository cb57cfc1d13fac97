import type { ValidationCheckResult, ValidationTestSuiteOnly } from '../../../shared/contracts/validation-suite';
import {
  describeTolerance,
  type CheckOutcome,
  type ReferenceCheck,
  type TestSuiteOnlyCheck,
} from '../../../shared/validation/reference-checks';

/** One registry entry with the outcome of running it here, as the validation suite page shows it. */
export function toValidationCheckResultView(check: ReferenceCheck, outcome: CheckOutcome): ValidationCheckResult {
  return {
    id: check.id,
    area: check.area,
    quantity: check.quantity,
    unit: check.unit,
    state: check.state,
    source: check.source,
    reference: check.reference,
    tolerance: check.tolerance,
    toleranceText: describeTolerance(check.tolerance),
    testFile: check.testFile,
    ours: outcome.ours,
    difference: outcome.difference,
    passed: outcome.passed,
    durationMs: outcome.durationMs,
    error: outcome.error ?? null,
  };
}

/** A check only the test suite runs, listed as it is in the registry. */
export function toValidationTestSuiteOnlyView(c: TestSuiteOnlyCheck): ValidationTestSuiteOnly {
  return {
    id: c.id,
    area: c.area,
    quantity: c.quantity,
    unit: c.unit,
    state: c.state,
    source: c.source,
    reference: c.reference,
    tolerance: c.tolerance,
    testFile: c.testFile,
    why: c.why,
  };
}
