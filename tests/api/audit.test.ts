import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EMAIL, startTestApp, type TestApp } from './test-app';

let t: TestApp;
let admin: Awaited<ReturnType<TestApp['signIn']>>;
const substanceIds: number[] = [];

interface Event {
  id: number;
  at: string;
  actorEmail: string | null;
  action: string;
  targetType: string;
  targetId: string | null;
  summary: string;
  before: unknown;
  after: unknown;
}

beforeAll(async () => {
  t = await startTestApp();
  admin = await t.signIn(EMAIL.admin);
  const modeller = await t.signIn(EMAIL.modeller);
  for (const name of ['Auditium A', 'Auditium B', 'Auditium C']) {
    const res = await modeller.post('/api/substances').send({ name, molarMassGPerMol: 4.0026 });
    expect(res.status).toBe(201);
    substanceIds.push(res.body.id);
  }
  await modeller.patch(`/api/substances/${substanceIds[0]}`).send({ description: 'edited for the audit test' });
  const consumer = await t.signIn(EMAIL.consumer);
  for (const id of substanceIds) await consumer.post(`/api/substances/${id}/follow`);
  await consumer.delete(`/api/substances/${substanceIds[1]}/follow`);
});
afterAll(() => t.close());

const audit = async (query: Record<string, string | number>) => {
  const res = await admin.get('/api/audit').query(query);
  expect(res.status).toBe(200);
  return res.body as { events: Event[]; nextBefore: number | null };
};

describe('GET /api/audit', () => {
  it('answers 401 without a session, 403 for other roles, 400 per bad field', async () => {
    expect((await t.client().get('/api/audit')).status).toBe(401);
    for (const email of [EMAIL.modeller, EMAIL.reviewer, EMAIL.consumer]) {
      expect((await (await t.signIn(email)).get('/api/audit')).status).toBe(403);
    }
    for (const [query, field] of [
      [{ limit: 501 }, 'limit'],
      [{ limit: 0 }, 'limit'],
      [{ before: -1 }, 'before'],
      [{ from: 'yesterday' }, 'from'],
      [{ to: '2026-13-45' }, 'to'],
      [{ from: '2026-12-02', to: '2026-12-01' }, 'to'],
    ] as const) {
      const res = await admin.get('/api/audit').query(query);
      expect(res.status, JSON.stringify(query)).toBe(400);
      expect(res.body.error.details.map((d: { field: string }) => d.field)).toContain(field);
    }
  });

  it('lists newest first with before/after parsed', async () => {
    const { events } = await audit({});
    expect(events.length).toBeGreaterThanOrEqual(7);
    const ids = events.map((e) => e.id);
    expect(ids).toEqual([...ids].sort((a, b) => b - a));
    const edit = events.find((e) => e.action === 'substance.updated')!;
    expect(edit).toMatchObject({ actorEmail: EMAIL.modeller, targetType: 'substance', targetId: String(substanceIds[0]) });
    expect((edit.after as { description: string }).description).toBe('edited for the audit test');
  });

  it('filters by action, actor substring, target type and id', async () => {
    const follows = await audit({ action: 'substance.followed' });
    expect(follows.events).toHaveLength(3);
    expect(follows.events.every((e) => e.actorEmail === EMAIL.consumer)).toBe(true);

    const byActor = await audit({ actor: 'CONSUMER@demo' });
    expect(byActor.events.map((e) => e.action).sort()).toEqual([
      'substance.followed',
      'substance.followed',
      'substance.followed',
      'substance.unfollowed',
    ]);

    const oneTarget = await audit({ targetType: 'substance', targetId: String(substanceIds[1]) });
    expect(oneTarget.events.map((e) => e.action).sort()).toEqual(['substance.created', 'substance.followed', 'substance.unfollowed']);

    expect((await audit({ action: 'no.such.action' })).events).toEqual([]);
  });

  it('filters by date: a date alone covers that whole UTC day', async () => {
    // Days taken from the events themselves, so a run across midnight UTC still covers them all.
    const events = (await audit({ limit: 500 })).events;
    const days = events.map((e) => e.at.slice(0, 10)).sort();
    expect((await audit({ from: days[0], to: days[days.length - 1], limit: 500 })).events.length).toBe(events.length);
    expect((await audit({ from: '2999-01-01' })).events).toEqual([]);
    expect((await audit({ to: '2000-01-01' })).events).toEqual([]);
    const cut = (await audit({ action: 'substance.unfollowed' })).events[0].at;
    const after = await audit({ from: cut, limit: 500 });
    expect(after.events.every((e) => e.at >= cut)).toBe(true);
    expect(after.events.some((e) => e.action === 'substance.unfollowed')).toBe(true);
  });

  it('pages with limit and the before cursor, without gaps or repeats', async () => {
    const everything = (await audit({ limit: 500 })).events.map((e) => e.id);
    const seen: number[] = [];
    let before: number | null = null;
    do {
      const page: { events: Event[]; nextBefore: number | null } = await audit(before === null ? { limit: 2 } : { limit: 2, before });
      expect(page.events.length).toBeLessThanOrEqual(2);
      seen.push(...page.events.map((e) => e.id));
      before = page.nextBefore;
    } while (before !== null);
    expect(seen).toEqual(everything);
  });

  it('lists the actions and target types in use', async () => {
    const res = await admin.get('/api/audit/vocabulary');
    expect(res.status).toBe(200);
    expect(res.body.actions).toEqual(expect.arrayContaining(['substance.created', 'substance.followed', 'substance.unfollowed']));
    expect(res.body.targetTypes).toContain('substance');
  });

  it('keeps audit rows append-only (the database refuses UPDATE and DELETE)', async () => {
    await expect(sql`UPDATE audit_event SET summary = 'changed'`.execute(t.ctx.db)).rejects.toThrow(/append-only/);
    await expect(sql`DELETE FROM audit_event`.execute(t.ctx.db)).rejects.toThrow(/append-only/);
  });
});
