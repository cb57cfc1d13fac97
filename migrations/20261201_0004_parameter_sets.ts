import { type Kysely, sql } from 'kysely';

/**
 * Parameter sets: frozen ε/σ proposed for use, numbered per substance and cutoff scheme, with their
 * review history and comment thread. The values are frozen by triggers; the state column changes only
 * to the target of the newest recorded transition, so every change of state leaves its row behind.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('parameter_set')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('substance_id', 'integer', (c) => c.notNull().references('substance.id'))
    .addColumn('scheme', 'text', (c) => c.notNull().check(sql`scheme in ('full-potential', 'truncated-tail', 'truncated-shifted')`))
    .addColumn('cutoff_sigma', 'real')
    .addColumn('version', 'integer', (c) => c.notNull().check(sql`version >= 1`))
    .addColumn('fit_id', 'integer', (c) => c.notNull().references('fit.id'))
    .addColumn('revision_of', 'integer', (c) => c.references('parameter_set.id').unique())
    .addColumn('model', 'text', (c) => c.notNull().check(sql`model = 'lj-12-6'`))
    .addColumn('epsilon_k', 'real', (c) => c.notNull().check(sql`epsilon_k > 0`))
    .addColumn('sigma_angstrom', 'real', (c) => c.notNull().check(sql`sigma_angstrom > 0`))
    .addColumn('epsilon_std_err_k', 'real')
    .addColumn('sigma_std_err_angstrom', 'real')
    .addColumn('correlation', 'real')
    .addColumn('datasets_json', 'text', (c) => c.notNull())
    .addColumn('temperature_min_k', 'real', (c) => c.notNull())
    .addColumn('temperature_max_k', 'real', (c) => c.notNull())
    .addColumn('pressure_min_mpa', 'real')
    .addColumn('pressure_max_mpa', 'real')
    .addColumn('rationale', 'text', (c) => c.notNull())
    .addColumn('state', 'text', (c) =>
      c.notNull().check(sql`state in ('draft', 'in_review', 'approved', 'changes_requested', 'superseded', 'retired')`),
    )
    .addColumn('created_by', 'text', (c) => c.notNull().references('user.id'))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('updated_at', 'text', (c) => c.notNull())
    .addUniqueConstraint('parameter_set_version_unique', ['substance_id', 'scheme', 'version'])
    .addCheckConstraint(
      'parameter_set_cutoff',
      sql`(scheme = 'full-potential' and cutoff_sigma is null) or (scheme <> 'full-potential' and cutoff_sigma between 2.5 and 4)`,
    )
    .addCheckConstraint('parameter_set_temperature_range', sql`temperature_min_k > 0 and temperature_min_k < temperature_max_k`)
    .addCheckConstraint(
      'parameter_set_pressure_range',
      sql`(pressure_min_mpa is null and pressure_max_mpa is null) or (pressure_min_mpa > 0 and pressure_min_mpa < pressure_max_mpa)`,
    )
    .execute();
  await db.schema.createIndex('parameter_set_state_idx').on('parameter_set').columns(['state', 'substance_id']).execute();

  await db.schema
    .createTable('parameter_set_transition')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('parameter_set_id', 'integer', (c) => c.notNull().references('parameter_set.id'))
    .addColumn('move', 'text', (c) => c.notNull())
    .addColumn('from_state', 'text')
    .addColumn('to_state', 'text', (c) => c.notNull())
    .addColumn('actor_id', 'text', (c) => c.references('user.id'))
    .addColumn('comment', 'text')
    .addColumn('at', 'text', (c) => c.notNull())
    .execute();
  await db.schema
    .createIndex('parameter_set_transition_set_idx')
    .on('parameter_set_transition')
    .columns(['parameter_set_id', 'id'])
    .execute();

  await db.schema
    .createTable('parameter_set_comment')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('parameter_set_id', 'integer', (c) => c.notNull().references('parameter_set.id'))
    .addColumn('author_id', 'text', (c) => c.notNull().references('user.id'))
    .addColumn('body', 'text', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('parameter_set_comment_set_idx').on('parameter_set_comment').columns(['parameter_set_id', 'id']).execute();

  // Values, provenance and numbering are frozen at creation.
  await sql`CREATE TRIGGER parameter_set_frozen BEFORE UPDATE OF
      id, substance_id, scheme, cutoff_sigma, version, fit_id, revision_of, model, epsilon_k, sigma_angstrom,
      epsilon_std_err_k, sigma_std_err_angstrom, correlation, datasets_json, created_by, created_at
    ON parameter_set
    BEGIN SELECT RAISE(ABORT, 'parameter_set values are frozen at creation; draft a new parameter set'); END`.execute(db);
  // Rationale and validity may be corrected while the set is a draft, never after.
  await sql`CREATE TRIGGER parameter_set_draft_fields BEFORE UPDATE OF
      rationale, temperature_min_k, temperature_max_k, pressure_min_mpa, pressure_max_mpa
    ON parameter_set WHEN OLD.state <> 'draft'
    BEGIN SELECT RAISE(ABORT, 'only a draft parameter set may change its rationale or validity'); END`.execute(db);
  // The state follows the newest transition row, which must start where the set stands.
  await sql`CREATE TRIGGER parameter_set_state_logged BEFORE UPDATE OF state ON parameter_set
    WHEN NEW.state IS NOT OLD.state AND NOT EXISTS (
      SELECT 1 FROM parameter_set_transition t
      WHERE t.id = (SELECT max(id) FROM parameter_set_transition WHERE parameter_set_id = NEW.id)
        AND t.from_state = OLD.state AND t.to_state = NEW.state)
    BEGIN SELECT RAISE(ABORT, 'a parameter set changes state only through a recorded transition'); END`.execute(db);
  await sql`CREATE TRIGGER parameter_set_transition_from BEFORE INSERT ON parameter_set_transition
    WHEN (NEW.from_state IS NULL AND EXISTS (SELECT 1 FROM parameter_set_transition WHERE parameter_set_id = NEW.parameter_set_id))
      OR (NEW.from_state IS NOT NULL AND NEW.from_state IS NOT (SELECT state FROM parameter_set WHERE id = NEW.parameter_set_id))
    BEGIN SELECT RAISE(ABORT, 'a transition must start from the state the parameter set is in'); END`.execute(db);
  for (const table of ['parameter_set', 'parameter_set_transition', 'parameter_set_comment']) {
    await sql
      .raw(`CREATE TRIGGER ${table}_no_delete BEFORE DELETE ON ${table} BEGIN SELECT RAISE(ABORT, '${table} rows are never deleted'); END`)
      .execute(db);
  }
  for (const table of ['parameter_set_transition', 'parameter_set_comment']) {
    await sql
      .raw(`CREATE TRIGGER ${table}_no_update BEFORE UPDATE ON ${table} BEGIN SELECT RAISE(ABORT, '${table} rows are append-only'); END`)
      .execute(db);
  }
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const t of ['parameter_set_comment', 'parameter_set_transition', 'parameter_set']) await db.schema.dropTable(t).execute();
}
