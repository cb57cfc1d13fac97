import type SQLite from 'better-sqlite3';
import { BetterSqlite3Adapter } from '@lucia-auth/adapter-sqlite';
import { hash, verify } from '@node-rs/argon2';
import { Lucia, TimeSpan } from 'lucia';

/** Sessions last 12 hours and slide forward while in use (lucia extends them past half-life). */
export const SESSION_LIFETIME = new TimeSpan(12, 'h');

export function createAuth(sqlite: SQLite.Database, options: { secureCookies: boolean }) {
  const adapter = new BetterSqlite3Adapter(sqlite, { user: 'user', session: 'session' });
  return new Lucia(adapter, {
    sessionExpiresIn: SESSION_LIFETIME,
    sessionCookie: {
      name: 'epsigma_session',
      attributes: { secure: options.secureCookies, sameSite: 'lax' },
    },
  });
}

export type Auth = ReturnType<typeof createAuth>;

declare module 'lucia' {
  interface Register {
    Lucia: Auth;
  }
}

// Argon2id with the library's defaults (OWASP-recommended memory-hard hashing); only the hash is stored.
export const hashPassword = (password: string) => hash(password);
export const verifyPassword = (passwordHash: string, password: string) => verify(passwordHash, password);
