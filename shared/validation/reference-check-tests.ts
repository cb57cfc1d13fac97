/**
 * For test files only: one vitest case per registry entry, so a unit test and the admin page's validation suite assert
 * the same reference, tolerance and computation. A failure names the check, its source, ours and the reference.
 */
import { expect, it } from 'vitest';
import { explainOutcome, runReferenceCheck, withinTolerance, type ReferenceCheck } from './reference-check';

export function itPassesReferenceChecks(checks: readonly ReferenceCheck[]): void {
  for (const check of checks) {
    it(`${check.quantity} at ${check.state}: ${check.source} [${check.id}]`, () => {
      const outcome = runReferenceCheck(check);
      expect(outcome.passed, explainOutcome(check, outcome)).toBe(true);
    });
  }
}

/** The same as one assertion, for a test that checks more around the reference value. */
export function expectReferenceCheck(check: ReferenceCheck): number {
  const outcome = runReferenceCheck(check);
  expect(outcome.passed, explainOutcome(check, outcome)).toBe(true);
  return outcome.ours as number;
}

/** A value computed another way (through the command line, say) held to a registry entry's reference and tolerance. */
export function expectWithinReference(ours: number, check: ReferenceCheck): void {
  const outcome = {
    id: check.id,
    ours,
    difference: ours - check.reference,
    passed: withinTolerance(ours, check.reference, check.tolerance),
    durationMs: 0,
  };
  expect(outcome.passed, explainOutcome(check, outcome)).toBe(true);
}
