/**
 * `npm run -s bench:fit -- --redis URL [--worker-processes N] [--json]`: the cold joint fit of bench:fit through
 * the Redis driver, with 1, 2, … N worker processes (`npm run worker`, one simulation thread each) and a web
 * context that runs no jobs itself (WORKERS=0). A fresh database each time, so every run is cold. Reports the
 * wall time per count of worker processes: scaling measured, not assumed. A report, never a test.
 * Use a Redis that no running Epsigma shares: the bench's jobs would mix with its queue.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { createContext } from '../server/bootstrap';
import { loadEnv } from '../server/config/env';
import { seedDemo } from '../server/demo-seed';
import { createFit, findFit } from '../server/features/fits/fits.service';
import { rolesOf } from '../server/features/people/people.repository';

const root = fileURLToPath(new URL('..', import.meta.url));

function startWorker(redisUrl: string, name: string): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/jobs/worker-main.ts'], {
    cwd: root,
    env: { ...process.env, REDIS_URL: redisUrl, WORKERS: '1', WORKER_NAME: name },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  return new Promise((resolve, reject) => {
    child.stdout!.on('data', (d: Buffer) => {
      output += d.toString();
      if (output.includes('WORKER READY')) resolve(child);
    });
    child.stderr!.on('data', (d: Buffer) => (output += d.toString()));
    child.on('exit', (code) => reject(new Error(`worker ${name} exited with ${code}:\n${output}`)));
  });
}

async function stopWorker(child: ChildProcess) {
  if (child.exitCode !== null || child.signalCode !== null) return;
  const exited = new Promise((r) => child.once('exit', r));
  child.kill('SIGTERM');
  await exited;
}

/** One cold fit with `count` worker processes; returns its wall time and what it ran. */
async function coldFit(redisUrl: string, count: number) {
  const dir = mkdtempSync(path.join(tmpdir(), 'epsigma-bench-workers-'));
  const workers = await Promise.all(Array.from({ length: count }, (_, i) => startWorker(redisUrl, `bench-worker-${i + 1}`)));
  const env = loadEnv({
    ...process.env,
    NODE_ENV: 'production',
    DATABASE_PATH: path.join(dir, 'bench.sqlite'),
    LOG_REQUESTS: '0',
    REDIS_URL: redisUrl,
    WORKERS: '0',
  });
  const ctx = await createContext(env, () => {});
  try {
    await seedDemo(ctx, { demoPassword: 'bench-password' });
    const user = await ctx.db
      .selectFrom('user')
      .select(['id', 'email', 'name'])
      .where('email', '=', 'modeller@demo.epsigma.test')
      .executeTakeFirstOrThrow();
    const actor = { ...user, roles: await rolesOf(ctx.db, user.id) };
    const substance = await ctx.db.selectFrom('substance').select('id').where('name', '=', 'Quillgas QG-1').executeTakeFirstOrThrow();
    const measurementSets = await ctx.db
      .selectFrom('measurementSet')
      .select(['id', 'kind'])
      .where('substanceId', '=', substance.id)
      .where('kind', 'in', ['b2', 'density'])
      .execute();
    const started = performance.now();
    const { id, jobId } = await createFit(ctx, actor, {
      substanceId: substance.id,
      measurementSets: measurementSets.map((d) => ({ id: d.id })),
    });
    const job = await ctx.jobs.waitFor(jobId);
    const wallSeconds = Number(((performance.now() - started) / 1000).toFixed(2));
    const result = JSON.parse((await findFit(ctx.db, id))!.resultJson ?? '{}');
    const ranOn = await ctx.db.selectFrom('job').select('ranOn').distinct().where('kind', '=', 'simulation').execute();
    return {
      workerProcesses: count,
      status: job.status,
      wallSeconds,
      runsUsed: result.mdRunCount,
      rounds: result.mdIterations?.length,
      epsilonK: result.epsilonK,
      sigmaAngstrom: result.sigmaAngstrom,
      workersUsed: ranOn.length,
      error: job.error,
    };
  } finally {
    await ctx.close();
    await Promise.all(workers.map(stopWorker));
    rmSync(dir, { recursive: true, force: true });
  }
}

export async function benchWithWorkerProcesses(redisUrl: string, maxProcesses: number, json: boolean) {
  if (!Number.isInteger(maxProcesses) || maxProcesses < 1 || maxProcesses > 64)
    throw new Error('--worker-processes must be a whole number from 1 to 64');
  const runs = [];
  for (let n = 1; n <= maxProcesses; n++) runs.push(await coldFit(redisUrl, n));
  const report = {
    fixture: 'Quillgas QG-1 demo: densities + B2 table, cold cache each time',
    driver: 'redis',
    redis: redisUrl,
    runs,
    speedup: runs.length > 1 ? Number((runs[0].wallSeconds / runs[runs.length - 1].wallSeconds).toFixed(2)) : null,
  };
  if (json) console.log(JSON.stringify(report, null, 2));
  else {
    console.log(`${report.fixture}, Redis driver at ${redisUrl}, web process WORKERS=0`);
    for (const r of runs)
      console.log(
        `${r.workerProcesses} worker process(es): ${r.status} in ${r.wallSeconds} s, ${r.runsUsed} runs on ${r.workersUsed} worker(s), ${r.rounds} rounds, ε/k_B = ${r.epsilonK?.toFixed(2)} K, σ = ${r.sigmaAngstrom?.toFixed(4)} Å`,
      );
    if (report.speedup) console.log(`speed-up from 1 to ${maxProcesses} worker processes: ${report.speedup}×`);
  }
}
