import { createHash } from 'node:crypto';
import type SQLite from 'better-sqlite3';
import { BetterSqlite3Adapter } from '@lucia-auth/adapter-sqlite';
import { hash, verify } from '@node-rs/argon2';
import { Lucia, TimeSpan, type Adapter, type DatabaseSession } from 'lucia';

/** Sessions last 12 hours and slide forward while in use (lucia extends them past half-life). */
export const SESSION_LIFETIME = new TimeSpan(12, 'h');

/**
 * What the session table stores for a session token: its SHA-256 (hex). The cookie keeps the token itself,
 * so reading the database file gives no session away.
 */
export const sessionIdHash = (token: string) => createHash('sha256').update(token).digest('hex');

/**
 * lucia's SQLite adapter behind a hash: every id going in is hashed, and a session coming out carries the
 * token it was looked up with (never the stored hash), so cookies and invalidation keep working with tokens.
 */
export class HashedSessionAdapter implements Adapter {
  constructor(private readonly inner: Adapter) {}

  async getSessionAndUser(token: string): ReturnType<Adapter['getSessionAndUser']> {
    const [session, user] = await this.inner.getSessionAndUser(sessionIdHash(token));
    return [session ? { ...session, id: token } : null, user];
  }
  async getUserSessions(userId: string): Promise<DatabaseSession[]> {
    return this.inner.getUserSessions(userId);
  }
  async setSession(session: DatabaseSession): Promise<void> {
    await this.inner.setSession({ ...session, id: sessionIdHash(session.id) });
  }
  async updateSessionExpiration(token: string, expiresAt: Date): Promise<void> {
    await this.inner.updateSessionExpiration(sessionIdHash(token), expiresAt);
  }
  async deleteSession(token: string): Promise<void> {
    await this.inner.deleteSession(sessionIdHash(token));
  }
  async deleteUserSessions(userId: string): Promise<void> {
    await this.inner.deleteUserSessions(userId);
  }
  async deleteExpiredSessions(): Promise<void> {
    await this.inner.deleteExpiredSessions();
  }
}

export function createAuth(sqlite: SQLite.Database, options: { secureCookies: boolean }) {
  const adapter = new HashedSessionAdapter(new BetterSqlite3Adapter(sqlite, { user: 'user', session: 'session' }));
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
