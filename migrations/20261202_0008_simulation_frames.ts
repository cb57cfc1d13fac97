import type { Kysely } from 'kysely';

/**
 * Per-frame data of finished NPT runs, for reweighting to nearby reduced states (shared/physics/md/mbar.ts): the
 * potential energy of the sampled Hamiltonian and the volume of every retained production frame, as little-endian
 * Float64 BLOBs, with the engine settings that decide which runs may be pooled (atoms, cutoff in σ, cutoff scheme,
 * timestep). One row per simulation job, written by the web process when the run's result arrives.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('simulation_frames')
    .addColumn('job_id', 'integer', (c) => c.primaryKey().references('job.id').onDelete('cascade'))
    .addColumn('reduced_temperature', 'real', (c) => c.notNull())
    .addColumn('reduced_pressure', 'real', (c) => c.notNull())
    .addColumn('atoms', 'integer', (c) => c.notNull())
    .addColumn('cutoff', 'real', (c) => c.notNull())
    .addColumn('scheme', 'text', (c) => c.notNull())
    .addColumn('timestep', 'real', (c) => c.notNull())
    .addColumn('phase', 'text', (c) => c.notNull())
    .addColumn('frame_count', 'integer', (c) => c.notNull())
    .addColumn('statistical_inefficiency', 'real', (c) => c.notNull())
    .addColumn('hamiltonian_potential', 'blob', (c) => c.notNull())
    .addColumn('volume', 'blob', (c) => c.notNull())
    .addColumn('created_at', 'text', (c) => c.notNull())
    .execute();
  await db.schema
    .createIndex('simulation_frames_settings_idx')
    .on('simulation_frames')
    .columns(['atoms', 'cutoff', 'scheme', 'timestep'])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('simulation_frames').execute();
}
