/**
 * The thread pool under cancel. piscina 5 (checked with 5.3.2) starts no thread for a task queued behind one
 * that was aborted, which left a fit "running" at 0 % with the server idle after a cancelled simulation; the
 * pool now keeps waiting tasks in its own queue and stops a cancelled task through a shared flag.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { CancelledError, createWorkerPool, TaskError } from './worker-pool';

const pool = createWorkerPool(1, 1);
afterAll(() => pool.close());

const LONG = { reducedTemperature: 1.5, reducedPressure: 0.5, atoms: 108, steps: 400_000, seed: 1 };
const SHORT = { reducedTemperature: 1.5, reducedPressure: 0.5, atoms: 108, steps: 1000, seed: 2 };

describe('worker pool', () => {
  it('a task queued behind a cancelled one runs: one thread, cancel the running simulation, the next finishes', async () => {
    const controller = new AbortController();
    let started = false;
    const long = pool.run('simulation', LONG, () => (started = true), controller.signal);
    const next = pool.run('simulation', SHORT, () => {});
    for (let i = 0; i < 600 && !started; i++) await new Promise((r) => setTimeout(r, 50));
    expect(started).toBe(true);
    expect(pool.busy('simulation')).toBe(1);
    expect(pool.waiting('simulation')).toBe(1);
    controller.abort();
    await expect(long).rejects.toBeInstanceOf(CancelledError);
    const result = (await next) as { reducedDensity: number; settings: { seed: number } };
    expect(result.settings.seed).toBe(2);
    await new Promise((r) => setImmediate(r));
    expect(pool.busy('simulation') + pool.waiting('simulation')).toBe(0);
  }, 60_000);

  it('a task cancelled while it waits leaves the queue at once and never starts', async () => {
    const first = pool.run('simulation', SHORT, () => {});
    const controller = new AbortController();
    let ran = false;
    const waiting = pool.run('simulation', { ...SHORT, seed: 3 }, () => (ran = true), controller.signal);
    controller.abort();
    await expect(waiting).rejects.toBeInstanceOf(CancelledError);
    await first;
    expect(ran).toBe(false);
  }, 60_000);

  it("a fit runs in its own lane while the simulation thread is busy; a task's own error is a TaskError", async () => {
    const controller = new AbortController();
    const long = pool.run('simulation', LONG, () => {}, controller.signal);
    // An empty data set: the fit refuses it itself (a deterministic error, not a crash).
    await expect(pool.run('fit', { measurementSets: [], options: {} }, () => {})).rejects.toBeInstanceOf(TaskError);
    expect(pool.busy('simulation')).toBe(1);
    controller.abort();
    await expect(long).rejects.toBeInstanceOf(CancelledError);
  }, 60_000);
});

describe('worker-side code', () => {
  it('never reaches the database or the web features (worker processes must not open SQLite)', () => {
    const root = fileURLToPath(new URL('../..', import.meta.url));
    const seen = new Set<string>();
    const visit = (file: string) => {
      if (seen.has(file)) return;
      seen.add(file);
      const text = readFileSync(file, 'utf8');
      for (const m of text.matchAll(/^\s*(?:import|export)\s[^'"]*?from\s+['"](\.[^'"]+)['"]/gm)) {
        const target = path.resolve(path.dirname(file), m[1]);
        visit(target.endsWith('.ts') ? target : `${target}.ts`);
      }
      for (const m of text.matchAll(/import\(\s*['"](\.[^'"]+)['"]\s*\)/g)) visit(path.resolve(path.dirname(file), m[1]) + '.ts');
    };
    visit(path.join(root, 'server/jobs/worker-main.ts'));
    visit(path.join(root, 'server/jobs/worker.ts'));
    const files = [...seen].map((f) => path.relative(root, f));
    expect(files).toContain('server/jobs/queue-worker.ts');
    expect(files).toContain('shared/physics/md/npt.ts');
    expect(files.filter((f) => f.startsWith('server/db/') || f.startsWith('server/features/') || f === 'server/bootstrap.ts')).toEqual([]);
  });
});
