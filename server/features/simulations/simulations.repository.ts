import type { Db, Tx } from '../../db/database';

/** The job row of a simulation, or undefined when the id is not a simulation. */
export async function findSimulationJob(db: Db | Tx, id: number) {
  return db.selectFrom('job').selectAll().where('id', '=', id).where('kind', '=', 'simulation').executeTakeFirst();
}

/** The newest simulations first. */
export async function listSimulationJobs(db: Db | Tx, limit: number) {
  return db.selectFrom('job').selectAll().where('kind', '=', 'simulation').orderBy('id', 'desc').limit(limit).execute();
}

export type SimulationJobRow = NonNullable<Awaited<ReturnType<typeof findSimulationJob>>>;
