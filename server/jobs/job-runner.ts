import os from 'node:os';
import type { Db, Tx } from '../db/database';
import type { JobStatus } from './job.table';
import { engineVersionOf, laneOf, type Lane, type ProgressReport } from './tasks';
import { CancelledError, TaskError, type TaskPool } from './worker-pool';
import { readStoredJson } from '../../shared/schemas/old-names';

export interface JobRequest {
  kind: string;
  input: unknown;
  /** Recorded on the job so a run can be repeated exactly. */
  seed: number;
  /**
   * Identical requests (same kind, key and engine version) reuse the queued, running or finished job instead of
   * computing again, however many fits ask for them.
   */
  cacheKey?: string;
  createdBy?: string | null;
}

export interface JobView {
  id: number;
  kind: string;
  status: JobStatus;
  progress: number;
  stage: string | null;
  result: unknown;
  error: string | null;
  retryable: boolean;
  attempts: number;
  seed: number;
  /** Worker process that ran (or runs) the job: host and process id. */
  ranOn: string | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

/** What an orchestrating job may use while it runs on the main thread. */
export interface JobRunEnvironment {
  db: Db;
  jobs: JobQueue;
  /** Runs a worker task directly (not as a job of its own), in the task's lane; it waits when every thread of the lane is busy. */
  runTask: (kind: string, payload: unknown, onProgress: (p: ProgressReport) => void) => Promise<unknown>;
  progress: (p: ProgressReport) => void;
  signal: AbortSignal;
}

/**
 * What a job kind needs from the runner. A compute kind turns the stored input into a worker payload
 * (in the web process, where the database is) and runs on a worker, one thread per job. An orchestrating
 * kind (`run`) runs on the web process's main thread and spends its time waiting for work it hands to
 * workers, so it takes no worker slot. `input` is the job's stored input_json, parsed; each kind names its own
 * input type in its methods (method parameters are compared bivariantly, so a kind may declare it).
 */
export type JobKind =
  | {
      toPayload(db: Db, input: unknown, job: { id: number; seed: number }): Promise<unknown> | unknown;
      /**
       * Keeps what belongs beside the job (in the web process, in the transaction that stores the result) and
       * returns what goes into job.result_json; the queue itself never looks inside a result.
       */
      storeResult?: (tx: Tx, jobId: number, result: unknown) => Promise<unknown>;
      run?: undefined;
    }
  | {
      run(env: JobRunEnvironment, input: unknown, job: { id: number; seed: number }): Promise<unknown>;
      toPayload?: undefined;
      storeResult?: undefined;
    };

export interface LaneCounts {
  waiting: number;
  active: number;
  /** Waiting for a retry after a failure (backoff). */
  delayed: number;
}

/** A worker process that runs jobs, as it last reported itself. */
export interface WorkerInfo {
  name: string;
  host: string;
  pid: number;
  threads: Record<Lane, number>;
  active: number;
  engineVersions: Record<string, string>;
  startedAt: string;
  lastSeenAt: string;
}

/** GET /api/health `queue` (counts only) and the admin's queue view (with the workers). */
export interface QueueHealth {
  driver: 'sqlite' | 'redis';
  waiting: number;
  active: number;
  delayed: number;
  /** Live worker processes (the web process counts when it runs jobs itself). */
  workers: number;
  lanes: Record<Lane, LaneCounts>;
  workerList: WorkerInfo[];
  /** Set when the queue could not be asked (Redis unreachable): the counts are then zero, not known. */
  error?: string;
}

/**
 * The small interface every caller uses. Jobs are rows in SQLite, written by the web process only; a driver
 * (JobExecutor) runs them: in this process's threads (default) or on worker processes through Redis.
 */
export interface JobQueue {
  readonly driver: 'sqlite' | 'redis';
  /** Pass a transaction to queue the job together with the record that owns it; it starts after the commit. */
  enqueue(request: JobRequest, executor?: Db | Tx): Promise<{ id: number; reused: boolean }>;
  get(id: number): Promise<JobView | undefined>;
  cancel(id: number): Promise<boolean>;
  retry(id: number): Promise<boolean>;
  /** Resolves when the job has finished (succeeded, failed or cancelled). */
  waitFor(id: number): Promise<JobView>;
  health(): Promise<QueueHealth>;
  start(): Promise<void>;
  stop(): Promise<void>;
}

/** What happens to a job while a driver runs it. */
export interface ExecutionHooks {
  /** A worker took the job (again, after a stall or a retry): where, and how many starts so far. */
  onActive: (info: { ranOn: string; attempt: number }) => void;
  onProgress: (p: ProgressReport) => void;
  /** A failed attempt that will be tried again after a pause. */
  onRetry: (info: { reason: string; delayMs: number; attempt: number }) => void;
}

/** A driver: where jobs and tasks run. The runner stays the only writer of the job table. */
export interface JobExecutor {
  readonly driver: 'sqlite' | 'redis';
  /**
   * Whether a compute job of this lane may be handed over now (embedded: a free thread; Redis: always, the queue
   * waits). A true answer reserves the room until runJob ends, or until `release` when the job never got there.
   */
  reserve(lane: Lane): boolean;
  release(lane: Lane): void;
  /**
   * Runs one execution of a compute job (`ref` names it; the same ref after a web-process restart joins the
   * execution already under way). Resolves with the task's result, rejects with TaskError (the task failed),
   * CancelledError, or an error after the last attempt.
   */
  runJob(
    job: { id: number; kind: string; ref: string; engineVersion: string },
    payload: unknown,
    hooks: ExecutionHooks,
    signal: AbortSignal,
  ): Promise<unknown>;
  /** Runs a task for an orchestrating job (not a job of its own). */
  runTask(kind: string, payload: unknown, onProgress: (p: ProgressReport) => void, signal: AbortSignal): Promise<unknown>;
  counts(): Promise<Omit<QueueHealth, 'driver' | 'waiting' | 'active' | 'delayed'>>;
  close(): Promise<void>;
}

/** Attempts of an execution before it fails for good (BullMQ attempts; embedded: thread crashes and restarts). */
export const MAX_ATTEMPTS = 3;
/** First pause before a retry; doubled each time. */
export const RETRY_BACKOFF_MS = 2000;
const PROGRESS_WRITE_INTERVAL_MS = 250;
const FINISHED: JobStatus[] = ['succeeded', 'failed', 'cancelled'];

export function toJobView(row: {
  id: number;
  kind: string;
  status: JobStatus;
  progress: number;
  stage: string | null;
  resultJson: string | null;
  error: string | null;
  retryable: number;
  attempts: number;
  seed: number;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  ranOn?: string | null;
}): JobView {
  return {
    id: row.id,
    kind: row.kind,
    status: row.status,
    progress: row.progress,
    stage: row.stage,
    result: row.resultJson ? readStoredJson(row.resultJson) : null,
    error: row.error,
    retryable: row.retryable === 1,
    attempts: row.attempts,
    seed: row.seed,
    ranOn: row.ranOn ?? null,
    createdAt: row.createdAt,
    startedAt: row.startedAt,
    finishedAt: row.finishedAt,
  };
}

/** The cache key as stored: the engine version of the kind first, so results of older code are not reused. */
const versionedKey = (kind: string, cacheKey: string) => `${engineVersionOf(kind)}|${cacheKey}`;

const messageOf = (err: unknown) => (err instanceof Error ? err.message : String(err));

/** This process as a worker name: host and process id. */
export const processName = (suffix = '') => `${os.hostname()}:${process.pid}${suffix}`;

/**
 * The embedded driver: compute jobs and tasks run in this process's thread pool, one pool per lane. A thread
 * crash counts as a failed attempt and is retried with backoff; the task's own error fails the job at once.
 */
export class LocalExecutor implements JobExecutor {
  readonly driver = 'sqlite' as const;
  private readonly name = processName();
  private readonly startedAt = new Date().toISOString();

  constructor(private readonly pool: TaskPool) {}

  private reserved: Record<Lane, number> = { simulation: 0, fast: 0 };

  reserve(lane: Lane): boolean {
    if (this.reserved[lane] >= this.pool.sizes[lane]) return false;
    this.reserved[lane]++;
    return true;
  }

  release(lane: Lane) {
    this.reserved[lane] = Math.max(0, this.reserved[lane] - 1);
  }

  async runJob(job: { id: number; kind: string }, payload: unknown, hooks: ExecutionHooks, signal: AbortSignal): Promise<unknown> {
    try {
      return await this.attempts(job, payload, hooks, signal);
    } finally {
      this.release(laneOf(job.kind));
    }
  }

  private async attempts(
    job: { id: number; kind: string },
    payload: unknown,
    hooks: ExecutionHooks,
    signal: AbortSignal,
  ): Promise<unknown> {
    for (let attempt = 1; ; attempt++) {
      hooks.onActive({ ranOn: this.name, attempt });
      try {
        return await this.pool.run(job.kind, payload, hooks.onProgress, signal);
      } catch (err) {
        if (err instanceof TaskError || err instanceof CancelledError || signal.aborted || attempt >= MAX_ATTEMPTS) {
          if (err instanceof TaskError || err instanceof CancelledError || signal.aborted) throw err;
          throw new Error(`failed after ${attempt} attempts: ${messageOf(err)}`, { cause: err });
        }
        const delayMs = RETRY_BACKOFF_MS * 2 ** (attempt - 1);
        hooks.onRetry({ reason: messageOf(err), delayMs, attempt });
        await new Promise((r) => setTimeout(r, delayMs));
      }
    }
  }

  runTask(kind: string, payload: unknown, onProgress: (p: ProgressReport) => void, signal: AbortSignal) {
    return this.pool.run(kind, payload, onProgress, signal);
  }

  async counts() {
    const threads = this.pool.sizes;
    const active = this.pool.busy('simulation') + this.pool.busy('fast');
    const workerList: WorkerInfo[] = [
      {
        name: this.name,
        host: os.hostname(),
        pid: process.pid,
        threads,
        active,
        engineVersions: {},
        startedAt: this.startedAt,
        lastSeenAt: new Date().toISOString(),
      },
    ];
    return {
      workers: 1,
      lanes: {
        simulation: { waiting: this.pool.waiting('simulation'), active: this.pool.busy('simulation'), delayed: 0 },
        fast: { waiting: this.pool.waiting('fast'), active: this.pool.busy('fast'), delayed: 0 },
      },
      workerList,
    };
  }

  close() {
    return this.pool.close();
  }
}

/**
 * Jobs persisted in SQLite (the web process is the single writer) and run by a driver. Compute jobs are handed
 * to the driver while their lane has room; orchestrating jobs run on the main thread at once.
 */
export class JobRunner implements JobQueue {
  private running = new Map<number, { controller: AbortController; ref: string }>();
  private waiters = new Map<number, Array<(job: JobView) => void>>();
  private stopped = false;
  private pumping = false;
  private pumpAgain = false;
  private refCounter = 0;

  constructor(
    private readonly db: Db,
    private readonly executor: JobExecutor,
    private readonly kinds: Record<string, JobKind>,
    private readonly log: (m: string) => void,
  ) {}

  get driver() {
    return this.executor.driver;
  }

  /**
   * Jobs a stopped or crashed web process left behind. Embedded: every unfinished execution died with the
   * process, so it is queued again (same seed, so the same result), or failed after too many attempts. Redis:
   * compute jobs went on without us on the worker processes; the runner joins them again by their ref.
   */
  async start(): Promise<void> {
    const now = new Date().toISOString();
    const left = await this.db
      .selectFrom('job')
      .select(['id', 'kind', 'status', 'attempts', 'queueRef'])
      .where('status', 'in', ['queued', 'running'])
      .where('queueRef', 'is not', null)
      .execute();
    let requeued = 0;
    const rejoin: number[] = [];
    for (const job of left) {
      const compute = !this.kinds[job.kind]?.run;
      if (compute && this.executor.driver === 'redis') {
        rejoin.push(job.id);
      } else if (job.status === 'running' && job.attempts >= MAX_ATTEMPTS) {
        await this.db
          .updateTable('job')
          .set({
            status: 'failed',
            retryable: 1,
            error: `Interrupted by a server restart ${job.attempts} times; not resumed again. Retry it when the cause is fixed.`,
            finishedAt: now,
            updatedAt: now,
          })
          .where('id', '=', job.id)
          .execute();
      } else {
        await this.db
          .updateTable('job')
          .set({ status: 'queued', progress: 0, queueRef: null, stage: 'resumed after a server restart', updatedAt: now })
          .where('id', '=', job.id)
          .execute();
        requeued++;
      }
    }
    if (left.length) this.log(`job runner: ${requeued} interrupted job(s) queued again, ${rejoin.length} joined on the worker processes`);
    this.stopped = false;
    for (const id of rejoin) {
      const row = await this.db
        .selectFrom('job')
        .select(['id', 'kind', 'inputJson', 'seed', 'queueRef'])
        .where('id', '=', id)
        .executeTakeFirstOrThrow();
      // The queue counts the starts of this execution itself.
      this.executor.reserve(laneOf(row.kind));
      this.launch(row.id, row.kind, readStoredJson(row.inputJson), row.seed, row.queueRef!, 0);
    }
    void this.pump();
  }

  async stop(): Promise<void> {
    this.stopped = true;
    // Not a cancel: the Redis driver leaves the job running on its worker, and the next start joins it again.
    for (const { controller } of this.running.values()) controller.abort(new Error('server stopping'));
    await this.executor.close();
  }

  async enqueue(request: JobRequest, executor: Db | Tx = this.db): Promise<{ id: number; reused: boolean }> {
    if (!this.kinds[request.kind]) throw new Error(`Unknown job kind "${request.kind}".`);
    // Look-up and insert in one transaction, so two fits asking at the same moment get one job.
    if (executor === this.db) return this.db.transaction().execute((tx) => this.insertOrReuse(request, tx));
    return this.insertOrReuse(request, executor);
  }

  private async insertOrReuse(request: JobRequest, executor: Db | Tx): Promise<{ id: number; reused: boolean }> {
    const cacheKey = request.cacheKey ? versionedKey(request.kind, request.cacheKey) : null;
    if (cacheKey) {
      const existing = await executor
        .selectFrom('job')
        .select('id')
        .where('kind', '=', request.kind)
        .where('cacheKey', '=', cacheKey)
        .where('status', 'in', ['queued', 'running', 'succeeded'])
        .orderBy('id', 'desc')
        .executeTakeFirst();
      if (existing) return { id: existing.id, reused: true };
    }
    const now = new Date().toISOString();
    const row = await executor
      .insertInto('job')
      .values({
        kind: request.kind,
        status: 'queued',
        inputJson: JSON.stringify(request.input),
        seed: request.seed,
        cacheKey,
        createdBy: request.createdBy ?? null,
        createdAt: now,
        updatedAt: now,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    // Inside a transaction the pump's queries wait on the single connection until the commit.
    setImmediate(() => void this.pump());
    return { id: row.id, reused: false };
  }

  async get(id: number): Promise<JobView | undefined> {
    const row = await this.db.selectFrom('job').selectAll().where('id', '=', id).executeTakeFirst();
    return row ? toJobView(row) : undefined;
  }

  async cancel(id: number): Promise<boolean> {
    const now = new Date().toISOString();
    const res = await this.db
      .updateTable('job')
      .set({ status: 'cancelled', finishedAt: now, updatedAt: now, error: 'Cancelled by a person.' })
      .where('id', '=', id)
      .where('status', 'in', ['queued', 'running'])
      .executeTakeFirst();
    this.running.get(id)?.controller.abort(new CancelledError());
    const changed = Number(res.numUpdatedRows) > 0;
    if (changed) await this.notify(id);
    return changed;
  }

  async retry(id: number): Promise<boolean> {
    const now = new Date().toISOString();
    const res = await this.db
      .updateTable('job')
      .set({
        status: 'queued',
        progress: 0,
        stage: null,
        error: null,
        retryable: 0,
        attempts: 0,
        resultJson: null,
        startedAt: null,
        finishedAt: null,
        queueRef: null,
        ranOn: null,
        updatedAt: now,
      })
      .where('id', '=', id)
      .where('status', 'in', ['failed', 'cancelled'])
      .executeTakeFirst();
    void this.pump();
    return Number(res.numUpdatedRows) > 0;
  }

  waitFor(id: number): Promise<JobView> {
    return new Promise((resolve, reject) => {
      // Registered before the read, so a job finishing in between still wakes us.
      this.waiters.set(id, [...(this.waiters.get(id) ?? []), resolve]);
      this.get(id).then((job) => {
        if (!job) return reject(new Error(`No job ${id}.`));
        if (FINISHED.includes(job.status)) {
          this.waiters.set(
            id,
            (this.waiters.get(id) ?? []).filter((r) => r !== resolve),
          );
          resolve(job);
        }
      }, reject);
    });
  }

  async health(): Promise<QueueHealth> {
    const rows = await this.db
      .selectFrom('job')
      .select(['kind', 'status', 'queueRef'])
      .where('status', 'in', ['queued', 'running'])
      .execute();
    const lanes = { simulation: { waiting: 0, active: 0, delayed: 0 }, fast: { waiting: 0, active: 0, delayed: 0 } };
    let counts: Awaited<ReturnType<JobExecutor['counts']>>;
    let error: string | undefined;
    try {
      // Redis down must not hang the health check: ask with a deadline.
      counts = await Promise.race([
        this.executor.counts(),
        new Promise<never>((_, reject) => setTimeout(() => reject(new Error('no answer within 2 s')), 2000).unref()),
      ]);
    } catch (err) {
      error = `the queue did not answer: ${messageOf(err)}`;
      counts = {
        workers: 0,
        lanes: { simulation: { waiting: 0, active: 0, delayed: 0 }, fast: { waiting: 0, active: 0, delayed: 0 } },
        workerList: [],
      };
    }
    if (this.executor.driver === 'redis') {
      // The queue holds the truth about compute work; orchestrating fits wait in the web process.
      Object.assign(lanes, counts.lanes);
    } else {
      for (const r of rows) {
        if (this.kinds[r.kind]?.run) continue;
        const lane = laneOf(r.kind);
        if (r.status === 'running') lanes[lane].active++;
        else lanes[lane].waiting++;
      }
      lanes.fast.waiting += counts.lanes.fast.waiting;
      lanes.fast.active += counts.lanes.fast.active;
    }
    const sum = (k: keyof LaneCounts) => lanes.simulation[k] + lanes.fast[k];
    return {
      driver: this.executor.driver,
      waiting: sum('waiting'),
      active: sum('active'),
      delayed: sum('delayed'),
      workers: counts.workers,
      lanes,
      workerList: counts.workerList,
      ...(error ? { error } : {}),
    };
  }

  private async notify(id: number) {
    const list = this.waiters.get(id);
    if (!list?.length) return;
    const job = await this.get(id);
    if (!job || !FINISHED.includes(job.status)) return;
    this.waiters.delete(id);
    for (const resolve of list) resolve(job);
  }

  /** Hands queued jobs to the driver: orchestrating kinds at once, compute kinds while their lane has room. */
  private async pump(): Promise<void> {
    if (this.stopped) return;
    if (this.pumping) {
      this.pumpAgain = true;
      return;
    }
    this.pumping = true;
    try {
      do {
        this.pumpAgain = false;
        const queued = await this.db
          .selectFrom('job')
          .select(['id', 'kind', 'inputJson', 'seed', 'attempts'])
          .where('status', '=', 'queued')
          .where('queueRef', 'is', null)
          .orderBy('id')
          .limit(500)
          .execute();
        for (const next of queued) {
          if (this.stopped) break;
          const kind = this.kinds[next.kind];
          if (!kind) continue;
          if (!kind.run && !this.executor.reserve(laneOf(next.kind))) continue;
          const ref = `${next.id}.${Date.now().toString(36)}${(this.refCounter++).toString(36)}`;
          const claimed = await this.db
            .updateTable('job')
            .set({ queueRef: ref, stage: kind.run ? null : 'waiting for a worker', updatedAt: new Date().toISOString() })
            .where('id', '=', next.id)
            .where('status', '=', 'queued')
            .where('queueRef', 'is', null)
            .executeTakeFirst();
          if (Number(claimed.numUpdatedRows) === 0) {
            if (!kind.run) this.executor.release(laneOf(next.kind));
            continue;
          }
          this.launch(next.id, next.kind, readStoredJson(next.inputJson), next.seed, ref, next.attempts);
        }
      } while (this.pumpAgain && !this.stopped);
    } finally {
      this.pumping = false;
    }
  }

  /** `baseAttempts`: starts before this execution (after a restart of the web process, embedded). */
  private launch(id: number, kindName: string, input: unknown, seed: number, ref: string, baseAttempts: number) {
    const controller = new AbortController();
    this.running.set(id, { controller, ref });
    void this.execute(id, kindName, input, seed, ref, baseAttempts, controller);
  }

  /** Updates the row of this execution only: a retried or cancelled job ignores late news of an earlier one. */
  private ofExecution(id: number, ref: string) {
    return this.db.updateTable('job').where('id', '=', id).where('queueRef', '=', ref).where('status', 'in', ['queued', 'running']);
  }

  private async execute(
    id: number,
    kindName: string,
    input: unknown,
    seed: number,
    ref: string,
    baseAttempts: number,
    controller: AbortController,
  ) {
    const kind = this.kinds[kindName];
    let lastWrite = 0;
    const onProgress = (p: ProgressReport) => {
      const now = Date.now();
      if (now - lastWrite < PROGRESS_WRITE_INTERVAL_MS) return;
      lastWrite = now;
      void this.ofExecution(id, ref)
        .set({ progress: Math.min(1, Math.max(0, p.fraction)), stage: p.stage.slice(0, 200), updatedAt: new Date().toISOString() })
        .where('status', '=', 'running')
        .execute();
    };
    const hooks: ExecutionHooks = {
      onActive: ({ ranOn, attempt }) => {
        const now = new Date().toISOString();
        lastWrite = 0;
        void this.ofExecution(id, ref)
          .set({
            status: 'running',
            startedAt: now,
            updatedAt: now,
            attempts: baseAttempts + attempt,
            progress: 0,
            stage: 'started',
            ranOn: ranOn.slice(0, 200),
          })
          .execute();
      },
      onProgress,
      onRetry: ({ reason, delayMs, attempt }) => {
        void this.ofExecution(id, ref)
          .set({
            stage: `attempt ${attempt} failed (${reason.slice(0, 120)}); trying again in ${Math.round(delayMs / 1000)} s`,
            updatedAt: new Date().toISOString(),
          })
          .execute();
      },
    };
    try {
      let result: unknown;
      if (kind.run) {
        hooks.onActive({ ranOn: processName(), attempt: 1 });
        const env: JobRunEnvironment = {
          db: this.db,
          jobs: this,
          runTask: (task, payload, taskProgress) => this.executor.runTask(task, payload, taskProgress, controller.signal),
          progress: onProgress,
          signal: controller.signal,
        };
        result = await kind.run(env, input, { id, seed });
      } else {
        let payload: unknown;
        try {
          payload = await kind.toPayload(this.db, input, { id, seed });
        } catch (err) {
          this.executor.release(laneOf(kindName));
          throw err;
        }
        result = await this.executor.runJob(
          { id, kind: kindName, ref, engineVersion: engineVersionOf(kindName) },
          payload,
          hooks,
          controller.signal,
        );
      }
      // Only a job still under way takes the result: a cancelled job stays cancelled.
      const current = await this.db
        .selectFrom('job')
        .select('id')
        .where('id', '=', id)
        .where('queueRef', '=', ref)
        .where('status', 'in', ['queued', 'running'])
        .executeTakeFirst();
      if (current) {
        await this.db.transaction().execute(async (tx) => {
          const stored = kind.storeResult ? await kind.storeResult(tx, id, result) : result;
          const now = new Date().toISOString();
          await tx
            .updateTable('job')
            .set({ status: 'succeeded', progress: 1, stage: 'done', resultJson: JSON.stringify(stored), finishedAt: now, updatedAt: now })
            .where('id', '=', id)
            .where('queueRef', '=', ref)
            .where('status', 'in', ['queued', 'running'])
            .execute();
        });
      }
    } catch (err) {
      // A cancelled job is already marked (the update matches only unfinished rows of this execution); on a stop
      // the job stays as it is so the next start resumes or rejoins it.
      if (!this.stopped) {
        const now = new Date().toISOString();
        await this.ofExecution(id, ref)
          .set({ status: 'failed', error: messageOf(err).slice(0, 2000), retryable: 1, finishedAt: now, updatedAt: now })
          .execute();
      }
    } finally {
      if (this.running.get(id)?.ref === ref) this.running.delete(id);
      await this.notify(id);
      void this.pump();
    }
  }
}
