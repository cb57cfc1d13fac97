import { createHash } from 'node:crypto';
import { mkdtempSync, rmSync, statSync } from 'node:fs';
import type { Server } from 'node:http';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Migrator } from 'kysely';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MIGRATIONS } from '../../migrations/index';
import { createApp } from '../../server/app';
import { createContext } from '../../server/bootstrap';
import { migrateToLatest, openDatabase } from '../../server/db/database';
import { EMAIL, startTestApp, TEST_PASSWORD, type TestApp } from './test-app';

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');
const login = (t: TestApp, email: string, password: string, headers: Record<string, string> = {}) =>
  t.client().post('/api/auth/login').set(headers).send({ email, password });

describe('sign-in limiter (SIGN_IN_LIMIT=3)', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp({ SIGN_IN_LIMIT: '3' });
  });
  afterAll(() => t.close());

  it('keys on the e-mail as validation reads it: spaces, tabs, case, no-break and full-width spellings share the lock, right password included', async () => {
    for (let i = 0; i < 3; i++) expect((await login(t, EMAIL.admin, 'wrong-password')).status).toBe(401);
    const variants = [
      EMAIL.admin,
      `  ${EMAIL.admin}`,
      `${EMAIL.admin} `,
      `\t${EMAIL.admin}`,
      EMAIL.admin.toUpperCase(),
      `\u00a0${EMAIL.admin}`,
      `\uff41dmin@demo.epsigma.test`,
    ];
    for (const email of variants) {
      const res = await login(t, email, TEST_PASSWORD);
      expect(res.status, JSON.stringify(email)).toBe(429);
      expect(res.body.error.code).toBe('too_many_attempts');
      expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
    }
  });

  it('counts failures only: many successful sign-ins never lock, and a success clears earlier failures', async () => {
    for (let i = 0; i < 6; i++) expect((await login(t, EMAIL.reviewer, TEST_PASSWORD)).status).toBe(200);
    for (let i = 0; i < 2; i++) expect((await login(t, EMAIL.reviewer, 'wrong-password')).status).toBe(401);
    expect((await login(t, EMAIL.reviewer, TEST_PASSWORD)).status).toBe(200);
    for (let i = 0; i < 2; i++) expect((await login(t, EMAIL.reviewer, 'wrong-password')).status).toBe(401);
    expect((await login(t, EMAIL.reviewer, TEST_PASSWORD)).status).toBe(200);
  });

  it('parallel guesses cannot slip past the limit', async () => {
    const answers = await Promise.all(Array.from({ length: 8 }, () => login(t, EMAIL.modeller, 'wrong-password')));
    const statuses = answers.map((r) => r.status).sort();
    expect(statuses.filter((s) => s === 401)).toHaveLength(3);
    expect(statuses.filter((s) => s === 429)).toHaveLength(5);
  });

  it('does not believe X-Forwarded-For without TRUST_PROXY: a made-up client address gets no fresh tries', async () => {
    for (const xff of ['203.0.113.7', '198.51.100.1, 127.0.0.1']) {
      expect((await login(t, EMAIL.admin, TEST_PASSWORD, { 'X-Forwarded-For': xff })).status).toBe(429);
    }
  });

  it('keeps the counts in the database: a restarted app on the same file is still locked', async () => {
    const ctx2 = await createContext(t.ctx.env, () => {});
    const app2 = createApp(ctx2);
    const server: Server = await new Promise((resolve) => {
      const s = app2.listen(0, '127.0.0.1', () => resolve(s));
    });
    try {
      const port = (server.address() as { port: number }).port;
      const base = `http://127.0.0.1:${port}`;
      const res = await request(base).post('/api/auth/login').set('Origin', base).send({ email: EMAIL.admin, password: TEST_PASSWORD });
      expect(res.status).toBe(429);
      const other = await request(base)
        .post('/api/auth/login')
        .set('Origin', base)
        .send({ email: EMAIL.consumer, password: TEST_PASSWORD });
      expect(other.status).toBe(200);
    } finally {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await ctx2.close();
    }
  });
});

describe('sign-in limiter behind a proxy (TRUST_PROXY=loopback)', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp({ SIGN_IN_LIMIT: '2', TRUST_PROXY: 'loopback' });
  });
  afterAll(() => t.close());

  it('counts per forwarded client address when the proxy is trusted', async () => {
    const from = (ip: string) => ({ 'X-Forwarded-For': ip });
    for (let i = 0; i < 2; i++) expect((await login(t, EMAIL.admin, 'wrong-password', from('203.0.113.7'))).status).toBe(401);
    expect((await login(t, EMAIL.admin, TEST_PASSWORD, from('203.0.113.7'))).status).toBe(429);
    // Another client behind the same proxy is a different client.
    expect((await login(t, EMAIL.admin, TEST_PASSWORD, from('198.51.100.1'))).status).toBe(200);
  });
});

describe('secrets at rest', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it('stores only the SHA-256 of a session token; the cookie keeps the token and keeps working', async () => {
    const res = await login(t, EMAIL.modeller, TEST_PASSWORD);
    const token = String(res.headers['set-cookie']).match(/epsigma_session=([^;]+)/)![1];
    const user = await t.ctx.db.selectFrom('user').select('id').where('email', '=', EMAIL.modeller).executeTakeFirstOrThrow();
    const ids = (await t.ctx.db.selectFrom('session').select('id').where('userId', '=', user.id).execute()).map((r) => r.id);
    expect(ids).not.toContain(token);
    expect(ids).toContain(sha256(token));
    // The stored value does not open a session: only the token does.
    expect(
      (
        await t
          .client()
          .get('/api/me')
          .set('Cookie', `epsigma_session=${sha256(token)}`)
      ).status,
    ).toBe(401);
    expect((await t.client().get('/api/me').set('Cookie', `epsigma_session=${token}`)).status).toBe(200);
    // Sign-out removes the hashed row.
    await t.client().post('/api/auth/logout').set('Cookie', `epsigma_session=${token}`);
    expect(await t.ctx.db.selectFrom('session').select('id').where('id', '=', sha256(token)).executeTakeFirst()).toBeUndefined();
  });

  it('creates the database file 0600 (its -wal too) and a new data folder 0700', () => {
    const file = t.ctx.env.DATABASE_PATH;
    expect(statSync(file).mode & 0o777).toBe(0o600);
    expect(statSync(`${file}-wal`).mode & 0o777).toBe(0o600);
    const dir = mkdtempSync(path.join(tmpdir(), 'epsigma-modes-'));
    try {
      const nested = path.join(dir, 'data', 'epsigma.sqlite');
      const handle = openDatabase(nested);
      handle.sqlite.exec('create table x (a)');
      expect(statSync(path.join(dir, 'data')).mode & 0o777).toBe(0o700);
      expect(statSync(nested).mode & 0o777).toBe(0o600);
      handle.sqlite.close();
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('the migration hashes sessions stored before it, so people stay signed in', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'epsigma-mig-'));
    const handle = openDatabase(path.join(dir, 'old.sqlite'));
    try {
      const migrator = new Migrator({ db: handle.db, provider: { getMigrations: async () => MIGRATIONS } });
      const before = await migrator.migrateTo('20261201_0006_tokens_preferences');
      expect(before.error).toBeUndefined();
      await handle.db
        .insertInto('user')
        .values({
          id: 'u1',
          email: 'ada@quillmoor.example',
          name: 'Ada Fenwick',
          passwordHash: 'x',
          active: 1,
          createdAt: '2026-12-01T00:00:00Z',
        } as never)
        .execute();
      await handle.db.insertInto('session').values({ id: 'plain-token-from-before', expiresAt: 4102444800, userId: 'u1' }).execute();
      await migrateToLatest(handle.db);
      const rows = await handle.db.selectFrom('session').select('id').execute();
      expect(rows.map((r) => r.id)).toEqual([sha256('plain-token-from-before')]);
    } finally {
      await handle.close();
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
