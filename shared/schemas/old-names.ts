/**
 * Old names still accepted after the vocabulary rename (DEVELOPERS.md, Vocabulary), so a client written against the
 * earlier API (`datasets`, `datasetId`, `property`, `molarMass`) keeps working. A request schema names its old
 * fields where it is declared (`acceptOldFields(schema, [[old, new]])`); the server's validBody renames them before
 * the schema reads the body (a new name wins over an old one; the old key is dropped, so a strict schema does not
 * see it twice). This file is left alone by the rename script.
 */
export function renameOldField(value: unknown, oldName: string, newName: string): unknown {
  if (!value || typeof value !== 'object' || Array.isArray(value) || !(oldName in value)) return value;
  const { [oldName]: old, ...rest } = value as Record<string, unknown>;
  return newName in rest ? rest : { ...rest, [newName]: old };
}

export type OldFieldNames = ReadonlyArray<readonly [oldName: string, newName: string]>;

/** Several renames at once: `[[old, new], …]`. */
export const renameOldFields = (value: unknown, pairs: OldFieldNames): unknown =>
  pairs.reduce((v, [oldName, newName]) => renameOldField(v, oldName, newName), value);

const OLD_FIELDS = new WeakMap<object, OldFieldNames>();

/** Declares the old names of a request schema's top-level fields; returns the schema itself (its type is unchanged). */
export function acceptOldFields<S extends object>(schema: S, pairs: OldFieldNames): S {
  OLD_FIELDS.set(schema, pairs);
  return schema;
}

/** The old field names a request schema accepts (none for most). */
export const oldFieldsOf = (schema: object): OldFieldNames => OLD_FIELDS.get(schema) ?? [];

/** A request body with its old field names renamed for this schema. */
export const withNewFieldNames = (schema: object, body: unknown): unknown => renameOldFields(body, oldFieldsOf(schema));

/** A stored key in the old vocabulary, in the new one: datasetId → measurementSetId, perDataset → perMeasurementSet. */
const newKey = (key: string) =>
  key
    .replace(/(?<=[a-z0-9])Dataset(s?)/g, (_, s: string) => `MeasurementSet${s}`)
    .replace(/^dataset(s?)(?=[A-Z0-9]|$)/, (_, s: string) => `measurementSet${s}`);

function renameKeysDeep(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(renameKeysDeep);
  if (!value || typeof value !== 'object') return value;
  return Object.fromEntries(Object.entries(value).map(([k, v]) => [newKey(k), renameKeysDeep(v)]));
}

/**
 * Parses a stored JSON column (fit and parameter-set references, job inputs and results) written before or after
 * the rename: keys of the old vocabulary (`datasetId`, `datasets`, `perDataset`, `datasetIndex`) come back in the
 * new one. Rows written since the rename hold no old key, so they are parsed as they are.
 */
// `any` by default, as JSON.parse was at these places; the entity contracts (issue #17, item 1) give them types.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export function readStoredJson<T = any>(json: string): T {
  const parsed: unknown = JSON.parse(json);
  return (json.includes('"dataset') || json.includes('Dataset') ? renameKeysDeep(parsed) : parsed) as T;
}
