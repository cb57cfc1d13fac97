import { chmodSync, closeSync, existsSync, mkdirSync, openSync, statSync } from 'node:fs';
import path from 'node:path';
import SQLite from 'better-sqlite3';
import { CamelCasePlugin, Kysely, Migrator, SqliteDialect, type Transaction } from 'kysely';
import { MIGRATIONS } from '../../migrations/index';
import type { Database } from './schema';

export type Db = Kysely<Database>;
export type Tx = Transaction<Database>;

export interface DatabaseHandle {
  db: Db;
  sqlite: SQLite.Database;
  close: () => Promise<void>;
}

/**
 * The database holds password hashes, session and token hashes and unpublished work: a folder it creates is
 * 0700 and the file (with its -wal and -shm companions, which SQLite creates with the file's mode) is 0600.
 * An existing file readable by others is tightened to 0600.
 */
function prepareDatabaseFile(databasePath: string): void {
  const file = path.resolve(databasePath);
  mkdirSync(path.dirname(file), { recursive: true, mode: 0o700 });
  if (!existsSync(file)) closeSync(openSync(file, 'a', 0o600));
  for (const f of [file, `${file}-wal`, `${file}-shm`]) {
    if (existsSync(f) && (statSync(f).mode & 0o077) !== 0) chmodSync(f, 0o600);
  }
}

/** Opens the SQLite file with WAL and foreign keys on; snake_case columns appear as camelCase in TypeScript. */
export function openDatabase(databasePath: string): DatabaseHandle {
  if (databasePath !== ':memory:' && databasePath !== '') prepareDatabaseFile(databasePath);
  const sqlite = new SQLite(databasePath);
  sqlite.pragma('journal_mode = WAL');
  sqlite.pragma('foreign_keys = ON');
  sqlite.pragma('busy_timeout = 5000');
  const db = new Kysely<Database>({ dialect: new SqliteDialect({ database: sqlite }), plugins: [new CamelCasePlugin()] });
  return { db, sqlite, close: () => db.destroy() };
}

/** Runs every pending migration in migrations/; throws with the failing migration's name. */
export async function migrateToLatest(db: Db): Promise<string[]> {
  const migrator = new Migrator({
    db,
    provider: { getMigrations: async () => MIGRATIONS },
  });
  const { error, results } = await migrator.migrateToLatest();
  const failed = results?.find((r) => r.status === 'Error');
  if (error || failed) {
    const reason = error instanceof Error ? error.message : String(error ?? 'unknown error');
    throw new Error(`Migration ${failed?.migrationName ?? ''} failed: ${reason}`);
  }
  return (results ?? []).filter((r) => r.status === 'Success').map((r) => r.migrationName);
}
