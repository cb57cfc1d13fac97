import type { Health } from '../../../shared/contracts/health';
import type { QueueHealth } from '../../../shared/contracts/simulation';

/** The health answer; the queue's worker list is left out (counts only without a sign-in). */
export function toHealthView(version: string, queueHealth: QueueHealth, now: Date): Health {
  const { workerList: _workers, ...queue } = queueHealth;
  return { status: 'ok', version, database: 'ok', queue, time: now.toISOString() };
}
