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
  WORKERS: z.coerce.number().int().min(1).max(64).default(Math.max(1, os.availableParallelism() - 1)),
  LOG_REQUESTS: z.enum(['0', '1']).default('1'),
  /** Sign-in attempts allowed per e-mail address and client address in 15 minutes. */
  SIGN_IN_LIMIT: z.coerce.number().int().min(1).default(10),
});

export type Env = z.infer<typeof envSchema>;

export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid environment:\n${lines.join('\n')}`);
  }
  return parsed.data;
}
