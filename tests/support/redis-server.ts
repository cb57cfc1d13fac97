import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import net from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Redis } from 'ioredis';

const root = fileURLToPath(new URL('../..', import.meta.url));
export const REDIS_SERVER = process.env.REDIS_SERVER_PATH ?? '/usr/bin/redis-server';

/** A free TCP port on 127.0.0.1 (asked of the system, then released). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const port = (srv.address() as net.AddressInfo).port;
      srv.close(() => resolve(port));
    });
  });
}

async function waitForPing(url: string, timeoutMs = 10_000) {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const r = new Redis(url, { lazyConnect: true, maxRetriesPerRequest: 0, retryStrategy: () => null });
    r.on('error', () => {});
    try {
      await r.connect();
      if ((await r.ping()) === 'PONG') return;
    } catch {
      if (Date.now() > end) throw new Error(`redis at ${url} did not answer`);
    } finally {
      r.disconnect();
    }
    await new Promise((res) => setTimeout(res, 50));
  }
}

export interface TestRedis {
  url: string;
  dir: string;
  /** Kills the server at once (SIGKILL): only what the append-only file holds survives. */
  kill: () => Promise<void>;
  /** Starts it again on the same port and folder. */
  restart: () => Promise<void>;
  stop: () => Promise<void>;
}

/**
 * Debian's redis-server on a free port, with append-only persistence in a fresh folder and no snapshots, the
 * settings the README asks for in production (appendonly yes, maxmemory-policy noeviction).
 */
export async function startRedis(): Promise<TestRedis> {
  if (!existsSync(REDIS_SERVER)) throw new Error(`${REDIS_SERVER} is missing: apt-get install -y redis-server (.ci/run does)`);
  const dir = mkdtempSync(path.join(tmpdir(), 'epsigma-redis-'));
  const port = await freePort();
  const url = `redis://127.0.0.1:${port}`;
  let child: ChildProcess;
  const launch = async () => {
    child = spawn(
      REDIS_SERVER,
      [
        '--port',
        String(port),
        '--bind',
        '127.0.0.1',
        '--save',
        '',
        '--appendonly',
        'yes',
        '--appendfsync',
        'always',
        '--maxmemory-policy',
        'noeviction',
        '--dir',
        dir,
      ],
      { stdio: 'ignore' },
    );
    await waitForPing(url);
  };
  const kill = async () => {
    if (child.exitCode !== null || child.signalCode !== null) return;
    const exited = new Promise((r) => child.once('exit', r));
    child.kill('SIGKILL');
    await exited;
  };
  await launch();
  return {
    url,
    dir,
    kill,
    restart: launch,
    stop: async () => {
      await kill();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

export interface WorkerProcess {
  name: string;
  output: () => string;
  /** SIGKILL, as a machine that dies would. */
  kill: () => Promise<void>;
  stop: () => Promise<void>;
}

/** `npm run worker` as its own process (node --import tsx server/jobs/worker-main.ts). */
export async function startWorkerProcess(redisUrl: string, extraEnv: Record<string, string> = {}): Promise<WorkerProcess> {
  let output = '';
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/jobs/worker-main.ts'], {
    cwd: root,
    env: { ...process.env, REDIS_URL: redisUrl, WORKERS: '1', ...extraEnv },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const name = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`worker did not start:\n${output}`)), 60_000);
    child.stdout!.on('data', (d: Buffer) => {
      output += d.toString();
      const m = output.match(/WORKER READY (\S+)/);
      if (m) {
        clearTimeout(timer);
        resolve(m[1]);
      }
    });
    child.stderr!.on('data', (d: Buffer) => (output += d.toString()));
    child.on('exit', (code) => reject(new Error(`worker exited with ${code}:\n${output}`)));
  });
  const waitExit = () => new Promise((r) => (child.exitCode !== null || child.signalCode !== null ? r(null) : child.once('exit', r)));
  return {
    name,
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
    },
  };
}
