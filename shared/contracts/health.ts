/**
 * Contract of GET /api/health (no sign-in): the server is up, its version, the database answers, and the job queue's
 * counts. The queue block is the admin's queue view without its worker list: which machines run the jobs is for
 * signed-in people (GET /api/simulations/queue). Built in server/features/health/health.view.ts.
 */
import { z } from 'zod';
import { queueHealthSchema } from './simulation';

export const healthQueueView = queueHealthSchema.omit({ workerList: true });
export type HealthQueue = z.infer<typeof healthQueueView>;

export const healthView = z.strictObject({
  status: z.literal('ok'),
  version: z.string(),
  database: z.literal('ok'),
  queue: healthQueueView,
  time: z.string(),
});
export type Health = z.infer<typeof healthView>;
