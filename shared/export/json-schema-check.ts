/**
 * Checks a value against one of our published JSON Schemas (draft 2020-12) with Ajv, the reference validator,
 * with strict schemas (an unknown keyword in a schema throws instead of being skipped). "format" is an annotation, as
 * 2020-12 treats it by default (JSON Schema Validation 2020-12, §7.2.1). Ajv's errors are turned into our plain
 * problem list: a JSON Pointer (RFC 6901) and a message in the words our tests and error answers use.
 */
import { Ajv2020, type ErrorObject, type ValidateFunction } from 'ajv/dist/2020.js';
import type { JsonSchema } from './json-schema';

export interface SchemaProblem {
  /** JSON Pointer (RFC 6901) of the offending value, "" for the root. */
  path: string;
  message: string;
}

const ajv = new Ajv2020({ allErrors: true, strictSchema: true, strictTypes: false, verbose: true, validateFormats: false });
const compiled = new WeakMap<object, ValidateFunction>();

function jsonType(value: unknown): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'array';
  if (typeof value === 'number' && Number.isInteger(value)) return 'number';
  return typeof value;
}

const pointer = (path: string, key: string | number) => `${path}/${String(key).replace(/~/g, '~0').replace(/\//g, '~1')}`;

function toProblem(error: ErrorObject): SchemaProblem {
  const path = error.instancePath;
  const p = error.params as Record<string, unknown>;
  switch (error.keyword) {
    case 'type': {
      const types = Array.isArray(p.type) ? (p.type as string[]) : String(p.type).split(',');
      return { path, message: `expected ${types.join(' or ')}, got ${jsonType(error.data)}` };
    }
    case 'required':
      return { path, message: `missing required property "${String(p.missingProperty)}"` };
    case 'additionalProperties':
      return { path: pointer(path, String(p.additionalProperty)), message: 'no value is allowed here' };
    case 'false schema':
      return { path, message: 'no value is allowed here' };
    case 'const':
      return { path, message: `must equal ${JSON.stringify(p.allowedValue)}` };
    case 'enum':
      return { path, message: `must be one of ${(p.allowedValues as unknown[]).map((e) => JSON.stringify(e)).join(', ')}` };
    case 'minimum':
      return { path, message: `must be ≥ ${String(p.limit)}` };
    case 'maximum':
      return { path, message: `must be ≤ ${String(p.limit)}` };
    default:
      return { path, message: error.message ?? `fails "${error.keyword}"` };
  }
}

/** Every problem of `value` against `schema`; an empty list means valid. Throws on a schema Ajv refuses. */
export function checkJsonSchema(schema: JsonSchema | boolean, value: unknown): SchemaProblem[] {
  if (typeof schema === 'boolean') return schema ? [] : [{ path: '', message: 'no value is allowed here' }];
  let validate = compiled.get(schema);
  if (!validate) {
    validate = ajv.compile(schema);
    compiled.set(schema, validate);
  }
  return validate(value) ? [] : (validate.errors ?? []).map(toProblem);
}
