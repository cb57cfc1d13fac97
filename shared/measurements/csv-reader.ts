/**
 * Low-level CSV reading with papaparse: delimiter and decimal-separator detection, comment and
 * blank-line skipping, and the line number of every record (as a spreadsheet numbers its rows).
 */
import Papa from 'papaparse';

export type Delimiter = ',' | ';' | '\t';
export type DecimalSeparator = '.' | ',';

export const DELIMITERS: readonly Delimiter[] = [',', ';', '\t'];

export interface CsvRecord {
  /** 1-based line where the record starts, counting comment and blank lines. */
  line: number;
  /** Cells, trimmed. */
  cells: string[];
}

export interface CsvSyntaxError {
  line: number;
  message: string;
}

/** Removes a byte-order mark and turns CRLF / CR line endings into LF. */
export function normaliseText(text: string): string {
  return text.replace(/^\uFEFF/, '').replace(/\r\n?/g, '\n');
}

function isBlank(cells: string[]): boolean {
  return cells.every((c) => c.trim() === '');
}

/**
 * Reads all records. Lines starting with '#' are comments; lines whose cells are all blank
 * (including ",,," as spreadsheets export them) are skipped. `text` must be normalised.
 */
export function readRecords(text: string, delimiter: Delimiter): { records: CsvRecord[]; errors: CsvSyntaxError[] } {
  const records: CsvRecord[] = [];
  const errors: CsvSyntaxError[] = [];
  // A record starts where the previous one ended, after any comment lines papaparse skipped;
  // newlines before that start give its line number (counted incrementally).
  let previousEnd = 0;
  let scanned = 0;
  let newlines = 0;
  Papa.parse<string[]>(text, {
    delimiter,
    comments: '#',
    skipEmptyLines: false,
    step: (result) => {
      const cells = result.data;
      let start = previousEnd;
      while (start < text.length && text.startsWith('#', start)) {
        const nl = text.indexOf('\n', start);
        start = nl < 0 ? text.length : nl + 1;
      }
      previousEnd = result.meta.cursor;
      for (; scanned < start; scanned++) if (text.charCodeAt(scanned) === 10) newlines++;
      const line = newlines + 1;
      for (const e of result.errors) {
        errors.push({ line, message: e.message });
      }
      if (isBlank(cells)) return;
      records.push({ line, cells: cells.map((c) => c.trim()) });
    },
  });
  return { records, errors };
}

/**
 * Picks the delimiter that splits the header into the most consistent table: the header must have
 * at least two cells and the data lines the same count. Ties go to tab, then semicolon, then comma,
 * because a decimal-comma file split on commas gives ragged rows while the reverse never happens.
 */
export function detectDelimiter(text: string): Delimiter {
  const sample = text.split('\n').slice(0, 200).join('\n');
  let best: Delimiter = ',';
  let bestScore = -1;
  for (const d of ['\t', ';', ','] as Delimiter[]) {
    const parsed = Papa.parse<string[]>(sample, { delimiter: d, comments: '#', skipEmptyLines: 'greedy' });
    const rows = parsed.data;
    if (rows.length === 0 || rows[0].length < 2) continue;
    const width = rows[0].length;
    const data = rows.slice(1);
    const score = data.length === 0 ? 1 : data.filter((r) => r.length === width).length / data.length;
    if (score > bestScore) {
      best = d;
      bestScore = score;
    }
  }
  return best;
}

const COMMA_DECIMAL = /^[-+−]?\d*,\d+(?:[eE][-+]?\d+)?$/;
const DOT_DECIMAL = /^[-+−]?\d*\.\d+(?:[eE][-+]?\d+)?$/;

/**
 * Decimal commas are assumed when the file is not comma-delimited and its cells contain numbers
 * written like "1,23" but none like "1.23" (European spreadsheet exports).
 */
export function detectDecimal(records: CsvRecord[], delimiter: Delimiter): DecimalSeparator {
  if (delimiter === ',') return '.';
  let comma = 0;
  let dot = 0;
  for (const r of records) {
    for (const c of r.cells) {
      if (COMMA_DECIMAL.test(c)) comma++;
      else if (DOT_DECIMAL.test(c)) dot++;
    }
  }
  return comma > 0 && dot === 0 ? ',' : '.';
}

const NUMBER = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$/;

export type NumberCell = { ok: true; value: number } | { ok: false; reason: string };

/** Parses one cell as a finite decimal number with the given decimal separator. */
export function parseNumberCell(text: string, decimal: DecimalSeparator): NumberCell {
  let s = text.trim().replace(/\u2212/g, '-');
  if (decimal === ',') {
    if (s.includes('.')) return { ok: false, reason: 'contains a "." but the file uses decimal commas' };
    s = s.replace(',', '.');
  } else if (COMMA_DECIMAL.test(s)) {
    return { ok: false, reason: 'looks like a decimal comma; choose the decimal-comma option for this file' };
  }
  if (!NUMBER.test(s)) return { ok: false, reason: 'is not a number' };
  const value = Number(s);
  if (!Number.isFinite(value)) return { ok: false, reason: 'is too large to be a finite number' };
  return { ok: true, value };
}
