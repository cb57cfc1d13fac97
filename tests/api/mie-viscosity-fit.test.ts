import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { b2WithGradient } from '../../shared/physics/virial';
import { viscosityWithGradient } from '../../shared/physics/viscosity';
import { newSubstance } from './approved-set';
import { EMAIL, startTestApp, type TestApp } from './test-app';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
let t: TestApp;
let modeller: Agent;
let substanceId: number;
let b2Id: number;
let etaId: number;
let b3Id: number;

// An invented Mie 16-6 gas of the Quillmoor scenario (ε/k_B = 150 K, σ = 3.7 Å, M = 58.1 g/mol). B2 from the Mie
// quadrature of virial.ts, η from the Mie collision integrals of mie-collision-integrals.ts (checked against an independent
// scipy quadrature in its test), each with a small deterministic wiggle well inside the stated uncertainty; not real data.
const TRUTH = { epsilonK: 150, sigmaAngstrom: 3.7, repulsiveExponent: 16, molarMassGPerMol: 58.1 };

function b2Csv(): Buffer {
  const lines = ['T (K),B2 (cm3/mol),u(B2) (cm3/mol)'];
  [100, 120, 145, 175, 210, 260, 330, 420, 550, 720, 950].forEach((T, i) => {
    const b2 = b2WithGradient(T, TRUTH.epsilonK, TRUTH.sigmaAngstrom, undefined, { repulsiveExponent: 16 }).b2Cm3PerMol;
    lines.push(`${T},${(b2 + 0.2 * Math.sin(1.7 * i)).toFixed(4)},0.4`);
  });
  return Buffer.from(lines.join('\n'));
}

function viscosityCsv(): Buffer {
  const lines = ['T (K),eta (uPa s),u(eta) (uPa s)'];
  [150, 200, 260, 330, 420, 540, 700, 900, 1150].forEach((T, i) => {
    const eta = viscosityWithGradient(T, TRUTH.epsilonK, TRUTH.sigmaAngstrom, TRUTH.molarMassGPerMol, {
      repulsiveExponent: 16,
    }).viscosityMicroPaS;
    lines.push(`${T},${(eta * (1 + 0.001 * Math.sin(2.3 * i))).toFixed(4)},${(0.003 * eta).toFixed(4)}`);
  });
  return Buffer.from(lines.join('\n'));
}

async function upload(property: string, name: string, file: Buffer): Promise<number> {
  const res = await modeller
    .post('/api/measurement-sets')
    .field('substanceId', substanceId)
    .field('property', property)
    .field('name', name)
    .field('source', 'Fenwick Thermophysics Laboratory, invented Mie run 9')
    .field('doi', `10.1000/epsigma.mie.9.${property}`)
    .attach('file', file, { filename: `${property}.csv`, contentType: 'text/csv' });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.id;
}

beforeAll(async () => {
  t = await startTestApp();
  modeller = await t.signIn(EMAIL.modeller);
  substanceId = await newSubstance(modeller, 'Quillgas QG-9', TRUTH.molarMassGPerMol);
  b2Id = await upload('b2', 'QG-9 B2, Fenwick cell B', b2Csv());
  etaId = await upload('viscosity', 'QG-9 viscosity, oscillating disc', viscosityCsv());
  b3Id = await upload(
    'b3',
    'QG-9 B3, Burnett',
    Buffer.from('T (K),B3 (cm6/mol2),u(B3) (cm6/mol2)\n200,2100,150\n300,1800,120\n400,1600,120\n'),
  );
});
afterAll(() => t.close());

async function fitResult(options: Record<string, unknown>) {
  const res = await modeller.post('/api/fits').send({ substanceId, measurementSets: [{ id: b2Id }, { id: etaId }], options });
  expect(res.status, JSON.stringify(res.body)).toBe(202);
  const job = await t.ctx.jobs.waitFor(res.body.jobId);
  expect(job.status, JSON.stringify(job.error ?? null)).toBe('succeeded');
  return (await modeller.get(`/api/fits/${res.body.id}`)).body.result;
}

describe('Mie λr-6 fits of B2 and viscosity together', () => {
  it('with λr held at 16: recovers ε and σ within 2 standard errors, with a posterior over both kinds', async () => {
    const r = await fitResult({ model: 'mie', repulsiveExponent: 16, posterior: { samples: 200 } });
    expect([r.model, r.repulsiveExponent]).toEqual(['mie', 16]);
    expect(Math.abs(r.epsilonK - TRUTH.epsilonK)).toBeLessThan(2 * r.stdErr.epsilonK);
    expect(Math.abs(r.sigmaAngstrom - TRUTH.sigmaAngstrom)).toBeLessThan(2 * r.stdErr.sigmaAngstrom);
    expect(r.criterion).toMatchObject({ parameters: 2, points: 20 });
    for (const name of ['epsilonK', 'sigmaAngstrom']) {
      expect(r.posterior[name].lower95).toBeLessThan(TRUTH[name as 'epsilonK' | 'sigmaAngstrom']);
      expect(r.posterior[name].upper95).toBeGreaterThan(TRUTH[name as 'epsilonK' | 'sigmaAngstrom']);
    }
  });

  it('with λr fitted by profile: 16 lies inside the 95 % profile interval', async () => {
    const r = await fitResult({ model: 'mie', fitRepulsiveExponent: true });
    expect(r.model).toBe('mie');
    const p = r.repulsiveExponentProfile;
    expect(p.lower95).not.toBeNull();
    expect(p.lower95).toBeLessThan(16);
    expect(p.upper95 ?? 36).toBeGreaterThan(16);
    expect(Math.abs(r.repulsiveExponent - 16)).toBeLessThan(3);
  });

  it('still refuses a kind without a Mie model (B3) with 422 kind_not_mie, naming the set and the kinds that have one', async () => {
    const res = await modeller
      .post('/api/fits')
      .send({ substanceId, measurementSets: [{ id: b2Id }, { id: b3Id }], options: { model: 'mie', repulsiveExponent: 16 } });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('kind_not_mie');
    expect(res.body.error.message).toMatch(
      /^Measurement set "QG-9 B3, Burnett" holds .*B3.*, which has no Mie λr-6 model yet; a Mie fit takes B2 and dilute-gas viscosity data, and densities with λr held\.$/,
    );
    expect(res.body.error.details[0].field).toMatch(/\.1\.id$/);
  });
});
