/**
 * One contract, both drivers: the embedded SQLite queue (jobs in this process's threads) and the Redis driver
 * (BullMQ; the web process runs no jobs, WORKERS=0, and one `npm run worker` process runs them). Each driver gets
 * its own database, and the Redis driver its own redis-server on a free port.
 * Simulations here are small (108 atoms): the physics is checked in shared/physics/md; this checks the plumbing.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Queue } from 'bullmq';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createContext } from '../../server/bootstrap';
import { loadEnv } from '../../server/config/env';
import { normaliseState, simulationCacheKey, type SimulationInput } from '../../server/features/simulations/simulations.service';
import { PREFIX, QUEUE_NAMES, redisConnection } from '../../server/jobs/redis-common';
import { runNpt } from '../../shared/physics/md/npt';
import { b2WithGradient } from '../../shared/physics/virial';
import { startRedis, startWorkerProcess, type TestRedis, type WorkerProcess } from '../support/redis-server';

type Ctx = Awaited<ReturnType<typeof createContext>>;
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** A simulation request as the density fit and the API make it (defaults filled in, cache key of the state). */
function simulation(state: {
  reducedTemperature: number;
  reducedPressure: number;
  atoms: number;
  steps: number;
  seed: number;
  cutoff?: number;
}) {
  const s = normaliseState(state);
  const input: SimulationInput = { state: s };
  return { kind: 'simulation', input, seed: s.seed, cacheKey: simulationCacheKey(s) };
}
const SHORT = { reducedTemperature: 1.5, reducedPressure: 0.5, atoms: 108, steps: 2000 };
/** Minutes of work if nobody stops it. */
const LONG = { reducedTemperature: 1.5, reducedPressure: 0.5, atoms: 108, steps: 400_000 };

/** A B2 table made from the invented Quillgas QG-1 truth (ε/k_B = 131.5 K, σ = 3.524 Å, fixtures/demo/scenario.ts), in the database. */
async function seedB2Fit(ctx: Ctx) {
  await ctx.db
    .insertInto('user')
    .values({ id: 'u1', email: 'queue@test', name: 'Queue', passwordHash: 'x', createdAt: new Date().toISOString() })
    .execute();
  const s = await ctx.db
    .insertInto('substance')
    .values({ name: 'Quillgas QG-1', molarMassGramsPerMol: 44.62, createdBy: 'u1', createdAt: '', updatedAt: '' })
    .returning('id')
    .executeTakeFirstOrThrow();
  const d = await ctx.db
    .insertInto('measurementSet')
    .values({ substanceId: s.id, kind: 'b2', name: 'b2', createdBy: 'u1', createdAt: '' })
    .returning('id')
    .executeTakeFirstOrThrow();
  const v = await ctx.db
    .insertInto('measurementSetVersion')
    .values({
      measurementSetId: d.id,
      version: 1,
      sha256: 'x',
      originalFilename: 'x.csv',
      originalBytes: Buffer.from('x'),
      defaultRelativeUncertainty: 0.01,
      delimiter: ',',
      decimal: '.',
      columnsJson: '[]',
      rowCount: 10,
      uploadedBy: 'u1',
      uploadedAt: '',
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  for (let i = 0; i < 10; i++) {
    const T = 160 + 50 * i;
    await ctx.db
      .insertInto('measurementRow')
      .values({
        measurementSetVersionId: v.id,
        position: i,
        fileRow: i + 2,
        temperatureK: T,
        pressureMpa: null,
        value: b2WithGradient(T, 131.5, 3.524).b2Cm3PerMol,
        uncertainty: 0.5,
        uncertaintySource: 'measured',
        rawJson: '{}',
      })
      .execute();
  }
  return {
    kind: 'fit',
    seed: 0,
    input: {
      measurementSets: [{ measurementSetId: d.id, version: 1, versionId: v.id, kind: 'b2', name: 'b2', weight: 1 }],
      options: { restarts: 4, maxIterations: 400 },
    },
  };
}

async function until<T>(what: string, read: () => Promise<T>, ok: (v: T) => boolean, timeoutMs = 30_000): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const v = await read();
    if (ok(v)) return v;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}: last ${JSON.stringify(v)?.slice(0, 300)}`);
    await sleep(50);
  }
}

describe.each(['sqlite', 'redis'] as const)('job queue contract, %s driver', (driver) => {
  const dir = mkdtempSync(path.join(tmpdir(), `epsigma-queue-${driver}-`));
  let redis: TestRedis | undefined;
  let worker: WorkerProcess | undefined;
  let ctx: Ctx;
  let fit: Awaited<ReturnType<typeof seedB2Fit>>;
  const env = () =>
    loadEnv({
      NODE_ENV: 'test',
      DATABASE_PATH: path.join(dir, 'jobs.sqlite'),
      LOG_REQUESTS: '0',
      ...(redis ? { REDIS_URL: redis.url, WORKERS: '0', QUEUE_LOCK_MS: '4000' } : { WORKERS: '1' }),
    });
  const status = (id: number) => ctx.jobs.get(id).then((j) => j!);

  beforeAll(async () => {
    if (driver === 'redis') {
      redis = await startRedis();
      worker = await startWorkerProcess(redis.url, { WORKERS: '1', QUEUE_LOCK_MS: '4000' });
    }
    ctx = await createContext(env(), () => {});
    fit = await seedB2Fit(ctx);
  }, 90_000);

  afterAll(async () => {
    await ctx?.close();
    await worker?.stop();
    await redis?.stop();
    rmSync(dir, { recursive: true, force: true });
  });

  it('runs a job: progress while it runs, then the result exactly as the engine computes it, and where it ran', async () => {
    // Long enough (a few seconds) that a status poll sees it running even on a loaded machine.
    expect(ctx.jobs.driver).toBe(driver);
    const req = simulation({ ...SHORT, steps: 16_000, seed: 11 });
    const { id, reused } = await ctx.jobs.enqueue(req);
    expect(reused).toBe(false);
    const seen = await until(
      'progress',
      () => status(id),
      (j) => (j.status === 'running' && j.progress > 0 && j.progress < 1) || j.status === 'succeeded',
    );
    expect(seen.status, 'a progress report arrives before the end').toBe('running');
    expect(seen.stage).toMatch(/melting|tuning|production|extension/);
    const done = await ctx.jobs.waitFor(id);
    expect(done.status, done.error ?? '').toBe('succeeded');
    expect(done.progress).toBe(1);
    expect(done.attempts).toBe(1);
    expect(done.ranOn).toEqual(driver === 'redis' ? worker!.name : expect.stringContaining(`:${process.pid}`));
    // The queue hands the result over untouched: the same numbers as the engine run here with the same seed.
    const direct = runNpt((req.input as SimulationInput).state);
    expect((done.result as typeof direct).reducedDensity).toBe(direct.reducedDensity);
    expect((done.result as typeof direct).stdErr).toBe(direct.stdErr);
    // The kind's storeResult ran in the web process: the frames sit beside the job, not in its result.
    expect((done.result as { frames?: unknown }).frames).toBeUndefined();
    const frames = await ctx.db.selectFrom('simulationFrames').select('frameCount').where('jobId', '=', id).executeTakeFirstOrThrow();
    expect((done.result as { framesStored: number }).framesStored).toBe(frames.frameCount);
    expect(frames.frameCount).toBeGreaterThan(0);
    const health = await ctx.jobs.health();
    expect(health).toMatchObject({ driver, workers: 1 });
  }, 60_000);

  it("fails with the task's own reason at once (running it again would give the same), and a retry runs it again", async () => {
    // 108 atoms cannot hold a 4σ cutoff: the engine refuses with a RangeError naming the option.
    const { id } = await ctx.jobs.enqueue(simulation({ ...SHORT, cutoff: 4, seed: 12 }));
    const failed = await ctx.jobs.waitFor(id);
    expect(failed.status).toBe('failed');
    expect(failed.error).toMatch(/box smaller than 2·cutoff/);
    expect(failed.attempts).toBe(1);
    expect(failed.retryable).toBe(true);
    expect(await ctx.jobs.retry(id)).toBe(true);
    expect((await status(id)).status).toBe('queued');
    const again = await ctx.jobs.waitFor(id);
    expect(again.status).toBe('failed');
    expect(again.error).toMatch(/box smaller than 2·cutoff/);
    expect(await ctx.jobs.retry(id + 1000)).toBe(false);
  }, 60_000);

  it('cancel: a queued job never starts; a running job stops within seconds and frees its worker for the next job', async () => {
    const long = await ctx.jobs.enqueue(simulation({ ...LONG, seed: 21 }));
    await until(
      'the long run to start',
      () => status(long.id),
      (j) => j.status === 'running',
    );
    const queued = await ctx.jobs.enqueue(simulation({ ...SHORT, seed: 22 }));
    const next = await ctx.jobs.enqueue(simulation({ ...SHORT, seed: 23 }));
    expect(await ctx.jobs.cancel(queued.id)).toBe(true);
    expect((await ctx.jobs.waitFor(queued.id)).status).toBe('cancelled');
    await sleep(300);
    expect((await status(next.id)).status, 'one worker slot: the next job waits').toBe('queued');

    const cancelledAt = Date.now();
    expect(await ctx.jobs.cancel(long.id)).toBe(true);
    // The one worker thread is free again only when the long run has really stopped.
    await until(
      'the next job to start',
      () => status(next.id),
      (j) => j.status !== 'queued',
      10_000,
    );
    const stoppedWithinMs = Date.now() - cancelledAt;
    expect(stoppedWithinMs).toBeLessThan(8000);
    expect((await ctx.jobs.waitFor(next.id)).status).toBe('succeeded');
    const cancelled = await status(long.id);
    expect(cancelled.status).toBe('cancelled');
    expect(cancelled.error).toBe('Cancelled by a person.');
    expect(await ctx.jobs.cancel(long.id)).toBe(false);
    expect(await ctx.jobs.cancel(next.id)).toBe(false);

    const never = await status(queued.id);
    expect(never.ranOn).toBeNull();
    expect(never.attempts).toBe(0);
    expect(await ctx.jobs.retry(queued.id)).toBe(true);
    const retried = await ctx.jobs.waitFor(queued.id);
    expect(retried.status).toBe('succeeded');
    expect(retried.attempts).toBe(1);
  }, 90_000);

  it('a fast job (a B2 fit) never waits behind simulations', async () => {
    const long = await ctx.jobs.enqueue(simulation({ ...LONG, seed: 31 }));
    const waiting = await ctx.jobs.enqueue(simulation({ ...LONG, seed: 32 }));
    await until(
      'the long run to start',
      () => status(long.id),
      (j) => j.status === 'running',
    );
    const b2 = await ctx.jobs.enqueue(fit);
    const done = await until(
      'the B2 fit',
      () => status(b2.id),
      (j) => !['queued', 'running'].includes(j.status),
      20_000,
    );
    expect(done.status, done.error ?? '').toBe('succeeded');
    expect((done.result as { epsilonK: number }).epsilonK).toBeCloseTo(131.5, 2);
    expect((await status(long.id)).status, 'the simulation is still running').toBe('running');
    expect((await status(waiting.id)).status).toBe('queued');
    const health = await ctx.jobs.health();
    expect(health.lanes.simulation).toMatchObject({ active: 1, waiting: 1 });
    expect(health.active).toBeGreaterThanOrEqual(1);
    await ctx.jobs.cancel(waiting.id);
    await ctx.jobs.cancel(long.id);
  }, 60_000);

  it('identical work requested by two fits at once is one job, run once', async () => {
    const req = simulation({ ...SHORT, seed: 41 });
    const [a, b] = await Promise.all([ctx.jobs.enqueue(req), ctx.jobs.enqueue(structuredClone(req))]);
    expect(b.id).toBe(a.id);
    expect([a.reused, b.reused].sort()).toEqual([false, true]);
    const [da, db] = await Promise.all([ctx.jobs.waitFor(a.id), ctx.jobs.waitFor(b.id)]);
    expect(da.status).toBe('succeeded');
    expect(db.result).toEqual(da.result);
    expect(da.attempts).toBe(1);
    expect(await ctx.jobs.enqueue(req)).toEqual({ id: a.id, reused: true });
    const rows = await ctx.db
      .selectFrom('job')
      .select('id')
      .where('kind', '=', 'simulation')
      .where('cacheKey', 'like', `%${req.cacheKey}`)
      .execute();
    expect(rows).toHaveLength(1);
    if (redis) {
      // One BullMQ job for the row, whoever asked.
      const connection = redisConnection(redis.url);
      const queue = new Queue(QUEUE_NAMES.simulation, { connection, prefix: PREFIX });
      try {
        const jobs = (await queue.getJobs(['completed', 'failed', 'active', 'waiting'])).filter((j) => j.data.jobId === a.id);
        expect(jobs).toHaveLength(1);
        expect(jobs[0].attemptsStarted).toBe(1);
      } finally {
        await queue.close();
        connection.disconnect();
      }
    }
  }, 60_000);

  it('a restart of the web process loses no job: the result of a run under way is stored', async () => {
    const { id } = await ctx.jobs.enqueue(simulation({ ...SHORT, steps: 5000, seed: 51 }));
    await until(
      'the run to start',
      () => status(id),
      (j) => j.status === 'running',
    );
    await ctx.close();
    ctx = await createContext(env(), () => {});
    const done = await ctx.jobs.waitFor(id);
    expect(done.status, done.error ?? '').toBe('succeeded');
    // Embedded: the run died with the process and ran again (same seed). Redis: it went on on the worker process
    // and the new web process joined it.
    expect(done.attempts).toBe(driver === 'redis' ? 1 : 2);
    expect(done.ranOn).toEqual(driver === 'redis' ? worker!.name : expect.stringContaining(`:${process.pid}`));
    expect((done.result as { settings: { seed: number } }).settings.seed).toBe(51);
  }, 90_000);
});
