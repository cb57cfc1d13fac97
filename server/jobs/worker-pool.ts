import { MessageChannel } from 'node:worker_threads';
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';
import type { ProgressReport } from './tasks';

/** Runs tasks in worker threads; the pool size is the WORKERS setting. */
export interface TaskPool {
  run(kind: string, payload: unknown, onProgress: (p: ProgressReport) => void, signal?: AbortSignal): Promise<unknown>;
  readonly size: number;
  close(): Promise<void>;
}

export function createWorkerPool(size: number): TaskPool {
  const fromSource = import.meta.url.endsWith('.ts');
  const filename = fileURLToPath(new URL(fromSource ? './worker.ts' : './worker.js', import.meta.url));
  // Workers inherit the parent's flags; from source (tests, `npm start`) they also need the TypeScript loader.
  const execArgv = fromSource && !process.execArgv.some((a) => a.includes('tsx')) ? [...process.execArgv, '--import', 'tsx'] : process.execArgv;
  const pool = new Piscina({ filename, maxThreads: size, minThreads: 0, idleTimeout: 30_000, execArgv });
  return {
    size,
    async run(kind, payload, onProgress, signal) {
      const channel = new MessageChannel();
      channel.port1.on('message', (p: ProgressReport) => onProgress(p));
      try {
        return await pool.run({ kind, payload, port: channel.port2 }, { transferList: [channel.port2], signal });
      } finally {
        channel.port1.close();
      }
    },
    close: () => pool.destroy(),
  };
}
