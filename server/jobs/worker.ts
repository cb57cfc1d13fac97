import type { MessagePort } from 'node:worker_threads';
import { TASKS } from './tasks';

/** piscina entry point: run one task and stream its progress over the port the main thread handed over. */
export default async function runTask({ kind, payload, port }: { kind: string; payload: unknown; port: MessagePort }) {
  const task = TASKS[kind];
  if (!task) throw new Error(`No worker task for job kind "${kind}".`);
  let last = 0;
  try {
    return await task(payload, (p) => {
      // At most ~20 progress messages a second: enough for a smooth bar, cheap for tight loops.
      const now = Date.now();
      if (now - last < 50 && p.fraction < 1) return;
      last = now;
      port.postMessage(p);
    });
  } finally {
    port.close();
  }
}
