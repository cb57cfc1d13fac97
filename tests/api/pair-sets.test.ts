/**
 * Pair sets end to end: k_ij fitted to a B12 measurement set with two approved sets fixed, review with four eyes, and
 * the approved pair set used by GET /api/mixtures (JSON and every export) instead of the combining rule.
 * Data: invented B12 generated at a known k_ij from the approved sets' own parameters (synthetic round trip).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { crossB2 } from '../../shared/mixing/cross-virial';
import { approvedSet, newSubstance } from './approved-set';
import { EMAIL, startTestApp, type TestApp } from './test-app';

let t: TestApp;
let modeller: Awaited<ReturnType<TestApp['signIn']>>;
let reviewer: Awaited<ReturnType<TestApp['signIn']>>;
let setA: { setId: number };
let setB: { setId: number };
let substanceA: number;
let b12Id: number;
let pure: Array<{ epsilonK: number; sigmaAngstrom: number }>;
const K_TRUE = 0.04;

beforeAll(async () => {
  t = await startTestApp();
  modeller = await t.signIn(EMAIL.modeller);
  reviewer = await t.signIn(EMAIL.reviewer);
  substanceA = await newSubstance(modeller, 'Pairium A', 40);
  const substanceB = await newSubstance(modeller, 'Pairium B', 58);
  setA = await approvedSet(t, { modeller, reviewer }, { substanceId: substanceA, epsilonK: 140, sigmaAngstrom: 3.5 });
  setB = await approvedSet(t, { modeller, reviewer }, { substanceId: substanceB, epsilonK: 220, sigmaAngstrom: 4.2 });
  pure = [];
  for (const s of [setA, setB]) {
    const body = (await modeller.get(`/api/parameter-sets/${s.setId}`)).body;
    pure.push({ epsilonK: body.epsilonK, sigmaAngstrom: body.sigmaAngstrom });
  }
  const lines = [
    'T (K),B12 (cm3/mol),u(B12) (cm3/mol)',
    ...[180, 220, 260, 320, 400, 500].map((T) => `${T},${crossB2(T, pure[0], pure[1], K_TRUE).toFixed(4)},1`),
  ];
  const up = await modeller
    .post('/api/measurement-sets')
    .field('substanceId', substanceA)
    .field('kind', 'b12')
    .field('name', 'Invented B12')
    .attach('file', Buffer.from(lines.join('\n')), { filename: 'b12.csv', contentType: 'text/csv' });
  expect(up.status).toBe(201);
  b12Id = up.body.id;
});
afterAll(() => t.close());

describe('pair sets', () => {
  let pairSetId: number;

  it('checks roles and input: 401, 403, 400 per field, 422 naming the field', async () => {
    expect((await t.client().post('/api/pair-sets').send({})).status).toBe(401);
    const consumer = await t.signIn(EMAIL.consumer);
    expect(
      (await consumer.post('/api/pair-sets').send({ parameterSetIds: [setA.setId, setB.setId], measurementSetId: b12Id })).status,
    ).toBe(403);
    const bad = await modeller.post('/api/pair-sets').send({ parameterSetIds: [setA.setId], measurementSetId: 'x' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.map((d: { field: string }) => d.field)).toEqual(
      expect.arrayContaining(['parameterSetIds', 'measurementSetId']),
    );
    const wrongKind = await modeller.post('/api/pair-sets').send({
      parameterSetIds: [setA.setId, setB.setId],
      measurementSetId: (await modeller.get(`/api/measurement-sets?substanceId=${substanceA}`)).body.measurementSets.find(
        (d: { kind: string }) => d.kind === 'b2',
      ).id,
    });
    expect(wrongKind.status).toBe(422);
    expect(wrongKind.body.error.details[0].field).toBe('measurementSetId');
  });

  it('fits k_ij with the pure sets fixed and sends the pair set to review', async () => {
    const res = await modeller.post('/api/pair-sets').send({ parameterSetIds: [setB.setId, setA.setId], measurementSetId: b12Id });

    expect(res.status).toBe(201);
    pairSetId = res.body.id;
    expect(res.body.state).toBe('in_review');
    expect(res.body.kij).toBeCloseTo(K_TRUE, 4);
    expect(res.body.kijStdErr).toBeGreaterThan(0);
    expect(res.body.epsilon12K).toBeCloseTo((1 - res.body.kij) * Math.sqrt(pure[0].epsilonK * pure[1].epsilonK), 8);
    expect(res.body.setA.id).toBe(Math.min(setA.setId, setB.setId));
    // The Mixtures answer still uses the rule while the pair set waits for review.
    const before = await modeller.get(`/api/mixtures?sets=${setA.setId},${setB.setId}&rule=lorentz-berthelot`);
    expect(before.body.pairs.find((p: { i: number; j: number }) => p.i !== p.j).kind).toBe('combining-rule-estimate');
  });

  it('refuses the author’s own review and approves with a second person', async () => {
    const self = await t.signIn('modeller@demo.epsigma.test');
    expect((await self.post(`/api/pair-sets/${pairSetId}/review`).send({ decision: 'approve' })).status).toBe(403);
    const ok = await reviewer
      .post(`/api/pair-sets/${pairSetId}/review`)
      .send({ decision: 'approve', comment: 'B12 residuals within uncertainty.' });
    expect(ok.status).toBe(200);
    expect(ok.body.state).toBe('approved');
    expect((await reviewer.post(`/api/pair-sets/${pairSetId}/review`).send({ decision: 'approve' })).status).toBe(409);
    expect(() => t.ctx.sqlite.prepare('UPDATE pair_set SET kij = 0').run()).toThrow(/frozen/);
  });

  it('is used by the Mixtures answer and every mixture export, labelled as fitted', async () => {
    const json = await modeller.get(`/api/mixtures?sets=${setA.setId},${setB.setId}&rule=lorentz-berthelot`);
    const cross = json.body.pairs.find((p: { i: number; j: number }) => p.i !== p.j);
    expect(cross).toMatchObject({ kind: 'fitted-pair-set', pairSetId });
    expect(cross.epsilonK).toBeCloseTo((1 - cross.kij) * Math.sqrt(pure[0].epsilonK * pure[1].epsilonK), 8);
    expect(json.body.note).toMatch(/fitted come from approved pair sets/);
    const lammps = await modeller.get(`/api/mixtures?sets=${setA.setId},${setB.setId}&rule=lorentz-berthelot&format=lammps-real`);
    expect(lammps.text).toMatch(new RegExp(`fitted pair set ${pairSetId}, k_ij = `));
    const csv = await modeller.get(`/api/mixtures?sets=${setA.setId},${setB.setId}&rule=lorentz-berthelot&format=csv`);
    expect(csv.text).toMatch(/fitted-pair-set/);
    const gromacs = await modeller.get(`/api/mixtures?sets=${setA.setId},${setB.setId}&rule=lorentz-berthelot&format=gromacs`);
    expect(gromacs.text).toMatch(new RegExp(`fitted pair set ${pairSetId}`));
    const list = await modeller.get('/api/pair-sets?state=approved');
    expect(list.body.pairSets.map((p: { id: number }) => p.id)).toContain(pairSetId);
  });
});
