/** `npm run db:migrate`: apply pending migrations to DATABASE_PATH. */
import { loadEnv } from '../server/config/env';
import { migrateToLatest, openDatabase } from '../server/db/database';

const env = loadEnv();
const handle = openDatabase(env.DATABASE_PATH);
try {
  const applied = await migrateToLatest(handle.db);
  console.log(applied.length ? `Applied ${applied.length} migration(s): ${applied.join(', ')}` : 'The database is up to date.');
} finally {
  await handle.close();
}
