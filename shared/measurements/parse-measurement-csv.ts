/**
 * Parses an uploaded measurement CSV into canonical rows, or into a list of problems.
 * Pure: runs on the server and in the browser (upload preview). Nothing partial is returned:
 * when any problem is found, `rows` is empty and `ok` is false.
 */
import {
  DEFAULT_RELATIVE_UNCERTAINTY,
  PROPERTY_KIND_IDS,
  PROPERTY_KINDS,
  QUANTITIES,
  defaultUncertainty,
  isPropertyKind,
  isQuantityKey,
  kindQuantities,
  type CanonicalField,
  type CanonicalRow,
  type PropertyKind,
  type QuantityKey,
} from './property-kinds';
import { inferKindFromQuantities, parseHeader, type ColumnMapping } from './headers';
import {
  DELIMITERS,
  detectDecimal,
  detectDelimiter,
  normaliseText,
  parseNumberCell,
  readRecords,
  type CsvRecord,
  type DecimalSeparator,
  type Delimiter,
} from './csv-reader';
import { MAX_DATA_ROWS, MAX_PROBLEMS, type Problem, type ProblemCode } from './problems';
import { UnitConversionError, makeConverter, normaliseUnitText } from './units';
import { judgeValue, unitSlipHint } from './plausibility';

export interface ParseOptions {
  /** Inferred from the headers when absent. */
  kind?: PropertyKind;
  /** Detected (tab, semicolon, comma) when absent. */
  delimiter?: Delimiter;
  /** Detected when absent: ',' for non-comma-delimited files whose numbers are written "1,23". */
  decimal?: DecimalSeparator;
  /** Explicit meaning of columns by 0-based index; overrides what the header says. */
  mapping?: ColumnMapping;
  /** Relative standard uncertainty for rows without one, 0 < x ≤ 1 (default DEFAULT_RELATIVE_UNCERTAINTY = 0.01). */
  defaultRelativeUncertainty?: number;
  /** Molar mass of the substance, g/mol; needed only for densities given in mol/L or mol/m³. */
  molarMassGPerMol?: number;
  /** Maximum number of data rows (default MAX_DATA_ROWS = 5000). */
  maxRows?: number;
}

export interface ParsedColumn {
  /** 0-based index in the header line. */
  index: number;
  /** Header text as written. */
  header: string;
  /** Quantity key this column is used as, absent when the column is not used. */
  quantity?: string;
  /** Canonical row field this column fills. */
  field?: string;
  /** Unit text as written in the header or given in the mapping. */
  unitText?: string;
  /** Canonical unit the values were converted to (e.g. "cm³/mol"). */
  canonicalUnit?: string;
}

export interface ParseResult {
  ok: boolean;
  kind?: PropertyKind;
  delimiter: string;
  decimal: string;
  columns: ParsedColumn[];
  /** Canonical rows in file order; empty when !ok. */
  rows: CanonicalRow[];
  problems: Problem[];
  /**
   * Values that are possible but unusual (shared/measurements/plausibility.ts), one per column: accepted, shown
   * to the person. Impossible values are problems instead.
   */
  warnings: Problem[];
  /** 0-based indices of columns not used (unrecognised, ignored, or of another kind). */
  unmappedColumns: number[];
  /** Relative uncertainty applied to rows without a measured one. */
  defaultRelativeUncertainty: number;
}

/** Relative tolerance under which two state-point coordinates count as equal (conversion round-off). */
export const DUPLICATE_RELATIVE_TOLERANCE = 1e-9;

class ProblemList {
  readonly items: Problem[] = [];
  private dropped = 0;
  add(p: Problem): void {
    if (this.items.length < MAX_PROBLEMS) this.items.push(p);
    else this.dropped++;
  }
  finish(): Problem[] {
    if (this.dropped > 0) {
      this.items.push({
        code: 'too-many-problems',
        message: `${this.dropped} more problem(s) not listed; fix the ones above and upload again.`,
      });
    }
    return this.items;
  }
}

function quoteList(headers: string[]): string {
  return headers.map((h) => `"${h}"`).join(', ');
}

function checkOptions(options: ParseOptions, problems: ProblemList) {
  let rel = DEFAULT_RELATIVE_UNCERTAINTY;
  if (options.defaultRelativeUncertainty !== undefined) {
    const x = options.defaultRelativeUncertainty;
    if (typeof x !== 'number' || !Number.isFinite(x) || x <= 0 || x > 1) {
      problems.add({
        field: 'defaultRelativeUncertainty',
        code: 'invalid-option',
        message: `Default relative uncertainty must be a number with 0 < x ≤ 1 (e.g. 0.01 for 1 %), got ${String(x)}.`,
      });
    } else rel = x;
  }
  let maxRows = MAX_DATA_ROWS;
  if (options.maxRows !== undefined) {
    if (!Number.isInteger(options.maxRows) || options.maxRows < 1) {
      problems.add({
        field: 'maxRows',
        code: 'invalid-option',
        message: `maxRows must be a positive integer, got ${String(options.maxRows)}.`,
      });
    } else maxRows = options.maxRows;
  }
  let molarMassGPerMol: number | undefined;
  if (options.molarMassGPerMol !== undefined) {
    const m = options.molarMassGPerMol;
    if (typeof m !== 'number' || !Number.isFinite(m) || m <= 0) {
      problems.add({
        field: 'molarMassGPerMol',
        code: 'invalid-molar-mass',
        message: `Molar mass must be a positive number of g/mol, got ${String(m)}.`,
      });
    } else molarMassGPerMol = m;
  }
  if (options.kind !== undefined && !isPropertyKind(options.kind)) {
    problems.add({
      field: 'kind',
      code: 'invalid-option',
      message: `Unknown property kind "${String(options.kind)}"; expected one of ${PROPERTY_KIND_IDS.join(', ')}.`,
    });
  }
  if (options.delimiter !== undefined && !DELIMITERS.includes(options.delimiter)) {
    problems.add({
      field: 'delimiter',
      code: 'invalid-option',
      message: `Delimiter must be comma, semicolon or tab, got "${String(options.delimiter)}".`,
    });
  }
  if (options.decimal !== undefined && options.decimal !== '.' && options.decimal !== ',') {
    problems.add({
      field: 'decimal',
      code: 'invalid-option',
      message: `Decimal separator must be "." or ",", got "${String(options.decimal)}".`,
    });
  }
  return { rel, maxRows, molarMassGPerMol };
}

interface UsedColumn {
  index: number;
  header: string;
  quantity: QuantityKey;
  field: CanonicalField;
  unitText: string;
  convert?: (v: number) => number;
}

/**
 * Parses and validates a measurement CSV. Headers name the quantity and carry the unit in
 * parentheses or brackets ("T (K)", "p [bar]", "u(B2) (cm3/mol)"); values are converted to the
 * canonical units of the kind registry. See Problem for the row-number convention.
 */
export function parseMeasurementCsv(text: string, options: ParseOptions = {}): ParseResult {
  const problems = new ProblemList();
  const { rel, maxRows, molarMassGPerMol } = checkOptions(options, problems);
  const normalised = normaliseText(text ?? '');
  const delimiter: Delimiter =
    options.delimiter && DELIMITERS.includes(options.delimiter) ? options.delimiter : detectDelimiter(normalised);
  const result = (partial: Partial<ParseResult>): ParseResult => {
    const list = problems.finish();
    const ok = list.length === 0;
    return {
      ok,
      kind: partial.kind,
      delimiter,
      decimal: partial.decimal ?? (options.decimal === ',' ? ',' : '.'),
      columns: partial.columns ?? [],
      rows: ok ? (partial.rows ?? []) : [],
      problems: list,
      warnings: partial.warnings ?? [],
      unmappedColumns: partial.unmappedColumns ?? [],
      defaultRelativeUncertainty: rel,
    };
  };

  if (normalised.trim() === '') {
    problems.add({
      code: 'empty-file',
      message: 'The file is empty; expected a header line such as "T (K),B2 (cm3/mol)" followed by data rows.',
    });
    return result({});
  }
  const { records, errors } = readRecords(normalised, delimiter);
  for (const e of errors) {
    problems.add({
      row: e.line,
      code: 'csv-syntax',
      message: `Row ${e.line}: the CSV cannot be read here (${e.message}); check quotes on this line.`,
    });
  }
  if (records.length === 0) {
    problems.add({
      code: 'empty-file',
      message: 'The file holds only comments or blank lines; expected a header line followed by data rows.',
    });
    return result({});
  }

  const headerRecord = records[0];
  const headerLine = headerRecord.line;
  const dataRecords = records.slice(1);
  const decimal: DecimalSeparator =
    options.decimal === '.' || options.decimal === ',' ? options.decimal : detectDecimal(dataRecords, delimiter);

  // Column meaning: header recognition, then the caller's mapping on top.
  const parsedHeaders = headerRecord.cells.map((h) => parseHeader(h));
  const meaning: Array<{ quantity?: QuantityKey; unitText?: string }> = parsedHeaders.map((p) => ({
    quantity: p.quantity,
    unitText: p.unitText,
  }));
  for (const [key, entry] of Object.entries(options.mapping ?? {})) {
    const index = Number(key);
    if (!Number.isInteger(index) || index < 0 || index >= meaning.length) {
      problems.add({
        field: 'mapping',
        code: 'invalid-mapping',
        message: `The mapping names column ${key}, but the header line has columns 0 to ${meaning.length - 1}.`,
      });
      continue;
    }
    if (!entry || (entry.quantity !== 'ignore' && !isQuantityKey(entry.quantity))) {
      problems.add({
        column: headerRecord.cells[index],
        field: 'mapping',
        code: 'invalid-mapping',
        message: `The mapping for column "${headerRecord.cells[index]}" names an unknown quantity "${String(entry?.quantity)}"; expected one of ${Object.keys(QUANTITIES).join(', ')} or ignore.`,
      });
      continue;
    }
    if (entry.quantity === 'ignore') {
      meaning[index] = {};
      continue;
    }
    // Without a unit in the mapping, the unit written in the header applies, unless the header
    // named another quantity (its unit would then belong to that one).
    const header = parsedHeaders[index];
    const headerUnitApplies = header.quantity === undefined || header.quantity === entry.quantity;
    const unitText = entry.unit !== undefined && entry.unit.trim() !== '' ? entry.unit : headerUnitApplies ? header.unitText : undefined;
    meaning[index] = { quantity: entry.quantity, unitText };
  }

  const present = new Set(meaning.map((m) => m.quantity).filter((x): x is QuantityKey => x !== undefined));
  const kind: PropertyKind | undefined = options.kind && isPropertyKind(options.kind) ? options.kind : inferKindFromQuantities(present);
  const baseColumns = (): ParseResult['columns'] =>
    headerRecord.cells.map((header, index) => ({ index, header, unitText: meaning[index].unitText }));

  if (!kind) {
    const valueHeaders = PROPERTY_KIND_IDS.filter((k) => present.has(PROPERTY_KINDS[k].valueQuantity));
    problems.add({
      row: headerLine,
      code: 'unknown-kind',
      message:
        valueHeaders.length > 1
          ? `The header line has columns for several properties (${valueHeaders.join(', ')}); upload one property per file or choose the property.`
          : `Cannot tell which property the file holds from its header line (${quoteList(headerRecord.cells)}); expected a column of one property such as "B2 (cm3/mol)", "rho (kg/m3)", "eta (uPa s)", "B3 (cm6/mol2)", "rho_liq (kg/m3)", "rho_vap (kg/m3)" or "p_sat (kPa)", or choose the property and map the columns.`,
    });
    return result({ decimal, columns: baseColumns(), unmappedColumns: headerRecord.cells.map((_, i) => i) });
  }

  const def = PROPERTY_KINDS[kind];
  const allowed = new Set(kindQuantities(kind));
  const looksLike = inferKindFromQuantities(present);
  if (looksLike && looksLike !== kind && !present.has(def.valueQuantity)) {
    const other = PROPERTY_KINDS[looksLike];
    const column = headerRecord.cells[meaning.findIndex((m) => m.quantity === other.valueQuantity)];
    problems.add({
      row: headerLine,
      column,
      code: 'kind-mismatch',
      message: `The upload is for ${def.label}, but column "${column}" holds ${QUANTITIES[other.valueQuantity].label} (${other.label}); choose the matching property or upload the right file.`,
    });
  }
  const used: UsedColumn[] = [];
  const unmappedColumns: number[] = [];
  const columns: ParseResult['columns'] = baseColumns();
  meaning.forEach((m, index) => {
    const header = headerRecord.cells[index];
    if (!m.quantity || !allowed.has(m.quantity)) {
      unmappedColumns.push(index);
      return;
    }
    const qdef = QUANTITIES[m.quantity];
    const earlier = used.find((u) => u.quantity === m.quantity);
    if (earlier) {
      problems.add({
        row: headerLine,
        column: header,
        field: qdef.field,
        code: 'duplicate-column',
        message: `Column "${header}" is a second ${qdef.label} column (the first is "${earlier.header}"); keep one, or map the other to "ignore".`,
      });
      unmappedColumns.push(index);
      return;
    }
    const col: UsedColumn = { index, header, quantity: m.quantity, field: qdef.field, unitText: m.unitText ?? '' };
    try {
      // An invalid molar mass was reported with the options; skip the molar columns' second message.
      if (options.molarMassGPerMol !== undefined && molarMassGPerMol === undefined) col.convert = undefined;
      else col.convert = makeConverter(col.unitText, m.quantity, { molarMassGPerMol });
    } catch (e) {
      if (!(e instanceof UnitConversionError)) throw e;
      problems.add({
        row: headerLine,
        column: header,
        field: qdef.field,
        code: e.code as ProblemCode,
        message: `Column "${header}": ${e.message}`,
      });
    }
    used.push(col);
    columns[index] = {
      index,
      header,
      quantity: m.quantity,
      field: qdef.field,
      unitText: m.unitText,
      canonicalUnit: qdef.canonicalUnitLabel,
    };
  });

  const unrecognised = unmappedColumns.map((i) => headerRecord.cells[i]).filter((h) => h !== '');
  for (const c of def.columns) {
    if (!c.required || used.some((u) => u.quantity === c.quantity)) continue;
    const qdef = QUANTITIES[c.quantity];
    problems.add({
      row: headerLine,
      field: qdef.field,
      code: 'missing-required-column',
      message:
        `No ${qdef.label} column found for ${def.label}; expected a header such as "${qdef.exampleHeader}".` +
        (unrecognised.length ? ` Unrecognised columns: ${quoteList(unrecognised)}; map one of them if it holds the ${qdef.label}.` : ''),
    });
  }

  if (dataRecords.length === 0) {
    problems.add({ code: 'no-data-rows', message: 'The file has a header line but no data rows.' });
    return result({ kind, decimal, columns, unmappedColumns });
  }
  if (dataRecords.length > maxRows) {
    problems.add({
      code: 'too-many-rows',
      message: `The file has ${dataRecords.length} data rows; at most ${maxRows} are accepted per upload. Split it into several measurement sets.`,
    });
    return result({ kind, decimal, columns, unmappedColumns });
  }

  const warnings: Problem[] = [];
  const rows = validateRows(dataRecords, headerRecord.cells.length, used, kind, decimal, rel, problems, warnings);
  return result({ kind, decimal, columns, unmappedColumns, rows, warnings });
}

function validateRows(
  records: CsvRecord[],
  width: number,
  used: UsedColumn[],
  kind: PropertyKind,
  decimal: DecimalSeparator,
  rel: number,
  problems: ProblemList,
  warnings: Problem[],
): CanonicalRow[] {
  const def = PROPERTY_KINDS[kind];
  const rows: CanonicalRow[] = [];
  // Unusual values per column: the first one's row and message, and how many.
  const unusual = new Map<UsedColumn, { row: number; message: string; count: number }>();
  const uncertaintyColumn = used.find((u) => u.quantity === def.uncertaintyQuantity);
  for (const rec of records) {
    const line = rec.line;
    let rowOk = true;
    if (rec.cells.length > width && rec.cells.slice(width).some((c) => c !== '')) {
      problems.add({
        row: line,
        code: 'extra-cells',
        message: `Row ${line} has ${rec.cells.length} cells but the header line has ${width} columns; remove the extra cells or add a header for them.`,
      });
      rowOk = false;
    }
    const values: Partial<Record<CanonicalField, number>> = {};
    const raw: Partial<Record<CanonicalField, string>> = {};
    for (const col of used) {
      const qdef = QUANTITIES[col.quantity];
      const required = def.columns.find((c) => c.quantity === col.quantity)?.required ?? false;
      const text = rec.cells[col.index] ?? '';
      if (text === '') {
        if (required) {
          problems.add({
            row: line,
            column: col.header,
            field: col.field,
            code: 'missing-value',
            message: `Row ${line}, column "${col.header}": the ${qdef.label} is empty; a number is required.`,
          });
          rowOk = false;
        }
        continue;
      }
      raw[col.field] = text;
      const n = parseNumberCell(text, decimal);
      if (!n.ok) {
        problems.add({
          row: line,
          column: col.header,
          field: col.field,
          code: 'non-numeric',
          message: `Row ${line}, column "${col.header}": "${text}" ${n.reason}; expected a number such as ${decimal === ',' ? '300,15' : '300.15'}.`,
        });
        rowOk = false;
        continue;
      }
      if (!col.convert) {
        rowOk = false;
        continue;
      }
      const v = col.convert(n.value);
      if (qdef.positivity === 'positive' && !(v > 0)) {
        const canonical = `${formatNumber(v)} ${qdef.canonicalUnitLabel}`;
        const shown =
          col.unitText && normalisedEquals(col.unitText, qdef.canonicalUnit) ? canonical : `${text} ${col.unitText} = ${canonical}`;
        problems.add({
          row: line,
          column: col.header,
          field: col.field,
          code: (qdef.nonPositiveCode ?? 'invalid-option') as ProblemCode,
          message: `Row ${line}, column "${col.header}": ${qdef.label} ${shown} is not positive; it must be greater than zero${qdef.key === 'temperature' ? ' kelvin' : ''}.`,
        });
        rowOk = false;
        continue;
      }
      const judged = Number.isFinite(v)
        ? judgeValue(col.field, v, qdef.label)
        : {
            verdict: 'refuse' as const,
            message: `${qdef.label} "${text}" ${col.unitText} does not fit in a number once converted to ${qdef.canonicalUnitLabel}.`,
          };
      if (judged.verdict === 'refuse') {
        problems.add({
          row: line,
          column: col.header,
          field: col.field,
          code: 'implausible-value',
          message: `Row ${line}, column "${col.header}": ${judged.message}`,
        });
        rowOk = false;
        continue;
      }
      if (judged.verdict === 'warn') {
        const seen = unusual.get(col) ?? { row: line, message: judged.message, count: 0 };
        seen.count++;
        unusual.set(col, seen);
      }
      values[col.field] = v;
    }
    if (!rowOk) continue;
    const value = values[def.valueField] as number;
    let uncertaintySource: 'measured' | 'default-relative' = 'measured';
    if (!uncertaintyColumn || values[def.uncertaintyField] === undefined) {
      values[def.uncertaintyField] = defaultUncertainty(kind, value, rel);
      uncertaintySource = 'default-relative';
    }
    rows.push({ kind, row: line, uncertaintySource, raw, ...values } as CanonicalRow);
  }
  findDuplicates(rows, used, kind, problems);
  for (const [col, seen] of unusual) {
    const columnValues = rows.map((r) => (r as unknown as Record<string, number>)[col.field]).filter((x) => x !== undefined);
    const hint = unitSlipHint(col.field, columnValues, col.unitText);
    const more = seen.count > 1 ? ` (${seen.count - 1} more row${seen.count > 2 ? 's' : ''} in this column)` : '';
    warnings.push(
      hint
        ? { row: seen.row, column: col.header, field: col.field, code: 'suspect-unit', message: `Column "${col.header}": ${hint}` }
        : {
            row: seen.row,
            column: col.header,
            field: col.field,
            code: 'unusual-value',
            message: `Row ${seen.row}, column "${col.header}": ${seen.message}${more}`,
          },
    );
  }
  return rows;
}

function normalisedEquals(unitText: string, canonical: string): boolean {
  return normaliseUnitText(unitText) === canonical;
}

function formatNumber(v: number): string {
  return Number.isInteger(v) ? String(v) : String(Number(v.toPrecision(10)));
}

function close(a: number, b: number): boolean {
  return Math.abs(a - b) <= DUPLICATE_RELATIVE_TOLERANCE * Math.max(Math.abs(a), Math.abs(b));
}

/** Duplicate state points (after conversion): sort by the first state field, compare neighbours within tolerance. */
function findDuplicates(rows: CanonicalRow[], used: UsedColumn[], kind: PropertyKind, problems: ProblemList): void {
  const fields = PROPERTY_KINDS[kind].stateFields;
  const get = (r: CanonicalRow, f: CanonicalField) => (r as unknown as Record<string, number>)[f];
  const order = rows.map((_, i) => i).sort((a, b) => get(rows[a], fields[0]) - get(rows[b], fields[0]) || rows[a].row - rows[b].row);
  const firstColumn = used.find((u) => u.field === fields[0]);
  const reported = new Set<number>();
  for (let i = 0; i < order.length; i++) {
    const a = rows[order[i]];
    for (let j = i + 1; j < order.length; j++) {
      const b = rows[order[j]];
      if (!close(get(a, fields[0]), get(b, fields[0]))) break;
      if (!fields.every((f) => close(get(a, f), get(b, f)))) continue;
      const [first, later] = a.row < b.row ? [a, b] : [b, a];
      if (reported.has(later.row)) continue;
      reported.add(later.row);
      const point = fields
        .map((f) => {
          const q = Object.values(QUANTITIES).find((d) => d.field === f)!;
          return `${q.symbol} = ${formatNumber(get(later, f))} ${q.canonicalUnitLabel}`;
        })
        .join(', ');
      const written = fields.map((f) => `"${used.find((u) => u.field === f)?.header ?? f}" = ${later.raw[f] ?? ''}`).join(', ');
      problems.add({
        row: later.row,
        column: firstColumn?.header,
        field: fields.join(','),
        code: 'duplicate-state-point',
        message: `Row ${later.row} (${written}) repeats the state point of row ${first.row} (${point}); each state point may appear once. Remove one or average them.`,
      });
    }
  }
}
