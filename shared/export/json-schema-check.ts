/**
 * A small JSON Schema (draft 2020-12) checker for the subset of keywords our export schemas use:
 * type, required, properties, additionalProperties, items, enum, const, minimum, maximum.
 * Annotation keywords ($schema, $id, title, description, $comment, format) are ignored, as 2020-12 treats
 * "format" as an annotation by default (JSON Schema Validation 2020-12, §7.2.1). Any other keyword throws, so a
 * schema can never silently rely on something this checker skips.
 */
import type { JsonSchema } from './json-schema';

export interface SchemaProblem {
  /** JSON Pointer (RFC 6901) of the offending value, "" for the root. */
  path: string;
  message: string;
}

const ANNOTATIONS = new Set(['$schema', '$id', 'title', 'description', '$comment', 'format']);
const SUPPORTED = new Set(['type', 'required', 'properties', 'additionalProperties', 'items', 'enum', 'const', 'minimum', 'maximum']);

function jsonType(value: unknown): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'array';
  return typeof value; // 'object' | 'string' | 'number' | 'boolean' (| others that are not JSON)
}

/** JSON Schema Validation 2020-12 §6.1.1: "integer" matches any number with a zero fractional part. */
function matchesType(value: unknown, type: string): boolean {
  const t = jsonType(value);
  if (type === 'integer') return t === 'number' && Number.isInteger(value);
  if (type === 'number') return t === 'number' && Number.isFinite(value as number);
  return t === type;
}

/** Equality in the JSON data model (JSON Schema Core 2020-12 §4.2.2): objects unordered, arrays ordered. */
function jsonEqual(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  const ta = jsonType(a);
  if (ta !== jsonType(b)) return false;
  if (ta === 'array') {
    const x = a as unknown[];
    const y = b as unknown[];
    return x.length === y.length && x.every((v, k) => jsonEqual(v, y[k]));
  }
  if (ta === 'object') {
    const x = a as Record<string, unknown>;
    const y = b as Record<string, unknown>;
    const kx = Object.keys(x);
    return kx.length === Object.keys(y).length && kx.every((k) => Object.prototype.hasOwnProperty.call(y, k) && jsonEqual(x[k], y[k]));
  }
  return false;
}

const pointer = (path: string, key: string | number) => `${path}/${String(key).replace(/~/g, '~0').replace(/\//g, '~1')}`;

function check(schema: JsonSchema | boolean, value: unknown, path: string, out: SchemaProblem[]): void {
  if (schema === true) return;
  if (schema === false) {
    out.push({ path, message: 'no value is allowed here' });
    return;
  }
  for (const keyword of Object.keys(schema)) {
    if (!SUPPORTED.has(keyword) && !ANNOTATIONS.has(keyword)) throw new Error(`json-schema-check: keyword "${keyword}" is not supported`);
  }
  if ('type' in schema) {
    const types = Array.isArray(schema.type) ? (schema.type as string[]) : [schema.type as string];
    if (!types.some((t) => matchesType(value, t))) {
      out.push({ path, message: `expected ${types.join(' or ')}, got ${jsonType(value)}` });
      return; // the other keywords would only repeat the type problem
    }
  }
  if ('const' in schema && !jsonEqual(value, schema.const)) out.push({ path, message: `must equal ${JSON.stringify(schema.const)}` });
  if ('enum' in schema && !(schema.enum as unknown[]).some((e) => jsonEqual(value, e))) {
    out.push({ path, message: `must be one of ${(schema.enum as unknown[]).map((e) => JSON.stringify(e)).join(', ')}` });
  }
  // Numeric keywords apply to numbers only (Validation 2020-12 §6.2); other types pass them.
  if (typeof value === 'number') {
    if (typeof schema.minimum === 'number' && value < schema.minimum) out.push({ path, message: `must be ≥ ${schema.minimum}` });
    if (typeof schema.maximum === 'number' && value > schema.maximum) out.push({ path, message: `must be ≤ ${schema.maximum}` });
  }
  if (jsonType(value) === 'object') {
    const obj = value as Record<string, unknown>;
    for (const key of (schema.required as string[] | undefined) ?? []) {
      if (!Object.prototype.hasOwnProperty.call(obj, key)) out.push({ path, message: `missing required property "${key}"` });
    }
    const props = (schema.properties as Record<string, JsonSchema> | undefined) ?? {};
    for (const [key, v] of Object.entries(obj)) {
      if (Object.prototype.hasOwnProperty.call(props, key)) check(props[key], v, pointer(path, key), out);
      // additionalProperties applies to the members "properties" does not name (Core 2020-12 §10.3.2.3).
      else if ('additionalProperties' in schema) check(schema.additionalProperties as JsonSchema | boolean, v, pointer(path, key), out);
    }
  }
  if (Array.isArray(value) && 'items' in schema) {
    value.forEach((v, k) => check(schema.items as JsonSchema | boolean, v, pointer(path, k), out));
  }
}

/** Every problem of `value` against `schema`; an empty list means valid. */
export function checkJsonSchema(schema: JsonSchema | boolean, value: unknown): SchemaProblem[] {
  const out: SchemaProblem[] = [];
  check(schema, value, '', out);
  return out;
}
