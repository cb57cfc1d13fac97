/**
 * zod schema of a personal API token request (POST /api/tokens), shared by the server and the client.
 */
import { z } from 'zod';

/** POST /api/tokens */
export const createTokenBody = z
  .object({ name: z.string({ error: 'give the token a name' }).trim().min(1, 'give the token a name').max(80, 'at most 80 characters') })
  .strict();
