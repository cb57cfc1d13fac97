/**
 * `npm run db:seed`: migrate, then seed the demo scenario when the database has no people yet —
 * the same as the first `npm start`: people, substances, tables, and approved parameter sets from real fits.
 */
import { createContext } from '../server/bootstrap';
import { loadEnv } from '../server/config/env';
import { seedDemo } from '../server/demo-seed';

const env = loadEnv();
const ctx = await createContext(env, () => {});
try {
  const { seeded, approved } = await seedDemo(ctx, { demoPassword: env.DEMO_PASSWORD, withApprovedSets: true });
  console.log(
    seeded ? `Seeded the demo scenario (${approved} approved parameter sets).` : 'The database already has people; nothing seeded.',
  );
} finally {
  await ctx.close();
}
