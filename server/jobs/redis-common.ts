/**
 * Names shared by the web process (redis-executor.ts) and the worker processes (queue-worker.ts). Nothing here
 * touches the database: worker processes load this file, tasks.ts and shared/ only.
 */
import { Redis } from 'ioredis';
import type { Lane } from './tasks';

/** Key prefix of every BullMQ key and of Epsigma's own keys in Redis. */
export const PREFIX = 'epsigma';
/** One BullMQ queue per lane, so fast fits never wait behind simulations. */
export const QUEUE_NAMES: Record<Lane, string> = { fast: 'fast', simulation: 'simulation' };
export const LANES: Lane[] = ['simulation', 'fast'];

/** Set by the web process to stop a running job; the worker checks it every second (between MD blocks the task stops). */
export const cancelKey = (lane: Lane, jobId: string) => `${PREFIX}:cancel:${lane}:${jobId}`;
/** Each worker process refreshes its own key (with a short expiry): the live workers are the keys that exist. */
export const workerKey = (name: string) => `${PREFIX}:worker:${name}`;
export const WORKER_KEY_PATTERN = `${PREFIX}:worker:*`;
export const HEARTBEAT_MS = 5000;
export const HEARTBEAT_TTL_S = 15;

/** What a job in Redis carries: everything a worker needs, nothing that needs the database. */
export interface QueuedTask {
  task: string;
  payload: unknown;
  /** The engine version the web process expects (tasks.ts ENGINE_VERSIONS): a worker on other code refuses the job. */
  engineVersion: string;
  /** Code version of the web process that queued it (package version and commit), for the record. */
  codeVersion: string;
  /** The job row in the web process's database, when the task is a job of its own. */
  jobId?: number;
}

/** What progress a worker reports through BullMQ (job.updateProgress). */
export interface QueuedProgress {
  fraction: number;
  stage: string;
}

/** BullMQ's ioredis connections must not give up on a command (maxRetriesPerRequest: null). */
export function redisConnection(url: string): Redis {
  return new Redis(url, { maxRetriesPerRequest: null, enableReadyCheck: true });
}
