/**
 * One reference check: a number the product computes, compared with a value from outside the project (a published
 * table, a certified data set, an independent evaluation), with the tolerance the unit tests use. The tests read these
 * entries, and the admin page runs the same entries on the server, so the two cannot drift apart.
 */

export const VALIDATION_AREAS = [
  'B2',
  'Quantum B2',
  'Mie B2',
  'B3',
  'Collision integrals',
  'Viscosity',
  'EOS: JZG 1993',
  'EOS: Kolafa–Nezbeda 1994',
  'EOS: Thol 2016',
  'Coexistence and freezing',
  'Fits to real data',
  'Combining rules',
  'Units and constants',
  'Statistics distributions',
  'Least squares (NIST StRD)',
  'Molecular dynamics',
] as const;
export type ValidationArea = (typeof VALIDATION_AREAS)[number];

/**
 * absolute: |ours − reference| < value; relative: |ours − reference|/|reference| < value;
 * range: lower < ours < upper (a published spread, or a bound the source states), the reference shown beside it.
 */
export type Tolerance =
  { kind: 'absolute'; value: number } | { kind: 'relative'; value: number } | { kind: 'range'; lower: number; upper: number };

export interface ReferenceCheck {
  /** Stable id, e.g. "b2.hcb-table.t1"; tests and the page name checks by it. */
  id: string;
  area: ValidationArea;
  /** What is compared, e.g. "B2*". */
  quantity: string;
  /** Unit of reference and ours; "1" for a pure number. */
  unit: string;
  /** The state or case, e.g. "T* = 1". */
  state: string;
  /** Author, year, table; "from memory" where the test says so. */
  source: string;
  reference: number;
  tolerance: Tolerance;
  /** The unit test that asserts this check. */
  testFile: string;
  /** Computes our value with the product's own functions. */
  compute: () => number;
}

/** A check too slow for a page (molecular dynamics runs of minutes): listed with source and tolerance, run by the tests only. */
export interface TestSuiteOnlyCheck {
  id: string;
  area: ValidationArea;
  quantity: string;
  unit: string;
  state: string;
  source: string;
  reference: number;
  /** In words, since these tolerances include the run's own standard error. */
  tolerance: string;
  testFile: string;
  /** Why it is not run on the page, with a cost estimate. */
  why: string;
}

export interface CheckOutcome {
  id: string;
  ours: number | null;
  difference: number | null;
  passed: boolean;
  durationMs: number;
  /** Set when the computation threw. */
  error?: string;
}

export function withinTolerance(ours: number, reference: number, tolerance: Tolerance): boolean {
  if (!Number.isFinite(ours)) return false;
  switch (tolerance.kind) {
    case 'absolute':
      return Math.abs(ours - reference) < tolerance.value;
    case 'relative':
      return Math.abs(ours - reference) / Math.abs(reference) < tolerance.value;
    case 'range':
      return ours > tolerance.lower && ours < tolerance.upper;
  }
}

/** The tolerance in words, as the page and a failing test show it. */
export function describeTolerance(tolerance: Tolerance): string {
  switch (tolerance.kind) {
    case 'absolute':
      return `± ${tolerance.value}`;
    case 'relative':
      return `± ${tolerance.value * 100} % (relative)`;
    case 'range':
      return `between ${tolerance.lower} and ${tolerance.upper}`;
  }
}

/** Runs one check; a computation that throws fails the check with its message instead of stopping the suite. */
export function runReferenceCheck(check: ReferenceCheck, now: () => number = () => performance.now()): CheckOutcome {
  const start = now();
  try {
    const ours = check.compute();
    const durationMs = now() - start;
    return {
      id: check.id,
      ours,
      difference: ours - check.reference,
      passed: withinTolerance(ours, check.reference, check.tolerance),
      durationMs,
    };
  } catch (e) {
    return {
      id: check.id,
      ours: null,
      difference: null,
      passed: false,
      durationMs: now() - start,
      error: e instanceof Error ? e.message : String(e),
    };
  }
}

/** One line for a test's failure message: what, where, source, ours against reference and tolerance. */
export function explainOutcome(check: ReferenceCheck, outcome: CheckOutcome): string {
  const ours = outcome.error ? `error: ${outcome.error}` : `ours ${outcome.ours}`;
  return `${check.id}: ${check.quantity} at ${check.state} (${check.source}): ${ours}, reference ${check.reference}, tolerance ${describeTolerance(check.tolerance)}`;
}

/** toBeCloseTo(x, d) in vitest passes when |a − x| < 10^−d / 2: the same test as an absolute tolerance. */
export const closeToDigits = (digits: number): Tolerance => ({ kind: 'absolute', value: 10 ** -digits / 2 });
export const absolute = (value: number): Tolerance => ({ kind: 'absolute', value });
export const relative = (value: number): Tolerance => ({ kind: 'relative', value });
export const range = (lower: number, upper: number): Tolerance => ({ kind: 'range', lower, upper });
