import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { REFERENCE_CHECKS, TEST_SUITE_ONLY_CHECKS } from '../../shared/validation/reference-checks';
import type { ValidationSuiteRun } from '../../shared/contracts/validation-suite';
import { EMAIL, startTestApp, type TestApp } from './test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t.close());

describe('GET /api/admin/validation-suite', () => {
  it('runs every registry check on the server for an admin, all passing, and keeps the run', async () => {
    const admin = await t.signIn(EMAIL.admin);
    const res = await admin.get('/api/admin/validation-suite');
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe('no-store');
    const run = res.body as ValidationSuiteRun;
    expect(run.summary.total).toBe(REFERENCE_CHECKS.length);
    expect(run.checks.map((c) => c.id)).toEqual(REFERENCE_CHECKS.map((c) => c.id));
    const failed = run.checks
      .filter((c) => !c.passed)
      .map((c) => `${c.id}: ours ${c.ours}, reference ${c.reference} (${c.error ?? c.toleranceText})`);
    expect(failed).toEqual([]);
    expect(run.summary).toMatchObject({ passed: REFERENCE_CHECKS.length, failed: 0, testSuiteOnly: TEST_SUITE_ONLY_CHECKS.length });
    expect(run.codeVersion).toBe(t.ctx.codeVersion);
    expect(Date.parse(run.ranAt)).not.toBeNaN();
    // Each row carries what the page shows: source, reference, ours, the difference, tolerance and duration.
    const b2 = run.checks.find((c) => c.id === 'b2.hcb-table.t1')!;
    expect(b2).toMatchObject({
      area: 'B2',
      source: 'Hirschfelder, Curtiss & Bird 1954, Table I-B (from memory)',
      reference: -2.538,
      toleranceText: '± 0.0005',
    });
    expect(b2.difference).toBeCloseTo((b2.ours as number) - b2.reference, 12);
    expect(b2.durationMs).toBeGreaterThanOrEqual(0);
    expect(run.testSuiteOnly.every((c) => c.why.startsWith('run in the test suite only (too slow for a page)'))).toBe(true);

    // The second request answers the kept run; ?rerun=1 runs it again.
    const again = await admin.get('/api/admin/validation-suite');
    expect(again.body).toMatchObject({ ranAt: run.ranAt, cached: true });
    const rerun = await admin.get('/api/admin/validation-suite').query({ rerun: '1' });
    expect(rerun.status).toBe(200);
    expect(rerun.body.cached).toBe(false);
    expect(rerun.body.ranAt >= run.ranAt).toBe(true);
    expect(rerun.body.summary.failed).toBe(0);
  }, 120_000);

  it('refuses modellers, reviewers and consumers (403) and anonymous callers (401) in the one error shape', async () => {
    for (const who of [EMAIL.modeller, EMAIL.reviewer, EMAIL.consumer]) {
      const res = await (await t.signIn(who)).get('/api/admin/validation-suite');
      expect(res.status, who).toBe(403);
      expect(res.body.error.message).toMatch(/run the validation suite; that needs the Admin role/);
    }
    const anonymous = await t.client().get('/api/admin/validation-suite');
    expect(anonymous.status).toBe(401);
    expect(anonymous.body.error.code).toBeTruthy();
  });

  it('validates the query', async () => {
    const admin = await t.signIn(EMAIL.admin);
    const bad = await admin.get('/api/admin/validation-suite').query({ rerun: 'yes' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('validation_failed');
    expect(bad.body.error.details[0]).toMatchObject({ field: 'rerun', message: 'rerun must be 0 or 1' });
    const unknown = await admin.get('/api/admin/validation-suite').query({ area: 'B2' });
    expect(unknown.status).toBe(400);
  });
});
