import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { b2WithGradient } from '../../shared/physics/virial';
import { EMAIL, startTestApp, type TestApp } from './test-app';

let t: TestApp;
let modeller: Awaited<ReturnType<TestApp['signIn']>>;
let substanceId: number;
let b2MeasurementSetId: number;

// Synthetic B2 table from known, invented parameters with a small deterministic wiggle (not real data).
const TRUE = { epsilonK: 150, sigmaAngstrom: 3.6 };
function syntheticB2Csv(): Buffer {
  const lines = ['T (K),B2 (cm3/mol),u(B2) (cm3/mol)'];
  for (let i = 0; i < 14; i++) {
    const T = 180 + i * 40;
    const b2 = b2WithGradient(T, TRUE.epsilonK, TRUE.sigmaAngstrom).b2Cm3PerMol;
    const wiggle = 0.3 * Math.sin(1.7 * i);
    lines.push(`${T},${(b2 + wiggle).toFixed(4)},0.5`);
  }
  return Buffer.from(lines.join('\n'));
}

beforeAll(async () => {
  t = await startTestApp();
  modeller = await t.signIn(EMAIL.modeller);
  substanceId = (await modeller.post('/api/substances').send({ name: 'Fittium', molarMassGPerMol: 83.8 })).body.id;
  const up = await modeller
    .post('/api/measurement-sets')
    .field('substanceId', substanceId)
    .field('kind', 'b2')
    .field('name', 'Synthetic B2')
    .attach('file', syntheticB2Csv(), { filename: 'b2.csv', contentType: 'text/csv' });
  expect(up.status).toBe(201);
  b2MeasurementSetId = up.body.id;
});
afterAll(() => t.close());

describe('fits', () => {
  it('route family: 401 without session, 403 for roles that may not run fits, 400 per field', async () => {
    expect(
      (
        await t
          .client()
          .post('/api/fits')
          .send({ substanceId, measurementSets: [{ id: b2MeasurementSetId }] })
      ).status,
    ).toBe(401);
    for (const email of [EMAIL.consumer, EMAIL.reviewer, EMAIL.admin]) {
      const agent = await t.signIn(email);
      expect((await agent.post('/api/fits').send({ substanceId, measurementSets: [{ id: b2MeasurementSetId }] })).status).toBe(403);
    }
    const bad = await modeller
      .post('/api/fits')
      .send({ substanceId: 'x', measurementSets: [], options: { bounds: { epsilonK: [10, 5], sigmaAngstrom: [1, 9] }, colour: 'red' } });
    expect(bad.status).toBe(400);
    const fields = bad.body.error.details.map((d: { field: string }) => d.field);
    expect(fields).toEqual(expect.arrayContaining(['substanceId', 'measurementSets', 'options.bounds.epsilonK']));
  });

  it('refuses a measurement set of another substance with 422 naming the field', async () => {
    const other = (await modeller.post('/api/substances').send({ name: 'Otherium', molarMassGPerMol: 20 })).body.id;
    const res = await modeller.post('/api/fits').send({ substanceId: other, measurementSets: [{ id: b2MeasurementSetId }] });
    expect(res.status).toBe(422);
    expect(res.body.error.details[0].field).toBe('measurementSets.0.id');
  });

  it('answers 202 at once, runs in the background and recovers the parameters', async () => {
    const res = await modeller.post('/api/fits').send({ substanceId, measurementSets: [{ id: b2MeasurementSetId, weight: 1 }] });
    expect(res.status).toBe(202);
    expect(res.body).toMatchObject({ id: expect.any(Number), number: 1 });
    const done = await t.ctx.jobs.waitFor(res.body.jobId);
    expect(done.status).toBe('succeeded');
    const fit = await modeller.get(`/api/fits/${res.body.id}`);
    expect(fit.status).toBe(200);
    expect(fit.body).toMatchObject({ id: res.body.id, number: 1, status: 'succeeded', progress: 1 });
    const r = fit.body.result;
    // The synthetic truth (150 K, 3.6 Å) is recovered within a few standard errors.
    expect(Math.abs(r.epsilonK - TRUE.epsilonK)).toBeLessThan(4 * r.stdErr.epsilonK + 0.5);
    expect(Math.abs(r.sigmaAngstrom - TRUE.sigmaAngstrom)).toBeLessThan(4 * r.stdErr.sigmaAngstrom + 0.005);
    expect(r).toMatchObject({ dof: 12, covarianceScaling: 'reduced-chi2' });
    expect(r.residuals).toHaveLength(14);
    expect(r.perMeasurementSet[0]).toMatchObject({ measurementSetId: b2MeasurementSetId, points: 14 });
    expect(fit.body.measurementSets).toEqual([
      {
        measurementSetId: b2MeasurementSetId,
        version: 1,
        versionId: expect.any(Number),
        kind: 'b2',
        valueUnit: 'cm^3/mol',
        name: 'Synthetic B2',
        weight: 1,
        excludeRows: [],
        excludeReason: null,
      },
    ]);
    expect(fit.body.codeVersion).toMatch(/^\d+\.\d+\.\d+/);
  });

  it('numbers fits per substance and lists them', async () => {
    const res = await modeller
      .post('/api/fits')
      .send({ substanceId, measurementSets: [{ id: b2MeasurementSetId }], options: { restarts: 0 } });
    expect(res.body.number).toBe(2);
    await t.ctx.jobs.waitFor(res.body.jobId);
    const list = await modeller.get(`/api/substances/${substanceId}/fits`);
    expect(list.status).toBe(200);
    expect(list.body.fits.map((f: { number: number }) => f.number)).toEqual([2, 1]);
    expect(list.body.fits[0].status).toBe('succeeded');
    // A fit behind no published set is unpublished work: a consumer gets 404 (tests/api/consumer-reads-and-ownership.test.ts).
    const consumer = await t.signIn(EMAIL.consumer);
    expect((await consumer.get(`/api/fits/${res.body.id}`)).status).toBe(404);
  });

  it('says plainly when the fit ended on a bound', async () => {
    const res = await modeller.post('/api/fits').send({
      substanceId,
      measurementSets: [{ id: b2MeasurementSetId }],
      options: { bounds: { epsilonK: [10, 120], sigmaAngstrom: [2, 6] }, restarts: 0 },
    });
    await t.ctx.jobs.waitFor(res.body.jobId);
    const fit = await modeller.get(`/api/fits/${res.body.id}`);
    expect(fit.body.result.hitBounds).toContain('epsilonK');
    expect(fit.body.result.epsilonK).toBeCloseTo(120, 6);
  });

  it('keeps the fit record immutable in the database', () => {
    expect(() => t.ctx.sqlite.prepare("UPDATE fit SET model = 'x'").run()).toThrow(/immutable/);
  });

  it('answers 404 for an unknown fit and 409 when cancelling a finished one', async () => {
    expect((await modeller.get('/api/fits/9999')).status).toBe(404);
    const list = await modeller.get(`/api/substances/${substanceId}/fits`);
    const res = await modeller.post(`/api/fits/${list.body.fits[0].id}/cancel`);
    expect(res.status).toBe(409);
  });
});
