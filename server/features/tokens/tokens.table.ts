import type { Generated } from 'kysely';

/** A personal read-only API token; only the SHA-256 hash of its secret is stored. */
export interface ApiTokenTable {
  id: Generated<number>;
  userId: string;
  name: string;
  /** base64url SHA-256 of the secret as the client sends it. */
  tokenHash: string;
  /** First 8 characters of the secret, for display. */
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
}
