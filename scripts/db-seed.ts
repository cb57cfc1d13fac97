/**
 * `npm run db:seed`: migrate, then seed the demo scenario when the database has no people yet —
 * the same as the first `npm start`: people, substances, tables, and approved parameter sets from real fits.
 */
import { createContext } from '../server/bootstrap';
import { loadEnv } from '../server/config/env';
import { seedDemo } from '../server/db/seed';
import { seedApprovedDemoSets } from '../server/features/catalog/catalog.seed';

const env = loadEnv();
const ctx = await createContext(env, () => {});
try {
  const { seeded } = await seedDemo(ctx.db, { demoPassword: env.DEMO_PASSWORD });
  const approved = seeded ? await seedApprovedDemoSets(ctx) : 0;
  console.log(seeded ? `Seeded the demo scenario (${approved} approved parameter sets).` : 'The database already has people; nothing seeded.');
} finally {
  await ctx.close();
}
