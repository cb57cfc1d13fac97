import { mkdtempSync, rmSync } from 'node:fs';
import type { Server } from 'node:http';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { createApp } from '../../server/app';
import { createContext } from '../../server/bootstrap';
import { loadEnv } from '../../server/config/env';
import { seedDemo } from '../../server/demo-seed';

export const TEST_PASSWORD = 'test-password-for-demo';

export const EMAIL = {
  admin: 'admin@demo.epsigma.test',
  modeller: 'modeller@demo.epsigma.test',
  reviewer: 'reviewer@demo.epsigma.test',
  consumer: 'consumer@demo.epsigma.test',
} as const;

/**
 * The real app on a fresh, migrated and seeded SQLite file in a temporary folder, listening on a random
 * port so that Origin checks see a real host. `logs` collects everything the server logged.
 */
export async function startTestApp(envOverrides: Record<string, string> = {}) {
  const dir = mkdtempSync(path.join(tmpdir(), 'epsigma-api-'));
  const logs: string[] = [];
  const env = loadEnv({
    NODE_ENV: 'test',
    DATABASE_PATH: path.join(dir, 'test.sqlite'),
    DEMO_PASSWORD: TEST_PASSWORD,
    LOG_REQUESTS: '1',
    SIGN_IN_LIMIT: '1000',
    WORKERS: '1',
    CHECK_RESPONSES: process.env.CHECK_RESPONSES ?? '1',
    ...envOverrides,
  });
  const ctx = await createContext(env, (m) => logs.push(m));
  await seedDemo(ctx, { demoPassword: TEST_PASSWORD });
  const app = createApp(ctx);
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const address = server.address();
  const baseUrl = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}`;

  /** A client that keeps cookies and sends this site's Origin, like a browser tab. */
  const client = () => {
    const agent = request.agent(baseUrl);
    agent.set('Origin', baseUrl);
    return agent;
  };

  const signIn = async (email: string, password = TEST_PASSWORD) => {
    const agent = client();
    const res = await agent.post('/api/auth/login').send({ email, password });
    if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
    return agent;
  };

  const close = async () => {
    await new Promise<void>((resolve) => server.close(() => resolve()));
    await ctx.close();
    rmSync(dir, { recursive: true, force: true });
  };

  return { ctx, app, baseUrl, client, signIn, close, logs, dir };
}

export type TestApp = Awaited<ReturnType<typeof startTestApp>>;
