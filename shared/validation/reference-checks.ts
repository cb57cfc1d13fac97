/**
 * The registry of reference checks: every fast comparison the unit tests make against a source outside the project,
 * run again by GET /api/admin/validation-suite on the server, and the slow simulation checks that only the test suite
 * runs. Tests import their area's entries from the files in checks/, so page and tests share reference, tolerance and code.
 */
import { COEXISTENCE_CHECKS, JZG_CHECKS, KOLAFA_NEZBEDA_CHECKS, THOL_CHECKS } from './checks/eos-checks';
import { COMBINING_RULE_CHECKS, REAL_DATA_FIT_CHECKS, UNIT_CHECKS } from './checks/material-checks';
import { MD_CHECKS, MD_TEST_SUITE_ONLY } from './checks/md-checks';
import { LEAST_SQUARES_CHECKS, STATISTICS_CHECKS } from './checks/statistics-checks';
import { MIE_CROSS_SECTION_CHECKS } from './checks/mie-transport-checks';
import { COLLISION_INTEGRAL_CHECKS, VISCOSITY_CHECKS } from './checks/transport-checks';
import { B2_CHECKS, B3_CHECKS, MIE_B2_CHECKS, QUANTUM_B2_CHECKS } from './checks/virial-checks';
import { VALIDATION_AREAS, type ReferenceCheck, type TestSuiteOnlyCheck } from './reference-check';

export * from './reference-check';

const areaOrder = (c: { area: string }) => VALIDATION_AREAS.indexOf(c.area as (typeof VALIDATION_AREAS)[number]);

export const REFERENCE_CHECKS: readonly ReferenceCheck[] = [
  ...B2_CHECKS,
  ...QUANTUM_B2_CHECKS,
  ...MIE_B2_CHECKS,
  ...B3_CHECKS,
  ...COLLISION_INTEGRAL_CHECKS,
  ...MIE_CROSS_SECTION_CHECKS,
  ...VISCOSITY_CHECKS,
  ...JZG_CHECKS,
  ...KOLAFA_NEZBEDA_CHECKS,
  ...THOL_CHECKS,
  ...COEXISTENCE_CHECKS,
  ...REAL_DATA_FIT_CHECKS,
  ...COMBINING_RULE_CHECKS,
  ...UNIT_CHECKS,
  ...STATISTICS_CHECKS,
  ...LEAST_SQUARES_CHECKS,
  ...MD_CHECKS,
].sort((a, b) => areaOrder(a) - areaOrder(b));

export const TEST_SUITE_ONLY_CHECKS: readonly TestSuiteOnlyCheck[] = [...MD_TEST_SUITE_ONLY];

export function referenceCheckById(id: string): ReferenceCheck {
  const check = REFERENCE_CHECKS.find((c) => c.id === id);
  if (!check) throw new Error(`no reference check with id "${id}"`);
  return check;
}
