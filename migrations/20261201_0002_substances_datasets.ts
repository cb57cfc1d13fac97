import { type Kysely, sql } from 'kysely';

/**
 * Substances and their measurement sets. A measurement set (dataset) has immutable versions, each
 * holding the original file bytes, its SHA-256 and the rows in canonical units. Versions and rows
 * are never updated or deleted (triggers); withdrawal is its own append-only record.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('substance')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('formula', 'text')
    .addColumn('description', 'text')
    .addColumn('molar_mass_grams_per_mol', 'real', (c) => c.notNull().check(sql`molar_mass_grams_per_mol > 0`))
    .addColumn('created_by', 'text', (c) => c.notNull().references('user.id'))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('updated_at', 'text', (c) => c.notNull())
    .execute();
  await sql`CREATE UNIQUE INDEX substance_name_unique ON substance (name COLLATE NOCASE)`.execute(db);

  await db.schema
    .createTable('dataset')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('substance_id', 'integer', (c) => c.notNull().references('substance.id'))
    .addColumn('property', 'text', (c) => c.notNull())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('created_by', 'text', (c) => c.notNull().references('user.id'))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('dataset_substance_idx').on('dataset').column('substance_id').execute();

  await db.schema
    .createTable('dataset_version')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('dataset_id', 'integer', (c) => c.notNull().references('dataset.id'))
    .addColumn('version', 'integer', (c) => c.notNull())
    .addColumn('sha256', 'text', (c) => c.notNull())
    .addColumn('original_filename', 'text', (c) => c.notNull())
    .addColumn('original_bytes', 'blob', (c) => c.notNull())
    .addColumn('source', 'text')
    .addColumn('doi', 'text')
    .addColumn('method', 'text')
    .addColumn('notes', 'text')
    .addColumn('default_relative_uncertainty', 'real', (c) => c.notNull())
    .addColumn('delimiter', 'text', (c) => c.notNull())
    .addColumn('decimal', 'text', (c) => c.notNull())
    .addColumn('columns_json', 'text', (c) => c.notNull())
    .addColumn('row_count', 'integer', (c) => c.notNull())
    .addColumn('uploaded_by', 'text', (c) => c.notNull().references('user.id'))
    .addColumn('uploaded_at', 'text', (c) => c.notNull())
    .addUniqueConstraint('dataset_version_unique', ['dataset_id', 'version'])
    .execute();

  await db.schema
    .createTable('measurement_row')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('dataset_version_id', 'integer', (c) => c.notNull().references('dataset_version.id'))
    .addColumn('position', 'integer', (c) => c.notNull())
    .addColumn('file_row', 'integer', (c) => c.notNull())
    .addColumn('temperature_k', 'real', (c) => c.notNull().check(sql`temperature_k > 0`))
    .addColumn('pressure_mpa', 'real')
    .addColumn('value', 'real', (c) => c.notNull())
    .addColumn('uncertainty', 'real', (c) => c.notNull().check(sql`uncertainty > 0`))
    .addColumn('uncertainty_source', 'text', (c) => c.notNull().check(sql`uncertainty_source in ('measured', 'default-relative')`))
    .addColumn('raw_json', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('measurement_row_version_idx').on('measurement_row').columns(['dataset_version_id', 'position']).execute();

  await db.schema
    .createTable('dataset_withdrawal')
    .addColumn('dataset_id', 'integer', (c) => c.primaryKey().references('dataset.id'))
    .addColumn('withdrawn_by', 'text', (c) => c.notNull().references('user.id'))
    .addColumn('withdrawn_at', 'text', (c) => c.notNull())
    .addColumn('reason', 'text', (c) => c.notNull())
    .execute();

  for (const table of ['dataset_version', 'measurement_row', 'dataset_withdrawal']) {
    await sql
      .raw(`CREATE TRIGGER ${table}_no_update BEFORE UPDATE ON ${table} BEGIN SELECT RAISE(ABORT, '${table} rows are immutable'); END`)
      .execute(db);
    await sql
      .raw(`CREATE TRIGGER ${table}_no_delete BEFORE DELETE ON ${table} BEGIN SELECT RAISE(ABORT, '${table} rows are immutable'); END`)
      .execute(db);
  }
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const t of ['dataset_withdrawal', 'measurement_row', 'dataset_version', 'dataset', 'substance'])
    await db.schema.dropTable(t).execute();
}
