import { expect } from 'vitest';
import { b2WithGradient } from '../../shared/physics/virial';
import type { TestApp } from './test-app';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

/** Synthetic B2 table from invented parameters with a small deterministic wiggle (cm³/mol). */
export function syntheticB2Csv(
  epsilonK: number,
  sigmaAngstrom: number,
  shift = 0,
  temperaturesK = Array.from({ length: 12 }, (_, i) => 180 + i * 40),
): Buffer {
  const lines = ['T (K),B2 (cm3/mol),u(B2) (cm3/mol)'];
  temperaturesK.forEach((T, i) => {
    const b2 = b2WithGradient(T, epsilonK, sigmaAngstrom).b2Cm3PerMol;
    lines.push(`${T},${(b2 + 0.3 * Math.sin(1.7 * i) + shift).toFixed(4)},0.5`);
  });
  return Buffer.from(lines.join('\n'));
}

export async function newSubstance(modeller: Agent, name: string, molarMass = 40): Promise<number> {
  const res = await modeller.post('/api/substances').send({ name, molarMassGPerMol: molarMass });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.id;
}

/** Uploads a B2 table, fits it, drafts a set, submits it and has the reviewer approve it: the review API end to end. */
export async function approvedSet(
  t: TestApp,
  people: { modeller: Agent; reviewer: Agent },
  input: {
    substanceId: number;
    epsilonK: number;
    sigmaAngstrom: number;
    shift?: number;
    temperaturesK?: number[];
    doi?: string;
    scheme?: 'truncated-shifted';
    cutoffSigma?: number;
  },
): Promise<{ setId: number; fitId: number; measurementSetId: number }> {
  const { modeller, reviewer } = people;
  const up = await modeller
    .post('/api/measurement-sets')
    .field('substanceId', input.substanceId)
    .field('kind', 'b2')
    .field('name', `Synthetic B2 ${input.epsilonK} K`)
    .field('source', 'Fenwick Thermophysics Laboratory, invented catalog run')
    .field('doi', input.doi ?? '10.1000/epsigma.catalog.1')
    .attach('file', syntheticB2Csv(input.epsilonK, input.sigmaAngstrom, input.shift, input.temperaturesK), {
      filename: 'b2.csv',
      contentType: 'text/csv',
    });
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  const fit = await modeller.post('/api/fits').send({ substanceId: input.substanceId, measurementSets: [{ id: up.body.id }] });
  expect(fit.status).toBe(202);
  const job = await t.ctx.jobs.waitFor(fit.body.jobId);
  expect(job.status).toBe('succeeded');
  const draft = await modeller.post('/api/parameter-sets').send({
    fitId: fit.body.id,
    rationale: 'Fits the synthetic B2 table within its uncertainty.',
    ...(input.scheme ? { scheme: input.scheme, cutoffSigma: input.cutoffSigma } : {}),
  });
  expect(draft.status, JSON.stringify(draft.body)).toBe(201);
  expect((await modeller.post(`/api/parameter-sets/${draft.body.id}/submit`)).status).toBe(200);
  const approve = await reviewer
    .post(`/api/parameter-sets/${draft.body.id}/review`)
    .send({ decision: 'approve', comment: 'Checked against the data; approved.' });
  expect(approve.status, JSON.stringify(approve.body)).toBe(200);
  return { setId: draft.body.id, fitId: fit.body.id, measurementSetId: up.body.id };
}
