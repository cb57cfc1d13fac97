import { execFile } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';

const execFileAsync = promisify(execFile);
const repoRoot = fileURLToPath(new URL('../../', import.meta.url));

export interface CliOutcome {
  code: number;
  stdout: string;
  stderr: string;
}

/**
 * Runs the real dispatcher (scripts/cli.ts) in a child process, as a user would via `npm run -s cli --`,
 * and returns its exit code and output; a non-zero exit is returned, not thrown.
 */
export async function runCli(args: string[], timeoutMs = 30_000): Promise<CliOutcome> {
  try {
    const { stdout, stderr } = await execFileAsync(process.execPath, ['--import', 'tsx', 'scripts/cli.ts', ...args], {
      cwd: repoRoot,
      timeout: timeoutMs,
    });
    return { code: 0, stdout, stderr };
  } catch (err) {
    const e = err as { code?: number; stdout?: string; stderr?: string };
    return { code: typeof e.code === 'number' ? e.code : -1, stdout: e.stdout ?? '', stderr: e.stderr ?? '' };
  }
}
