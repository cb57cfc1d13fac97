import type { Generated } from 'kysely';

export type JobStatus = 'queued' | 'running' | 'succeeded' | 'failed' | 'cancelled';

export interface JobTable {
  id: Generated<number>;
  kind: string;
  status: JobStatus;
  progress: Generated<number>;
  stage: string | null;
  inputJson: string;
  resultJson: string | null;
  error: string | null;
  retryable: Generated<number>;
  attempts: Generated<number>;
  seed: number;
  cacheKey: string | null;
  /** The driver's name for the current execution (changes on retry); null while the job waits to be handed over. */
  queueRef: string | null;
  /** Worker process that ran the job: host and process id. */
  ranOn: string | null;
  createdBy: string | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  updatedAt: string;
}
