import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../..', import.meta.url));
export const DEMO_PASSWORD = 'browser-test-password';

export interface RunningApp {
  url: string;
  dir: string;
  /** Stops the server (SIGTERM, then SIGKILL) and removes its folder unless it was handed in. */
  stop: () => Promise<void>;
  /** Kills the process at once, as a crash would, leaving the database as it is. */
  kill: () => Promise<void>;
  output: () => string;
}

/**
 * Starts the real server entry point (server/index.ts) on a random port. With `dir`, the database in that
 * folder is used and kept (for restart tests); otherwise a fresh folder is made and removed on stop.
 */
export async function startApp(
  extraEnv: Record<string, string> = {},
  options: { dir?: string; requireClient?: boolean } = {},
): Promise<RunningApp> {
  if ((options.requireClient ?? true) && !existsSync(path.join(root, 'dist', 'client', 'index.html')))
    throw new Error('The client is not built: run `vite build` first (npm test does).');
  const dir = options.dir ?? mkdtempSync(path.join(tmpdir(), 'epsigma-app-'));
  let output = '';
  const child: ChildProcess = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: root,
    env: {
      ...process.env,
      NODE_ENV: 'production',
      PORT: '0',
      HOST: '127.0.0.1',
      DATABASE_PATH: path.join(dir, 'app.sqlite'),
      DEMO_PASSWORD,
      LOG_REQUESTS: '0',
      WORKERS: '1',
      CHECK_RESPONSES: '1',
      ...extraEnv,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`server did not start:\n${output}`)), 60_000);
    child.stdout!.on('data', (d: Buffer) => {
      output += d.toString();
      const m = output.match(/LISTENING (http:\/\/\S+)/);
      if (m) {
        clearTimeout(timer);
        resolve(m[1]);
      }
    });
    child.stderr!.on('data', (d: Buffer) => (output += d.toString()));
    child.on('exit', (code) => reject(new Error(`server exited with ${code}:\n${output}`)));
  });
  const waitExit = () => new Promise((r) => (child.exitCode !== null || child.signalCode !== null ? r(null) : child.once('exit', r)));
  return {
    url,
    dir,
    output: () => output,
    kill: async () => {
      child.kill('SIGKILL');
      await waitExit();
    },
    stop: async () => {
      if (child.exitCode === null && child.signalCode === null) {
        child.kill('SIGTERM');
        await Promise.race([waitExit(), new Promise((r) => setTimeout(r, 5000))]);
        if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
      }
      if (!options.dir) rmSync(dir, { recursive: true, force: true });
    },
  };
}
