/**
 * Contract of a personal read-only API token: the answers of /api/tokens (list, create, revoke).
 * Built in server/features/tokens/tokens.view.ts; the secret itself is only in the create answer, never stored.
 */
import { z } from 'zod';

export const tokenView = z.strictObject({
  id: z.number().int(),
  name: z.string(),
  /** The secret's first characters, to tell tokens apart on screen. */
  prefix: z.string(),
  createdAt: z.string(),
  lastUsedAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
  active: z.boolean(),
});
export type TokenView = z.infer<typeof tokenView>;

export const tokenListView = z.strictObject({ tokens: z.array(tokenView) });
export type TokenList = z.infer<typeof tokenListView>;

/** POST /api/tokens: the one answer that carries the secret. */
export const createdTokenView = tokenView.extend({ token: z.string() });
export type CreatedToken = z.infer<typeof createdTokenView>;
