import type { Env } from './config/env';
import type { Db, DatabaseHandle } from './db/database';
import type { Auth } from './features/auth/auth';
import type { JobQueue } from './jobs/job-runner';
import type { MailRuntime } from './features/mail/mail.runtime';

/** What every feature's routes are built from: configuration, the database and the session manager. */
export interface AppContext {
  env: Env;
  db: Db;
  sqlite: DatabaseHandle['sqlite'];
  auth: Auth;
  log: (message: string) => void;
  jobs: JobQueue;
  /** Outbox sender and, without SMTP_URL, the local fake mail service. */
  mail: MailRuntime;
  /** Package version and commit, recorded on every fit. */
  codeVersion: string;
}
