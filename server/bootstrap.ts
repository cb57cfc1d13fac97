import { execFileSync } from 'node:child_process';
import type { AppContext } from './app-context';
import type { Env } from './config/env';
import { migrateToLatest, openDatabase } from './db/database';
import { createAuth } from './features/auth/auth';
import { startMail } from './features/mail/mail.runtime';
import { fitJobKind } from './features/fits/fits.service';
import { simulationJobKind } from './features/simulations/simulations.service';
import { JobRunner, LocalExecutor, type JobExecutor, type JobKind } from './jobs/job-runner';
import { createWorkerPool } from './jobs/worker-pool';
import pkg from '../package.json' with { type: 'json' };

/**
 * Every kind of long job, by name, registered by its feature; the worker side lives in server/jobs/tasks.ts under the
 * same names. The job runner (infrastructure) knows kinds only through this table.
 */
export const JOB_KINDS: Record<string, JobKind> = {
  fit: fitJobKind,
  simulation: simulationJobKind,
};

/** Package version plus the commit when the code runs from a git checkout. */
function readCodeVersion(): string {
  try {
    const commit = execFileSync('git', ['rev-parse', '--short=12', 'HEAD'], { stdio: ['ignore', 'pipe', 'ignore'] })
      .toString()
      .trim();
    return `${pkg.version}+${commit}`;
  } catch {
    return pkg.version;
  }
}

/** Opens and migrates the database, starts the job runner and builds the shared context of the app. */
export async function createContext(
  env: Env,
  log: (message: string) => void = console.log,
): Promise<AppContext & { close: () => Promise<void> }> {
  const handle = openDatabase(env.DATABASE_PATH);
  await migrateToLatest(handle.db);
  const publicUrl = env.PUBLIC_URL ?? `http://${env.HOST}:${env.PORT}`;
  const auth = createAuth(handle.sqlite, { secureCookies: publicUrl.startsWith('https:') });
  const codeVersion = readCodeVersion();
  // The job driver: the embedded queue (this process's threads) by default, BullMQ workers with REDIS_URL.
  // BullMQ and ioredis load only when they are used.
  const executor: JobExecutor = env.REDIS_URL
    ? await (
        await import('./jobs/redis-executor')
      ).RedisExecutor.create({ redisUrl: env.REDIS_URL, codeVersion, localThreads: env.WORKERS, lockMs: env.QUEUE_LOCK_MS, log })
    : new LocalExecutor(createWorkerPool(env.WORKERS));
  const jobs = new JobRunner(handle.db, executor, JOB_KINDS, log);
  await jobs.start();
  const mail = await startMail(handle.db, { smtpUrl: env.SMTP_URL, from: env.MAIL_FROM, publicUrl }, log);
  return {
    env,
    db: handle.db,
    sqlite: handle.sqlite,
    auth,
    log,
    jobs,
    mail,
    codeVersion,
    close: async () => {
      await mail.close();
      await jobs.stop();
      await handle.close();
    },
  };
}
