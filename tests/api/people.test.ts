import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EMAIL, startTestApp, type TestApp } from './test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

const newPerson = {
  email: 'new.modeller@demo.epsigma.test',
  name: 'Noor Falk',
  roles: ['modeller', 'reviewer'],
  password: 'initial-password-1',
};

describe('people administration', () => {
  it('answers 401 without a session', async () => {
    expect((await t.client().get('/api/people')).status).toBe(401);
    expect((await t.client().post('/api/people').send(newPerson)).status).toBe(401);
  });

  it('answers 403 for roles other than admin', async () => {
    for (const email of [EMAIL.modeller, EMAIL.reviewer, EMAIL.consumer]) {
      const agent = await t.signIn(email);
      const res = await agent.get('/api/people');
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
      expect((await agent.post('/api/people').send(newPerson)).status).toBe(403);
    }
  });

  it('answers 400 with a message per field for a malformed body', async () => {
    const admin = await t.signIn(EMAIL.admin);
    const res = await admin.post('/api/people').send({ email: 'nope', name: '', roles: ['wizard'], password: 'short' });
    expect(res.status).toBe(400);
    const fields = res.body.error.details.map((d: { field: string }) => d.field);
    expect(fields).toEqual(expect.arrayContaining(['email', 'name', 'roles.0', 'password']));
  });

  it('creates a person with several roles, who can then sign in; the audit trail records it without the password', async () => {
    const admin = await t.signIn(EMAIL.admin);
    const res = await admin.post('/api/people').send(newPerson);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email: newPerson.email, name: newPerson.name, roles: ['modeller', 'reviewer'], active: true });
    expect(JSON.stringify(res.body)).not.toMatch(/password|hash/i);
    const agent = await t.signIn(newPerson.email, newPerson.password);
    expect((await agent.get('/api/me')).body.roles).toEqual(['modeller', 'reviewer']);
    const audit = await t.ctx.db
      .selectFrom('auditEvent')
      .selectAll()
      .where('action', '=', 'user.created')
      .where('targetId', '=', res.body.id)
      .execute();
    expect(audit).toHaveLength(1);
    expect(JSON.stringify(audit)).not.toContain(newPerson.password);
    const dup = await admin.post('/api/people').send(newPerson);
    expect(dup.status).toBe(409);
  });

  it('changes roles (audited with before and after) and deactivation ends the sessions', async () => {
    const admin = await t.signIn(EMAIL.admin);
    const list = await admin.get('/api/people');
    const person = list.body.people.find((u: { email: string }) => u.email === newPerson.email);
    const agent = await t.signIn(newPerson.email, newPerson.password);
    const changed = await admin.patch(`/api/people/${person.id}`).send({ roles: ['consumer'] });
    expect(changed.status).toBe(200);
    expect(changed.body.roles).toEqual(['consumer']);
    const audit = await t.ctx.db
      .selectFrom('auditEvent')
      .selectAll()
      .where('action', '=', 'user.roles_changed')
      .where('targetId', '=', person.id)
      .executeTakeFirstOrThrow();
    expect(JSON.parse(audit.beforeJson!).roles).toEqual(['modeller', 'reviewer']);
    expect(JSON.parse(audit.afterJson!).roles).toEqual(['consumer']);
    expect((await agent.get('/api/me')).body.roles).toEqual(['consumer']);

    expect((await admin.patch(`/api/people/${person.id}`).send({ active: false })).status).toBe(200);
    expect((await agent.get('/api/me')).status).toBe(401);
    const again = await t.client().post('/api/auth/login').send({ email: newPerson.email, password: newPerson.password });
    expect(again.status).toBe(401);
  });

  it('refuses to remove the last active admin (409) and changes nothing', async () => {
    const admin = await t.signIn(EMAIL.admin);
    const me = (await admin.get('/api/me')).body;
    const res = await admin.patch(`/api/people/${me.id}`).send({ roles: ['modeller'] });
    expect(res.status).toBe(409);
    expect((await admin.get('/api/me')).body.roles).toEqual(['admin']);
  });

  it('answers 404 for an unknown person and 400 for an empty patch', async () => {
    const admin = await t.signIn(EMAIL.admin);
    expect((await admin.patch('/api/people/no-such-id').send({ active: true })).status).toBe(404);
    expect((await admin.patch('/api/people/no-such-id').send({})).status).toBe(400);
  });
});

describe('audit trail storage', () => {
  it('refuses UPDATE and DELETE of audit rows at the database (trigger)', () => {
    expect(() => t.ctx.sqlite.prepare("UPDATE audit_event SET summary = 'edited'").run()).toThrow(/append-only/);
    expect(() => t.ctx.sqlite.prepare('DELETE FROM audit_event').run()).toThrow(/append-only/);
  });
});
