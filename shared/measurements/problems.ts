/**
 * One message per problem found in an uploaded file.
 *
 * Row convention: `row` is the 1-based line number in the file, counting every line (comment and
 * blank lines too), which is the row number a spreadsheet shows when it opens the CSV. The header
 * is row 1 when no comment line stands above it, so the first data row is then row 2.
 */
export interface Problem {
  /** 1-based line of the file as a spreadsheet shows it (see the convention above). */
  row?: number;
  /** Original header text of the column concerned. */
  column?: string;
  /** Canonical field concerned (e.g. temperatureK) or an option name. */
  field?: string;
  code: ProblemCode;
  /** What is wrong and what was expected, for a person. */
  message: string;
}

export const PROBLEM_CODES = [
  'empty-file',
  'no-data-rows',
  'too-many-rows',
  'too-many-problems',
  'csv-syntax',
  'extra-cells',
  'unknown-kind',
  'kind-mismatch',
  'invalid-option',
  'invalid-mapping',
  'missing-required-column',
  'duplicate-column',
  'missing-unit',
  'unknown-unit',
  'wrong-dimension',
  'missing-molar-mass',
  'invalid-molar-mass',
  'non-numeric',
  'missing-value',
  'nonpositive-temperature',
  'nonpositive-pressure',
  'nonpositive-density',
  'nonpositive-viscosity',
  'nonpositive-uncertainty',
  'duplicate-state-point',
  'implausible-value',
  // Warnings (ParseResult.warnings): the upload is accepted.
  'unusual-value',
  'suspect-unit',
] as const;

export type ProblemCode = (typeof PROBLEM_CODES)[number];

/** Default limit on data rows per upload. */
export const MAX_DATA_ROWS = 5000;

/** Problems listed before the rest are summarised in one 'too-many-problems' message. */
export const MAX_PROBLEMS = 200;
