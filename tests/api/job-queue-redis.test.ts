/**
 * Many machines, on one: a redis-server of its own (free port, append-only file, no snapshots), the real web
 * process with REDIS_URL and WORKERS=0 (it runs no jobs itself), and `npm run worker` processes.
 * Simulations are small (108 atoms): the plumbing is under test, the engine has its own tests.
 */
import { Redis } from 'ioredis';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, startApp, type RunningApp } from '../support/app-process';
import { startRedis, startWorkerProcess, type TestRedis, type WorkerProcess } from '../support/redis-server';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const LOCK_MS = '4000';

let redis: TestRedis;
let app: RunningApp;
const workers: WorkerProcess[] = [];

/** A signed-in modeller against a server in another process: cookie + this site's Origin, like a browser tab. */
async function signedIn(url: string) {
  const login = await fetch(`${url}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: url },
    body: JSON.stringify({ email: 'modeller@demo.epsigma.test', password: DEMO_PASSWORD }),
  });
  const cookie = login.headers.get('set-cookie')!.split(';')[0];
  return async (method: string, p: string, body?: unknown) => {
    const res = await fetch(`${url}/api${p}`, {
      method,
      headers: { cookie, origin: url, ...(body ? { 'content-type': 'application/json' } : {}) },
      body: body ? JSON.stringify(body) : undefined,
    });
    return { status: res.status, body: await res.json() };
  };
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- API answers, read loosely
type Answer = any;

async function until<T = Answer>(what: string, read: () => Promise<T>, ok: (v: T) => boolean, timeoutMs: number): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const v = await read();
    if (ok(v)) return v;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}: last ${JSON.stringify(v)?.slice(0, 400)}`);
    await sleep(100);
  }
}

/** How many times BullMQ recorded each job of the simulation queue as completed (its event stream). */
async function completions(url: string): Promise<Map<string, number>> {
  const r = new Redis(url);
  try {
    const entries = await r.xrange('epsigma:simulation:events', '-', '+');
    const counts = new Map<string, number>();
    for (const [, fields] of entries) {
      const f: Record<string, string> = {};
      for (let i = 0; i < fields.length; i += 2) f[fields[i]] = fields[i + 1];
      if (f.event === 'completed') counts.set(f.jobId, (counts.get(f.jobId) ?? 0) + 1);
    }
    return counts;
  } finally {
    r.disconnect();
  }
}

beforeAll(async () => {
  redis = await startRedis();
  app = await startApp({ REDIS_URL: redis.url, WORKERS: '0', QUEUE_LOCK_MS: LOCK_MS }, { requireClient: false });
}, 90_000);

afterAll(async () => {
  for (const w of workers) await w.stop();
  await app?.stop();
  await redis?.stop();
});

describe('web process with WORKERS=0 and worker processes through Redis', () => {
  it('a worker killed with SIGKILL mid-run loses nothing: all four runs succeed, none completes twice, and a B2 fit meanwhile finishes in seconds', async () => {
    const api = await signedIn(app.url);
    workers.push(
      await startWorkerProcess(redis.url, { WORKERS: '1', QUEUE_LOCK_MS: LOCK_MS }),
      await startWorkerProcess(redis.url, { WORKERS: '1', QUEUE_LOCK_MS: LOCK_MS }),
    );
    const [a, b] = workers;
    const health = (await api('GET', '/health')).body.queue;
    expect(health).toMatchObject({ driver: 'redis', workers: 2 });

    const ids: number[] = [];
    for (const [i, t] of [1.4, 1.5, 1.6, 1.7].entries()) {
      const res = await api('POST', '/simulations', {
        reducedTemperature: t,
        reducedPressure: 0.5,
        atoms: 108,
        steps: 10000,
        seed: 100 + i,
      });
      expect(res.status).toBe(202);
      ids.push(res.body.id);
    }
    // Both workers busy, then one dies without warning.
    const running = await until<Answer[]>(
      'a run on each worker',
      async () =>
        (await api('GET', '/simulations')).body.simulations.filter(
          (s: { id: number; status: string }) => ids.includes(s.id) && s.status === 'running',
        ),
      (list) => new Set(list.map((s) => s.ranOn)).size === 2,
      60_000,
    );
    const victim = running.find((s: { ranOn: string }) => s.ranOn === a.name)!;
    await a.kill();

    // A B2 fit now: the fast lane of the surviving worker takes it at once, beside its simulation.
    const substances = (await api('GET', '/substances')).body.substances;
    const substanceId = substances.find((s: { name: string }) => s.name === 'Quillgas QG-1').id;
    const b2 = (await api('GET', `/measurement-sets?substanceId=${substanceId}`)).body.measurementSets.find(
      (d: { kind: string }) => d.kind === 'b2',
    );
    const submitted = Date.now();
    const fit = await api('POST', '/fits', { substanceId, measurementSets: [{ id: b2.id }] });
    expect(fit.status).toBe(202);
    const fitDone = await until<Answer>(
      'the B2 fit',
      async () => (await api('GET', `/fits/${fit.body.id}`)).body,
      (f) => !['queued', 'running'].includes(f.status),
      30_000,
    );
    expect(fitDone.status, fitDone.error ?? '').toBe('succeeded');
    const fitSeconds = (Date.now() - submitted) / 1000;
    const stillRunning = (await api('GET', '/simulations')).body.simulations.filter(
      (s: { id: number; status: string }) => ids.includes(s.id) && s.status !== 'succeeded',
    );
    expect(stillRunning.length, `the fit took ${fitSeconds} s and did not wait for the simulations`).toBeGreaterThan(0);
    // The invented truth behind the demo B2 table is ε/k_B = 131.5 K (fixtures/demo/scenario.ts); B2 alone pins it to a few %.
    expect(Math.abs(fitDone.result.epsilonK - 131.5)).toBeLessThan(10);

    const all = await until<Answer[]>(
      'all four runs',
      async () => (await api('GET', '/simulations')).body.simulations.filter((s: { id: number }) => ids.includes(s.id)),
      (list) => list.every((s) => !['queued', 'running'].includes(s.status)),
      150_000,
    );
    for (const s of all) expect(s.status, `simulation ${s.id}: ${s.error}`).toBe('succeeded');
    // The killed worker's run was taken back after its lock ran out and finished on the other worker.
    const rerun = all.find((s: { id: number }) => s.id === victim.id);
    expect(rerun.ranOn).toBe(b.name);
    expect(rerun.attempts).toBe(2);
    // None twice: each BullMQ job completed exactly once.
    const done = await completions(redis.url);
    expect([...done.values()]).toEqual([1, 1, 1, 1]);
    const detail = (await api('GET', `/simulations/${victim.id}`)).body;
    expect(detail.summary.reducedDensity).toBeGreaterThan(0);
  }, 240_000);

  it('a Redis restart with the append-only file loses no queued job', async () => {
    const api = await signedIn(app.url);
    for (const w of workers.splice(0)) await w.stop();
    const ids: number[] = [];
    for (const seed of [201, 202])
      ids.push(
        (await api('POST', '/simulations', { reducedTemperature: 1.5, reducedPressure: 0.5, atoms: 108, steps: 2000, seed })).body.id,
      );
    await sleep(500);
    expect((await api('GET', '/health')).body.queue.lanes.simulation.waiting).toBe(2);
    await redis.kill();
    await redis.restart();
    workers.push(await startWorkerProcess(redis.url, { WORKERS: '1', QUEUE_LOCK_MS: LOCK_MS }));
    const all = await until<Answer[]>(
      'both queued runs after the restart',
      async () => (await api('GET', '/simulations')).body.simulations.filter((s: { id: number }) => ids.includes(s.id)),
      (list) => list.every((s) => !['queued', 'running'].includes(s.status)),
      90_000,
    );
    for (const s of all) {
      expect(s.status, `simulation ${s.id}: ${s.error}`).toBe('succeeded');
      expect(s.ranOn).toBe(workers[0].name);
    }
  }, 150_000);
});
