import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { b2WithGradient } from '../../shared/physics/virial';
import { EMAIL, startTestApp, type TestApp } from './test-app';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

let t: TestApp;
let modeller: Agent;
let reviewer: Agent;
let admin: Agent;
let consumer: Agent;
/** A second reviewer, and a person who both models and reviews (for the four-eyes cases). */
let reviewer2: Agent;
let dual: Agent;
let substanceId: number;
let fitId: number;
let dualFitId: number;
let b2MeasurementSetId: number;

// Synthetic B2 table from invented parameters (ε/k_B = 150 K, σ = 3.6 Å) with a small deterministic wiggle.
const TRUE = { epsilonK: 150, sigmaAngstrom: 3.6 };
const TEMPERATURES_K = Array.from({ length: 14 }, (_, i) => 180 + i * 40);
function syntheticB2Csv(shift = 0): Buffer {
  const lines = ['T (K),B2 (cm3/mol),u(B2) (cm3/mol)'];
  TEMPERATURES_K.forEach((T, i) => {
    const b2 = b2WithGradient(T, TRUE.epsilonK, TRUE.sigmaAngstrom).b2Cm3PerMol;
    lines.push(`${T},${(b2 + 0.3 * Math.sin(1.7 * i) + shift).toFixed(4)},0.5`);
  });
  return Buffer.from(lines.join('\n'));
}

async function runFit(agent: Agent, measurementSetId: number): Promise<number> {
  const res = await agent.post('/api/fits').send({ substanceId, measurementSets: [{ id: measurementSetId }] });
  expect(res.status).toBe(202);
  const job = await t.ctx.jobs.waitFor(res.body.jobId);
  expect(job.status).toBe('succeeded');
  return res.body.id;
}

async function addPerson(email: string, roles: string[]) {
  const res = await admin.post('/api/people').send({ email, name: email.split('@')[0], roles, password: 'a-long-test-password' });
  expect(res.status).toBe(201);
  return { agent: await t.signIn(email, 'a-long-test-password'), id: res.body.id as string };
}

/** Everything a refused request must leave untouched. */
async function snapshot() {
  const db = t.ctx.db;
  const count = async (table: 'parameterSetTransition' | 'parameterSetComment' | 'auditEvent' | 'mailOutbox') =>
    Number(
      (
        await db
          .selectFrom(table)
          .select((eb) => eb.fn.countAll<number>().as('n'))
          .executeTakeFirstOrThrow()
      ).n,
    );
  return {
    sets: await db.selectFrom('parameterSet').selectAll().orderBy('id').execute(),
    transitions: await count('parameterSetTransition'),
    comments: await count('parameterSetComment'),
    audit: await count('auditEvent'),
    mail: await count('mailOutbox'),
  };
}

async function expectRefused(request: PromiseLike<{ status: number; body: { error?: { code: string } } }>, status: number, code?: string) {
  const before = await snapshot();
  const res = await request;
  expect(res.status, JSON.stringify(res.body)).toBe(status);
  if (code) expect(res.body.error?.code).toBe(code);
  expect(await snapshot()).toEqual(before);
}

const draft = (agent: Agent, body: Record<string, unknown>) =>
  agent.post('/api/parameter-sets').send({ rationale: 'Fits the Fenwick B2 table within its uncertainty.', ...body });

async function mailsWith(reason: string) {
  const rows = await t.ctx.db.selectFrom('mailOutbox').selectAll().where('reason', '=', reason).orderBy('id').execute();
  return rows.map((r) => ({ to: JSON.parse(r.toJson) as string[], subject: r.subject, text: r.text, link: r.link }));
}

beforeAll(async () => {
  // Two workers: the density-fit case runs its simulations two at a time.
  t = await startTestApp({ WORKERS: '2' });
  modeller = await t.signIn(EMAIL.modeller);
  reviewer = await t.signIn(EMAIL.reviewer);
  admin = await t.signIn(EMAIL.admin);
  consumer = await t.signIn(EMAIL.consumer);
  reviewer2 = (await addPerson('second.reviewer@demo.epsigma.test', ['reviewer'])).agent;
  ({ agent: dual } = await addPerson('dual.role@demo.epsigma.test', ['modeller', 'reviewer']));
  substanceId = (await modeller.post('/api/substances').send({ name: 'Reviewium', molarMassGPerMol: 83.8 })).body.id;
  const up = await modeller
    .post('/api/measurement-sets')
    .field('substanceId', substanceId)
    .field('kind', 'b2')
    .field('name', 'Synthetic B2')
    .field('source', 'Fenwick Thermophysics Laboratory, invented run 7')
    .field('doi', '10.1000/epsigma.test.7')
    .attach('file', syntheticB2Csv(), { filename: 'b2.csv', contentType: 'text/csv' });
  expect(up.status).toBe(201);
  b2MeasurementSetId = up.body.id;
  fitId = await runFit(modeller, b2MeasurementSetId);
  dualFitId = await runFit(dual, b2MeasurementSetId);
  // The consumer follows the substance (the follows feature's table), to receive approval and retirement notices.
  const consumerRow = await t.ctx.db.selectFrom('user').select('id').where('email', '=', EMAIL.consumer).executeTakeFirstOrThrow();
  await t.ctx.db
    .insertInto('substanceFollow')
    .values({ userId: consumerRow.id, substanceId, createdAt: new Date().toISOString() })
    .execute();
});
afterAll(() => t.close());

describe('drafting a parameter set', () => {
  it('route family: 401 without a session, 403 for roles that may not draft, 400 per field', async () => {
    expect((await t.client().post('/api/parameter-sets').send({ fitId, rationale: 'x' })).status).toBe(401);
    expect((await t.client().get('/api/review-queue')).status).toBe(401);
    await expectRefused(draft(consumer, { fitId }), 403);
    await expectRefused(draft(reviewer, { fitId }), 403);
    await expectRefused(draft(admin, { fitId }), 403);
    const bad = await modeller
      .post('/api/parameter-sets')
      .send({ fitId: 'one', scheme: 'truncated-shifted', validity: { temperatureMinK: 500, temperatureMaxK: 200 } });
    expect(bad.status).toBe(400);
    const fields = bad.body.error.details.map((d: { field: string }) => d.field);
    expect(fields).toEqual(expect.arrayContaining(['fitId', 'rationale', 'validity.temperatureMaxK']));
    expect((await draft(modeller, { fitId, scheme: 'truncated-shifted' })).body.error.details[0].field).toBe('cutoffSigma');
    for (const cutoffSigma of [2.4, 4.1])
      expect((await draft(modeller, { fitId, scheme: 'truncated-tail', cutoffSigma })).status).toBe(400);
    expect((await draft(modeller, { fitId, cutoffSigma: 3 })).body.error.details[0].field).toBe('cutoffSigma');
    expect((await draft(modeller, { fitId, epsilonK: 99 })).status).toBe(400);
  });

  it('refuses an unknown fit (422) and a fit that did not succeed (409), storing nothing', async () => {
    await expectRefused(draft(modeller, { fitId: 99999 }), 422, 'unknown_fit');
    // One point cannot determine two parameters: the fit fails.
    const tiny = await modeller
      .post('/api/measurement-sets')
      .field('substanceId', substanceId)
      .field('kind', 'b2')
      .field('name', 'One point')
      .attach('file', Buffer.from('T (K),B2 (cm3/mol),u(B2) (cm3/mol)\n300,-20,1\n'), { filename: 'one.csv', contentType: 'text/csv' });
    expect(tiny.status).toBe(201);
    const res = await modeller.post('/api/fits').send({ substanceId, measurementSets: [{ id: tiny.body.id }] });
    await t.ctx.jobs.waitFor(res.body.jobId);
    const fit = await modeller.get(`/api/fits/${res.body.id}`);
    expect(fit.body.status).toBe('failed');
    await expectRefused(draft(modeller, { fitId: res.body.id }), 409, 'fit_not_succeeded');
  });

  it('freezes the fit’s values, its measurement set versions and a validity range defaulting to the data span', async () => {
    const fit = (await modeller.get(`/api/fits/${fitId}`)).body;
    const res = await draft(modeller, { fitId });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      id: expect.any(Number),
      version: 1,
      state: 'draft',
      scheme: 'full-potential',
      cutoffSigma: null,
      model: 'lj-12-6',
      epsilonK: fit.result.epsilonK,
      sigmaAngstrom: fit.result.sigmaAngstrom,
      stdErr: { epsilonK: fit.result.stdErr.epsilonK, sigmaAngstrom: fit.result.stdErr.sigmaAngstrom },
      correlation: fit.result.correlation,
      validity: { temperatureMinK: 180, temperatureMaxK: 700, pressureMinMPa: null, pressureMaxMPa: null },
      fitId,
    });
    // The fit recovers the invented parameters the data were made from (tolerance: the 0.3 cm³/mol wiggle).
    expect(res.body.epsilonK).toBeCloseTo(TRUE.epsilonK, 0);
    expect(res.body.sigmaAngstrom).toBeCloseTo(TRUE.sigmaAngstrom, 1);
    const detail = (await modeller.get(`/api/parameter-sets/${res.body.id}`)).body;
    expect(detail.measurementSets).toEqual([
      expect.objectContaining({
        measurementSetId: b2MeasurementSetId,
        version: 1,
        source: 'Fenwick Thermophysics Laboratory, invented run 7',
        doi: '10.1000/epsigma.test.7',
        rowCount: 14,
      }),
    ]);
    expect(detail.fit).toMatchObject({
      id: fitId,
      number: fit.number,
      reducedChi2: fit.result.reducedChi2,
      dataSpan: { temperatureMinK: 180, temperatureMaxK: 700 },
    });
    expect(detail.history).toEqual([
      expect.objectContaining({ move: 'create', fromState: null, toState: 'draft', actorName: 'Milo Carraway' }),
    ]);
    expect(detail.allowedMoves).toEqual(['submit', 'edit']);
  });

  it('numbers versions per substance and scheme', async () => {
    const shifted = await draft(modeller, {
      fitId,
      scheme: 'truncated-shifted',
      cutoffSigma: 2.5,
      validity: { temperatureMinK: 200, temperatureMaxK: 600 },
    });
    expect(shifted.status).toBe(201);
    expect(shifted.body).toMatchObject({
      version: 1,
      scheme: 'truncated-shifted',
      cutoffSigma: 2.5,
      validity: { temperatureMinK: 200, temperatureMaxK: 600 },
    });
    const again = await draft(modeller, { fitId });
    expect(again.body.version).toBe(2);
  });

  it('the database itself refuses to change frozen values or to change state without a transition row', async () => {
    const id = (await draft(modeller, { fitId })).body.id;
    await expect(t.ctx.db.updateTable('parameterSet').set({ epsilonK: 1 }).where('id', '=', id).execute()).rejects.toThrow(/frozen/);
    await expect(
      t.ctx.db.updateTable('parameterSet').set({ sigmaAngstrom: 1, rationale: 'x' }).where('id', '=', id).execute(),
    ).rejects.toThrow(/frozen/);
    await expect(t.ctx.db.updateTable('parameterSet').set({ state: 'approved' }).where('id', '=', id).execute()).rejects.toThrow(
      /recorded transition/,
    );
    await expect(t.ctx.db.deleteFrom('parameterSet').where('id', '=', id).execute()).rejects.toThrow(/never deleted/);
    await expect(
      t.ctx.db.updateTable('parameterSetTransition').set({ comment: 'rewritten' }).where('parameterSetId', '=', id).execute(),
    ).rejects.toThrow(/append-only/);
  });
});

describe('the review walk', () => {
  let v1: number;
  let rev: number;
  let v2: number;

  it('draft: only the author edits rationale/validity; values never; nobody reviews, retires or approves it', async () => {
    v1 = (await draft(modeller, { fitId, scheme: 'truncated-tail', cutoffSigma: 3 })).body.id;
    await expectRefused(
      reviewer.post(`/api/parameter-sets/${v1}/review`).send({ decision: 'approve', comment: 'Looks right.' }),
      409,
      'wrong_state',
    );
    await expectRefused(admin.post(`/api/parameter-sets/${v1}/retire`).send({ reason: 'Not needed.' }), 409, 'wrong_state');
    await expectRefused(consumer.post(`/api/parameter-sets/${v1}/submit`), 403);
    await expectRefused(reviewer.post(`/api/parameter-sets/${v1}/submit`), 403);
    await expectRefused(dual.post(`/api/parameter-sets/${v1}/submit`), 403, 'not_author');
    await expectRefused(modeller.patch(`/api/parameter-sets/${v1}`).send({ epsilonK: 120 }), 409, 'values_frozen');
    await expectRefused(
      modeller.patch(`/api/parameter-sets/${v1}`).send({ sigmaAngstrom: 3.1, rationale: 'sneaky' }),
      409,
      'values_frozen',
    );
    await expectRefused(dual.patch(`/api/parameter-sets/${v1}`).send({ rationale: 'Not mine to edit.' }), 403, 'not_author');
    await expectRefused(modeller.post(`/api/parameter-sets/${v1}/revise`).send({ rationale: 'Revising a draft.' }), 409, 'wrong_state');
    const edited = await modeller.patch(`/api/parameter-sets/${v1}`).send({
      rationale: 'Tail-corrected use at 3σ; B2 sees the whole potential.',
      validity: { temperatureMinK: 190, temperatureMaxK: 650 },
    });
    expect(edited.status).toBe(200);
    expect(edited.body).toMatchObject({
      state: 'draft',
      rationale: 'Tail-corrected use at 3σ; B2 sees the whole potential.',
      validity: { temperatureMinK: 190, temperatureMaxK: 650 },
    });
  });

  it('submit: the author hands it in; reviewers (never the author) are told', async () => {
    const res = await modeller.post(`/api/parameter-sets/${v1}/submit`);
    expect(res.status).toBe(200);
    expect(res.body.state).toBe('in_review');
    const [mail] = await mailsWith('parameterSet.submitted');
    expect(mail.to.sort()).toEqual([EMAIL.reviewer, 'second.reviewer@demo.epsigma.test', 'dual.role@demo.epsigma.test'].sort());
    expect(mail.subject).toContain('Reviewium v1');
    expect(mail.link).toBe(`/parameter-sets/${v1}`);
    await expectRefused(modeller.post(`/api/parameter-sets/${v1}/submit`), 409, 'wrong_state');
    await expectRefused(modeller.patch(`/api/parameter-sets/${v1}`).send({ rationale: 'Changed my mind.' }), 409, 'wrong_state');
  });

  it('in review: the queue shows it to reviewers who had no part in it', async () => {
    const queue = (await reviewer.get('/api/review-queue')).body.parameterSets;
    expect(queue.map((s: { id: number }) => s.id)).toContain(v1);
    expect(queue.find((s: { id: number }) => s.id === v1).submittedAt).toEqual(expect.any(String));
    expect((await modeller.get('/api/review-queue')).status).toBe(403);
    expect((await admin.get('/api/review-queue')).status).toBe(403);
  });

  it('in review: wrong decisions are refused and change nothing', async () => {
    await expectRefused(reviewer.post(`/api/parameter-sets/${v1}/review`).send({ decision: 'request_changes' }), 400, 'validation_failed');
    await expectRefused(
      reviewer.post(`/api/parameter-sets/${v1}/review`).send({ decision: 'approve', comment: '   ' }),
      400,
      'validation_failed',
    );
    await expectRefused(
      reviewer.post(`/api/parameter-sets/${v1}/review`).send({ decision: 'accept', comment: 'ok' }),
      400,
      'validation_failed',
    );
    await expectRefused(modeller.post(`/api/parameter-sets/${v1}/review`).send({ decision: 'approve', comment: 'Mine is fine.' }), 403);
    await expectRefused(admin.post(`/api/parameter-sets/${v1}/review`).send({ decision: 'approve', comment: 'Admin says yes.' }), 403);
    await expectRefused(reviewer.post(`/api/parameter-sets/${v1}/retire`).send({ reason: 'Too early.' }), 409, 'wrong_state');
  });

  it('comments thread on the set; consumers cannot comment', async () => {
    const c = await reviewer.post(`/api/parameter-sets/${v1}/comments`).send({ body: 'Why 3σ and not 2.5σ?' });
    expect(c.status).toBe(201);
    expect((await modeller.post(`/api/parameter-sets/${v1}/comments`).send({ body: 'Our MD runs use 3σ.' })).status).toBe(201);
    await expectRefused(consumer.post(`/api/parameter-sets/${v1}/comments`).send({ body: 'Hello' }), 403);
    await expectRefused(reviewer.post(`/api/parameter-sets/${v1}/comments`).send({ body: '' }), 400);
    const detail = (await reviewer.get(`/api/parameter-sets/${v1}`)).body;
    expect(detail.comments.map((x: { authorName: string; body: string }) => [x.authorName, x.body])).toEqual([
      ['Rhea Lindqvist-Oduya', 'Why 3σ and not 2.5σ?'],
      ['Milo Carraway', 'Our MD runs use 3σ.'],
    ]);
  });

  it('request changes: the set stays as the record of the review; the author is told', async () => {
    const res = await reviewer
      .post(`/api/parameter-sets/${v1}/review`)
      .send({ decision: 'request_changes', comment: 'Narrow the range to where the residuals are flat.' });
    expect(res.status).toBe(200);
    expect(res.body.state).toBe('changes_requested');
    expect(res.body.allowedMoves).toEqual([]);
    const [mail] = await mailsWith('parameterSet.changes_requested');
    expect(mail.to).toEqual([EMAIL.modeller]);
    expect(mail.text).toContain('Narrow the range to where the residuals are flat.');
    await expectRefused(
      reviewer2.post(`/api/parameter-sets/${v1}/review`).send({ decision: 'approve', comment: 'Fine by me.' }),
      409,
      'wrong_state',
    );
    await expectRefused(modeller.post(`/api/parameter-sets/${v1}/submit`), 409, 'wrong_state');
  });

  it('revise: a new draft (next version) from the same fit, linked to the set sent back; only once', async () => {
    await expectRefused(reviewer.post(`/api/parameter-sets/${v1}/revise`).send({ rationale: 'Reviewer revises.' }), 403);
    await expectRefused(modeller.post(`/api/parameter-sets/${v1}/revise`).send({ rationale: 'Has cutoff.', cutoffSigma: 5 }), 400);
    // A revision takes the fit's scheme like a first draft (full potential for a B2 fit) unless it names one, as the form does.
    const res = await modeller.post(`/api/parameter-sets/${v1}/revise`).send({
      rationale: 'Range narrowed to 200–600 K, as asked.',
      scheme: 'truncated-tail',
      cutoffSigma: 3,
      validity: { temperatureMinK: 200, temperatureMaxK: 600 },
    });
    expect(res.status).toBe(201);
    rev = res.body.id;
    const old = (await modeller.get(`/api/parameter-sets/${v1}`)).body;
    expect(res.body).toMatchObject({
      version: 2,
      state: 'draft',
      revisionOf: v1,
      scheme: 'truncated-tail',
      cutoffSigma: 3,
      epsilonK: old.epsilonK,
      sigmaAngstrom: old.sigmaAngstrom,
      validity: { temperatureMinK: 200, temperatureMaxK: 600 },
    });
    expect(old).toMatchObject({ state: 'changes_requested', revisedBy: rev });
    await expectRefused(modeller.post(`/api/parameter-sets/${v1}/revise`).send({ rationale: 'Twice.' }), 409, 'already_revised');
    expect((await modeller.post(`/api/parameter-sets/${rev}/submit`)).body.state).toBe('in_review');
  });

  it('approve: a reviewer with no part in it approves with a comment; author and followers are told', async () => {
    const res = await reviewer
      .post(`/api/parameter-sets/${rev}/review`)
      .send({ decision: 'approve', comment: 'Residuals flat over 200–600 K; approved for tail-corrected MD.' });
    expect(res.status).toBe(200);
    expect(res.body.state).toBe('approved');
    const [toAuthor] = await mailsWith('parameterSet.approved');
    expect(toAuthor.to).toEqual([EMAIL.modeller]);
    expect(toAuthor.subject).toBe('Approved: Reviewium v2 (Truncated with tail corrections, r_c = 3 σ)');
    const [toFollowers] = await mailsWith('parameterSet.version_approved');
    expect(toFollowers.to).toEqual([EMAIL.consumer]);
    expect(toFollowers.text).toContain('first approved version');
  });

  it('approved: values and rationale can never change; nobody reviews or submits it again', async () => {
    await expectRefused(modeller.patch(`/api/parameter-sets/${rev}`).send({ epsilonK: 140 }), 409);
    await expectRefused(modeller.patch(`/api/parameter-sets/${rev}`).send({ rationale: 'Rewritten after approval.' }), 409, 'wrong_state');
    await expectRefused(
      reviewer2.post(`/api/parameter-sets/${rev}/review`).send({ decision: 'approve', comment: 'Again.' }),
      409,
      'wrong_state',
    );
    await expectRefused(
      reviewer2.post(`/api/parameter-sets/${rev}/review`).send({ decision: 'request_changes', comment: 'Too late.' }),
      409,
      'wrong_state',
    );
    await expectRefused(modeller.post(`/api/parameter-sets/${rev}/submit`), 409, 'wrong_state');
    await expect(t.ctx.db.updateTable('parameterSet').set({ rationale: 'direct write' }).where('id', '=', rev).execute()).rejects.toThrow(
      /only a draft/,
    );
  });

  it('four-eyes: the author of the set, or of its fit, never decides on it, whatever roles they hold', async () => {
    const own = (
      await draft(dual, { fitId, scheme: 'truncated-tail', cutoffSigma: 3, rationale: 'Drafted by a modeller who also reviews.' })
    ).body.id;
    expect((await dual.post(`/api/parameter-sets/${own}/submit`)).status).toBe(200);
    await expectRefused(
      dual.post(`/api/parameter-sets/${own}/review`).send({ decision: 'approve', comment: 'Looks good to me.' }),
      403,
      'four_eyes',
    );
    await expectRefused(
      dual.post(`/api/parameter-sets/${own}/review`).send({ decision: 'request_changes', comment: 'Hmm.' }),
      403,
      'four_eyes',
    );
    const fromDualFit = (await draft(modeller, { fitId: dualFitId, scheme: 'truncated-tail', cutoffSigma: 3 })).body.id;
    expect((await modeller.post(`/api/parameter-sets/${fromDualFit}/submit`)).status).toBe(200);
    await expectRefused(
      dual.post(`/api/parameter-sets/${fromDualFit}/review`).send({ decision: 'approve', comment: 'My fit is fine.' }),
      403,
      'four_eyes',
    );
    const dualQueue = (await dual.get('/api/review-queue')).body.parameterSets.map((s: { id: number }) => s.id);
    expect(dualQueue).not.toContain(own);
    expect(dualQueue).not.toContain(fromDualFit);
    const reviewerQueue = (await reviewer.get('/api/review-queue')).body.parameterSets.map((s: { id: number }) => s.id);
    expect(reviewerQueue).toEqual(expect.arrayContaining([own, fromDualFit]));
    v2 = fromDualFit;
  });

  it('approving a newer version supersedes the approved one; followers hear of it', async () => {
    const res = await reviewer2
      .post(`/api/parameter-sets/${v2}/review`)
      .send({ decision: 'approve', comment: 'Same values, wider rationale; approved.' });
    expect(res.status).toBe(200);
    expect(res.body.state).toBe('approved');
    const older = (await reviewer.get(`/api/parameter-sets/${rev}`)).body;
    expect(older.state).toBe('superseded');
    expect(older.history.at(-1)).toMatchObject({
      move: 'supersede',
      fromState: 'approved',
      toState: 'superseded',
      actorId: null,
      actorName: 'Epsigma',
      comment: `Superseded by v${res.body.version}`,
    });
    const approvedNow = (await reviewer.get(`/api/parameter-sets?substanceId=${substanceId}&state=approved`)).body.parameterSets.filter(
      (s: { scheme: string }) => s.scheme === 'truncated-tail',
    );
    expect(approvedNow.map((s: { id: number }) => s.id)).toEqual([v2]);
    const followerMails = await mailsWith('parameterSet.version_approved');
    expect(followerMails.at(-1)!.text).toContain(`supersedes v${older.version}`);
    // The older version still in review can no longer be approved over the newer one.
    const inReviewOlder = (await reviewer.get(`/api/parameter-sets?substanceId=${substanceId}&state=in_review`)).body.parameterSets.find(
      (s: { version: number; scheme: string }) => s.scheme === 'truncated-tail' && s.version < res.body.version,
    );
    await expectRefused(
      reviewer.post(`/api/parameter-sets/${inReviewOlder.id}/review`).send({ decision: 'approve', comment: 'Late approval.' }),
      409,
      'newer_version_approved',
    );
  });

  it('retire: reviewers and admins withdraw an approved set with a reason; superseded and drafts cannot be retired', async () => {
    await expectRefused(modeller.post(`/api/parameter-sets/${v2}/retire`).send({ reason: 'Author wants it gone.' }), 403);
    await expectRefused(admin.post(`/api/parameter-sets/${v2}/retire`).send({}), 400, 'validation_failed');
    await expectRefused(admin.post(`/api/parameter-sets/${rev}/retire`).send({ reason: 'Already superseded.' }), 409, 'wrong_state');
    const res = await admin
      .post(`/api/parameter-sets/${v2}/retire`)
      .send({ reason: 'The B2 table was found to carry a calibration error.' });
    expect(res.status).toBe(200);
    expect(res.body.state).toBe('retired');
    const [mail] = await mailsWith('parameterSet.retired');
    expect(mail.to.sort()).toEqual([EMAIL.consumer, EMAIL.modeller].sort());
    expect(mail.text).toContain('calibration error');
    await expectRefused(reviewer.post(`/api/parameter-sets/${v2}/retire`).send({ reason: 'Twice.' }), 409, 'wrong_state');
  });

  it('consumers see published sets only', async () => {
    expect((await consumer.get(`/api/parameter-sets/${v1}`)).status).toBe(404);
    expect((await consumer.get(`/api/parameter-sets/${rev}`)).status).toBe(200);
    const listed = (await consumer.get(`/api/substances/${substanceId}/parameter-sets`)).body.parameterSets;
    expect(listed.length).toBeGreaterThan(0);
    expect(listed.every((s: { state: string }) => ['approved', 'superseded', 'retired'].includes(s.state))).toBe(true);
    const all = (await modeller.get(`/api/substances/${substanceId}/parameter-sets`)).body.parameterSets;
    expect(all.length).toBeGreaterThan(listed.length);
    expect((await modeller.get('/api/substances/99999/parameter-sets')).status).toBe(404);
  });

  it('the history and the audit trail hold every step of the walk, with actor and comment', async () => {
    const history = (await admin.get(`/api/parameter-sets/${v1}`)).body.history.map(
      (h: { move: string; toState: string; actorName: string }) => [h.move, h.toState, h.actorName],
    );
    expect(history).toEqual([
      ['create', 'draft', 'Milo Carraway'],
      ['edit', 'draft', 'Milo Carraway'],
      ['submit', 'in_review', 'Milo Carraway'],
      ['request_changes', 'changes_requested', 'Rhea Lindqvist-Oduya'],
      ['revise', 'changes_requested', 'Milo Carraway'],
    ]);
    const audit = async (id: number) =>
      (
        await t.ctx.db
          .selectFrom('auditEvent')
          .select(['action', 'actorEmail'])
          .where('targetType', '=', 'parameterSet')
          .where('targetId', '=', String(id))
          .orderBy('id')
          .execute()
      ).map((a) => [a.action, a.actorEmail]);
    expect(await audit(v1)).toEqual([
      ['parameterSet.drafted', EMAIL.modeller],
      ['parameterSet.edited', EMAIL.modeller],
      ['parameterSet.submitted', EMAIL.modeller],
      ['parameterSet.commented', EMAIL.reviewer],
      ['parameterSet.commented', EMAIL.modeller],
      ['parameterSet.changes_requested', EMAIL.reviewer],
      ['parameterSet.revised', EMAIL.modeller],
    ]);
    expect(await audit(rev)).toEqual([
      ['parameterSet.drafted', EMAIL.modeller],
      ['parameterSet.submitted', EMAIL.modeller],
      ['parameterSet.approved', EMAIL.reviewer],
      ['parameterSet.superseded', null],
    ]);
    expect(await audit(v2)).toEqual([
      ['parameterSet.drafted', EMAIL.modeller],
      ['parameterSet.submitted', EMAIL.modeller],
      ['parameterSet.approved', 'second.reviewer@demo.epsigma.test'],
      ['parameterSet.retired', EMAIL.admin],
    ]);
  });
});

describe('a set from a fit with density data', () => {
  // Small, fast simulations as in tests/api/density-fit.test.ts; the physics of that stage is tested there.
  it('defaults to the simulations’ cutoff scheme and to the temperature and pressure span of the data', async () => {
    const quillgas = (await modeller.get('/api/substances')).body.substances.find((s: { name: string }) => s.name === 'Quillgas QG-1');
    const measurementSets = (await modeller.get(`/api/measurement-sets?substanceId=${quillgas.id}`)).body.measurementSets as Array<{
      id: number;
      kind: string;
    }>;
    const density = measurementSets.find((d) => d.kind === 'density')!;
    const res = await modeller.post('/api/fits').send({
      substanceId: quillgas.id,
      measurementSets: measurementSets.filter((d) => d.kind === 'b2' || d.kind === 'density').map((d) => ({ id: d.id })),
      options: { density: { atoms: 108, steps: 3000, scheme: 'truncated-shifted' }, restarts: 0 },
    });
    expect(res.status).toBe(202);
    const job = await t.ctx.jobs.waitFor(res.body.jobId);
    expect(job.status, job.error ?? '').toBe('succeeded');
    const rows = (await modeller.get(`/api/measurement-sets/${density.id}`)).body.rows as Array<{
      temperatureK: number;
      pressureMPa: number;
    }>;
    const fitted = (await modeller.get(`/api/fits/${res.body.id}`)).body.result.residuals as Array<{ temperatureK: number }>;

    const set = await draft(modeller, { fitId: res.body.id, rationale: 'Joint B2 and density fit for truncated-and-shifted MD at 2.5σ.' });
    expect(set.status).toBe(201);
    expect(set.body).toMatchObject({ scheme: 'truncated-shifted', cutoffSigma: 2.5, version: 1 });
    // The span of the data, rounded where it is made (0.01 K, 0.001 MPa): −123.15 °C is 149.99999999999997 K in binary floating point.
    const decimals = (x: number, d: number) => Number(x.toFixed(d));
    expect(set.body.validity).toEqual({
      temperatureMinK: decimals(Math.min(...fitted.map((r) => r.temperatureK)), 2),
      temperatureMaxK: decimals(Math.max(...fitted.map((r) => r.temperatureK)), 2),
      pressureMinMPa: decimals(Math.min(...rows.map((r) => r.pressureMPa)), 3),
      pressureMaxMPa: decimals(Math.max(...rows.map((r) => r.pressureMPa)), 3),
    });
    // Naming the scheme overrides the default.
    const full = await draft(modeller, { fitId: res.body.id, scheme: 'full-potential', rationale: 'Compared with the B2-only set.' });
    expect(full.body).toMatchObject({ scheme: 'full-potential', cutoffSigma: null });
  });
});
