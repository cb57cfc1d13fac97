import type { Db } from '../../db/database';

/** The window in which failed sign-ins count. */
export const SIGN_IN_WINDOW_MS = 15 * 60 * 1000;

/**
 * Failed sign-ins per client address and e-mail, kept in SQLite (table sign_in_failure) so a restart does not
 * reset them. Every attempt is recorded before the password is checked and a success clears the key, so only failures count. The e-mail must already be validated
 * (signInBody: NFKC, trimmed, lower case), so "  Ann@x" and "ann@x" share one key; the client address is
 * req.ip, which honours X-Forwarded-For only when TRUST_PROXY says which proxies to believe.
 */
export function signInLimiter(db: Db, limit: number) {
  const keyOf = (clientAddress: string, email: string) => `${clientAddress}|${email}`;
  return {
    keyOf,
    /**
     * Counts this attempt as a failure up front (so parallel guesses cannot all slip under the limit) and
     * answers the seconds to wait when the key is already at the limit (then nothing is recorded), else 0.
     * Call `clear` after a successful sign-in: successes never count.
     */
    async begin(key: string, nowMs = Date.now()): Promise<number> {
      return db.transaction().execute(async (tx) => {
        const rows = await tx
          .selectFrom('signInFailure')
          .select('atMs')
          .where('key', '=', key)
          .where('atMs', '>', nowMs - SIGN_IN_WINDOW_MS)
          .orderBy('atMs', 'desc')
          .limit(limit)
          .execute();
        if (rows.length >= limit) return Math.max(1, Math.ceil((rows[rows.length - 1].atMs + SIGN_IN_WINDOW_MS - nowMs) / 1000));
        await tx
          .deleteFrom('signInFailure')
          .where('atMs', '<=', nowMs - SIGN_IN_WINDOW_MS)
          .execute();
        await tx.insertInto('signInFailure').values({ key, atMs: nowMs }).execute();
        return 0;
      });
    },
    async clear(key: string): Promise<void> {
      await db.deleteFrom('signInFailure').where('key', '=', key).execute();
    },
  };
}
