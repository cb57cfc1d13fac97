/**
 * The web process's side of the Redis driver (REDIS_URL): compute jobs and fast tasks become BullMQ jobs, one
 * queue per lane; worker processes (`npm run worker`) run them. The web process hears progress, starts, retries
 * and results through BullMQ's events and stores them: it stays the only writer of the database.
 */
import { randomUUID } from 'node:crypto';
import { Job, Queue, QueueEvents, type JobsOptions } from 'bullmq';
import type { Redis } from 'ioredis';
import type { ExecutionHooks, JobExecutor, LaneCounts, WorkerInfo } from './job-runner';
import { MAX_ATTEMPTS, RETRY_BACKOFF_MS } from './job-runner';
import { startQueueWorker } from './queue-worker';
import {
  cancelKey,
  LANES,
  PREFIX,
  QUEUE_NAMES,
  redisConnection,
  WORKER_KEY_PATTERN,
  type QueuedProgress,
  type QueuedTask,
} from './redis-common';
import { engineVersionOf, laneOf, type Lane, type ProgressReport } from './tasks';
import { CANCELLED_MESSAGE } from './worker';
import { CancelledError } from './worker-pool';

export interface RedisExecutorOptions {
  redisUrl: string;
  codeVersion: string;
  /** WORKERS of the web process: > 0 runs a worker in this process too; 0 leaves every job to worker processes. */
  localThreads: number;
  lockMs: number;
  log: (message: string) => void;
}

interface Pending {
  lane: Lane;
  jobId: string;
  name: string;
  data: QueuedTask;
  opts: JobsOptions;
  hooks?: ExecutionHooks;
  onProgress: (p: ProgressReport) => void;
  resolve: (value: unknown) => void;
  reject: (err: unknown) => void;
}

/** How often unfinished jobs are looked up directly, in case an event was missed (reconnect, web-process restart). */
const RECHECK_MS = 3000;
const CANCEL_KEY_TTL_S = 3600;

const COMMON_OPTIONS: JobsOptions = {
  attempts: MAX_ATTEMPTS,
  backoff: { type: 'exponential', delay: RETRY_BACKOFF_MS },
};
/** Simulations stay in Redis a day after they finish, so a restarted web process still finds their results. */
const JOB_OPTIONS: JobsOptions = { ...COMMON_OPTIONS, removeOnComplete: { age: 24 * 3600 }, removeOnFail: { age: 7 * 24 * 3600 } };
const TASK_OPTIONS: JobsOptions = { ...COMMON_OPTIONS, removeOnComplete: { age: 3600 }, removeOnFail: { age: 24 * 3600 } };

export class RedisExecutor implements JobExecutor {
  readonly driver = 'redis' as const;
  private pending = new Map<string, Pending>();
  private recheck?: NodeJS.Timeout;
  private closed = false;

  private constructor(
    private readonly options: RedisExecutorOptions,
    private readonly redis: Redis,
    private readonly queues: Record<Lane, Queue>,
    private readonly events: Record<Lane, QueueEvents>,
    private readonly localWorker: Awaited<ReturnType<typeof startQueueWorker>> | null,
    private readonly connections: Redis[],
  ) {}

  static async create(options: RedisExecutorOptions): Promise<RedisExecutor> {
    const redis = redisConnection(options.redisUrl);
    const connections: Redis[] = [];
    const connect = () => {
      const c = redisConnection(options.redisUrl);
      connections.push(c);
      return c;
    };
    const queues = {} as Record<Lane, Queue>;
    const events = {} as Record<Lane, QueueEvents>;
    for (const lane of LANES) {
      queues[lane] = new Queue(QUEUE_NAMES[lane], { connection: connect(), prefix: PREFIX });
      events[lane] = new QueueEvents(QUEUE_NAMES[lane], { connection: connect(), prefix: PREFIX });
    }
    await Promise.all([...Object.values(queues), ...Object.values(events)].map((q) => q.waitUntilReady()));
    const local =
      options.localThreads > 0
        ? await startQueueWorker({
            redisUrl: options.redisUrl,
            simulationThreads: options.localThreads,
            fastThreads: 1,
            lockMs: options.lockMs,
            log: options.log,
            name: undefined,
          })
        : null;
    const executor = new RedisExecutor(options, redis, queues, events, local, connections);
    executor.listen();
    return executor;
  }

  private listen() {
    for (const lane of LANES) {
      const ev = this.events[lane];
      const find = (jobId: string) => this.pending.get(`${lane}:${jobId}`);
      ev.on('active', ({ jobId }) => {
        const p = find(jobId);
        if (!p?.hooks) return;
        void Job.fromId(this.queues[lane], jobId).then((job) => {
          if (job && this.pending.get(`${lane}:${jobId}`) === p)
            p.hooks!.onActive({ ranOn: job.processedBy ?? 'a worker', attempt: Math.max(1, job.attemptsStarted) });
        });
      });
      ev.on('progress', ({ jobId, data }) => {
        const p = find(jobId);
        if (p && typeof data === 'object' && data) p.onProgress(data as QueuedProgress);
      });
      ev.on('delayed', ({ jobId, delay }) => {
        const p = find(jobId);
        if (!p?.hooks) return;
        void Job.fromId(this.queues[lane], jobId).then((job) => {
          if (job?.failedReason)
            p.hooks!.onRetry({ reason: job.failedReason, delayMs: Math.max(0, Number(delay) - Date.now()), attempt: job.attemptsMade });
        });
      });
      ev.on('completed', ({ jobId, returnvalue }) => {
        const p = find(jobId);
        if (p) this.settle(p, { ok: true, value: returnvalue });
      });
      ev.on('failed', ({ jobId, failedReason }) => {
        const p = find(jobId);
        if (!p) return;
        void Job.fromId(this.queues[lane], jobId).then((job) =>
          this.settle(p, { ok: false, reason: failedReason, attemptsMade: job?.attemptsMade ?? 1 }),
        );
      });
      ev.on('stalled', ({ jobId }) =>
        this.options.log(`queue: ${lane} job ${jobId} stalled (its worker stopped answering); it goes to another worker`),
      );
      ev.on('error', (err) => this.options.log(`queue events (${lane}): ${err.message}`));
    }
    this.recheck = setInterval(() => void this.recheckAll(), RECHECK_MS);
  }

  private settle(p: Pending, outcome: { ok: true; value: unknown } | { ok: false; reason: string; attemptsMade: number }) {
    const key = `${p.lane}:${p.jobId}`;
    if (this.pending.get(key) !== p) return;
    this.pending.delete(key);
    if (outcome.ok) return p.resolve(outcome.value);
    if (outcome.reason === CANCELLED_MESSAGE) return p.reject(new CancelledError());
    const attempts = Number(p.opts.attempts ?? 1);
    p.reject(
      new Error(
        outcome.attemptsMade >= attempts && attempts > 1
          ? `failed after ${outcome.attemptsMade} attempts: ${outcome.reason}`
          : outcome.reason,
      ),
    );
  }

  /** Looks a job up directly: its result or failure, or (lost from Redis) adds it again. */
  private async check(p: Pending) {
    if (this.closed) return;
    const job = await Job.fromId(this.queues[p.lane], p.jobId);
    if (!job) {
      await this.queues[p.lane].add(p.name, p.data, { ...p.opts, jobId: p.jobId });
      return;
    }
    const state = await job.getState();
    if (state !== 'completed' && state !== 'failed') return;
    // The job may have finished between the two reads above: read it again so its result or reason is the final one.
    const done = (await Job.fromId(this.queues[p.lane], p.jobId)) ?? job;
    if (state === 'completed') this.settle(p, { ok: true, value: done.returnvalue });
    else this.settle(p, { ok: false, reason: done.failedReason, attemptsMade: done.attemptsMade });
  }

  private rechecking = false;

  private async recheckAll() {
    // One pass at a time, even when a pass over many jobs takes longer than the interval.
    if (this.rechecking) return;
    this.rechecking = true;
    try {
      for (const p of [...this.pending.values()]) {
        if (this.closed) break;
        await this.check(p).catch(() => {});
      }
    } finally {
      this.rechecking = false;
    }
  }

  private submit(
    lane: Lane,
    jobId: string,
    name: string,
    data: QueuedTask,
    opts: JobsOptions,
    onProgress: (p: ProgressReport) => void,
    signal: AbortSignal,
    hooks?: ExecutionHooks,
  ) {
    return new Promise<unknown>((resolve, reject) => {
      if (signal.aborted) return reject(new CancelledError());
      const p: Pending = { lane, jobId, name, data, opts, hooks, onProgress, resolve, reject };
      // Listening before adding: no event of this job can slip by.
      this.pending.set(`${lane}:${jobId}`, p);
      // A cancel stops the job on its worker; the web process stopping only stops listening (the next start rejoins).
      signal.addEventListener('abort', () => (signal.reason instanceof CancelledError ? void this.cancel(p) : this.detach(p)), {
        once: true,
      });
      // An existing id (a web process rejoining after its restart) adds nothing: the job under way is joined.
      this.queues[lane]
        .add(name, data, { ...opts, jobId })
        .then(() => this.check(p))
        .catch((err) => {
          this.pending.delete(`${lane}:${jobId}`);
          reject(err);
        });
    });
  }

  private detach(p: Pending) {
    const key = `${p.lane}:${p.jobId}`;
    if (this.pending.get(key) !== p) return;
    this.pending.delete(key);
    p.reject(new Error('the web process is stopping'));
  }

  /** A waiting job leaves the queue; a running one sees its cancel key within a second and stops between MD blocks. */
  private async cancel(p: Pending) {
    const key = `${p.lane}:${p.jobId}`;
    if (this.pending.get(key) === p) {
      this.pending.delete(key);
      p.reject(new CancelledError());
    }
    await this.redis.set(cancelKey(p.lane, p.jobId), '1', 'EX', CANCEL_KEY_TTL_S).catch(() => {});
    const job = await Job.fromId(this.queues[p.lane], p.jobId).catch(() => undefined);
    if (!job) return;
    const state = await job.getState().catch(() => 'unknown');
    if (state !== 'active' && state !== 'completed' && state !== 'failed') await job.remove().catch(() => {});
  }

  reserve(): boolean {
    return true;
  }

  release() {}

  runJob(
    job: { id: number; kind: string; ref: string; engineVersion: string },
    payload: unknown,
    hooks: ExecutionHooks,
    signal: AbortSignal,
  ) {
    const data: QueuedTask = {
      task: job.kind,
      payload,
      engineVersion: job.engineVersion,
      codeVersion: this.options.codeVersion,
      jobId: job.id,
    };
    return this.submit(laneOf(job.kind), job.ref, job.kind, data, JOB_OPTIONS, hooks.onProgress, signal, hooks);
  }

  runTask(kind: string, payload: unknown, onProgress: (p: ProgressReport) => void, signal: AbortSignal) {
    const data: QueuedTask = { task: kind, payload, engineVersion: engineVersionOf(kind), codeVersion: this.options.codeVersion };
    return this.submit(laneOf(kind), `t.${randomUUID()}`, kind, data, TASK_OPTIONS, onProgress, signal);
  }

  /** The live worker processes: their heartbeat keys. */
  async workers(): Promise<WorkerInfo[]> {
    const keys: string[] = [];
    let cursor = '0';
    do {
      const [next, found] = await this.redis.scan(cursor, 'MATCH', WORKER_KEY_PATTERN, 'COUNT', 200);
      cursor = next;
      keys.push(...found);
    } while (cursor !== '0');
    if (!keys.length) return [];
    const values = await this.redis.mget(...keys);
    return values
      .filter((v): v is string => !!v)
      .map((v) => JSON.parse(v) as WorkerInfo)
      .sort((a, b) => a.name.localeCompare(b.name));
  }

  async counts() {
    const lanes = {} as Record<Lane, LaneCounts>;
    for (const lane of LANES) {
      const c = await this.queues[lane].getJobCounts('waiting', 'prioritized', 'active', 'delayed');
      lanes[lane] = { waiting: (c.waiting ?? 0) + (c.prioritized ?? 0), active: c.active ?? 0, delayed: c.delayed ?? 0 };
    }
    const workerList = await this.workers();
    return { workers: workerList.length, lanes, workerList };
  }

  async close() {
    this.closed = true;
    clearInterval(this.recheck);
    await this.localWorker?.close();
    await Promise.all(LANES.flatMap((lane) => [this.events[lane].close(), this.queues[lane].close()]));
    for (const c of [this.redis, ...this.connections]) c.disconnect();
  }
}
