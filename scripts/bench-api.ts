/**
 * `npm run -s bench:api [-- --json] [--connections 50] [--seconds 10]`: read throughput of the API. Starts the
 * real server entry point (server/index.ts) on a scratch database, which seeds the whole demo (people,
 * measurement sets, approved parameter sets), signs in as the demo consumer and drives GET /api/health and
 * GET /api/catalog with autocannon, one after the other in the same run so the two are comparable.
 * Latency percentiles are computed from every response time. A report, never a test.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import autocannon from 'autocannon';

const { values } = parseArgs({
  options: { json: { type: 'boolean' }, connections: { type: 'string', default: '50' }, seconds: { type: 'string', default: '10' } },
});
const connections = Number(values.connections);
const seconds = Number(values.seconds);
if (!Number.isInteger(connections) || connections < 1 || !(seconds > 0)) {
  console.error('usage: npm run -s bench:api -- [--json] [--connections N ≥ 1] [--seconds S > 0]');
  process.exit(2);
}

const root = fileURLToPath(new URL('..', import.meta.url));
const dir = mkdtempSync(path.join(tmpdir(), 'epsigma-bench-api-'));
const password = 'bench-api-password';
const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
  cwd: root,
  env: {
    ...process.env,
    NODE_ENV: 'production',
    PORT: '0',
    HOST: '127.0.0.1',
    DATABASE_PATH: path.join(dir, 'bench.sqlite'),
    DEMO_PASSWORD: password,
    LOG_REQUESTS: '0',
    WORKERS: '1',
    SIGN_IN_LIMIT: '1000',
  },
  stdio: ['ignore', 'pipe', 'pipe'],
});
let output = '';
const stop = () => {
  if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM');
};
process.on('exit', () => {
  stop();
  rmSync(dir, { recursive: true, force: true });
});

interface Figures {
  requestsPerSecond: number;
  p50Ms: number;
  p95Ms: number;
  p99Ms: number;
  errors: number;
}

const percentile = (sorted: number[], p: number) =>
  sorted.length ? sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] : NaN;
const round = (x: number, digits: number) => Number(x.toFixed(digits));

async function measure(url: string, cookie: string): Promise<Figures> {
  const times: number[] = [];
  let bad = 0;
  const instance = autocannon({ url, connections, duration: seconds, headers: { cookie }, timeout: 10 });
  instance.on('response', (_client: unknown, statusCode: number, _bytes: number, responseTimeMs: number) => {
    times.push(responseTimeMs);
    if (statusCode !== 200) bad++;
  });
  const result = await instance;
  times.sort((a, b) => a - b);
  return {
    requestsPerSecond: round(times.length / (result.duration || seconds), 1),
    p50Ms: round(percentile(times, 50), 1),
    p95Ms: round(percentile(times, 95), 1),
    p99Ms: round(percentile(times, 99), 1),
    errors: bad + result.errors + result.timeouts,
  };
}

try {
  const base = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`the server did not start within 120 s:\n${output}`)), 120_000);
    child.stdout.on('data', (d: Buffer) => {
      output += d.toString();
      const m = output.match(/LISTENING (http:\/\/\S+)/);
      if (m) {
        clearTimeout(timer);
        resolve(m[1]);
      }
    });
    child.stderr.on('data', (d: Buffer) => (output += d.toString()));
    child.on('exit', (code) => reject(new Error(`the server exited with ${code}:\n${output}`)));
  });
  const login = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: base },
    body: JSON.stringify({ email: 'consumer@demo.epsigma.test', password }),
  });
  if (login.status !== 200) throw new Error(`sign-in failed: ${login.status} ${await login.text()}`);
  const cookie = login.headers.get('set-cookie')!.split(';')[0];
  const catalog = (await (await fetch(`${base}/api/catalog`, { headers: { cookie } })).json()) as { sets: unknown[] };

  // A warm-up of 3 s per route at full load, so neither pays for the first requests (JIT, SQLite page cache)
  // or for the start-up work still running (the demo's review mails leaving the outbox).
  for (const route of ['health', 'catalog'])
    await autocannon({ url: `${base}/api/${route}`, connections, duration: 3, headers: { cookie } });
  const health = await measure(`${base}/api/health`, cookie);
  const catalogFigures = await measure(`${base}/api/catalog`, cookie);
  const report = { health, catalog: catalogFigures };

  if (values.json) {
    console.log(JSON.stringify(report));
  } else {
    console.log(
      `API read benchmark: ${connections} connections, ${seconds} s per route, demo catalog of ${catalog.sets.length} approved sets, signed in as the demo consumer`,
    );
    console.log('route            req/s     p50 ms   p95 ms   p99 ms   errors');
    for (const [name, f] of Object.entries(report)) {
      console.log(
        `${`GET /api/${name}`.padEnd(16)} ${String(f.requestsPerSecond).padStart(7)}  ${String(f.p50Ms).padStart(7)}  ${String(f.p95Ms).padStart(7)}  ${String(f.p99Ms).padStart(7)}  ${String(f.errors).padStart(7)}`,
      );
    }
    const ratio = catalogFigures.requestsPerSecond / health.requestsPerSecond;
    console.log(`catalog / health throughput: ${ratio.toFixed(2)} (goal ≥ 0.5); catalog p95 ${catalogFigures.p95Ms} ms (goal ≤ 100 ms)`);
  }
} finally {
  stop();
}
