/**
 * Recognising column headers: "T (K)", "p [bar]", "u(B2) (cm3/mol)", "T/K", "Temperature in °C".
 * The quantity name is matched case-insensitively against the aliases in the kind registry; the
 * unit is the text in the last parentheses or brackets.
 */
import { PROPERTY_KIND_IDS, PROPERTY_KINDS, QUANTITIES, kindQuantities, type PropertyKind, type QuantityKey } from './property-kinds';

export interface ParsedHeader {
  header: string;
  /** Quantity part of the header as written. */
  name: string;
  /** Unit text as written (without the brackets), undefined when the header has none. */
  unitText?: string;
  /** Recognised quantity, if the name matches an alias. */
  quantity?: QuantityKey;
  /** True when the unit was implied by a canonical field name header such as "temperatureK". */
  unitImplied?: boolean;
}

/** What the caller (the mapping step of the UI) says a column holds. 'ignore' drops the column. */
export interface ColumnMappingEntry {
  quantity: QuantityKey | 'ignore';
  /** Unit text in any accepted spelling; when absent the unit written in the header is used. */
  unit?: string;
}

/** Column index (0-based, as in the header line) → what that column holds. */
export type ColumnMapping = Record<number, ColumnMappingEntry>;

function nameKey(s: string): string {
  return s
    .normalize('NFKC')
    .toLowerCase()
    .replace(/[\s_-]+/g, '');
}

const ALIAS_INDEX: Map<string, QuantityKey> = (() => {
  const m = new Map<string, QuantityKey>();
  for (const def of Object.values(QUANTITIES)) {
    for (const a of def.aliases) m.set(nameKey(a), def.key);
  }
  return m;
})();

const FIELD_INDEX: Map<string, QuantityKey> = new Map(Object.values(QUANTITIES).map((d) => [d.field.toLowerCase(), d.key]));

/** Quantity named by a header's name part, if any. */
export function matchQuantityName(name: string): QuantityKey | undefined {
  return ALIAS_INDEX.get(nameKey(name));
}

/** Splits a header into quantity name and unit text and recognises the quantity. */
export function parseHeader(header: string): ParsedHeader {
  const h = header.trim();
  // A whole-header match first, so "u(B2)" is a name and not "u" with unit "B2".
  const whole = matchQuantityName(h);
  if (whole) return { header, name: h, quantity: whole };
  const field = FIELD_INDEX.get(h.toLowerCase());
  if (field) return { header, name: h, quantity: field, unitText: QUANTITIES[field].canonicalUnit, unitImplied: true };

  // Candidate splits, in order: "name (unit)" / "name [unit]" (last bracketed group), quantity
  // calculus "T/K" or "rho/(kg/m3)", and "T in K". The first whose name is known wins; otherwise the
  // bracket split is kept so the mapping step can show the unit the file wrote.
  const candidates: Array<{ name: string; unitText: string }> = [];
  const bracket = /^(.*?)\s*[([]\s*([^()[\]]*?)\s*[)\]]\s*$/.exec(h);
  if (bracket && bracket[1] !== '') candidates.push({ name: bracket[1].replace(/\s*[/,:]\s*$/, ''), unitText: bracket[2] });
  const slash = /^([^/]+?)\s*\/\s*(.+)$/.exec(h);
  if (slash)
    candidates.push({
      name: slash[1],
      unitText: slash[2]
        .trim()
        .replace(/^\((.*)\)$/, '$1')
        .trim(),
    });
  const inWord = /^(.+?)\s+in\s+(.+)$/i.exec(h);
  if (inWord) candidates.push({ name: inWord[1], unitText: inWord[2].trim() });
  for (const c of candidates) {
    const quantity = matchQuantityName(c.name);
    if (quantity) return { header, name: c.name, unitText: c.unitText, quantity };
  }
  if (bracket && bracket[1] !== '') return { header, name: bracket[1], unitText: bracket[2] };
  return { header, name: h };
}

/**
 * The kind whose measured property appears among the headers, or undefined when none or more than
 * one does (e.g. a file with both B2 and η columns).
 */
export function inferKindFromHeaders(headers: string[]): PropertyKind | undefined {
  const quantities = new Set(headers.map((h) => parseHeader(h).quantity).filter((x): x is QuantityKey => x !== undefined));
  return inferKindFromQuantities(quantities);
}

export function inferKindFromQuantities(quantities: Set<QuantityKey>): PropertyKind | undefined {
  const found = PROPERTY_KIND_IDS.filter((k) => quantities.has(PROPERTY_KINDS[k].valueQuantity));
  return found.length === 1 ? found[0] : undefined;
}

export interface MappingSuggestion {
  kind?: PropertyKind;
  /** Recognised columns of the kind, with the unit written in the header (or the canonical unit when none was written). */
  mapping: ColumnMapping;
  /** Columns whose header was not recognised or belongs to no column of the kind (0-based). */
  unrecognisedColumns: number[];
  /** Recognised columns whose header carries no unit; their suggested unit is the canonical one. */
  missingUnitColumns: number[];
  /** Required quantities of the kind that no column supplies. */
  missingRequired: QuantityKey[];
}

/**
 * Suggests a column mapping from headers for the mapping step of the upload screen.
 * When `kind` is absent it is inferred from the headers.
 */
export function suggestColumnMapping(headers: string[], kind?: PropertyKind): MappingSuggestion {
  const parsed = headers.map(parseHeader);
  const k = kind ?? inferKindFromQuantities(new Set(parsed.map((p) => p.quantity).filter((x): x is QuantityKey => !!x)));
  const allowed = new Set<QuantityKey>(k ? kindQuantities(k) : (Object.keys(QUANTITIES) as QuantityKey[]));
  const mapping: ColumnMapping = {};
  const unrecognisedColumns: number[] = [];
  const missingUnitColumns: number[] = [];
  const taken = new Set<QuantityKey>();
  parsed.forEach((p, i) => {
    if (!p.quantity || !allowed.has(p.quantity) || taken.has(p.quantity)) {
      unrecognisedColumns.push(i);
      return;
    }
    taken.add(p.quantity);
    const unitText = p.unitText?.trim();
    if (!unitText) missingUnitColumns.push(i);
    mapping[i] = { quantity: p.quantity, unit: unitText ? unitText : QUANTITIES[p.quantity].canonicalUnit };
  });
  const missingRequired = k ? PROPERTY_KINDS[k].columns.filter((c) => c.required && !taken.has(c.quantity)).map((c) => c.quantity) : [];
  return { kind: k, mapping, unrecognisedColumns, missingUnitColumns, missingRequired };
}

/** Header line of a template file for a kind, in canonical units (for a "download template" link). */
export function templateHeaders(kind: PropertyKind): string[] {
  return PROPERTY_KINDS[kind].columns.map((c) => {
    const q = QUANTITIES[c.quantity];
    return `${q.exampleHeader.replace(/\s*\([^()]*\)$/, '')} (${q.canonicalUnitLabel})`;
  });
}
