/**
 * Issue 14, server side: a held parameter, rows left out, profile χ² and the correlation warning, a failed
 * fit's last iterate, validity limits without float artefacts, plain-words messages, the audit trail, the
 * author's notices, "needs my action", the diff between versions and the citation rule for review.
 * The B2 tables are generated from the LJ model at invented parameters (no substance is meant).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { b2WithGradient } from '../../shared/physics/virial';
import { EMAIL, startTestApp, type TestApp } from './test-app';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
let t: TestApp;
let modeller: Agent;
let reviewer: Agent;
let admin: Agent;
let substanceId: number;
let measurementSetId: number;

const TRUE = { epsilonK: 180, sigmaAngstrom: 3.7 };
/** 14 rows; temperatures in °C so that the K values carry the 273.15 offset (−30 °C → 243.15 K). */
function b2CsvCelsius(): Buffer {
  const lines = ['T [°C],B2 [cm3/mol],u(B2) [cm3/mol]'];
  for (let i = 0; i < 14; i++) {
    const celsius = -30 + i * 40;
    const b2 = b2WithGradient(celsius + 273.15, TRUE.epsilonK, TRUE.sigmaAngstrom).b2Cm3PerMol;
    lines.push(`${celsius},${(b2 + 0.3 * Math.sin(1.7 * i)).toFixed(4)},0.5`);
  }
  return Buffer.from(lines.join('\n'));
}

async function upload(name: string, source: string | null) {
  let req = modeller.post('/api/measurement-sets').field('substanceId', substanceId).field('kind', 'b2').field('name', name);
  if (source) req = req.field('source', source);
  return req.attach('file', b2CsvCelsius(), { filename: 'b2.csv', contentType: 'text/csv' });
}

async function runFit(body: Record<string, unknown>) {
  const res = await modeller.post('/api/fits').send({ substanceId, ...body });
  expect(res.status, JSON.stringify(res.body)).toBe(202);
  await t.ctx.jobs.waitFor(res.body.jobId);
  const fit = await modeller.get(`/api/fits/${res.body.id}`);
  return { id: res.body.id as number, number: res.body.number as number, body: fit.body };
}

beforeAll(async () => {
  t = await startTestApp();
  modeller = await t.signIn(EMAIL.modeller);
  reviewer = await t.signIn(EMAIL.reviewer);
  admin = await t.signIn(EMAIL.admin);
  substanceId = (await modeller.post('/api/substances').send({ name: 'Halvane', molarMassGPerMol: 58.1 })).body.id;
  const up = await upload('Halvane B2, invented', 'Fenwick Thermophysics Laboratory, invented run 14');
  expect(up.status).toBe(201);
  expect(up.body.warnings).toEqual([]);
  measurementSetId = up.body.id;
}, 60_000);
afterAll(() => t.close());

describe('holding a parameter (item 12)', () => {
  it('keeps the held σ exact, gives it no standard error and counts one parameter fewer', async () => {
    const { body } = await runFit({ measurementSets: [{ id: measurementSetId }], fixed: { sigmaAngstrom: 3.65 } });
    expect(body.status).toBe('succeeded');
    const r = body.result;
    expect(r.sigmaAngstrom).toBe(3.65);
    expect(r.stdErr.sigmaAngstrom).toBeNull();
    expect(r.stdErr.epsilonK).toBeGreaterThan(0);
    expect(r.heldParameters).toEqual(['sigmaAngstrom']);
    // ν = N − free parameters: 14 − 1 (Bevington & Robinson 2003, §6.4, from memory).
    expect(r.dof).toBe(13);
    expect(r.profiles.sigmaAngstrom).toBeNull();
    expect(body.options.fixed).toEqual({ sigmaAngstrom: 3.65 });
  });

  it('refuses holding both, naming the field as the form labels it', async () => {
    const res = await modeller
      .post('/api/fits')
      .send({ substanceId, measurementSets: [{ id: measurementSetId }], fixed: { epsilonK: 180, sigmaAngstrom: 3.7 } });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0]).toMatchObject({ field: 'fixed.sigmaAngstrom', label: 'Hold σ (Å)' });
    expect(res.body.error.message).toBe('Hold σ (Å): hold ε or σ, not both: with both held there is nothing to fit.');
  });
});

describe('leaving rows out (item 13)', () => {
  it('records the rows and the reason, flags them in the residuals and leaves them out of χ² and ν', async () => {
    const { body } = await runFit({
      measurementSets: [{ id: measurementSetId, excludeRows: [5, 2], excludeReason: 'Readings after the pump fault' }],
    });
    expect(body.measurementSets[0]).toMatchObject({ excludeRows: [2, 5], excludeReason: 'Readings after the pump fault' });
    const r = body.result;
    expect(r.dof).toBe(10);
    expect(r.residuals).toHaveLength(14);
    expect(r.residuals.filter((x: { excluded: boolean }) => x.excluded).map((x: { rowNumber: number }) => x.rowNumber)).toEqual([2, 5]);
    const counted = r.residuals
      .filter((x: { excluded: boolean }) => !x.excluded)
      .reduce((s: number, x: { residual: number }) => s + x.residual ** 2, 0);
    expect(counted).toBeCloseTo(r.chi2, 8);
    expect(r.perMeasurementSet[0]).toMatchObject({ points: 12, excludedPoints: 2 });
    const list = await modeller.get(`/api/substances/${substanceId}/fits`);
    expect(list.body.fits.find((f: { id: number }) => f.id === body.id).measurementSets[0].excludeRows).toEqual([2, 5]);
  });

  it('answers 422 naming a row the measurement set does not have, and 400 for a row that is not a number from 1', async () => {
    const res = await modeller.post('/api/fits').send({ substanceId, measurementSets: [{ id: measurementSetId, excludeRows: [3, 15] }] });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('unknown_row');
    expect(res.body.error.message).toContain('there is no row 15 to leave out');
    expect(res.body.error.details).toEqual([expect.objectContaining({ field: 'measurementSets.0.excludeRows', row: 15 })]);
    const all = await modeller
      .post('/api/fits')
      .send({ substanceId, measurementSets: [{ id: measurementSetId, excludeRows: Array.from({ length: 13 }, (_, i) => i + 1) }] });
    expect(all.status).toBe(422);
    expect(all.body.error).toMatchObject({
      code: 'too_few_points',
      message: 'Leaving out these rows leaves 1 point(s) for 2 free parameter(s); the fit needs at least 2.',
    });
    const bad = await modeller.post('/api/fits').send({ substanceId, measurementSets: [{ id: measurementSetId, excludeRows: [0] }] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/^Rows left out \(measurement set 1 of the request\): row numbers are whole numbers from 1\.$/);
  });
});

describe('correlation and profiles (item 14), failed fits (item 4)', () => {
  it('warns in plain words when |corr(ε, σ)| > 0.95 and gives profile-χ² intervals around the best values', async () => {
    // B2 over a narrow range of T* constrains mainly one combination of ε and σ (common practice, no source):
    // the six lowest isotherms alone give |corr| > 0.95; all fourteen do not.
    const narrow = (
      await runFit({ measurementSets: [{ id: measurementSetId, excludeRows: [7, 8, 9, 10, 11, 12, 13, 14] }], options: { restarts: 0 } })
    ).body.result;
    expect(Math.abs(narrow.correlation)).toBeGreaterThan(0.95);
    expect(narrow.strongCorrelation).toBe(true);
    expect(narrow.warnings.join(' ')).toContain('the data pin down a combination of the two');
    const { body } = await runFit({ measurementSets: [{ id: measurementSetId }] });
    const r = body.result;
    expect(Math.abs(r.correlation)).toBeLessThan(0.95);
    expect(r.strongCorrelation).toBe(false);
    expect(r.warnings.join(' ')).not.toContain('strongly correlated');
    for (const name of ['epsilonK', 'sigmaAngstrom'] as const) {
      const p = r.profiles[name];
      expect(p.lower).toBeLessThan(r[name]);
      expect(p.upper).toBeGreaterThan(r[name]);
      // The interval is of the order of the linearised ±1 standard error (within a factor of two).
      expect((p.upper - p.lower) / (2 * r.stdErr[name])).toBeGreaterThan(0.5);
      expect((p.upper - p.lower) / (2 * r.stdErr[name])).toBeLessThan(2);
      expect(p.values.length).toBe(p.deltaChi2.length);
    }
    expect(r.converged).toBe(true);
  });

  it('a fit that does not converge shows its last iterate, not converged, the same in the list and on its page', async () => {
    const { id, body } = await runFit({
      measurementSets: [{ id: measurementSetId }],
      options: { start: { epsilonK: 40, sigmaAngstrom: 6 }, restarts: 0, maxIterations: 5 },
    });
    expect(body.status).toBe('failed');
    const r = body.result;
    expect(r.converged).toBe(false);
    expect(Number.isFinite(r.epsilonK)).toBe(true);
    expect(r.stdErr).toEqual({ epsilonK: null, sigmaAngstrom: null });
    expect(r.residuals).toHaveLength(14);
    const item = (await modeller.get(`/api/substances/${substanceId}/fits`)).body.fits.find((f: { id: number }) => f.id === id);
    expect(item).toMatchObject({
      status: 'failed',
      converged: false,
      epsilonK: r.epsilonK,
      sigmaAngstrom: r.sigmaAngstrom,
      stdErr: { epsilonK: null, sigmaAngstrom: null },
    });
  });
});

describe('audit and notices of fits (items 9 and 16)', () => {
  it('audits completion and failure, naming the fit as the screens do, and tells its author in-app and by mail', async () => {
    const ok = await runFit({ measurementSets: [{ id: measurementSetId }], options: { restarts: 0 } });
    const failed = await runFit({
      measurementSets: [{ id: measurementSetId }],
      options: { start: { epsilonK: 40, sigmaAngstrom: 6 }, restarts: 0, maxIterations: 5 },
    });
    const audit = (await admin.get('/api/audit?targetType=fit&limit=500')).body.events as Array<{
      action: string;
      targetId: string;
      targetLabel: string;
      summary: string;
    }>;
    const done = audit.find((e) => e.action === 'fit.succeeded' && e.targetId === String(ok.id))!;
    expect(done.targetLabel).toBe(`Fit #${ok.number} of Halvane`);
    expect(done.summary).toBe(`Fit #${ok.number} of Halvane finished`);
    const fail = audit.find((e) => e.action === 'fit.failed' && e.targetId === String(failed.id))!;
    expect(fail.summary).toMatch(new RegExp(`^Fit #${failed.number} of Halvane failed: the fit did not converge`));

    const notices = (await modeller.get('/api/notices')).body;
    const finished = notices.notices.find((n: { text: string }) => n.text === `Fit #${ok.number} of Halvane finished.`);
    expect(finished).toMatchObject({ link: `/fits/${ok.id}`, readAt: null });
    expect(notices.notices.some((n: { text: string }) => n.text.startsWith(`Fit #${failed.number} of Halvane failed:`))).toBe(true);
    const unread = notices.unread;
    expect((await modeller.post(`/api/notices/${finished.id}/read`)).status).toBe(204);
    expect((await modeller.get('/api/notices')).body.unread).toBe(unread - 1);
    // Someone else's notice is not theirs to read, and the reviewer started no fit.
    expect((await reviewer.post(`/api/notices/${finished.id}/read`)).status).toBe(404);
    expect((await reviewer.get('/api/notices')).body.notices.some((n: { text: string }) => n.text.includes('Halvane'))).toBe(false);
    expect((await t.client().get('/api/notices')).status).toBe(401);

    const mail = await t.ctx.db
      .selectFrom('mailOutbox')
      .select(['toJson', 'subject', 'reason'])
      .where('reason', 'in', ['fit.succeeded', 'fit.failed'])
      .execute();
    expect(mail).toEqual(
      expect.arrayContaining([
        expect.objectContaining({
          toJson: JSON.stringify([EMAIL.modeller]),
          subject: `Finished: Fit #${ok.number} of Halvane`,
          reason: 'fit.succeeded',
        }),
      ]),
    );
    expect(mail.some((m) => m.subject === `Failed: Fit #${failed.number} of Halvane`)).toBe(true);
  });
});

describe('parameter sets (items 2, 5, 7, 9, 16)', () => {
  let fitId: number;
  let v1: number;
  let v2: number;

  it('rounds the proposed validity to 0.01 K where it is made, and the exports repeat it', async () => {
    fitId = (await runFit({ measurementSets: [{ id: measurementSetId }], options: { restarts: 0 } })).id;
    const draft = await modeller.post('/api/parameter-sets').send({ fitId, rationale: 'Fits the invented B2 table.' });
    expect(draft.status, JSON.stringify(draft.body)).toBe(201);
    v1 = draft.body.id;
    // −30 °C + 273.15 is 243.14999999999998 in binary floating point; the limit is 243.15 exactly.
    expect(draft.body.validity.temperatureMinK).toBe(243.15);
    expect(draft.body.validity.temperatureMaxK).toBe(763.15);
  });

  it('says in plain words which field is wrong and which role is missing (item 7)', async () => {
    const bad = await modeller.patch(`/api/parameter-sets/${v1}`).send({ validity: { temperatureMinK: 300, temperatureMaxK: 250 } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toBe('Valid to (K): the upper temperature must be above the lower one.');
    expect(bad.body.error.details[0]).toMatchObject({ field: 'validity.temperatureMaxK', label: 'Valid to (K)' });
    const refused = await admin.post(`/api/parameter-sets/${v1}/review`).send({ decision: 'approve', comment: 'fine' });
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toBe('Your role (Admin) does not allow you to review parameter sets; that needs the Reviewer role.');
  });

  it('lists drafts, sets to review and sets sent back under "needs my action"', async () => {
    const mine = (await modeller.get('/api/workbench/needs-action')).body.items;
    expect(mine).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ kind: 'draft', parameterSetId: v1, substanceName: 'Halvane', version: 1, state: 'draft' }),
      ]),
    );
    expect((await modeller.post(`/api/parameter-sets/${v1}/submit`)).status).toBe(200);
    const review = (await reviewer.get('/api/workbench/needs-action')).body.items;
    expect(review).toEqual(expect.arrayContaining([expect.objectContaining({ kind: 'awaiting-my-review', parameterSetId: v1 })]));
    expect(
      (await modeller.get('/api/workbench/needs-action')).body.items.some((i: { parameterSetId: number }) => i.parameterSetId === v1),
    ).toBe(false);
    expect(
      (
        await reviewer
          .post(`/api/parameter-sets/${v1}/review`)
          .send({ decision: 'request_changes', comment: 'Say why the lowest isotherm is kept.' })
      ).status,
    ).toBe(200);
    expect((await modeller.get('/api/workbench/needs-action')).body.items).toEqual(
      expect.arrayContaining([expect.objectContaining({ kind: 'changes-requested', parameterSetId: v1 })]),
    );
    expect((await t.client().get('/api/workbench/needs-action')).status).toBe(401);
  });

  it('a revision takes the scheme under the first-draft rules, the audit says what happened, and the diff shows the changes', async () => {
    const noCutoff = await modeller
      .post(`/api/parameter-sets/${v1}/revise`)
      .send({ scheme: 'truncated-tail', rationale: 'Meant for simulations.' });
    expect(noCutoff.status).toBe(400);
    expect(noCutoff.body.error.details[0]).toMatchObject({ field: 'cutoffSigma' });
    const rev = await modeller.post(`/api/parameter-sets/${v1}/revise`).send({
      scheme: 'truncated-tail',
      cutoffSigma: 3,
      rationale: 'Meant for simulations at r_c = 3 σ; the lowest isotherm is within its uncertainty.',
    });
    expect(rev.status, JSON.stringify(rev.body)).toBe(201);
    v2 = rev.body.id;
    expect(rev.body).toMatchObject({ scheme: 'truncated-tail', cutoffSigma: 3, version: 1 });
    const events = (await admin.get(`/api/audit?targetType=parameterSet&targetId=${v1}`)).body.events as Array<{
      action: string;
      summary: string;
      targetLabel: string;
    }>;
    const revised = events.find((e) => e.action === 'parameterSet.revised')!;
    expect(revised.summary).not.toMatch(/Changes requested → Changes requested/);
    expect(revised.summary).toMatch(/— Revised as v1 \(Truncated with tail corrections\)$/);
    expect(revised.targetLabel).toBe('Halvane v1 (Full potential)');

    const diff = (await modeller.get(`/api/parameter-sets/${v2}/diff`)).body;
    expect(diff.previous).toEqual({ id: v1, version: 1 });
    const byField = Object.fromEntries(diff.changes.map((c: { field: string }) => [c.field, c]));
    expect(byField.scheme).toMatchObject({ label: 'Cutoff scheme', before: 'Full potential', after: 'Truncated with tail corrections' });
    expect(byField.cutoffSigma).toMatchObject({ before: null, after: 3 });
    expect(byField.rationale).toBeDefined();
    expect(byField.epsilonK).toBeUndefined();
    expect((await modeller.get(`/api/parameter-sets/${v1}/diff`)).body).toEqual({ previous: null, changes: [] });
    const consumer = await t.signIn(EMAIL.consumer);
    expect((await consumer.get(`/api/parameter-sets/${v2}/diff`)).status).toBe(404);
  });

  it("without a scheme in the body, a revision takes the fit's scheme (full potential for a B2 fit)", async () => {
    expect((await modeller.post(`/api/parameter-sets/${v2}/submit`)).status).toBe(200);
    expect(
      (
        await reviewer
          .post(`/api/parameter-sets/${v2}/review`)
          .send({ decision: 'request_changes', comment: 'A B2 fit describes the full potential.' })
      ).status,
    ).toBe(200);
    const rev = await modeller.post(`/api/parameter-sets/${v2}/revise`).send({ rationale: 'Back to the scheme of the fit.' });
    expect(rev.status, JSON.stringify(rev.body)).toBe(201);
    expect(rev.body).toMatchObject({ scheme: 'full-potential', cutoffSigma: null, version: 2 });
  });

  it('approved, the JSON and CSV exports carry the rounded limits', async () => {
    const fresh = await modeller
      .post('/api/parameter-sets')
      .send({ fitId, rationale: 'Fits the invented B2 table; for export.', scheme: 'truncated-shifted', cutoffSigma: 2.5 });
    expect((await modeller.post(`/api/parameter-sets/${fresh.body.id}/submit`)).status).toBe(200);
    expect(
      (await reviewer.post(`/api/parameter-sets/${fresh.body.id}/review`).send({ decision: 'approve', comment: 'Checked.' })).status,
    ).toBe(200);
    const json = await modeller.get(`/api/parameter-sets/${fresh.body.id}/export?format=json`);
    expect(json.status).toBe(200);
    const text = json.text ?? json.body.toString();
    expect(text).toContain('"temperatureMinK": 243.15');
    expect(text).not.toContain('243.1499');
    const csv = await modeller.get(`/api/parameter-sets/${fresh.body.id}/export?format=csv`);
    const [header, row] = csv.text.trim().split('\n');
    const cells = header.split(',');
    expect(row.split(',')[cells.indexOf('T_min_K')]).toBe('243.15');
  });

  it('a set whose measurement set cites no source cannot go to review; the upload warns', async () => {
    const up = await upload('Halvane B2, uncited', null);
    expect(up.status).toBe(201);
    expect(up.body.warnings).toEqual([
      expect.stringContaining('cannot be submitted for review until a version that cites its source is uploaded'),
    ]);
    const fit = await runFit({ measurementSets: [{ id: up.body.id }], options: { restarts: 0 } });
    const draft = await modeller.post('/api/parameter-sets').send({ fitId: fit.id, rationale: 'Uncited data.' });
    const res = await modeller.post(`/api/parameter-sets/${draft.body.id}/submit`);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('citation_missing');
    expect(res.body.error.message).toContain('"Halvane B2, uncited" v1 has no source citation');
    // Nothing half-written: the set is still a draft.
    expect((await modeller.get(`/api/parameter-sets/${draft.body.id}`)).body.state).toBe('draft');
  });
});
