/** `npm run db:seed`: migrate, then seed the demo scenario when the database has no people yet. */
import { loadEnv } from '../server/config/env';
import { migrateToLatest, openDatabase } from '../server/db/database';
import { seedDemo } from '../server/db/seed';

const env = loadEnv();
const handle = openDatabase(env.DATABASE_PATH);
try {
  await migrateToLatest(handle.db);
  const { seeded } = await seedDemo(handle.db, { demoPassword: env.DEMO_PASSWORD });
  console.log(seeded ? 'Seeded the demo scenario.' : 'The database already has people; nothing seeded.');
} finally {
  await handle.close();
}
