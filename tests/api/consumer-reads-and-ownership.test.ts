import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { approvedSet, newSubstance, syntheticB2Csv } from './approved-set';
import { EMAIL, startTestApp, TEST_PASSWORD, type TestApp } from './test-app';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

let t: TestApp;
let admin: Agent, modeller: Agent, other: Agent, reviewer: Agent, consumer: Agent;
let published: { setId: number; fitId: number; measurementSetId: number };
let draftFitId: number;
let draftMeasurementSetId: number;
let substanceId: number;

const OTHER_MODELLER = 'wren.aldous@quillmoor.example';

beforeAll(async () => {
  t = await startTestApp();
  admin = await t.signIn(EMAIL.admin);
  const created = await admin
    .post('/api/people')
    .send({ email: OTHER_MODELLER, name: 'Wren Aldous', roles: ['modeller'], password: TEST_PASSWORD });
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  [modeller, other, reviewer, consumer] = await Promise.all([
    t.signIn(EMAIL.modeller),
    t.signIn(OTHER_MODELLER),
    t.signIn(EMAIL.reviewer),
    t.signIn(EMAIL.consumer),
  ]);
  substanceId = await newSubstance(modeller, 'quillgas QG-7', 58.1);
  published = await approvedSet(t, { modeller, reviewer }, { substanceId, epsilonK: 210, sigmaAngstrom: 3.9 });
  // Unpublished work of the same modeller: a second measurement set and its fit, never drafted into a set.
  const up = await modeller
    .post('/api/measurement-sets')
    .field('substanceId', substanceId)
    .field('kind', 'b2')
    .field('name', 'Unpublished B2 run')
    .attach('file', syntheticB2Csv(205, 3.95, 0.5), { filename: 'b2-draft.csv', contentType: 'text/csv' });
  expect(up.status).toBe(201);
  draftMeasurementSetId = up.body.id;
  const fit = await modeller.post('/api/fits').send({ substanceId, measurementSets: [{ id: draftMeasurementSetId }] });
  expect(fit.status).toBe(202);
  await t.ctx.jobs.waitFor(fit.body.jobId);
  draftFitId = fit.body.id;
}, 60_000);
afterAll(() => t.close());

describe('what a consumer may read', () => {
  it('reads the fit behind a published set (its card shows it), but no other fit', async () => {
    expect((await consumer.get(`/api/fits/${published.fitId}`)).status).toBe(200);
    const draft = await consumer.get(`/api/fits/${draftFitId}`);
    expect(draft.status).toBe(404);
    expect(draft.body.error.code).toBe('not_found');
    // The same answer as for a fit that does not exist: nothing is learned.
    expect((await consumer.get('/api/fits/999999')).status).toBe(404);
  });

  it('lists no fits of a substance, no measurement sets, no set detail and no original file', async () => {
    for (const p of [
      `/api/substances/${substanceId}/fits`,
      '/api/measurement-sets',
      `/api/measurement-sets?substanceId=${substanceId}`,
      `/api/measurement-sets/${draftMeasurementSetId}`,
      `/api/measurement-sets/${published.measurementSetId}`,
      `/api/measurement-sets/${draftMeasurementSetId}/versions/1/original`,
    ]) {
      const res = await consumer.get(p);
      expect(res.status, p).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    }
  });

  it('sees substances without their measurement sets or how many there are', async () => {
    const res = await consumer.get(`/api/substances/${substanceId}`);
    expect(res.status).toBe(200);
    expect(res.body.name).toBe('quillgas QG-7');
    expect(res.body).not.toHaveProperty('measurementSets');
    expect((await modeller.get(`/api/substances/${substanceId}`)).body.measurementSets).toHaveLength(2);
    // Nor how many sets of which kinds exist.
    const listed = (await consumer.get('/api/substances')).body.substances.find((s: { id: number }) => s.id === substanceId);
    expect(listed.name).toBe('quillgas QG-7');
    expect(listed).not.toHaveProperty('measurementSetCount');
    expect(listed).not.toHaveProperty('kinds');
    const forModeller = (await modeller.get('/api/substances')).body.substances.find((s: { id: number }) => s.id === substanceId);
    expect(forModeller).toMatchObject({ measurementSetCount: 2, kinds: ['b2'] });
  });

  it('the review roles still read every fit and measurement set', async () => {
    for (const agent of [admin, modeller, reviewer]) {
      expect((await agent.get(`/api/fits/${draftFitId}`)).status).toBe(200);
      expect((await agent.get(`/api/substances/${substanceId}/fits`)).status).toBe(200);
      expect((await agent.get(`/api/measurement-sets/${draftMeasurementSetId}`)).status).toBe(200);
      expect((await agent.get(`/api/measurement-sets/${draftMeasurementSetId}/versions/1/original`)).status).toBe(200);
    }
  });
});

describe('ownership rule: the author or an admin changes a fit or a measurement set', () => {
  it('another modeller may not cancel a fit; the author and an admin pass the rule (409 here: the fit has finished)', async () => {
    const res = await other.post(`/api/fits/${draftFitId}/cancel`);
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('not_author');
    expect(res.body.error.message).toContain('Milo Carraway');
    expect((await modeller.post(`/api/fits/${draftFitId}/cancel`)).status).toBe(409);
    expect((await admin.post(`/api/fits/${draftFitId}/cancel`)).status).toBe(409);
    expect((await consumer.post(`/api/fits/${draftFitId}/cancel`)).status).toBe(403);
  });

  it('an admin cancels a running fit of someone else, and the audit trail says so', async () => {
    const density = (await modeller.get('/api/measurement-sets')).body.measurementSets.find((d: { kind: string }) => d.kind === 'density');
    const fit = await modeller.post('/api/fits').send({
      substanceId: density.substanceId,
      measurementSets: [{ id: density.id }],
      options: { density: { atoms: 256, steps: 400000 } },
    });
    expect(fit.status, JSON.stringify(fit.body)).toBe(202);
    const res = await admin.post(`/api/fits/${fit.body.id}/cancel`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.status).toBe('cancelled');
    const audit = await t.ctx.db
      .selectFrom('auditEvent')
      .select(['actorEmail', 'summary'])
      .where('action', '=', 'fit.cancelled')
      .where('targetId', '=', String(fit.body.id))
      .executeTakeFirstOrThrow();
    expect(audit.actorEmail).toBe(EMAIL.admin);
    expect(audit.summary).toContain("as admin; the fit is Milo Carraway's");
  });

  it('another modeller may neither version nor withdraw a measurement set; the author may, and an admin may withdraw', async () => {
    const version = await other
      .post(`/api/measurement-sets/${draftMeasurementSetId}/versions`)
      .attach('file', syntheticB2Csv(205, 3.95, 0.7), { filename: 'b2-v2.csv', contentType: 'text/csv' });
    expect(version.status).toBe(403);
    expect(version.body.error.code).toBe('not_author');
    const withdraw = await other.post(`/api/measurement-sets/${draftMeasurementSetId}/withdraw`).send({ reason: 'Not mine to keep' });
    expect(withdraw.status).toBe(403);
    expect(withdraw.body.error.code).toBe('not_author');
    expect(
      await t.ctx.db
        .selectFrom('measurementSetWithdrawal')
        .select('measurementSetId')
        .where('measurementSetId', '=', draftMeasurementSetId)
        .execute(),
    ).toHaveLength(0);

    const own = await modeller
      .post(`/api/measurement-sets/${draftMeasurementSetId}/versions`)
      .attach('file', syntheticB2Csv(205, 3.95, 0.7), { filename: 'b2-v2.csv', contentType: 'text/csv' });
    expect(own.status, JSON.stringify(own.body)).toBe(201);
    expect(own.body.version).toBe(2);
    const byAdmin = await admin
      .post(`/api/measurement-sets/${draftMeasurementSetId}/withdraw`)
      .send({ reason: 'Duplicate of the published run' });
    expect(byAdmin.status).toBe(200);
    const audit = await t.ctx.db
      .selectFrom('auditEvent')
      .select(['actorEmail', 'summary'])
      .where('action', '=', 'dataset.withdrawn')
      .where('targetId', '=', String(draftMeasurementSetId))
      .executeTakeFirstOrThrow();
    expect(audit.actorEmail).toBe(EMAIL.admin);
    expect(audit.summary).toContain('as admin');
  });
});
