import { createHash } from 'node:crypto';
import type SQLite from 'better-sqlite3';
import { hash, verify } from '@node-rs/argon2';
import { Lucia, TimeSpan, type Adapter, type DatabaseSession, type DatabaseUser } from 'lucia';
import type { Role } from '../../../shared/auth/roles';

/** Sessions last 12 hours and slide forward while in use (lucia extends them past half-life). */
export const SESSION_LIFETIME = new TimeSpan(12, 'h');

/**
 * What the session table stores for a session token: its SHA-256 (hex). The cookie keeps the token itself,
 * so reading the database file gives no session away.
 */
export const sessionIdHash = (token: string) => createHash('sha256').update(token).digest('hex');

interface SessionUserRow {
  expiresAt: number;
  userId: string;
  email: string;
  name: string;
  active: number;
  roles: string | null;
}

/**
 * lucia's session store on the session table, keyed by the hash of the token: every id going in is hashed, and
 * a session coming out carries the token it was looked up with (never the stored hash), so cookies and
 * invalidation keep working with tokens. The lookup is one prepared statement that also brings the person's
 * e-mail, name, active flag and roles, so a signed-in request costs a single query before its route runs.
 */
export class HashedSessionStore implements Adapter {
  private readonly lookup;
  private readonly byUser;
  private readonly insert;
  private readonly extend;
  private readonly remove;
  private readonly removeOfUser;
  private readonly removeExpired;

  constructor(sqlite: SQLite.Database) {
    this.lookup = sqlite.prepare(
      `SELECT s.expires_at AS expiresAt, s.user_id AS userId, u.email, u.name, u.active,
        (SELECT group_concat(role, ',') FROM (SELECT role FROM user_role WHERE user_id = u.id ORDER BY role)) AS roles
       FROM session s JOIN user u ON u.id = s.user_id WHERE s.id = ?`,
    );
    this.byUser = sqlite.prepare('SELECT id, expires_at AS expiresAt, user_id AS userId FROM session WHERE user_id = ?');
    this.insert = sqlite.prepare('INSERT INTO session (id, expires_at, user_id) VALUES (?, ?, ?)');
    this.extend = sqlite.prepare('UPDATE session SET expires_at = ? WHERE id = ?');
    this.remove = sqlite.prepare('DELETE FROM session WHERE id = ?');
    this.removeOfUser = sqlite.prepare('DELETE FROM session WHERE user_id = ?');
    this.removeExpired = sqlite.prepare('DELETE FROM session WHERE expires_at <= ?');
  }

  async getSessionAndUser(token: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    const row = this.lookup.get(sessionIdHash(token)) as SessionUserRow | undefined;
    if (!row) return [null, null];
    return [
      { id: token, userId: row.userId, expiresAt: new Date(row.expiresAt * 1000), attributes: {} },
      { id: row.userId, attributes: { email: row.email, name: row.name, active: row.active, roles: row.roles ?? '' } },
    ];
  }
  async getUserSessions(userId: string): Promise<DatabaseSession[]> {
    // Only hashes are stored: these ids cannot open a session.
    return (this.byUser.all(userId) as Array<{ id: string; expiresAt: number; userId: string }>).map((r) => ({
      id: r.id,
      userId: r.userId,
      expiresAt: new Date(r.expiresAt * 1000),
      attributes: {},
    }));
  }
  async setSession(session: DatabaseSession): Promise<void> {
    this.insert.run(sessionIdHash(session.id), Math.floor(session.expiresAt.getTime() / 1000), session.userId);
  }
  async updateSessionExpiration(token: string, expiresAt: Date): Promise<void> {
    this.extend.run(Math.floor(expiresAt.getTime() / 1000), sessionIdHash(token));
  }
  async deleteSession(token: string): Promise<void> {
    this.remove.run(sessionIdHash(token));
  }
  async deleteUserSessions(userId: string): Promise<void> {
    this.removeOfUser.run(userId);
  }
  async deleteExpiredSessions(): Promise<void> {
    this.removeExpired.run(Math.floor(Date.now() / 1000));
  }
}

export function createAuth(sqlite: SQLite.Database, options: { secureCookies: boolean }) {
  return new Lucia(new HashedSessionStore(sqlite), {
    sessionExpiresIn: SESSION_LIFETIME,
    sessionCookie: {
      name: 'epsigma_session',
      attributes: { secure: options.secureCookies, sameSite: 'lax' },
    },
    getUserAttributes: (a) => ({ email: a.email, name: a.name, active: a.active, roles: a.roles ? (a.roles.split(',') as Role[]) : [] }),
  });
}

export type Auth = ReturnType<typeof createAuth>;

declare module 'lucia' {
  interface Register {
    Lucia: Auth;
    DatabaseUserAttributes: { email: string; name: string; active: number; roles: string };
  }
}

// Argon2id with the library's defaults (OWASP-recommended memory-hard hashing); only the hash is stored.
export const hashPassword = (password: string) => hash(password);
export const verifyPassword = (passwordHash: string, password: string) => verify(passwordHash, password);
