/**
 * `npm start`: build the client when the build is missing or older than its sources, then migrate,
 * seed an empty database with the demo and serve.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const builtIndex = path.join(root, 'dist', 'client', 'index.html');
const SOURCES = ['src', 'shared', 'index.html', 'vite.config.ts', 'package.json', 'public'];

function newestMtime(p: string): number {
  if (!existsSync(p)) return 0;
  const st = statSync(p);
  if (!st.isDirectory()) return st.mtimeMs;
  let newest = st.mtimeMs;
  for (const entry of readdirSync(p)) newest = Math.max(newest, newestMtime(path.join(p, entry)));
  return newest;
}

const builtAt = existsSync(builtIndex) ? statSync(builtIndex).mtimeMs : 0;
const sourcesAt = Math.max(...SOURCES.map((s) => newestMtime(path.join(root, s))));
if (builtAt < sourcesAt) {
  console.log(builtAt ? 'The client build is older than its sources; rebuilding…' : 'Building the client…');
  const result = spawnSync(path.join(root, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'warn'], {
    cwd: root,
    stdio: 'inherit',
  });
  if (result.status !== 0) {
    console.error('The client build failed.');
    process.exit(1);
  }
}

process.env.NODE_ENV ??= 'production';
const { startServer } = await import('../server/index');
await startServer();
