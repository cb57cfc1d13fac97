import os from 'node:os';
import path from 'node:path';
import { z } from 'zod';

/** The environment, validated once at start-up. Names and defaults are documented in the README. */
const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().default('127.0.0.1'),
  DATABASE_PATH: z.string().min(1).default(path.join('data', 'epsigma.sqlite')),
  DEMO_PASSWORD: z.string().min(8, 'DEMO_PASSWORD must have at least 8 characters').default('epsigma-demo-2026'),
  SMTP_URL: z.string().url().optional(),
  /** Public address used in e-mail links; defaults to http://HOST:PORT. */
  PUBLIC_URL: z.string().url().optional(),
  /** From header of every mail the app sends. */
  MAIL_FROM: z.string().min(3).default('Epsigma <epsigma@localhost>'),
  /** Threads that run jobs in this process (default cores − 1, at least 1); 0 with REDIS_URL: this process runs no jobs. */
  WORKERS: z.coerce
    .number()
    .int()
    .min(0)
    .max(64)
    .default(Math.max(1, os.availableParallelism() - 1)),
  /** A Redis server shared by the web process and `npm run worker` processes (BullMQ driver); unset: the embedded SQLite queue. */
  REDIS_URL: z
    .string()
    .regex(/^rediss?:\/\/\S+$/, 'REDIS_URL must look like redis://host:6379')
    .optional(),
  /** BullMQ lock of a running job (ms): a worker killed without warning gives its job to another worker about this long later. */
  QUEUE_LOCK_MS: z.coerce.number().int().min(2000).max(600_000).default(30_000),
  LOG_REQUESTS: z.enum(['0', '1']).default('1'),
  /** 1: every answer sent with sendView is parsed with its contract (shared/contracts) and drift answers 500; on in tests. */
  CHECK_RESPONSES: z.enum(['0', '1']).default('0'),
  /** Sign-in attempts allowed per e-mail address and client address in 15 minutes. */
  SIGN_IN_LIMIT: z.coerce.number().int().min(1).default(10),
  /**
   * Which peers may set X-Forwarded-For/-Host/-Proto: unset trusts none (the socket address is the client);
   * a hop count ("1") or a comma-separated list of addresses, subnets or loopback/linklocal/uniquelocal.
   */
  TRUST_PROXY: z
    .string()
    .trim()
    .regex(
      /^$|^\d{1,2}$|^[\w.:/]+(\s*,\s*[\w.:/]+)*$/,
      'TRUST_PROXY must be a hop count such as 1 or a comma-separated list of addresses or subnets (e.g. loopback, 10.0.0.0/8)',
    )
    .refine(
      (v) => !/^(true|yes|all|\*)$/i.test(v),
      'TRUST_PROXY=true would let any client forge its address and origin; name the proxy (e.g. loopback) or give a hop count',
    )
    .optional(),
});

/** Express's "trust proxy" value for TRUST_PROXY: false when unset, a hop count, or the list of trusted peers. */
export function trustProxySetting(value: string | undefined): false | number | string {
  if (value === undefined || value === '' || value === '0' || value.toLowerCase() === 'false') return false;
  return /^\d+$/.test(value) ? Number(value) : value;
}

export type Env = z.infer<typeof envSchema>;

export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid environment:\n${lines.join('\n')}`);
  }
  if (parsed.data.WORKERS === 0 && !parsed.data.REDIS_URL)
    throw new Error('Invalid environment:\n  WORKERS: 0 leaves nobody to run jobs without REDIS_URL (worker processes); use at least 1');
  return parsed.data;
}
