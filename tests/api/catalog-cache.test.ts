import SQLite from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { approvedSet, newSubstance } from './approved-set';
import { EMAIL, startTestApp, type TestApp } from './test-app';

/**
 * GET /api/catalog reuses its built entries until the database changes (server/features/catalog/catalog.service.ts
 * cachedCatalogSearch). These checks show every kind of change reaches the next read.
 */
describe('catalog reads after changes', () => {
  let t: TestApp;
  let reviewer: Awaited<ReturnType<TestApp['signIn']>>;
  let modeller: Awaited<ReturnType<TestApp['signIn']>>;
  let consumer: Awaited<ReturnType<TestApp['signIn']>>;
  let setId: number;
  let substanceId: number;
  const names = async () =>
    ((await consumer.get('/api/catalog')).body.sets as Array<{ id: number; substanceName: string }>).map(
      (s) => `${s.id}:${s.substanceName}`,
    );

  beforeAll(async () => {
    t = await startTestApp();
    [modeller, reviewer, consumer] = await Promise.all([t.signIn(EMAIL.modeller), t.signIn(EMAIL.reviewer), t.signIn(EMAIL.consumer)]);
    substanceId = await newSubstance(modeller, 'norrane N-2', 72.2);
    ({ setId } = await approvedSet(t, { modeller, reviewer }, { substanceId, epsilonK: 260, sigmaAngstrom: 4.3 }));
  }, 60_000);
  afterAll(() => t.close());

  it('shows a rename through the API and a write by another connection (another process) at the next read', async () => {
    expect(await names()).toEqual([`${setId}:norrane N-2`]);
    expect(await names()).toEqual([`${setId}:norrane N-2`]);
    expect((await modeller.patch(`/api/substances/${substanceId}`).send({ name: 'norrane N-3' })).status).toBe(200);
    expect(await names()).toEqual([`${setId}:norrane N-3`]);
    const other = new SQLite(t.ctx.env.DATABASE_PATH);
    try {
      other.prepare('update substance set name = ? where id = ?').run('norrane N-4', substanceId);
    } finally {
      other.close();
    }
    expect(await names()).toEqual([`${setId}:norrane N-4`]);
  });

  it('drops a retired set at the next read', async () => {
    const retired = await reviewer.post(`/api/parameter-sets/${setId}/retire`).send({ reason: 'Replaced by a wider temperature range' });
    expect(retired.status, JSON.stringify(retired.body)).toBe(200);
    expect(await names()).toEqual([]);
  });
});
