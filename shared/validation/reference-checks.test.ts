import { describe, expect, it } from 'vitest';
import { REFERENCE_CHECKS, TEST_SUITE_ONLY_CHECKS, VALIDATION_AREAS, runReferenceCheck, withinTolerance } from './reference-checks';

// The registry itself: each entry is asserted by its own area's test file; here only its shape is checked.
describe('registry of reference checks', () => {
  it('has unique ids, a source, a known area and a finite reference for every check', () => {
    const ids = [...REFERENCE_CHECKS, ...TEST_SUITE_ONLY_CHECKS].map((c) => c.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const c of [...REFERENCE_CHECKS, ...TEST_SUITE_ONLY_CHECKS]) {
      expect(c.source.length, c.id).toBeGreaterThan(5);
      expect(VALIDATION_AREAS, c.id).toContain(c.area);
      expect(Number.isFinite(c.reference), c.id).toBe(true);
      expect(c.testFile, c.id).toMatch(/\.test\.ts$/);
    }
  });

  it('reads tolerances the way the tests do: strict inequalities, relative to the reference', () => {
    expect(withinTolerance(1.5, 1, { kind: 'absolute', value: 0.75 })).toBe(true);
    expect(withinTolerance(1.5, 1, { kind: 'absolute', value: 0.5 })).toBe(false);
    expect(withinTolerance(-2.02, -2, { kind: 'relative', value: 0.011 })).toBe(true);
    expect(withinTolerance(-2.03, -2, { kind: 'relative', value: 0.011 })).toBe(false);
    expect(withinTolerance(3, 2.5, { kind: 'range', lower: 2, upper: 3 })).toBe(false);
    expect(withinTolerance(Number.NaN, 0, { kind: 'absolute', value: 1 })).toBe(false);
  });

  it('turns a computation that throws into a failed outcome with its message', () => {
    const outcome = runReferenceCheck({
      ...REFERENCE_CHECKS[0],
      compute: () => {
        throw new RangeError('tStar out of range');
      },
    });
    expect(outcome.passed).toBe(false);
    expect(outcome.error).toBe('tStar out of range');
    expect(outcome.ours).toBeNull();
  });
});
