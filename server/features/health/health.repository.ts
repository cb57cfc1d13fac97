import { sql } from 'kysely';
import type { Db } from '../../db/database';

/** Asks the database one trivial question; throws when it cannot answer. */
export async function pingDatabase(db: Db): Promise<void> {
  await sql`select 1`.execute(db);
}
