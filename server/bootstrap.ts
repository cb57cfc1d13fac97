import type { AppContext } from './app-context';
import type { Env } from './config/env';
import { migrateToLatest, openDatabase } from './db/database';
import { createAuth } from './features/auth/auth';

/** Opens and migrates the database and builds the shared context of the app. */
export async function createContext(env: Env, log: (message: string) => void = console.log): Promise<AppContext & { close: () => Promise<void> }> {
  const handle = openDatabase(env.DATABASE_PATH);
  await migrateToLatest(handle.db);
  const publicUrl = env.PUBLIC_URL ?? `http://${env.HOST}:${env.PORT}`;
  const auth = createAuth(handle.sqlite, { secureCookies: publicUrl.startsWith('https:') });
  return { env, db: handle.db, sqlite: handle.sqlite, auth, log, close: handle.close };
}
