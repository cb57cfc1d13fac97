import { type Kysely, sql } from 'kysely';

/**
 * One vocabulary (DEVELOPERS.md, Vocabulary): the uploaded, versioned table is a "measurement set" and its kind is
 * `kind`. Tables and columns are renamed in place (ALTER TABLE …
 * RENAME), so rows, ids, foreign keys and indexes stay as they are; SQLite rewrites the references in other
 * tables, indexes and triggers. The immutability triggers are created again under their new names and messages.
 * One old name stays: the unique constraint dataset_version_unique (SQLite renames no constraint without rebuilding
 * the table, and nothing refers to the name).
 * Stored JSON (fit and parameter-set references, job payloads) keeps whatever keys it was written with; the
 * reading code accepts both spellings.
 */
const TABLES: Array<[string, string]> = [
  ['dataset', 'measurement_set'],
  ['dataset_version', 'measurement_set_version'],
  ['dataset_withdrawal', 'measurement_set_withdrawal'],
];

const COLUMNS: Array<[table: string, from: string, to: string]> = [
  ['measurement_set', 'property', 'kind'],
  ['measurement_set_version', 'dataset_id', 'measurement_set_id'],
  ['measurement_set_withdrawal', 'dataset_id', 'measurement_set_id'],
  ['measurement_row', 'dataset_version_id', 'measurement_set_version_id'],
  ['fit', 'datasets_json', 'measurement_sets_json'],
  ['parameter_set', 'datasets_json', 'measurement_sets_json'],
  ['pair_set', 'dataset_version_id', 'measurement_set_version_id'],
];

async function dropImmutable(db: Kysely<any>, tables: string[]): Promise<void> {
  for (const table of tables) {
    for (const op of ['update', 'delete']) await sql.raw(`DROP TRIGGER IF EXISTS ${table}_no_${op}`).execute(db);
  }
}

async function createImmutable(db: Kysely<any>, tables: string[]): Promise<void> {
  for (const table of tables) {
    await sql
      .raw(`CREATE TRIGGER ${table}_no_update BEFORE UPDATE ON ${table} BEGIN SELECT RAISE(ABORT, '${table} rows are immutable'); END`)
      .execute(db);
    await sql
      .raw(`CREATE TRIGGER ${table}_no_delete BEFORE DELETE ON ${table} BEGIN SELECT RAISE(ABORT, '${table} rows are immutable'); END`)
      .execute(db);
  }
}

export async function up(db: Kysely<any>): Promise<void> {
  await dropImmutable(db, ['dataset_version', 'measurement_row', 'dataset_withdrawal']);
  for (const [from, to] of TABLES) await sql.raw(`ALTER TABLE ${from} RENAME TO ${to}`).execute(db);
  for (const [table, from, to] of COLUMNS) await sql.raw(`ALTER TABLE ${table} RENAME COLUMN ${from} TO ${to}`).execute(db);
  await sql`DROP INDEX IF EXISTS dataset_substance_idx`.execute(db);
  await db.schema.createIndex('measurement_set_substance_idx').on('measurement_set').column('substance_id').execute();
  await createImmutable(db, ['measurement_set_version', 'measurement_row', 'measurement_set_withdrawal']);
}

export async function down(db: Kysely<any>): Promise<void> {
  await dropImmutable(db, ['measurement_set_version', 'measurement_row', 'measurement_set_withdrawal']);
  await sql`DROP INDEX IF EXISTS measurement_set_substance_idx`.execute(db);
  for (const [table, from, to] of [...COLUMNS].reverse()) await sql.raw(`ALTER TABLE ${table} RENAME COLUMN ${to} TO ${from}`).execute(db);
  for (const [from, to] of [...TABLES].reverse()) await sql.raw(`ALTER TABLE ${to} RENAME TO ${from}`).execute(db);
  await db.schema.createIndex('dataset_substance_idx').on('dataset').column('substance_id').execute();
  await createImmutable(db, ['dataset_version', 'measurement_row', 'dataset_withdrawal']);
}
