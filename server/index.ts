import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { createApp } from './app';
import { createContext } from './bootstrap';
import { loadEnv } from './config/env';
import { seedApprovedSets, seedDemo } from './demo-seed';
import { DEMO_PEOPLE } from '../fixtures/demo/scenario';

const CLIENT_DIR = fileURLToPath(new URL('../dist/client/', import.meta.url));

/** Starts Epsigma: migrate, seed an empty database with the demo, serve the API and the built client. */
export async function startServer() {
  const env = loadEnv();
  const ctx = await createContext(env);
  // The demo catalog: real fits of the gas-phase tables, approved through the review services. With WORKERS=0 those
  // fits run on worker processes that may start after this one, so they are approved in the background once served.
  const workersHere = env.WORKERS > 0;
  const { seeded } = await seedDemo(ctx, { demoPassword: env.DEMO_PASSWORD, withApprovedSets: workersHere });
  const app = createApp(ctx, { clientDir: CLIENT_DIR });
  const server = app.listen(env.PORT, env.HOST, () => {
    const address = server.address();
    const port = typeof address === 'object' && address ? address.port : env.PORT;
    const url = `http://${env.HOST}:${port}`;
    // Mail links need the real port when PORT=0; PUBLIC_URL, when set, always wins.
    if (!env.PUBLIC_URL) ctx.mail.sender.setPublicUrl(url);
    console.log(`Epsigma is serving ${url} (database ${path.resolve(env.DATABASE_PATH)})`);
    if (seeded) console.log('Seeded the demo scenario into the empty database.');
    console.log(`Demo sign-ins (password from DEMO_PASSWORD${process.env.DEMO_PASSWORD ? '' : ', default "epsigma-demo-2026"'}):`);
    for (const p of DEMO_PEOPLE) console.log(`  ${p.roles.join(', ').padEnd(9)} ${p.email}`);
    console.log(`LISTENING ${url}`);
    if (seeded && !workersHere)
      seedApprovedSets(ctx).then(
        (n) => console.log(`Approved ${n} demo parameter sets (their fits ran on the worker processes).`),
        (err: unknown) => console.error(`Demo parameter sets not approved: ${err instanceof Error ? err.message : String(err)}`),
      );
  });
  const shutdown = () => {
    server.close();
    void ctx.close().then(() => process.exit(0));
  };
  process.on('SIGINT', shutdown);
  process.on('SIGTERM', shutdown);
  return server;
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  startServer().catch((err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
}
