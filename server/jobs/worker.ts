import type { MessagePort } from 'node:worker_threads';
import { TASKS } from './tasks';

export const CANCELLED_MESSAGE = 'cancelled';

/** What a task hands back: its result, or the reason it failed (the task's own error: running it again gives the same). */
export type TaskOutcome = { ok: true; value: unknown } | { ok: false; cancelled: boolean; message: string };

/**
 * piscina entry point: run one task and stream its progress over the port the main thread handed over.
 * `cancel` is a shared flag the main thread sets to stop the task: it is checked at every progress report
 * (between MD blocks of 256 steps), so the thread ends the task itself and stays alive for the next one.
 */
export default async function runTask({
  kind,
  payload,
  port,
  cancel,
}: {
  kind: string;
  payload: unknown;
  port: MessagePort;
  cancel: Int32Array;
}): Promise<TaskOutcome> {
  const task = TASKS[kind];
  if (!task) return { ok: false, cancelled: false, message: `No worker task for job kind "${kind}".` };
  let last = 0;
  try {
    const value = await task(payload, (p) => {
      if (Atomics.load(cancel, 0) !== 0) throw new Error(CANCELLED_MESSAGE);
      // At most ~20 progress messages a second: enough for a smooth bar, cheap for tight loops.
      const now = Date.now();
      if (now - last < 50 && p.fraction < 1) return;
      last = now;
      port.postMessage(p);
    });
    return { ok: true, value };
  } catch (err) {
    const cancelled = Atomics.load(cancel, 0) !== 0;
    return { ok: false, cancelled, message: cancelled ? CANCELLED_MESSAGE : err instanceof Error ? err.message : String(err) };
  } finally {
    port.close();
  }
}
