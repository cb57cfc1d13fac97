import type { Selectable } from 'kysely';
import type { TokenView } from '../../../shared/contracts/token';
import type { ApiTokenTable } from './tokens.table';

/** The columns of a token a view shows (never the hash or the owner). */
export type TokenViewColumns = Pick<Selectable<ApiTokenTable>, 'id' | 'name' | 'prefix' | 'createdAt' | 'lastUsedAt' | 'revokedAt'>;

export const toTokenView = (row: TokenViewColumns): TokenView => ({
  id: row.id,
  name: row.name,
  prefix: row.prefix,
  createdAt: row.createdAt,
  lastUsedAt: row.lastUsedAt,
  revokedAt: row.revokedAt,
  active: row.revokedAt === null,
});
