import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { reducedStateOf } from '../../shared/physics/corresponding-states';
import { EMAIL, startTestApp, type TestApp } from './test-app';

let t: TestApp;
let modeller: Awaited<ReturnType<TestApp['signIn']>>;
beforeAll(async () => {
  t = await startTestApp({ WORKERS: '2' });
  modeller = await t.signIn(EMAIL.modeller);
});
afterAll(() => t.close());

// Short runs: these tests check the plumbing (queue, cache, mapping), the engine's physics has its own tests.
const SHORT = { atoms: 108, steps: 2000 };

describe('simulations', () => {
  it('route family: 401 without session, 403 for consumers, 400 per field', async () => {
    expect((await t.client().get('/api/simulations')).status).toBe(401);
    const consumer = await t.signIn(EMAIL.consumer);
    expect((await consumer.get('/api/simulations')).status).toBe(403);
    const reviewer = await t.signIn(EMAIL.reviewer);
    expect((await reviewer.post('/api/simulations').send({ reducedTemperature: 1, reducedPressure: 1 })).status).toBe(403);
    const bad = await modeller.post('/api/simulations').send({ reducedTemperature: 0.1, reducedPressure: -1, cutoff: 9 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.map((d: { field: string }) => d.field)).toEqual(
      expect.arrayContaining(['reducedTemperature', 'reducedPressure', 'cutoff']),
    );
  });

  it('states per-request limits: at most 4 000 atoms, 500 000 steps and 250 000 000 atom-steps per run', async () => {
    const huge = await modeller
      .post('/api/simulations')
      .send({ reducedTemperature: 1.2, reducedPressure: 0.5, atoms: 20000, steps: 2_000_000 });
    expect(huge.status).toBe(400);
    expect(huge.body.error.details.map((d: { field: string }) => d.field)).toEqual(expect.arrayContaining(['atoms', 'steps']));
    // Each within its own cap, too much together: 4 000 × 100 000 = 4·10⁸.
    const product = await modeller
      .post('/api/simulations')
      .send({ reducedTemperature: 1.2, reducedPressure: 0.5, atoms: 4000, steps: 100_000 });
    expect(product.status).toBe(400);
    expect(product.body.error.details).toEqual([
      expect.objectContaining({ field: 'steps', message: expect.stringContaining('atoms × steps') }),
    ]);
    const fromSet = await modeller
      .post('/api/simulations/from-measurement-set')
      .send({ measurementSetId: 1, epsilonK: 131.5, sigmaAngstrom: 3.524, atoms: 4000, steps: 100_000 });
    expect(fromSet.status).toBe(400);
  });

  it('health reports the queue (counts only); signed-in people see the worker processes', async () => {
    const health = await t.client().get('/api/health');
    expect(health.body.queue).toMatchObject({
      driver: 'sqlite',
      workers: 1,
      lanes: { simulation: expect.any(Object), fast: expect.any(Object) },
    });
    expect(health.body.queue.workerList).toBeUndefined();
    expect((await t.client().get('/api/simulations/queue')).status).toBe(401);
    const admin = await t.signIn(EMAIL.admin);
    const queue = await admin.get('/api/simulations/queue');
    expect(queue.status).toBe(200);
    expect(queue.body.queue.workerList).toEqual([expect.objectContaining({ threads: { simulation: 2, fast: 1 } })]);
  });

  it('runs a state point in the background and reuses it for an identical request', async () => {
    const body = { reducedTemperature: 2.0, reducedPressure: 1.0, seed: 11, ...SHORT };
    const first = await modeller.post('/api/simulations').send(body);
    expect(first.status).toBe(202);
    expect(first.body.reused).toBe(false);
    const again = await modeller.post('/api/simulations').send(body);
    expect(again.body).toMatchObject({ id: first.body.id, reused: true });
    const done = await t.ctx.jobs.waitFor(first.body.id);
    expect(done.status).toBe('succeeded');
    const got = await modeller.get(`/api/simulations/${first.body.id}`);
    expect(got.body.summary.phase).toBe('fluid');
    // Supercritical T* = 2, P* = 1: the JZG EOS gives ρ* ≈ 0.48 (see shared/physics/lj-eos.test.ts); a short 108-atom run is within 10 %.
    expect(got.body.summary.reducedDensity).toBeGreaterThan(0.43);
    expect(got.body.summary.reducedDensity).toBeLessThan(0.53);
    expect(got.body.trace.step.length).toBeGreaterThan(10);
    expect(got.body.state).toMatchObject({ atoms: 108, steps: 2000, cutoff: 2.5, scheme: 'truncated-tail', seed: 11 });
    // Where it ran: this (web) process, with the embedded driver.
    expect(got.body.ranOn).toMatch(new RegExp(`:${process.pid}$`));
    const list = await modeller.get('/api/simulations');
    expect(list.body.simulations[0].trace).toBeUndefined();
  });

  it('maps density rows to reduced states with the given ε and σ', async () => {
    const substanceId = (await modeller.post('/api/substances').send({ name: 'Simium', molarMassGPerMol: 40 })).body.id;
    const csv = 'T (K),P (MPa),rho (kg/m3)\n240,10,500\n300,20,600\n';
    const up = await modeller
      .post('/api/measurement-sets')
      .field('substanceId', substanceId)
      .field('kind', 'density')
      .field('name', 'dens')
      .attach('file', Buffer.from(csv), { filename: 'd.csv', contentType: 'text/csv' });
    const res = await modeller
      .post('/api/simulations/from-measurement-set')
      .send({ measurementSetId: up.body.id, rows: [3], epsilonK: 120, sigmaAngstrom: 3.4, ...SHORT });
    expect(res.status).toBe(202);
    expect(res.body.runs).toHaveLength(1);
    const expected = reducedStateOf({ temperatureK: 300, pressureMPa: 20, epsilonK: 120, sigmaAngstrom: 3.4 });
    expect(res.body.runs[0].state.reducedTemperature).toBeCloseTo(expected.reducedTemperature, 8);
    expect(res.body.runs[0].state.reducedPressure).toBeCloseTo(expected.reducedPressure, 8);
    const sim = await modeller.get(`/api/simulations/${res.body.runs[0].id}`);
    expect(sim.body.origin).toMatchObject({
      measurementSetId: up.body.id,
      fileRow: 3,
      temperatureK: 300,
      pressureMPa: 20,
      densityKgPerM3: 600,
    });
    const missing = await modeller
      .post('/api/simulations/from-measurement-set')
      .send({ measurementSetId: up.body.id, rows: [99], epsilonK: 120, sigmaAngstrom: 3.4 });
    expect(missing.status).toBe(422);
    await t.ctx.jobs.cancel(res.body.runs[0].id);
  });
});
