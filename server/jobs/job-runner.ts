import type { Db, Tx } from '../db/database';
import type { JobStatus } from './job.table';
import type { ProgressReport } from './tasks';
import type { TaskPool } from './worker-pool';

export interface JobRequest {
  kind: string;
  input: unknown;
  /** Recorded on the job so a run can be repeated exactly. */
  seed: number;
  /** Identical requests (same kind and key) reuse the queued, running or finished job instead of computing again. */
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
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

/** What an orchestrating job may use while it runs on the main thread. */
export interface JobRunEnvironment {
  db: Db;
  jobs: JobQueue;
  /** Runs a worker task directly (not as a job of its own); piscina queues it when every thread is busy. */
  runTask: (kind: string, payload: unknown, onProgress: (p: ProgressReport) => void) => Promise<unknown>;
  progress: (p: ProgressReport) => void;
  signal: AbortSignal;
}

/**
 * What a job kind needs from the runner. A compute kind turns the stored input into a worker payload
 * (on the main thread, where the database is) and runs in the pool, one thread per job. An orchestrating
 * kind (`run`) runs on the main thread and spends its time waiting for work it hands to the pool, so it
 * takes no pool slot.
 */
export type JobKind =
  | { toPayload: (db: Db, input: any, job: { id: number; seed: number }) => Promise<unknown> | unknown; run?: undefined }
  | { run: (env: JobRunEnvironment, input: any, job: { id: number; seed: number }) => Promise<unknown>; toPayload?: undefined };

/**
 * The small interface every caller uses; the SQLite-backed runner below implements it, and a
 * Redis-backed queue shared by several machines can implement it later without touching callers.
 */
export interface JobQueue {
  /** Pass a transaction to queue the job together with the record that owns it; it starts after the commit. */
  enqueue(request: JobRequest, executor?: Db | Tx): Promise<{ id: number; reused: boolean }>;
  get(id: number): Promise<JobView | undefined>;
  cancel(id: number): Promise<boolean>;
  retry(id: number): Promise<boolean>;
  /** Resolves when the job has finished (succeeded, failed or cancelled). */
  waitFor(id: number): Promise<JobView>;
  start(): Promise<void>;
  stop(): Promise<void>;
}

const MAX_ATTEMPTS = 3;
const PROGRESS_WRITE_INTERVAL_MS = 250;

export function toJobView(row: {
  id: number; kind: string; status: JobStatus; progress: number; stage: string | null; resultJson: string | null; error: string | null;
  retryable: number; attempts: number; seed: number; createdAt: string; startedAt: string | null; finishedAt: string | null;
}): JobView {
  return {
    id: row.id,
    kind: row.kind,
    status: row.status,
    progress: row.progress,
    stage: row.stage,
    result: row.resultJson ? JSON.parse(row.resultJson) : null,
    error: row.error,
    retryable: row.retryable === 1,
    attempts: row.attempts,
    seed: row.seed,
    createdAt: row.createdAt,
    startedAt: row.startedAt,
    finishedAt: row.finishedAt,
  };
}

/** Jobs persisted in SQLite, executed in the worker pool, at most `pool.size` at a time. */
export class SqliteJobRunner implements JobQueue {
  private running = new Map<number, AbortController>();
  /** Jobs of compute kinds currently holding a pool thread. */
  private poolJobs = new Set<number>();
  private waiters = new Map<number, Array<(job: JobView) => void>>();
  private stopped = false;
  private pumping = false;

  constructor(
    private readonly db: Db,
    private readonly pool: TaskPool,
    private readonly kinds: Record<string, JobKind>,
    private readonly log: (m: string) => void,
  ) {}

  /** Jobs left `running` by a crash or restart are queued again (same seed, so the same result), or failed after too many attempts. */
  async start(): Promise<void> {
    const now = new Date().toISOString();
    const interrupted = await this.db.selectFrom('job').select(['id', 'attempts']).where('status', '=', 'running').execute();
    for (const job of interrupted) {
      if (job.attempts >= MAX_ATTEMPTS) {
        await this.db.updateTable('job').set({ status: 'failed', retryable: 1, error: `Interrupted by a server restart ${job.attempts} times; not resumed again. Retry it when the cause is fixed.`, finishedAt: now, updatedAt: now }).where('id', '=', job.id).execute();
      } else {
        await this.db.updateTable('job').set({ status: 'queued', progress: 0, stage: 'resumed after a server restart', updatedAt: now }).where('id', '=', job.id).execute();
      }
    }
    if (interrupted.length) this.log(`job runner: ${interrupted.length} interrupted job(s) handled at start-up`);
    this.stopped = false;
    void this.pump();
  }

  async stop(): Promise<void> {
    this.stopped = true;
    for (const controller of this.running.values()) controller.abort(new Error('server stopping'));
  }

  async enqueue(request: JobRequest, executor: Db | Tx = this.db): Promise<{ id: number; reused: boolean }> {
    if (!this.kinds[request.kind]) throw new Error(`Unknown job kind "${request.kind}".`);
    if (request.cacheKey) {
      const existing = await executor
        .selectFrom('job')
        .select('id')
        .where('kind', '=', request.kind)
        .where('cacheKey', '=', request.cacheKey)
        .where('status', 'in', ['queued', 'running', 'succeeded'])
        .orderBy('id', 'desc')
        .executeTakeFirst();
      if (existing) return { id: existing.id, reused: true };
    }
    const now = new Date().toISOString();
    const row = await executor
      .insertInto('job')
      .values({ kind: request.kind, status: 'queued', inputJson: JSON.stringify(request.input), seed: request.seed, cacheKey: request.cacheKey ?? null, createdBy: request.createdBy ?? null, createdAt: now, updatedAt: now })
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
    const res = await this.db.updateTable('job').set({ status: 'cancelled', finishedAt: now, updatedAt: now, error: 'Cancelled by a person.' }).where('id', '=', id).where('status', 'in', ['queued', 'running']).executeTakeFirst();
    this.running.get(id)?.abort(new Error('cancelled'));
    const changed = Number(res.numUpdatedRows) > 0;
    if (changed) await this.notify(id);
    return changed;
  }

  async retry(id: number): Promise<boolean> {
    const now = new Date().toISOString();
    const res = await this.db
      .updateTable('job')
      .set({ status: 'queued', progress: 0, stage: null, error: null, retryable: 0, attempts: 0, resultJson: null, startedAt: null, finishedAt: null, updatedAt: now })
      .where('id', '=', id)
      .where('status', 'in', ['failed', 'cancelled'])
      .executeTakeFirst();
    void this.pump();
    return Number(res.numUpdatedRows) > 0;
  }

  waitFor(id: number): Promise<JobView> {
    return new Promise((resolve, reject) => {
      this.get(id).then((job) => {
        if (!job) return reject(new Error(`No job ${id}.`));
        if (['succeeded', 'failed', 'cancelled'].includes(job.status)) return resolve(job);
        this.waiters.set(id, [...(this.waiters.get(id) ?? []), resolve]);
      }, reject);
    });
  }

  private async notify(id: number) {
    const list = this.waiters.get(id);
    if (!list) return;
    const job = await this.get(id);
    if (!job || !['succeeded', 'failed', 'cancelled'].includes(job.status)) return;
    this.waiters.delete(id);
    for (const resolve of list) resolve(job);
  }

  /** Starts queued jobs: orchestrating kinds at once, compute kinds while the pool has a free thread. */
  private async pump(): Promise<void> {
    if (this.pumping || this.stopped) return;
    this.pumping = true;
    try {
      let started = true;
      while (!this.stopped && started) {
        started = false;
        const queued = await this.db.selectFrom('job').select(['id', 'kind', 'attempts', 'inputJson', 'seed']).where('status', '=', 'queued').orderBy('id').limit(100).execute();
        for (const next of queued) {
          const orchestrating = !!this.kinds[next.kind]?.run;
          if (!orchestrating && this.poolJobs.size >= this.pool.size) continue;
          const now = new Date().toISOString();
          const claimed = await this.db
            .updateTable('job')
            .set({ status: 'running', startedAt: now, updatedAt: now, attempts: next.attempts + 1, progress: 0 })
            .where('id', '=', next.id)
            .where('status', '=', 'queued')
            .executeTakeFirst();
          if (Number(claimed.numUpdatedRows) === 0) continue;
          const controller = new AbortController();
          this.running.set(next.id, controller);
          if (!orchestrating) this.poolJobs.add(next.id);
          void this.execute(next.id, next.kind, JSON.parse(next.inputJson), next.seed, controller);
          started = true;
        }
      }
    } finally {
      this.pumping = false;
    }
  }

  private async execute(id: number, kindName: string, input: unknown, seed: number, controller: AbortController) {
    const kind = this.kinds[kindName];
    let lastWrite = 0;
    const onProgress = (p: ProgressReport) => {
      const now = Date.now();
      if (now - lastWrite < PROGRESS_WRITE_INTERVAL_MS) return;
      lastWrite = now;
      void this.db.updateTable('job').set({ progress: Math.min(1, Math.max(0, p.fraction)), stage: p.stage.slice(0, 200), updatedAt: new Date().toISOString() }).where('id', '=', id).where('status', '=', 'running').execute();
    };
    try {
      let result: unknown;
      if (kind.run) {
        const env: JobRunEnvironment = {
          db: this.db,
          jobs: this,
          runTask: (task, payload, taskProgress) => this.pool.run(task, payload, taskProgress, controller.signal),
          progress: onProgress,
          signal: controller.signal,
        };
        result = await kind.run(env, input, { id, seed });
      } else {
        const payload = await kind.toPayload(this.db, input, { id, seed });
        result = await this.pool.run(kindName, payload, onProgress, controller.signal);
      }
      const now = new Date().toISOString();
      // Only a job still running takes the result: a cancelled job stays cancelled.
      await this.db
        .updateTable('job')
        .set({ status: 'succeeded', progress: 1, stage: 'done', resultJson: JSON.stringify(result), finishedAt: now, updatedAt: now })
        .where('id', '=', id)
        .where('status', '=', 'running')
        .execute();
    } catch (err) {
      // A cancelled job is already marked (the update below matches only `running`); on a stop the job
      // stays `running` so the next start resumes it.
      if (!this.stopped) {
        const message = err instanceof Error ? err.message : String(err);
        const now = new Date().toISOString();
        await this.db.updateTable('job').set({ status: 'failed', error: message.slice(0, 2000), retryable: 1, finishedAt: now, updatedAt: now }).where('id', '=', id).where('status', '=', 'running').execute();
      }
    } finally {
      this.running.delete(id);
      this.poolJobs.delete(id);
      await this.notify(id);
      void this.pump();
    }
  }
}
