import type { Generated } from 'kysely';

/** One failed sign-in: key = client address + normalised e-mail (server/features/auth/sign-in-limiter.ts). */
export interface SignInFailureTable {
  id: Generated<number>;
  key: string;
  atMs: number;
}
