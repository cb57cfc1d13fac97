import { createHash, randomBytes } from 'node:crypto';
import type { CurrentUser } from '../../common/auth-middleware';
import { conflict, notFound } from '../../common/errors';
import type { Db, Tx } from '../../db/database';
import type { TokenView } from '../../../shared/contracts/token';
import { recordAudit } from '../audit/audit.service';
import { rolesOf } from '../people/people.repository';
import {
  countActiveTokens,
  findToken,
  findTokenByHash,
  insertToken,
  setTokenLastUsed,
  setTokenRevoked,
  tokensOf,
} from './tokens.repository';
import { toTokenView } from './tokens.view';

/** Tokens a person may hold at once that are not revoked; enough for a few scripts, few enough to review. */
export const MAX_ACTIVE_TOKENS = 20;

/** Characters of the secret shown on screen to tell tokens apart (never enough to use). */
export const TOKEN_PREFIX_LENGTH = 8;

/** A fresh secret: 32 random bytes (256 bits) in base64url, 43 characters. */
export function newTokenSecret(): string {
  return randomBytes(32).toString('base64url');
}

/**
 * What the database keeps of a secret: its SHA-256 in base64url. A fast hash is enough here because the
 * secret has 256 bits of entropy (no dictionary to try), unlike a password.
 */
export function tokenHash(secret: string): string {
  return createHash('sha256').update(secret, 'utf8').digest('base64url');
}

/** POST /api/tokens: the secret leaves the server once, in this answer; only its hash is stored and audited by id. */
export async function createToken(db: Db, actor: CurrentUser, name: string) {
  const secret = newTokenSecret();
  const now = new Date().toISOString();
  const row = await db.transaction().execute(async (tx) => {
    if ((await countActiveTokens(tx, actor.id)) >= MAX_ACTIVE_TOKENS)
      throw conflict(`You hold ${MAX_ACTIVE_TOKENS} active tokens; revoke one you no longer use first.`);
    const created = await insertToken(tx, {
      userId: actor.id,
      name,
      tokenHash: tokenHash(secret),
      prefix: secret.slice(0, TOKEN_PREFIX_LENGTH),
      createdAt: now,
      lastUsedAt: null,
      revokedAt: null,
    });
    await recordAudit(tx, {
      actor,
      action: 'token.created',
      targetType: 'apiToken',
      targetId: created.id,
      summary: `${actor.email} created the read-only API token "${name}" (${created.prefix}…)`,
      after: { name, prefix: created.prefix },
    });
    return created;
  });
  return { ...toTokenView(row), token: secret };
}

/** GET /api/tokens: the person's own tokens, newest first, never the secret or its hash. */
export async function listTokens(db: Db, userId: string): Promise<TokenView[]> {
  return (await tokensOf(db, userId)).map(toTokenView);
}

/** DELETE /api/tokens/:id: revokes one of the person's own tokens; revoking twice is not a second event. */
export async function revokeToken(db: Db, actor: CurrentUser, id: number): Promise<TokenView> {
  return db.transaction().execute(async (tx) => {
    const row = await findToken(tx, id);
    // Someone else's token is answered like a missing one: ids say nothing about other people.
    if (!row || row.userId !== actor.id) throw notFound(`Token ${id}`);
    if (row.revokedAt) return toTokenView(row);
    const revokedAt = new Date().toISOString();
    await setTokenRevoked(tx, id, revokedAt);
    await recordAudit(tx, {
      actor,
      action: 'token.revoked',
      targetType: 'apiToken',
      targetId: id,
      summary: `${actor.email} revoked the API token "${row.name}" (${row.prefix}…)`,
      before: { revokedAt: null },
      after: { revokedAt },
    });
    return toTokenView({ ...row, revokedAt });
  });
}

/** The active token with this secret and its owner, or undefined. */
export async function findActiveToken(db: Db | Tx, secret: string) {
  return findTokenByHash(db, tokenHash(secret));
}

/** Recorded at most once a minute per token, so a busy script does not write on every request. */
export async function touchToken(db: Db, id: number, lastUsedAt: string | null, now = new Date()) {
  if (lastUsedAt && now.getTime() - Date.parse(lastUsedAt) < 60_000) return;
  await setTokenLastUsed(db, id, now.toISOString());
}

/**
 * The owner of an active token, signed in with `via: 'token'` (null: unknown, revoked, or owner deactivated),
 * and the token's use noted; bearerTokenMiddleware calls it (registered in server/app.ts).
 */
export async function authenticateToken(db: Db, secret: string): Promise<CurrentUser | null> {
  const token = await findActiveToken(db, secret);
  if (!token || token.revokedAt !== null || token.active !== 1) return null;
  const user: CurrentUser = {
    id: token.userId,
    email: token.email,
    name: token.name,
    roles: await rolesOf(db, token.userId),
    via: 'token',
    tokenId: token.id,
  };
  await touchToken(db, token.id, token.lastUsedAt);
  return user;
}
