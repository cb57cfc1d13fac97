/**
 * A worker process's side of the Redis driver: takes jobs from the BullMQ queues (one per lane), runs them in
 * this process's threads and reports progress and results back through BullMQ. Never opens the database: the
 * web process stores what it hears. Used by `npm run worker` (worker-main.ts) and, with REDIS_URL and
 * WORKERS > 0, inside the web process too.
 */
import os from 'node:os';
import { UnrecoverableError, Worker, type Job } from 'bullmq';
import { CANCELLED_MESSAGE } from './worker';
import { CancelledError, createWorkerPool, TaskError } from './worker-pool';
import { ENGINE_VERSIONS, engineVersionOf, type Lane } from './tasks';
import {
  cancelKey,
  HEARTBEAT_MS,
  HEARTBEAT_TTL_S,
  LANES,
  PREFIX,
  QUEUE_NAMES,
  redisConnection,
  workerKey,
  type QueuedTask,
} from './redis-common';

export interface QueueWorkerOptions {
  redisUrl: string;
  /** Simulations this process runs at once (threads of the simulation lane). */
  simulationThreads: number;
  /** Fast tasks at once (fits of milliseconds); default 1. */
  fastThreads?: number;
  /** Shown on the Simulations screen as where a run ran; default host:pid. */
  name?: string;
  /** BullMQ lock (ms): a job of a process killed without warning goes to another worker about this long later. */
  lockMs?: number;
  log?: (message: string) => void;
}

/** How often a running job's cancel key is checked. */
const CANCEL_POLL_MS = 1000;
/** At most this often a job's progress goes to Redis. */
const PROGRESS_INTERVAL_MS = 500;

export async function startQueueWorker(options: QueueWorkerOptions) {
  const name = options.name ?? `${os.hostname()}:${process.pid}`;
  const log = options.log ?? console.log;
  const lockMs = options.lockMs ?? 30_000;
  const threads: Record<Lane, number> = { simulation: options.simulationThreads, fast: options.fastThreads ?? 1 };
  const pool = createWorkerPool(threads.simulation, threads.fast);
  const redis = redisConnection(options.redisUrl);
  /** Running jobs by lane and id, with the controller that stops them. */
  const active = new Map<string, { lane: Lane; id: string; controller: AbortController }>();
  const startedAt = new Date().toISOString();

  const processor = (lane: Lane) => async (job: Job<QueuedTask>) => {
    const data = job.data;
    const expected = engineVersionOf(data.task);
    if (data.engineVersion !== expected) {
      throw new UnrecoverableError(
        `worker ${name} runs ${data.task} engine ${expected}, the job needs ${data.engineVersion}: run the same code version on every machine`,
      );
    }
    if (await redis.exists(cancelKey(lane, job.id!))) throw new UnrecoverableError(CANCELLED_MESSAGE);
    const controller = new AbortController();
    const key = `${lane}:${job.id}`;
    active.set(key, { lane, id: job.id!, controller });
    let last = 0;
    try {
      return await pool.run(
        data.task,
        data.payload,
        (p) => {
          const now = Date.now();
          if (now - last < PROGRESS_INTERVAL_MS && p.fraction < 1) return;
          last = now;
          void job.updateProgress({ fraction: p.fraction, stage: p.stage }).catch(() => {});
        },
        controller.signal,
      );
    } catch (err) {
      // The task's own error or a cancel: trying again gives the same, so no retry. Anything else (a thread that
      // died, Redis trouble) is retried by BullMQ with backoff.
      if (err instanceof CancelledError) throw new UnrecoverableError(CANCELLED_MESSAGE);
      if (err instanceof TaskError) throw new UnrecoverableError(err.message);
      throw err;
    } finally {
      active.delete(key);
    }
  };

  // One poll for every running job: a cancel key set by the web process stops the task within about a second.
  const cancelPoll = setInterval(() => {
    if (!active.size) return;
    const list = [...active.values()];
    const pipeline = redis.pipeline();
    for (const a of list) pipeline.exists(cancelKey(a.lane, a.id));
    pipeline
      .exec()
      .then((results) => {
        results?.forEach(([err, found], i) => {
          if (!err && found === 1) list[i].controller.abort(new CancelledError());
        });
      })
      .catch(() => {});
  }, CANCEL_POLL_MS);

  const connections = LANES.map(() => redisConnection(options.redisUrl));
  const workers = LANES.filter((lane) => threads[lane] > 0).map(
    (lane, i) =>
      new Worker<QueuedTask>(QUEUE_NAMES[lane], processor(lane), {
        connection: connections[i],
        prefix: PREFIX,
        name,
        concurrency: threads[lane],
        lockDuration: lockMs,
        stalledInterval: Math.max(1000, Math.round(lockMs / 2)),
        // A job may be taken back from a dead worker this often before it fails for good.
        maxStalledCount: 3,
      }),
  );
  for (const w of workers) w.on('error', (err) => log(`worker ${name}: ${err.message}`));

  const heartbeat = async () => {
    const info = {
      name,
      host: os.hostname(),
      pid: process.pid,
      threads,
      active: active.size,
      engineVersions: ENGINE_VERSIONS,
      startedAt,
      lastSeenAt: new Date().toISOString(),
    };
    await redis.set(workerKey(name), JSON.stringify(info), 'EX', HEARTBEAT_TTL_S).catch(() => {});
  };
  await heartbeat();
  const beat = setInterval(() => void heartbeat(), HEARTBEAT_MS);
  await Promise.all(workers.map((w) => w.waitUntilReady()));
  log(`worker ${name}: taking jobs (${threads.simulation} simulation thread(s), ${threads.fast} fast thread(s))`);

  return {
    name,
    /** Stops taking jobs; running ones are stopped and given back to the queue (another worker takes them). */
    async close() {
      clearInterval(beat);
      clearInterval(cancelPoll);
      await Promise.all(workers.map((w) => w.close(true)));
      await pool.close();
      await redis.del(workerKey(name)).catch(() => {});
      for (const c of [redis, ...connections]) c.disconnect();
    },
  };
}
