import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { approvedSet, newSubstance, syntheticB2Csv } from './approved-set';
import { EMAIL, startTestApp, type TestApp } from './test-app';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
let t: TestApp;
let modeller: Agent;
let reviewer: Agent;
let substanceId: number;
let approved: { setId: number; fitId: number; measurementSetId: number };
let secondB2: number;

const FIELD = 'options.posterior.prior.parameterSetId';

beforeAll(async () => {
  t = await startTestApp();
  [modeller, reviewer] = await Promise.all([t.signIn(EMAIL.modeller), t.signIn(EMAIL.reviewer)]);
  substanceId = await newSubstance(modeller, 'Quillgas QG-9 prior', 44.1);
  // Synthetic B2 of invented parameters (ε/k_B = 160 K, σ = 3.6 Å), approved through the review API.
  approved = await approvedSet(
    t,
    { modeller, reviewer },
    { substanceId, epsilonK: 160, sigmaAngstrom: 3.6, doi: '10.1000/epsigma.prior.1' },
  );
  // A second, newer table of the same gas at other temperatures: the fit the prior is used in.
  const up = await modeller
    .post('/api/measurement-sets')
    .field('substanceId', substanceId)
    .field('kind', 'b2')
    .field('name', 'QG-9 B2, second campaign')
    .field('source', 'Fenwick Thermophysics Laboratory, invented second campaign')
    .field('doi', '10.1000/epsigma.prior.2')
    .attach('file', syntheticB2Csv(160, 3.6, 0.2, [200, 260, 340, 450, 600, 800]), { filename: 'b2.csv', contentType: 'text/csv' });
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  secondB2 = up.body.id;
});
afterAll(() => t.close());

const fitWithPrior = (parameterSetId: unknown, options: Record<string, unknown> = {}) =>
  modeller.post('/api/fits').send({
    substanceId,
    measurementSets: [{ id: secondB2 }],
    options: { restarts: 0, ...options, posterior: { samples: 300, prior: { parameterSetId } } },
  });

describe('a Gaussian prior from a previous approved set (options.posterior.prior)', () => {
  it('uses the approved set: the result names it and holds its values and covariance', async () => {
    const set = (await modeller.get(`/api/parameter-sets/${approved.setId}`)).body;
    const res = await fitWithPrior(approved.setId);
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    const job = await t.ctx.jobs.waitFor(res.body.jobId);
    expect(job.status, job.error ?? '').toBe('succeeded');
    const fit = (await modeller.get(`/api/fits/${res.body.id}`)).body;
    const post = fit.result.posterior;
    expect(post.priorSet).toMatchObject({ parameterSetId: approved.setId, epsilonK: set.epsilonK, sigmaAngstrom: set.sigmaAngstrom });
    const seE = set.epsilonStdErrK ?? set.stdErr?.epsilonK;
    expect(post.priorSet.covariance[0][0]).toBeCloseTo(seE * seE, 8);
    expect(post.priors).toMatch(/bivariate Gaussian of Quillgas QG-9 prior LJ 12-6 set v1 \(approved\)/);
    // Frozen with the fit's options, so the manifest and a re-run see the same numbers.
    expect(fit.options.posterior.prior).toMatchObject({ parameterSetId: approved.setId, epsilonK: set.epsilonK });
    for (const n of ['epsilonK', 'sigmaAngstrom']) {
      expect(post[n].lower95).toBeLessThan(post[n].upper95);
    }
  });

  it('refuses, naming the field: no such set, a set not approved, a set of another model', async () => {
    const missing = await fitWithPrior(999999);
    expect(missing.status).toBe(422);
    expect(missing.body.error.code).toBe('unknown_parameter_set');
    expect(missing.body.error.details[0].field).toBe(FIELD);

    // A draft of the second table's plain fit: drafted, never submitted.
    const plain = await modeller.post('/api/fits').send({ substanceId, measurementSets: [{ id: secondB2 }], options: { restarts: 0 } });
    expect((await t.ctx.jobs.waitFor(plain.body.jobId)).status).toBe('succeeded');
    const draft = await modeller.post('/api/parameter-sets').send({ fitId: plain.body.id, rationale: 'A draft that was never reviewed.' });
    expect(draft.status, JSON.stringify(draft.body)).toBe(201);
    const notApproved = await fitWithPrior(draft.body.id);
    expect(notApproved.status).toBe(422);
    expect(notApproved.body.error.code).toBe('prior_not_approved');
    expect(notApproved.body.error.message).toMatch(/draft/);
    expect(notApproved.body.error.details[0].field).toBe(FIELD);

    const otherModel = await fitWithPrior(approved.setId, { model: 'mie', repulsiveExponent: 16 });
    expect(otherModel.status).toBe(422);
    expect(otherModel.body.error.code).toBe('prior_model_mismatch');
    expect(otherModel.body.error.details[0].field).toBe(FIELD);
  });

  it('validates the shape: a whole positive id, nothing else', async () => {
    const wrong = await fitWithPrior('seven');
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.details.map((d: { field: string }) => d.field)).toContain(FIELD);
    const extra = await modeller.post('/api/fits').send({
      substanceId,
      measurementSets: [{ id: secondB2 }],
      options: { posterior: { prior: { parameterSetId: approved.setId, epsilonK: 1 } } },
    });
    expect(extra.status).toBe(400);
  });
});
