import { createServer } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { emailsOfFollowers, emailsOfRole } from '../../server/features/mail/mail.repository';
import { mailBody, queueMail } from '../../server/features/mail/mail.service';
import { MAX_MAIL_ATTEMPTS, retryDelayMs } from '../../server/features/mail/mail.sender';
import { EMAIL, startTestApp, type TestApp } from './test-app';

let t: TestApp;
let admin: Awaited<ReturnType<TestApp['signIn']>>;
let substanceId: number;

beforeAll(async () => {
  t = await startTestApp();
  admin = await t.signIn(EMAIL.admin);
  const modeller = await t.signIn(EMAIL.modeller);
  const res = await modeller.post('/api/substances').send({ name: 'Mailium', molarMassGPerMol: 20.18 });
  expect(res.status).toBe(201);
  substanceId = res.body.id;
});
afterAll(() => t.close());

const outboxRow = (subject: string) => t.ctx.db.selectFrom('mailOutbox').selectAll().where('subject', '=', subject).executeTakeFirst();

/** Runs the sender until the row has left 'queued' (the background loop may get there first). */
async function deliver(subject: string) {
  for (let i = 0; i < 50; i++) {
    await t.ctx.mail.flush();
    const row = await outboxRow(subject);
    if (row && row.status !== 'queued') return row;
  }
  throw new Error(`mail "${subject}" was never delivered`);
}

describe('outbox', () => {
  it('does not send mail queued in a transaction that rolls back', async () => {
    await expect(
      t.ctx.db.transaction().execute(async (tx) => {
        await queueMail(tx, { to: [EMAIL.reviewer], subject: 'Rolled back', ...mailBody(['never sent']), reason: 'test.rollback' });
        throw new Error('change refused');
      }),
    ).rejects.toThrow('change refused');
    await t.ctx.mail.flush();
    expect(await outboxRow('Rolled back')).toBeUndefined();
    const box = await admin.get('/api/mailbox');
    expect(box.body.messages.map((m: { subject: string }) => m.subject)).not.toContain('Rolled back');
  });

  it('delivers a queued mail over SMTP to the local service, listed by GET /api/mailbox', async () => {
    const id = await t.ctx.db.transaction().execute((tx) =>
      queueMail(tx, {
        to: [EMAIL.reviewer, EMAIL.reviewer.toUpperCase()],
        subject: 'Mailium v1 — submitted for review',
        ...mailBody(['Milo Carraway submitted Mailium v1 (ε/k_B = 35.6 ± 0.2 K, σ = 2.79 Å).']),
        link: `/substances/${substanceId}`,
        reason: 'test.delivery',
      }),
    );
    expect(id).toEqual(expect.any(Number));
    const row = await deliver('Mailium v1 — submitted for review');
    expect(row).toMatchObject({ status: 'sent', attempts: 1, lastError: null });
    expect(row.messageId).toMatch(/^<.+@.+>$/);

    const res = await admin.get('/api/mailbox').query({ to: 'reviewer@' });
    expect(res.status).toBe(200);
    const message = res.body.messages.find((m: { subject: string }) => m.subject === 'Mailium v1 — submitted for review');
    expect(message).toMatchObject({ to: [EMAIL.reviewer], from: 'Epsigma <epsigma@localhost>', messageId: row.messageId });
    expect(message.text).toContain('ε/k_B = 35.6 ± 0.2 K, σ = 2.79 Å');
    // Links are absolute, built from PUBLIC_URL or http://HOST:PORT.
    expect(message.text).toContain(`Open in Epsigma: http://127.0.0.1:${t.ctx.env.PORT}/substances/${substanceId}`);
    expect(message.html).toContain(`<a href="http://127.0.0.1:${t.ctx.env.PORT}/substances/${substanceId}">`);
    expect(message.receivedAt).toEqual(expect.any(String));

    const other = await admin.get('/api/mailbox').query({ to: 'consumer@' });
    expect(other.body.messages.map((m: { subject: string }) => m.subject)).not.toContain('Mailium v1 — submitted for review');
  });

  it('returns null and stores nothing when no recipient is left', async () => {
    expect(await queueMail(t.ctx.db, { to: ['  '], subject: 'Nobody', ...mailBody(['x']), reason: 'test.empty' })).toBeNull();
    expect(await outboxRow('Nobody')).toBeUndefined();
  });

  it('finds recipients by role and by follow', async () => {
    expect(await emailsOfRole(t.ctx.db, 'reviewer')).toEqual([EMAIL.reviewer]);
    expect(await emailsOfRole(t.ctx.db, 'admin')).toEqual([EMAIL.admin]);
    const consumer = await t.signIn(EMAIL.consumer);
    expect((await consumer.post(`/api/substances/${substanceId}/follow`)).status).toBe(200);
    expect(await emailsOfFollowers(t.ctx.db, substanceId)).toEqual([EMAIL.consumer]);
    expect((await consumer.delete(`/api/substances/${substanceId}/follow`)).status).toBe(200);
    expect(await emailsOfFollowers(t.ctx.db, substanceId)).toEqual([]);
  });
});

describe('GET /api/mailbox', () => {
  it('answers 401 without a session, 403 for other roles, 400 for a bad query', async () => {
    expect((await t.client().get('/api/mailbox')).status).toBe(401);
    for (const email of [EMAIL.modeller, EMAIL.reviewer, EMAIL.consumer]) {
      const res = await (await t.signIn(email)).get('/api/mailbox');
      expect(res.status).toBe(403);
    }
    expect((await t.client().get('/api/mail/outbox')).status).toBe(401);
    expect((await (await t.signIn(EMAIL.reviewer)).get('/api/mail/outbox')).status).toBe(403);
    const badStatus = await admin.get('/api/mail/outbox').query({ status: 'lost' });
    expect(badStatus.status).toBe(400);
    expect(badStatus.body.error.details[0].field).toBe('status');
    const bad = await admin.get('/api/mailbox').query({ limit: 0 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].field).toBe('limit');
  });
});

describe('GET /api/mail/outbox', () => {
  it('lists what was sent, newest first, with counts per status', async () => {
    const res = await admin.get('/api/mail/outbox').query({ status: 'sent' });
    expect(res.status).toBe(200);
    expect(res.body.mode).toBe('local');
    expect(res.body.counts.sent).toBeGreaterThanOrEqual(1);
    expect(res.body.messages.every((m: { status: string }) => m.status === 'sent')).toBe(true);
    expect(res.body.messages.map((m: { subject: string }) => m.subject)).toContain('Mailium v1 — submitted for review');
  });
});

describe('follows', () => {
  it('follows and unfollows a substance, audited once each', async () => {
    const modeller = await t.signIn(EMAIL.modeller);
    expect((await modeller.post(`/api/substances/${substanceId}/follow`)).body).toEqual({ substanceId, following: true });
    expect((await modeller.post(`/api/substances/${substanceId}/follow`)).status).toBe(200);
    const mine = await modeller.get('/api/me/follows');
    expect(mine.status).toBe(200);
    expect(mine.body.follows).toEqual([{ substanceId, substanceName: 'Mailium', followedAt: expect.any(String) }]);
    const events = await t.ctx.db
      .selectFrom('auditEvent')
      .selectAll()
      .where('action', '=', 'substance.followed')
      .where('actorEmail', '=', EMAIL.modeller)
      .execute();
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({ targetType: 'substance', targetId: String(substanceId) });

    expect((await modeller.delete(`/api/substances/${substanceId}/follow`)).body).toEqual({ substanceId, following: false });
    expect((await modeller.get('/api/me/follows')).body.follows).toEqual([]);
    const unfollowed = await t.ctx.db
      .selectFrom('auditEvent')
      .select('id')
      .where('action', '=', 'substance.unfollowed')
      .where('actorEmail', '=', EMAIL.modeller)
      .execute();
    expect(unfollowed).toHaveLength(1);
  });

  it('answers 401 without a session, 403 without an Origin, 400 for a bad id, 404 for an unknown substance', async () => {
    expect((await t.client().post(`/api/substances/${substanceId}/follow`)).status).toBe(401);
    expect((await t.client().get('/api/me/follows')).status).toBe(401);
    const consumer = await t.signIn(EMAIL.consumer);
    const noOrigin = await consumer.post(`/api/substances/${substanceId}/follow`).set('Origin', 'http://evil.example');
    expect(noOrigin.status).toBe(403);
    expect(noOrigin.body.error.code).toBe('origin_rejected');
    expect((await consumer.post('/api/substances/abc/follow')).status).toBe(400);
    expect((await consumer.delete('/api/substances/0/follow')).status).toBe(400);
    expect((await consumer.post('/api/substances/999999/follow')).status).toBe(404);
  });
});

/** A port on 127.0.0.1 that nothing listens on: bind a free one and release it. */
async function closedPort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as { port: number };
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

describe('with SMTP_URL pointing at a closed port', () => {
  let broken: TestApp;
  beforeAll(async () => {
    broken = await startTestApp({ SMTP_URL: `smtp://127.0.0.1:${await closedPort()}` });
  });
  afterAll(() => broken.close());

  it('starts no local service and answers 409 for the mailbox', async () => {
    expect(broken.ctx.mail).toMatchObject({ mode: 'smtp', localPort: null });
    const res = await (await broken.signIn(EMAIL.admin)).get('/api/mailbox');
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('mailbox_unavailable');
  });

  it('records each failure, retries with doubling waits, gives up after the last attempt, and never blocks requests', async () => {
    await broken.ctx.db
      .transaction()
      .execute((tx) => queueMail(tx, { to: [EMAIL.admin], subject: 'Unreachable', ...mailBody(['x']), reason: 'test.failure' }));
    const consumer = await broken.signIn(EMAIL.consumer);
    // Requests go on while the mail waits in the outbox.
    expect((await consumer.get('/api/me/follows')).status).toBe(200);

    const read = async () =>
      await broken.ctx.db.selectFrom('mailOutbox').selectAll().where('subject', '=', 'Unreachable').executeTakeFirstOrThrow();
    let row = await read();
    for (let i = 0; i < 50 && row.attempts === 0; i++) {
      await broken.ctx.mail.flush();
      row = await read();
    }
    expect(row).toMatchObject({ status: 'queued', attempts: 1, sentAt: null });
    expect(row.lastError).toMatch(/ECONNREFUSED/);

    for (let attempt = 2; attempt <= MAX_MAIL_ATTEMPTS; attempt++) {
      const due = new Date(row.nextAttemptAt);
      // Not yet due one second before its time: nothing is tried.
      expect(await broken.ctx.mail.flush(new Date(due.getTime() - 1000))).toBe(0);
      expect(await broken.ctx.mail.flush(due)).toBe(1);
      const next = await read();
      expect(next.attempts).toBe(attempt);
      expect(new Date(next.nextAttemptAt).getTime() - due.getTime()).toBe(retryDelayMs(attempt));
      row = next;
    }
    expect(row.status).toBe('failed');
    expect(row.lastError).toMatch(/ECONNREFUSED/);
    // A failed row is never tried again.
    expect(await broken.ctx.mail.flush(new Date(Date.now() + 365 * 86_400_000))).toBe(0);
    expect(broken.logs.some((l) => l.includes('giving up'))).toBe(true);

    const outbox = await (await broken.signIn(EMAIL.admin)).get('/api/mail/outbox').query({ status: 'failed' });
    expect(outbox.status).toBe(200);
    expect(outbox.body.mode).toBe('smtp');
    expect(outbox.body.counts.failed).toBe(1);
    expect(outbox.body.messages).toEqual([
      expect.objectContaining({
        subject: 'Unreachable',
        status: 'failed',
        attempts: MAX_MAIL_ATTEMPTS,
        to: [EMAIL.admin],
        nextAttemptAt: null,
        lastError: expect.stringMatching(/ECONNREFUSED/),
      }),
    ]);
  });
});
