import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, startApp } from '../support/app-process';

const dir = mkdtempSync(path.join(tmpdir(), 'epsigma-restart-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** A tiny client for a server in another process: cookie + this site's Origin, like a browser tab. */
async function signedIn(url: string) {
  const login = await fetch(`${url}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: url },
    body: JSON.stringify({ email: 'modeller@demo.epsigma.test', password: DEMO_PASSWORD }),
  });
  const cookie = login.headers.get('set-cookie')!.split(';')[0];
  return async (method: string, p: string, body?: unknown) => {
    const res = await fetch(`${url}/api${p}`, {
      method,
      headers: { cookie, origin: url, ...(body ? { 'content-type': 'application/json' } : {}) },
      body: body ? JSON.stringify(body) : undefined,
    });
    return { status: res.status, body: await res.json() };
  };
}

describe('killing the server during a run', () => {
  it('leaves no job stuck in running: the next start resumes it', async () => {
    const first = await startApp({}, { dir, requireClient: false });
    let api = await signedIn(first.url);
    // A long run, so it is surely still going when the process dies.
    const started = await api('POST', '/simulations', { reducedTemperature: 1.5, reducedPressure: 0.8, atoms: 500, steps: 400000 });
    expect(started.status).toBe(202);
    const id = started.body.id;
    for (let i = 0; i < 300; i++) {
      if ((await api('GET', `/simulations/${id}`)).body.status === 'running') break;
      await new Promise((r) => setTimeout(r, 100));
    }
    expect((await api('GET', `/simulations/${id}`)).body.status).toBe('running');
    await first.kill();

    const second = await startApp({}, { dir, requireClient: false });
    try {
      api = await signedIn(second.url);
      const after = (await api('GET', `/simulations/${id}`)).body;
      // Resumed from the start with the same seed: queued or running again, on its second attempt.
      expect(['queued', 'running']).toContain(after.status);
      expect(after.attempts).toBeGreaterThanOrEqual(after.status === 'running' ? 2 : 1);
      expect(after.seed).toBe(started.body.state.seed);
      const cancelled = await api('POST', `/simulations/${id}/cancel`);
      expect(cancelled.body.status).toBe('cancelled');
    } finally {
      await second.stop();
    }
  });
});
