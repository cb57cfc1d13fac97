/**
 * Old API names still work after the vocabulary rename (DEVELOPERS.md, Vocabulary): every renamed route
 * (/api/datasets/…, /api/users/…, /api/simulations/from-dataset) and every renamed request field (a fit's `datasets`,
 * `datasetId` of a simulation or pair-set request, an upload's `property`, a substance's `molarMass`) is accepted
 * and answered as its new name is. Real requests on a fresh migrated database. The rename script leaves this file alone.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { crossB2 } from '../../shared/mixing/cross-virial';
import { approvedSet, newSubstance, syntheticB2Csv } from './approved-set';
import { EMAIL, TEST_PASSWORD, startTestApp, type TestApp } from './test-app';

let t: TestApp;
let modeller: Awaited<ReturnType<TestApp['signIn']>>;
let reviewer: Awaited<ReturnType<TestApp['signIn']>>;
let admin: Awaited<ReturnType<TestApp['signIn']>>;
let substanceId: number;
let oldUploadId: number;

beforeAll(async () => {
  t = await startTestApp();
  modeller = await t.signIn(EMAIL.modeller);
  reviewer = await t.signIn(EMAIL.reviewer);
  admin = await t.signIn(EMAIL.admin);
  substanceId = await newSubstance(modeller, 'Oldnamium', 40);
});
afterAll(() => t.close());

describe('old routes: /api/datasets/…', () => {
  it('POST /api/datasets uploads a measurement set, with the kind in the old field `property`', async () => {
    const res = await modeller
      .post('/api/datasets')
      .field('substanceId', substanceId)
      .field('property', 'b2')
      .field('name', 'Uploaded the old way')
      .field('source', 'Fenwick Thermophysics Laboratory, invented run')
      .attach('file', syntheticB2Csv(150, 3.6), { filename: 'b2.csv', contentType: 'text/csv' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    oldUploadId = res.body.id;
    const stored = await modeller.get(`/api/measurement-sets/${oldUploadId}`);
    expect(stored.body).toMatchObject({ kind: 'b2', name: 'Uploaded the old way', version: 1 });
  });

  it('GET /api/datasets and GET /api/datasets/:id answer as the new routes do', async () => {
    const oldList = await modeller.get(`/api/datasets?substanceId=${substanceId}`);
    const newList = await modeller.get(`/api/measurement-sets?substanceId=${substanceId}`);
    expect(oldList.status).toBe(200);
    expect(oldList.body).toEqual(newList.body);
    expect(oldList.body.measurementSets.map((d: { id: number }) => d.id)).toContain(oldUploadId);
    const oldDetail = await modeller.get(`/api/datasets/${oldUploadId}`);
    expect(oldDetail.status).toBe(200);
    expect(oldDetail.body).toEqual((await modeller.get(`/api/measurement-sets/${oldUploadId}`)).body);
  });

  it('GET /api/datasets/:id/versions/:version/original gives the uploaded file', async () => {
    const res = await modeller.get(`/api/datasets/${oldUploadId}/versions/1/original`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.text ?? res.body.toString()).toContain('T (K),B2 (cm3/mol)');
  });

  it('POST /api/datasets/:id/versions adds a version, and the roles still apply', async () => {
    const csv = syntheticB2Csv(150, 3.6, 0.2);
    const consumer = await t.signIn(EMAIL.consumer);
    expect(
      (await consumer.post(`/api/datasets/${oldUploadId}/versions`).attach('file', csv, { filename: 'b2.csv', contentType: 'text/csv' }))
        .status,
    ).toBe(403);
    const res = await modeller
      .post(`/api/datasets/${oldUploadId}/versions`)
      .field('source', 'Corrected run')
      .attach('file', csv, { filename: 'b2.csv', contentType: 'text/csv' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.version).toBe(2);
  });

  it('POST /api/datasets/:id/withdraw withdraws it (Origin check included)', async () => {
    const spare = await modeller
      .post('/api/measurement-sets')
      .field('substanceId', substanceId)
      .field('kind', 'b2')
      .field('name', 'Spare')
      .attach('file', syntheticB2Csv(150, 3.6), { filename: 'b2.csv', contentType: 'text/csv' });
    const noOrigin = await t.client().post(`/api/datasets/${spare.body.id}/withdraw`).unset('Origin').send({ reason: 'no origin' });
    expect([401, 403]).toContain(noOrigin.status);
    const res = await modeller.post(`/api/datasets/${spare.body.id}/withdraw`).send({ reason: 'a spare run' });
    expect(res.status).toBe(200);
    expect((await modeller.get(`/api/measurement-sets/${spare.body.id}`)).body.withdrawn).toMatchObject({ reason: 'a spare run' });
  });

  it('POST /api/simulations/from-dataset takes `datasetId` and reaches the route (an unknown row is named)', async () => {
    const csv = ['T (K),p (MPa),rho (kg/m3),u(rho) (kg/m3)', '300,20,300,3', '320,20,280,3', '340,20,260,3'].join('\n');
    const up = await modeller
      .post('/api/measurement-sets')
      .field('substanceId', substanceId)
      .field('kind', 'density')
      .field('name', 'dens')
      .attach('file', Buffer.from(csv), { filename: 'd.csv', contentType: 'text/csv' });
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const body = { datasetId: up.body.id, rows: [99], epsilonK: 120, sigmaAngstrom: 3.4 };
    const old = await modeller.post('/api/simulations/from-dataset').send(body);
    const renamed = await modeller
      .post('/api/simulations/from-measurement-set')
      .send({ ...body, datasetId: undefined, measurementSetId: up.body.id });
    expect(old.status).toBe(422);
    expect(old.body).toEqual(renamed.body);
  });
});

describe('old routes: /api/users/…', () => {
  it('GET, POST and PATCH /api/users answer as /api/people does, for admins only', async () => {
    expect((await t.client().get('/api/users')).status).toBe(401);
    expect((await modeller.get('/api/users')).status).toBe(403);
    const list = await admin.get('/api/users');
    expect(list.status).toBe(200);
    expect(list.body).toEqual((await admin.get('/api/people')).body);
    const created = await admin
      .post('/api/users')
      .send({ email: 'old.route@demo.epsigma.test', name: 'Old Route', roles: ['consumer'], password: TEST_PASSWORD });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const changed = await admin.patch(`/api/users/${created.body.id}`).send({ roles: ['modeller'] });
    expect(changed.status).toBe(200);
    expect(changed.body.roles).toEqual(['modeller']);
    expect((await admin.get('/api/people')).body.people.find((p: { id: string }) => p.id === created.body.id).roles).toEqual(['modeller']);
  });
});

describe('old request fields', () => {
  it('a fit request with `datasets` starts the fit as `measurementSets` does', async () => {
    const res = await modeller.post('/api/fits').send({ substanceId, datasets: [{ id: oldUploadId, version: 1 }] });
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    const fit = await modeller.get(`/api/fits/${res.body.id}`);
    expect(fit.body.measurementSets[0]).toMatchObject({ measurementSetId: oldUploadId, version: 1 });
    // The new name wins when both are sent.
    const both = await modeller
      .post('/api/fits')
      .send({ substanceId, measurementSets: [{ id: oldUploadId, version: 2 }], datasets: [{ id: 999999 }] });
    expect(both.status, JSON.stringify(both.body)).toBe(202);
  });

  it('a substance with `molarMass` is stored as molarMassGPerMol', async () => {
    const created = await modeller.post('/api/substances').send({ name: 'Old field gas', molarMass: 44.5 });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect(created.body.molarMassGPerMol).toBe(44.5);
    const patched = await modeller.patch(`/api/substances/${created.body.id}`).send({ molarMass: 45 });
    expect(patched.status).toBe(200);
    expect(patched.body.molarMassGPerMol).toBe(45);
  });

  it('a pair-set request with `datasetId`, and `datasets` named in a parameter-set edit is refused as frozen', async () => {
    const other = await newSubstance(modeller, 'Oldnamium B', 58);
    const setA = await approvedSet(t, { modeller, reviewer }, { substanceId, epsilonK: 140, sigmaAngstrom: 3.5 });
    const setB = await approvedSet(t, { modeller, reviewer }, { substanceId: other, epsilonK: 220, sigmaAngstrom: 4.2 });
    const pure: Array<{ epsilonK: number; sigmaAngstrom: number }> = [];
    for (const s of [setA, setB])
      pure.push((await modeller.get(`/api/parameter-sets/${s.setId}`)).body as { epsilonK: number; sigmaAngstrom: number });
    const lines = [
      'T (K),B12 (cm3/mol),u(B12) (cm3/mol)',
      ...[180, 220, 260, 320, 400, 500].map((T) => `${T},${crossB2(T, pure[0], pure[1], 0.04).toFixed(4)},1`),
    ];
    const b12 = await modeller
      .post('/api/measurement-sets')
      .field('substanceId', substanceId)
      .field('kind', 'b12')
      .field('name', 'Invented B12')
      .attach('file', Buffer.from(lines.join('\n')), { filename: 'b12.csv', contentType: 'text/csv' });
    expect(b12.status).toBe(201);
    const pair = await modeller.post('/api/pair-sets').send({ parameterSetIds: [setA.setId, setB.setId], datasetId: b12.body.id });
    expect(pair.status, JSON.stringify(pair.body)).toBe(201);
    expect(pair.body.measurementSet ?? (await modeller.get(`/api/pair-sets/${pair.body.id}`)).body.measurementSet).toMatchObject({
      id: b12.body.id,
    });

    const refused = await modeller.patch(`/api/parameter-sets/${setA.setId}`).send({ datasets: [] });
    const refusedNew = await modeller.patch(`/api/parameter-sets/${setA.setId}`).send({ measurementSets: [] });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe(refusedNew.body.error.code);
  });
});
