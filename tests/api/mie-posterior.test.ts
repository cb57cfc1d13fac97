import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { resultDifferences } from '../../server/features/parameter-sets/manifest.service';
import { b2WithGradient } from '../../shared/physics/virial';
import { viscosityWithGradient } from '../../shared/physics/viscosity';
import { newSubstance } from './approved-set';
import { EMAIL, startTestApp, type TestApp } from './test-app';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
let t: TestApp;
let modeller: Agent;
let reviewer: Agent;
let consumer: Agent;
let substanceId: number;
let b2Id: number;

// Synthetic B2 of an invented Mie 16-6 gas (ε/k_B = 150 K, σ = 3.7 Å) from the quadrature of virial.ts (checked against
// an independent mpmath quadrature in mie-potential.test.ts), with a small deterministic wiggle; not real data.
function mieB2Csv(): Buffer {
  const lines = ['T (K),B2 (cm3/mol),u(B2) (cm3/mol)'];
  [100, 120, 145, 175, 210, 260, 330, 420, 550, 720, 950].forEach((T, i) =>
    lines.push(
      `${T},${(b2WithGradient(T, 150, 3.7, undefined, { repulsiveExponent: 16 }).b2Cm3PerMol + 0.2 * Math.sin(1.7 * i)).toFixed(4)},0.4`,
    ),
  );
  return Buffer.from(lines.join('\n'));
}

beforeAll(async () => {
  t = await startTestApp();
  [modeller, reviewer, consumer] = await Promise.all([t.signIn(EMAIL.modeller), t.signIn(EMAIL.reviewer), t.signIn(EMAIL.consumer)]);
  substanceId = await newSubstance(modeller, 'Quillgas QG-7', 58.1);
  const up = await modeller
    .post('/api/measurement-sets')
    .field('substanceId', substanceId)
    .field('kind', 'b2')
    .field('name', 'QG-7 B2, Fenwick cell B')
    .field('source', 'Fenwick Thermophysics Laboratory, invented run 7')
    .field('doi', '10.1000/epsigma.mie.7')
    .attach('file', mieB2Csv(), { filename: 'b2.csv', contentType: 'text/csv' });
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  b2Id = up.body.id;
});
afterAll(() => t.close());

describe('Mie λr-6 fits with a posterior, through review and export', () => {
  it('refuses inconsistent Mie options per field', async () => {
    const none = await modeller.post('/api/fits').send({ substanceId, measurementSets: [{ id: b2Id }], options: { model: 'mie' } });
    expect(none.status).toBe(400);
    expect(none.body.error.details.map((d: { field: string }) => d.field)).toContain('options.repulsiveExponent');
    const lj = await modeller.post('/api/fits').send({ substanceId, measurementSets: [{ id: b2Id }], options: { repulsiveExponent: 16 } });
    expect(lj.status).toBe(400);
    expect(lj.body.error.details.map((d: { field: string }) => d.field)).toContain('options.model');
  });

  it('fits a Mie 16-6 model with a posterior, ranks next measurements and states the criterion; the set goes through review and export', async () => {
    const res = await modeller.post('/api/fits').send({
      substanceId,
      measurementSets: [{ id: b2Id }],
      options: { model: 'mie', repulsiveExponent: 16, posterior: { samples: 300 } },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    expect((await t.ctx.jobs.waitFor(res.body.jobId)).status).toBe('succeeded');
    const fit = (await modeller.get(`/api/fits/${res.body.id}`)).body;
    expect(fit.model).toBe('mie');
    const r = fit.result;
    expect([r.model, r.repulsiveExponent]).toEqual(['mie', 16]);
    for (const name of ['epsilonK', 'sigmaAngstrom']) {
      expect(r.posterior[name].lower95).toBeLessThan(r[name]);
      expect(r.posterior[name].upper95).toBeGreaterThan(r[name]);
    }
    expect(r.posterior.diagnostics.seed).toBe(20261202);
    expect(r.posterior.draws.length).toBeGreaterThan(100);
    expect(r.nextMeasurements[0]).toMatchObject({ kind: 'b2', text: expect.stringMatching(/^B2 at /) });
    expect(r.criterion).toMatchObject({ parameters: 2, points: 11 });

    const draft = await modeller
      .post('/api/parameter-sets')
      .send({ fitId: res.body.id, rationale: 'Mie 16-6 fits the QG-7 B2 table within its uncertainty.' });
    expect(draft.status, JSON.stringify(draft.body)).toBe(201);
    expect(draft.body).toMatchObject({ potential: 'mie', repulsiveExponent: 16, potentialLabel: 'Mie 16-6' });
    expect(draft.body.label).toMatch(/Mie 16-6/);
    expect((await modeller.post(`/api/parameter-sets/${draft.body.id}/submit`)).status).toBe(200);
    const approve = await reviewer
      .post(`/api/parameter-sets/${draft.body.id}/review`)
      .send({ decision: 'approve', comment: 'Mie form checked; approved.' });
    expect(approve.status, JSON.stringify(approve.body)).toBe(200);

    const lammps = await consumer.get(`/api/parameter-sets/${draft.body.id}/export?format=lammps-real`);
    expect(lammps.status).toBe(200);
    expect(lammps.text).toMatch(/^pair_style mie\/cut /m);
    expect(lammps.text).toMatch(/^pair_coeff 1 1 \S+ \S+ 16 6$/m);
    const gromacs = await consumer.get(`/api/parameter-sets/${draft.body.id}/export?format=gromacs`);
    expect(gromacs.status).toBe(400);
    expect(gromacs.body.error.code).toBe('unsupported_potential');
    expect(gromacs.body.error.message).toMatch(/GROMACS has no Mie 16-6 pair function/);
    const json = await consumer.get(`/api/parameter-sets/${draft.body.id}/export?format=json`);
    expect(JSON.parse(json.text)).toMatchObject({ model: 'mie', repulsiveExponent: 16 });
    const catalog = await consumer.get('/api/catalog?q=QG-7');
    expect(catalog.body.sets[0]).toMatchObject({ potential: 'mie', repulsiveExponent: 16, potentialLabel: 'Mie 16-6' });

    // Predictions with an API token: B2 from the Mie model at the set's values, interval from the fit's posterior
    // draws, and a mark outside the validity range (the data span 100–950 K).
    const token = (await consumer.post('/api/tokens').send({ name: 'QG-7 predictions' })).body.token as string;
    const pred = await t
      .client()
      .get(`/api/parameter-sets/${draft.body.id}/predictions?kind=b2&temperaturesK=150,2000`)
      .set({ Authorization: `Bearer ${token}` });
    expect(pred.status, JSON.stringify(pred.body)).toBe(200);
    const [inside, outside] = pred.body.predictions;
    expect(inside.value).toBe(
      b2WithGradient(150, draft.body.epsilonK, draft.body.sigmaAngstrom, undefined, { repulsiveExponent: 16 }).b2Cm3PerMol,
    );
    expect(inside).toMatchObject({ unit: 'cm3/mol', intervalMethod: 'posterior draws', outsideValidity: false });
    expect(inside.lower95).toBeLessThan(inside.value);
    expect(inside.upper95).toBeGreaterThan(inside.value);
    expect(inside.standardError).toBeGreaterThan(0);
    expect(outside.outsideValidity).toBe(true);
    expect(outside.note).toMatch(/2000 K lies outside the validity range 100–950 K/);
    // Viscosity has a Mie model (Mie collision integrals): η of the 16-6 set with the interval from the posterior draws.
    const eta = await consumer.get(`/api/parameter-sets/${draft.body.id}/predictions?kind=viscosity&temperaturesK=300`);
    expect(eta.status, JSON.stringify(eta.body)).toBe(200);
    expect(eta.body.predictions[0].value).toBe(
      viscosityWithGradient(300, draft.body.epsilonK, draft.body.sigmaAngstrom, 58.1, { repulsiveExponent: 16 }).viscosityMicroPaS,
    );
    expect(eta.body.predictions[0]).toMatchObject({ unit: 'uPa s', intervalMethod: 'posterior draws', outsideValidity: false });
    // Density has none outside the simulation stage: still refused, saying which kinds a Mie set predicts.
    const rho = await consumer.get(`/api/parameter-sets/${draft.body.id}/predictions?kind=density&temperaturesK=300&pressuresMPa=5`);
    expect(rho.status).toBe(422);
    expect(rho.body.error.code).toBe('kind_not_mie');
    expect(rho.body.error.message).toMatch(/no fluid density .* model for Mie potentials yet \(B2 and dilute-gas viscosity only\)/);
    const noPressure = await consumer.get(`/api/parameter-sets/${draft.body.id}/predictions?kind=density&temperaturesK=300`);
    expect(noPressure.status).toBe(400);
    expect(noPressure.body.error.details[0].field).toBe('pressuresMPa');

    // Reproducible by anyone: the manifest names the data by SHA-256, and a re-run repeats the fit (posterior included) to the last digit.
    const manifest = (await consumer.get(`/api/parameter-sets/${draft.body.id}/manifest`)).body;
    expect(manifest.measurementSets[0].sha256).toBe(createHash('sha256').update(mieB2Csv()).digest('hex'));
    expect(manifest.seeds).toMatchObject({ restartPerturbations: 20240611, posterior: 20261202 });
    expect(manifest.options).toMatchObject({ model: 'mie', repulsiveExponent: 16, posterior: { samples: 300 } });
    const rerun = await consumer.get(`/api/parameter-sets/${draft.body.id}/rerun`);
    expect(rerun.status, JSON.stringify(rerun.body)).toBe(200);
    expect(rerun.body.differences).toEqual([]);
    expect(rerun.body.reproduced).toBe(true);
    expect(rerun.body.rerun.epsilonK).toBe(r.epsilonK);
    expect(rerun.body.rerun['posterior.epsilonK']).toEqual(r.posterior.epsilonK);
  });

  it('the re-run comparison notices a difference in the last digit', () => {
    const a = { epsilonK: 150.0, sigmaAngstrom: 3.7, stdErr: { epsilonK: 0.1, sigmaAngstrom: 0.001 }, chi2: 1.5 };
    expect(resultDifferences(a, JSON.parse(JSON.stringify(a)))).toEqual([]);
    expect(resultDifferences(a, { ...a, epsilonK: 150.00000000000003 }).map((d) => d.field)).toEqual(['epsilonK']);
    expect(resultDifferences(a, { ...a, stdErr: { ...a.stdErr, sigmaAngstrom: 0.0010000000000000002 } }).map((d) => d.field)).toEqual([
      'stdErr.sigmaAngstrom',
    ]);
  });
});
