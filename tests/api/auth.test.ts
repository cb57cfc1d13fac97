import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EMAIL, startTestApp, TEST_PASSWORD, type TestApp } from './test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

describe('health', () => {
  it('answers without a session', async () => {
    const res = await t.client().get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'ok', database: 'ok' });
  });

  it('unknown API routes answer 404 in the error shape', async () => {
    const res = await t.client().get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error).toMatchObject({ code: 'not_found' });
  });
});

describe('sign-in', () => {
  it('signs in with the right password and sets an HttpOnly session cookie', async () => {
    const res = await t.client().post('/api/auth/login').send({ email: EMAIL.modeller, password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ id: expect.any(String), email: EMAIL.modeller, name: 'Milo Carraway', roles: ['modeller'] });
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/epsigma_session=[^;]+;/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
  });

  it('matches the e-mail case-insensitively', async () => {
    const res = await t.client().post('/api/auth/login').send({ email: 'Reviewer@Demo.Epsigma.Test', password: TEST_PASSWORD });
    expect(res.status).toBe(200);
  });

  it('refuses a wrong password with 401, records the failure in the audit trail, and does not say which part was wrong', async () => {
    const before = await t.ctx.db.selectFrom('auditEvent').selectAll().where('action', '=', 'auth.sign_in_failed').execute();
    const res = await t.client().post('/api/auth/login').send({ email: EMAIL.admin, password: 'not-the-password' });
    expect(res.status).toBe(401);
    expect(res.body.error).toEqual({ code: 'invalid_credentials', message: 'E-mail or password is not right.' });
    const unknown = await t.client().post('/api/auth/login').send({ email: 'nobody@demo.epsigma.test', password: 'x' });
    expect(unknown.status).toBe(401);
    expect(unknown.body.error.message).toBe(res.body.error.message);
    const after = await t.ctx.db.selectFrom('auditEvent').selectAll().where('action', '=', 'auth.sign_in_failed').execute();
    expect(after.length - before.length).toBe(2);
    expect(JSON.stringify(after)).not.toContain('not-the-password');
  });

  it('answers a malformed body with 400 and a message per field', async () => {
    const res = await t.client().post('/api/auth/login').send({ email: 'not-an-email' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    const fields = res.body.error.details.map((d: { field: string }) => d.field);
    expect(fields).toEqual(expect.arrayContaining(['email', 'password']));
  });

  it('answers broken JSON with 400 in the error shape', async () => {
    const res = await t.client().post('/api/auth/login').set('content-type', 'application/json').send('{"email":');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_json');
  });

  it('refuses state-changing requests without this site as Origin', async () => {
    const res = await t
      .client()
      .post('/api/auth/login')
      .set('Origin', 'https://elsewhere.example')
      .send({ email: EMAIL.admin, password: TEST_PASSWORD });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('origin_rejected');
  });

  it('GET /api/me answers 401 without a session and the user with one', async () => {
    expect((await t.client().get('/api/me')).status).toBe(401);
    const agent = await t.signIn(EMAIL.consumer);
    const me = await agent.get('/api/me');
    expect(me.status).toBe(200);
    expect(Object.keys(me.body).sort()).toEqual(['email', 'id', 'name', 'roles']);
    expect(me.body.roles).toEqual(['consumer']);
  });

  it('sign-out ends the session', async () => {
    const agent = await t.signIn(EMAIL.consumer);
    expect((await agent.post('/api/auth/logout')).status).toBe(204);
    expect((await agent.get('/api/me')).status).toBe(401);
  });

  it('an expired session is refused', async () => {
    const agent = await t.signIn(EMAIL.reviewer);
    const user = await t.ctx.db.selectFrom('user').select('id').where('email', '=', EMAIL.reviewer).executeTakeFirstOrThrow();
    await t.ctx.db
      .updateTable('session')
      .set({ expiresAt: Math.floor(Date.now() / 1000) - 10 })
      .where('userId', '=', user.id)
      .execute();
    expect((await agent.get('/api/me')).status).toBe(401);
  });

  it('changes the own password only with the current one, and ends other sessions', async () => {
    const other = await t.signIn(EMAIL.reviewer);
    const agent = await t.signIn(EMAIL.reviewer);
    const wrong = await agent.post('/api/me/password').send({ currentPassword: 'wrong', newPassword: 'a-new-password-123' });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.details[0].field).toBe('currentPassword');
    const short = await agent.post('/api/me/password').send({ currentPassword: TEST_PASSWORD, newPassword: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.details[0].field).toBe('newPassword');
    expect((await agent.post('/api/me/password').send({ currentPassword: TEST_PASSWORD, newPassword: 'a-new-password-123' })).status).toBe(
      204,
    );
    expect((await agent.get('/api/me')).status).toBe(200);
    expect((await other.get('/api/me')).status).toBe(401);
    await t.signIn(EMAIL.reviewer, 'a-new-password-123');
    await agent.post('/api/me/password').send({ currentPassword: 'a-new-password-123', newPassword: TEST_PASSWORD });
  });

  it('never logs or returns a password, a hash or a session token', async () => {
    const res = await t.client().post('/api/auth/login').send({ email: EMAIL.admin, password: TEST_PASSWORD });
    const token = String(res.headers['set-cookie']).match(/epsigma_session=([^;]+)/)![1];
    const everything = t.logs.join('\n');
    expect(everything).not.toContain(TEST_PASSWORD);
    expect(everything).not.toContain(token);
    expect(everything).not.toMatch(/argon2/);
    expect(JSON.stringify(res.body)).not.toMatch(/hash|password|session/i);
  });
});

describe('sign-in rate limit', () => {
  it('answers 429 after too many attempts for one address', async () => {
    const limited = await startTestApp({ SIGN_IN_LIMIT: '3' });
    try {
      for (let i = 0; i < 3; i++)
        expect((await limited.client().post('/api/auth/login').send({ email: EMAIL.admin, password: 'wrong' })).status).toBe(401);
      const res = await limited.client().post('/api/auth/login').send({ email: EMAIL.admin, password: TEST_PASSWORD });
      expect(res.status).toBe(429);
      expect(res.body.error.code).toBe('too_many_attempts');
      // Another person's sign-in from the same address is not blocked by it.
      expect((await limited.client().post('/api/auth/login').send({ email: EMAIL.modeller, password: TEST_PASSWORD })).status).toBe(200);
    } finally {
      await limited.close();
    }
  });
});
