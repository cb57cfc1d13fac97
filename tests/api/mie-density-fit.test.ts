import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EMAIL, startTestApp, type TestApp } from './test-app';

let t: TestApp;
let modeller: Awaited<ReturnType<TestApp['signIn']>>;
let substanceId: number;
let b2AndDensity: Array<{ id: number }>;
let densityOnly: Array<{ id: number }>;

beforeAll(async () => {
  t = await startTestApp({ WORKERS: '2' });
  modeller = await t.signIn(EMAIL.modeller);
  const list = await modeller.get('/api/substances');
  substanceId = list.body.substances.find((s: { name: string }) => s.name === 'Quillgas QG-1').id;
  const sets: Array<{ id: number; kind: string }> = (await modeller.get(`/api/measurement-sets?substanceId=${substanceId}`)).body
    .measurementSets;
  b2AndDensity = sets.filter((d) => d.kind === 'b2' || d.kind === 'density').map((d) => ({ id: d.id }));
  densityOnly = sets.filter((d) => d.kind === 'density').map((d) => ({ id: d.id }));
});
afterAll(() => t.close());

// Plumbing of a Mie density fit with small, fast simulations; the physics is checked in shared/fitting/mie-density-stage.test.ts
// and shared/fitting/density-posterior.test.ts.
const SMALL = { atoms: 128, steps: 2000 };

describe('a Mie 16-6 fit with density data through the API (λr held)', () => {
  it('starts from the Mie B2 fit, simulates with λr in every run, samples the posterior on the reweighted runs', async () => {
    const res = await modeller.post('/api/fits').send({
      substanceId,
      measurementSets: b2AndDensity,
      options: { model: 'mie', repulsiveExponent: 16, restarts: 0, density: SMALL, posterior: { samples: 100 } },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    const done = await t.ctx.jobs.waitFor(res.body.jobId);
    expect(done.status, done.error ?? '').toBe('succeeded');
    const fit = (await modeller.get(`/api/fits/${res.body.id}`)).body;
    const r = fit.result;
    expect(fit.model).toBe('mie');
    expect([r.model, r.repulsiveExponent]).toEqual(['mie', 16]);
    expect(r.start.method).toBe('Mie 16-6 fit of the B2 data');
    expect(r.startStage.repulsiveExponent).toBe(16);
    expect(r.eosStage).toBeUndefined();
    expect(r.notes[0]).toMatch(/Mie 16-6 fit of the B2 data alone/);
    expect(r.schemeNote).toMatch(/Mie 16-6 potential with its own tail corrections/);
    // Every run was asked for with λr = 16 (its stored input), and its cache key says so.
    const jobs = await t.ctx.db.selectFrom('job').select(['inputJson', 'cacheKey']).where('kind', '=', 'simulation').execute();
    expect(jobs.length).toBe(r.mdRunCount);
    for (const j of jobs) {
      expect(JSON.parse(j.inputJson).state.repulsiveExponent).toBe(16);
      expect(j.cacheKey).toContain('"mie",16');
    }
    const post = r.posterior;
    expect(post, JSON.stringify(r.warnings)).toBeDefined();
    expect(post.coverage.proposals).toBeGreaterThan(0);
    expect(post.likelihood).toMatch(/MBAR/);
    for (const n of ['epsilonK', 'sigmaAngstrom']) expect(post[n].lower95).toBeLessThan(post[n].upper95);
  }, 900_000);

  it('refuses to fit λr with density data, naming the field', async () => {
    const res = await modeller
      .post('/api/fits')
      .send({ substanceId, measurementSets: densityOnly, options: { model: 'mie', fitRepulsiveExponent: true } });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('mie_density_needs_held_exponent');
    expect(res.body.error.details[0].field).toBe('options.fitRepulsiveExponent');
    const withSettings = await modeller
      .post('/api/fits')
      .send({ substanceId, measurementSets: densityOnly, options: { model: 'mie', fitRepulsiveExponent: true, density: SMALL } });
    expect(withSettings.status).toBe(400);
    expect(withSettings.body.error.details.map((d: { field: string }) => d.field)).toContain('options.fitRepulsiveExponent');
  });
});
