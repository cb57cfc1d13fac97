import { MessageChannel } from 'node:worker_threads';
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';
import { laneOf, type Lane, type ProgressReport } from './tasks';
import type { TaskOutcome } from './worker';

/** The task itself failed (bad input, a computation that cannot go on): running it again gives the same. */
export class TaskError extends Error {
  readonly permanent = true;
}

/** The task was stopped on request. */
export class CancelledError extends Error {
  constructor(message = 'cancelled') {
    super(message);
  }
}

/** A task that ignores its cancel flag this long is stopped by ending its thread. */
const HARD_ABORT_AFTER_MS = 5000;

/**
 * Runs tasks in worker threads, one pool per lane: `simulation` (the WORKERS setting) and `fast` (fits that take
 * milliseconds), so a fit never waits behind a simulation. Tasks wait in this module's own queue, never inside
 * piscina: piscina 5 starts no thread for a task queued behind one that was aborted, which left jobs stuck.
 */
export interface TaskPool {
  run(kind: string, payload: unknown, onProgress: (p: ProgressReport) => void, signal?: AbortSignal): Promise<unknown>;
  /** Threads of a lane. */
  readonly sizes: Record<Lane, number>;
  /** Tasks of a lane running now. */
  busy(lane: Lane): number;
  /** Tasks of a lane waiting for a thread. */
  waiting(lane: Lane): number;
  close(): Promise<void>;
}

interface Pending {
  start: () => void;
  signal?: AbortSignal;
  reject: (e: unknown) => void;
}

export function createWorkerPool(simulationThreads: number, fastThreads = 1): TaskPool {
  const fromSource = import.meta.url.endsWith('.ts');
  const filename = fileURLToPath(new URL(fromSource ? './worker.ts' : './worker.js', import.meta.url));
  // Workers inherit the parent's flags; from source (tests, `npm start`) they also need the TypeScript loader.
  const execArgv =
    fromSource && !process.execArgv.some((a) => a.includes('tsx')) ? [...process.execArgv, '--import', 'tsx'] : process.execArgv;
  const sizes: Record<Lane, number> = { simulation: simulationThreads, fast: fastThreads };
  const pools = {} as Record<Lane, Piscina | null>;
  for (const lane of ['simulation', 'fast'] as const) {
    pools[lane] = sizes[lane] > 0 ? new Piscina({ filename, maxThreads: sizes[lane], minThreads: 0, idleTimeout: 30_000, execArgv }) : null;
  }
  const running: Record<Lane, number> = { simulation: 0, fast: 0 };
  const queues: Record<Lane, Pending[]> = { simulation: [], fast: [] };
  let closed = false;

  const next = (lane: Lane) => {
    while (running[lane] < sizes[lane] && queues[lane].length) queues[lane].shift()!.start();
  };

  const execute = async (
    lane: Lane,
    kind: string,
    payload: unknown,
    onProgress: (p: ProgressReport) => void,
    signal?: AbortSignal,
  ): Promise<unknown> => {
    const channel = new MessageChannel();
    channel.port1.on('message', (p: ProgressReport) => onProgress(p));
    const cancel = new Int32Array(new SharedArrayBuffer(4));
    const hard = new AbortController();
    let timer: NodeJS.Timeout | undefined;
    const onAbort = () => {
      Atomics.store(cancel, 0, 1);
      timer = setTimeout(() => hard.abort(), HARD_ABORT_AFTER_MS);
    };
    if (signal?.aborted) onAbort();
    else signal?.addEventListener('abort', onAbort, { once: true });
    try {
      const outcome = (await pools[lane]!.run(
        { kind, payload, port: channel.port2, cancel },
        { transferList: [channel.port2], signal: hard.signal },
      )) as TaskOutcome;
      if (outcome.ok) return outcome.value;
      if (outcome.cancelled) throw new CancelledError();
      throw new TaskError(outcome.message);
    } catch (err) {
      if (hard.signal.aborted) throw new CancelledError();
      throw err;
    } finally {
      clearTimeout(timer);
      signal?.removeEventListener('abort', onAbort);
      channel.port1.close();
    }
  };

  return {
    sizes,
    busy: (lane) => running[lane],
    waiting: (lane) => queues[lane].length,
    run(kind, payload, onProgress, signal) {
      const lane = laneOf(kind);
      if (closed) return Promise.reject(new Error('the worker pool is closed'));
      if (!pools[lane]) return Promise.reject(new Error(`this process runs no ${lane} tasks (no threads for them)`));
      if (signal?.aborted) return Promise.reject(new CancelledError());
      return new Promise((resolve, reject) => {
        const pending: Pending = {
          signal,
          reject,
          start: () => {
            signal?.removeEventListener('abort', dropWaiting);
            running[lane]++;
            execute(lane, kind, payload, onProgress, signal)
              .then(resolve, reject)
              .finally(() => {
                running[lane]--;
                next(lane);
              });
          },
        };
        // Cancelled while waiting for a thread: leave the queue at once.
        const dropWaiting = () => {
          const i = queues[lane].indexOf(pending);
          if (i >= 0) queues[lane].splice(i, 1);
          reject(new CancelledError());
        };
        signal?.addEventListener('abort', dropWaiting, { once: true });
        queues[lane].push(pending);
        next(lane);
      });
    },
    async close() {
      closed = true;
      for (const lane of ['simulation', 'fast'] as const) {
        for (const p of queues[lane].splice(0)) p.reject(new Error('the worker pool is closed'));
        await pools[lane]?.destroy();
      }
    },
  };
}
