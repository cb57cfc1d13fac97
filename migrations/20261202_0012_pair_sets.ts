import { type Kysely, sql } from 'kysely';

/**
 * Pair sets: the combining-rule correction k_ij (and optionally l_ij) fitted to measured cross second virial
 * coefficients B12 of two substances, with both pure approved parameter sets held fixed. A pair set is reviewed
 * (four eyes) before the Mixtures page and the mixture exports use it instead of the combining rule. The fitted
 * values are frozen by a trigger; only the review columns change, once, out of 'in_review'.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('pair_set')
    .addColumn('id', 'integer', (c) => c.primaryKey().autoIncrement())
    .addColumn('first_set_id', 'integer', (c) => c.notNull().references('parameter_set.id'))
    .addColumn('second_set_id', 'integer', (c) => c.notNull().references('parameter_set.id'))
    .addColumn('dataset_version_id', 'integer', (c) => c.notNull().references('dataset_version.id'))
    .addColumn('fit_lij', 'integer', (c) => c.notNull().check(sql`fit_lij in (0, 1)`))
    .addColumn('kij', 'real', (c) => c.notNull())
    .addColumn('kij_std_err', 'real')
    .addColumn('lij', 'real')
    .addColumn('lij_std_err', 'real')
    .addColumn('epsilon12_k', 'real', (c) => c.notNull().check(sql`epsilon12_k > 0`))
    .addColumn('epsilon12_std_err_k', 'real')
    .addColumn('sigma12_angstrom', 'real', (c) => c.notNull().check(sql`sigma12_angstrom > 0`))
    .addColumn('sigma12_std_err_angstrom', 'real')
    .addColumn('result_json', 'text', (c) => c.notNull())
    .addColumn('state', 'text', (c) => c.notNull().check(sql`state in ('in_review', 'approved', 'changes_requested')`))
    .addColumn('created_by', 'text', (c) => c.notNull().references('user.id'))
    .addColumn('created_at', 'text', (c) => c.notNull())
    .addColumn('reviewed_by', 'text', (c) => c.references('user.id'))
    .addColumn('reviewed_at', 'text')
    .addColumn('review_comment', 'text')
    .addCheckConstraint('pair_set_order', sql`first_set_id < second_set_id`)
    .addCheckConstraint('pair_set_four_eyes', sql`reviewed_by is null or reviewed_by <> created_by`)
    .execute();
  await db.schema.createIndex('pair_set_sets_idx').on('pair_set').columns(['first_set_id', 'second_set_id', 'state']).execute();
  await sql`CREATE TRIGGER pair_set_frozen BEFORE UPDATE ON pair_set
    WHEN OLD.state <> 'in_review' OR NEW.kij IS NOT OLD.kij OR NEW.lij IS NOT OLD.lij OR NEW.epsilon12_k IS NOT OLD.epsilon12_k
      OR NEW.sigma12_angstrom IS NOT OLD.sigma12_angstrom OR NEW.first_set_id IS NOT OLD.first_set_id OR NEW.second_set_id IS NOT OLD.second_set_id
      OR NEW.result_json IS NOT OLD.result_json OR NEW.created_by IS NOT OLD.created_by
    BEGIN SELECT RAISE(ABORT, 'pair_set values are frozen and a decided pair set does not change'); END`.execute(db);
  await sql`CREATE TRIGGER pair_set_no_delete BEFORE DELETE ON pair_set BEGIN SELECT RAISE(ABORT, 'pair_set rows are kept'); END`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('pair_set').execute();
}
