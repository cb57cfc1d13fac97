import { setImmediate as nextTurn } from 'node:timers/promises';
import type { ValidationCheckResult, ValidationSuiteRun } from '../../../shared/contracts/validation-suite';
import {
  REFERENCE_CHECKS,
  TEST_SUITE_ONLY_CHECKS,
  VALIDATION_AREAS,
  runReferenceCheck,
  type ReferenceCheck,
} from '../../../shared/validation/reference-checks';
import { toValidationCheckResultView, toValidationTestSuiteOnlyView } from './validation-suite.view';

/**
 * Runs the registry of reference checks (shared/validation) on this server: the same entries, references, tolerances
 * and code the unit tests assert. A run takes a few seconds of CPU, so it is made once per process, on the first
 * request, and kept with the time it ran and the code version; a rerun replaces it. Between checks the loop yields
 * to the event loop so other requests are served while it runs. Concurrent callers share one run.
 */
let latest: Promise<Omit<ValidationSuiteRun, 'cached'>> | null = null;

async function runSuite(codeVersion: string, checks: readonly ReferenceCheck[]): Promise<Omit<ValidationSuiteRun, 'cached'>> {
  const ranAt = new Date().toISOString();
  const start = performance.now();
  const results: ValidationCheckResult[] = [];
  for (const check of checks) {
    await nextTurn();
    results.push(toValidationCheckResultView(check, runReferenceCheck(check)));
  }
  const passed = results.filter((r) => r.passed).length;
  return {
    ranAt,
    codeVersion,
    durationMs: performance.now() - start,
    summary: { total: results.length, passed, failed: results.length - passed, testSuiteOnly: TEST_SUITE_ONLY_CHECKS.length },
    areas: VALIDATION_AREAS.filter((area) => results.some((r) => r.area === area) || TEST_SUITE_ONLY_CHECKS.some((c) => c.area === area)),
    checks: results,
    testSuiteOnly: TEST_SUITE_ONLY_CHECKS.map(toValidationTestSuiteOnlyView),
  };
}

export async function validationSuite(codeVersion: string, options: { rerun: boolean }): Promise<ValidationSuiteRun> {
  const fresh = latest === null || options.rerun;
  if (fresh) {
    const run = runSuite(codeVersion, REFERENCE_CHECKS);
    latest = run;
    // A run that fails as a whole (not a check: those are caught) is not kept, so the next request tries again.
    run.catch(() => {
      if (latest === run) latest = null;
    });
  }
  return { ...(await latest!), cached: !fresh };
}
