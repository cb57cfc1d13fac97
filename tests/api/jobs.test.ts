import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { createContext } from '../../server/bootstrap';
import { loadEnv } from '../../server/config/env';
import { b2WithGradient } from '../../shared/physics/virial';

const dir = mkdtempSync(path.join(tmpdir(), 'epsigma-jobs-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const env = loadEnv({ NODE_ENV: 'test', DATABASE_PATH: path.join(dir, 'jobs.sqlite'), LOG_REQUESTS: '0', WORKERS: '1' });

/** A fit job input over an in-database B2 version (fits are the first job kind). */
async function seedFitInput(ctx: Awaited<ReturnType<typeof createContext>>) {
  await ctx.db
    .insertInto('user')
    .values({ id: 'u1', email: 'jobs@test', name: 'Jobs', passwordHash: 'x', createdAt: new Date().toISOString() })
    .execute();
  const s = await ctx.db
    .insertInto('substance')
    .values({ name: 'Jobium', molarMassGramsPerMol: 40, createdBy: 'u1', createdAt: '', updatedAt: '' })
    .returning('id')
    .executeTakeFirstOrThrow();
  const d = await ctx.db
    .insertInto('measurementSet')
    .values({ substanceId: s.id, kind: 'b2', name: 'b2', createdBy: 'u1', createdAt: '' })
    .returning('id')
    .executeTakeFirstOrThrow();
  const v = await ctx.db
    .insertInto('measurementSetVersion')
    .values({
      measurementSetId: d.id,
      version: 1,
      sha256: 'x',
      originalFilename: 'x.csv',
      originalBytes: Buffer.from('x'),
      defaultRelativeUncertainty: 0.01,
      delimiter: ',',
      decimal: '.',
      columnsJson: '[]',
      rowCount: 10,
      uploadedBy: 'u1',
      uploadedAt: '',
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  for (let i = 0; i < 10; i++) {
    const T = 150 + 50 * i;
    await ctx.db
      .insertInto('measurementRow')
      .values({
        measurementSetVersionId: v.id,
        position: i,
        fileRow: i + 2,
        temperatureK: T,
        pressureMpa: null,
        value: b2WithGradient(T, 120, 3.4).b2Cm3PerMol,
        uncertainty: 0.5,
        uncertaintySource: 'measured',
        rawJson: '{}',
      })
      .execute();
  }
  return {
    measurementSets: [{ measurementSetId: d.id, version: 1, versionId: v.id, kind: 'b2', name: 'b2', weight: 1 }],
    options: { restarts: 8, maxIterations: 400 },
  };
}

describe('job runner', () => {
  it('a job interrupted by a stop stays running, and the next start resumes it to the end', async () => {
    const first = await createContext(env, () => {});
    const input = await seedFitInput(first);
    const { id } = await first.jobs.enqueue({ kind: 'fit', input, seed: 7, createdBy: 'u1' });
    // Wait until the worker has it, then stop the server as a crash would (no chance to finish).
    for (let i = 0; i < 200 && (await first.jobs.get(id))?.status !== 'running'; i++) await new Promise((r) => setTimeout(r, 10));
    expect((await first.jobs.get(id))?.status).toBe('running');
    await first.close();

    const second = await createContext(env, () => {});
    try {
      const job = await second.jobs.get(id);
      expect(['queued', 'running']).toContain(job?.status);
      const done = await second.jobs.waitFor(id);
      expect(done.status).toBe('succeeded');
      expect(done.attempts).toBe(2);
      expect(done.seed).toBe(7);
      expect((done.result as { epsilonK: number }).epsilonK).toBeCloseTo(120, 3);
      const stuck = await second.db.selectFrom('job').select('id').where('status', '=', 'running').execute();
      expect(stuck).toEqual([]);
    } finally {
      await second.close();
    }
  });

  it('reuses the job of an identical request (same kind and cache key) instead of computing again', async () => {
    const ctx = await createContext(env, () => {});
    try {
      const input = (await ctx.db.selectFrom('job').select('inputJson').executeTakeFirstOrThrow()).inputJson;
      const a = await ctx.jobs.enqueue({ kind: 'fit', input: JSON.parse(input), seed: 1, cacheKey: 'same' });
      const b = await ctx.jobs.enqueue({ kind: 'fit', input: JSON.parse(input), seed: 1, cacheKey: 'same' });
      expect(b).toEqual({ id: a.id, reused: true });
      await ctx.jobs.waitFor(a.id);
      const c = await ctx.jobs.enqueue({ kind: 'fit', input: JSON.parse(input), seed: 1, cacheKey: 'same' });
      expect(c).toEqual({ id: a.id, reused: true });
    } finally {
      await ctx.close();
    }
  });

  it('cancels a queued or running job and records it; a finished job cannot be cancelled', async () => {
    const ctx = await createContext(env, () => {});
    try {
      const input = JSON.parse((await ctx.db.selectFrom('job').select('inputJson').executeTakeFirstOrThrow()).inputJson);
      const { id } = await ctx.jobs.enqueue({ kind: 'fit', input, seed: 3 });
      expect(await ctx.jobs.cancel(id)).toBe(true);
      const job = await ctx.jobs.waitFor(id);
      expect(job.status).toBe('cancelled');
      expect(await ctx.jobs.cancel(id)).toBe(false);
      expect(await ctx.jobs.retry(id)).toBe(true);
      expect((await ctx.jobs.waitFor(id)).status).toBe('succeeded');
    } finally {
      await ctx.close();
    }
  });
});
