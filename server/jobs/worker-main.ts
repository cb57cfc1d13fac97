/**
 * `npm run worker`: a worker process for the Redis driver. Takes simulations and fast fit tasks from the BullMQ
 * queues at REDIS_URL and runs WORKERS of them at once (default cores − 1, at least 1), on this machine or any
 * other with the same code version. It never opens the database; the web process stores what it reports.
 * SIGTERM/SIGINT: stop taking jobs; a job under way goes back to the queue and another worker finishes it.
 */
import os from 'node:os';
import { z } from 'zod';
import { startQueueWorker } from './queue-worker';

const schema = z.object({
  REDIS_URL: z
    .string({ error: 'REDIS_URL is required (e.g. redis://127.0.0.1:6379)' })
    .regex(/^rediss?:\/\/\S+$/, 'REDIS_URL must look like redis://host:6379'),
  WORKERS: z.coerce
    .number()
    .int()
    .min(1)
    .max(64)
    .default(Math.max(1, os.availableParallelism() - 1)),
  /** Threads for fast fit tasks (milliseconds each), besides the WORKERS simulation threads. */
  FAST_WORKERS: z.coerce.number().int().min(0).max(16).default(1),
  QUEUE_LOCK_MS: z.coerce.number().int().min(2000).max(600_000).default(30_000),
  /** Shown on the Simulations screen as where a run ran; default host:pid. */
  WORKER_NAME: z
    .string()
    .regex(/^[\w.:@/-]{1,100}$/, 'WORKER_NAME: letters, digits and . : @ / - _ only')
    .optional(),
});

const parsed = schema.safeParse(process.env);
if (!parsed.success) {
  console.error(`Invalid environment:\n${parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n')}`);
  process.exit(1);
}
const env = parsed.data;
const worker = await startQueueWorker({
  redisUrl: env.REDIS_URL,
  simulationThreads: env.WORKERS,
  fastThreads: env.FAST_WORKERS,
  lockMs: env.QUEUE_LOCK_MS,
  name: env.WORKER_NAME,
});
console.log(`WORKER READY ${worker.name}`);
let stopping = false;
const shutdown = () => {
  if (stopping) return;
  stopping = true;
  void worker.close().then(() => process.exit(0));
};
process.on('SIGINT', shutdown);
process.on('SIGTERM', shutdown);
