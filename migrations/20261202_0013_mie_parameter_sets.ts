import { type Kysely, sql } from 'kysely';

/**
 * Mie λr-6 parameter sets: the potential and its repulsive exponent λr beside ε and σ. The old `model` column keeps
 * its check ('lj-12-6', the family of fitted pair potentials with a 6 attraction) because SQLite cannot change a
 * column check without rebuilding a table others refer to; `potential` names the form ('lj-12-6' or 'mie') and
 * `repulsive_exponent` its λr (12 for LJ 12-6, 8–36 for Mie). Both are frozen at creation like the values.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('parameter_set')
    .addColumn('potential', 'text', (c) =>
      c
        .notNull()
        .defaultTo('lj-12-6')
        .check(sql`potential in ('lj-12-6', 'mie')`),
    )
    .execute();
  await db.schema
    .alterTable('parameter_set')
    .addColumn('repulsive_exponent', 'real', (c) =>
      c
        .notNull()
        .defaultTo(12)
        .check(sql`repulsive_exponent between 8 and 36`),
    )
    .execute();
  await sql`CREATE TRIGGER parameter_set_potential_checked BEFORE INSERT ON parameter_set
    WHEN (NEW.potential = 'lj-12-6') <> (NEW.repulsive_exponent = 12)
    BEGIN SELECT RAISE(ABORT, 'a parameter set is LJ 12-6 exactly when its repulsive exponent is 12'); END`.execute(db);
  await sql`CREATE TRIGGER parameter_set_potential_frozen BEFORE UPDATE OF potential, repulsive_exponent ON parameter_set
    BEGIN SELECT RAISE(ABORT, 'parameter_set values are frozen at creation; draft a new parameter set'); END`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`DROP TRIGGER parameter_set_potential_frozen`.execute(db);
  await sql`DROP TRIGGER parameter_set_potential_checked`.execute(db);
  await db.schema.alterTable('parameter_set').dropColumn('repulsive_exponent').execute();
  await db.schema.alterTable('parameter_set').dropColumn('potential').execute();
}
