import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkJsonSchema } from '../../shared/export/json-schema-check';
import { TOKEN_ROUTES } from '../../server/features/tokens/token-routes';
import { approvedSet, newSubstance } from './approved-set';
import { EMAIL, startTestApp, type TestApp } from './test-app';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

/*
 * CODATA 2018 exact constants (SI redefinition of 2019; Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021),
 * Table XXXII), typed here rather than imported so the export is checked against an outside source.
 * Thermochemical calorie 4.184 J exactly (NIST SP 811, 2008, B.8).
 */
const KB_J_PER_K = 1.380649e-23;
const NA_PER_MOL = 6.02214076e23;
const E_C = 1.602176634e-19;
const R_J_PER_MOL_K = KB_J_PER_K * NA_PER_MOL; // 8.314462618… J/(mol K)
const CAL_J = 4.184;

let t: TestApp;
let modeller: Agent;
let reviewer: Agent;
let consumer: Agent;
let catalogiumId: number;
let v1: number;
let v2: number;
let formulaId: number;
let formulaSet: number;
let shiftedSet: number;
let draftId: number;

beforeAll(async () => {
  t = await startTestApp();
  modeller = await t.signIn(EMAIL.modeller);
  reviewer = await t.signIn(EMAIL.reviewer);
  consumer = await t.signIn(EMAIL.consumer);
  const people = { modeller, reviewer };
  catalogiumId = await newSubstance(modeller, 'Catalogium', 39.95);
  v1 = (await approvedSet(t, people, { substanceId: catalogiumId, epsilonK: 120, sigmaAngstrom: 3.4 })).setId;
  // A second fit with shifted data approved later supersedes v1.
  v2 = (await approvedSet(t, people, { substanceId: catalogiumId, epsilonK: 120, sigmaAngstrom: 3.4, shift: -1.5 })).setId;
  // A name a spreadsheet would run as a formula (OWASP CSV injection), at higher temperatures only.
  formulaId = await newSubstance(modeller, '=HYPERLINK("http://x.invalid","Sulfane")', 34.08);
  formulaSet = (
    await approvedSet(t, people, {
      substanceId: formulaId,
      epsilonK: 300,
      sigmaAngstrom: 3.7,
      temperaturesK: Array.from({ length: 10 }, (_, i) => 600 + 50 * i),
    })
  ).setId;
  const shiftedSub = await newSubstance(modeller, 'Truncatane', 16.04);
  shiftedSet = (
    await approvedSet(t, people, {
      substanceId: shiftedSub,
      epsilonK: 150,
      sigmaAngstrom: 3.7,
      scheme: 'truncated-shifted',
      cutoffSigma: 2.5,
    })
  ).setId;
  // A draft nobody approved.
  const fit = (await modeller.get(`/api/substances/${catalogiumId}/fits`)).body.fits[0].id;
  draftId = (await modeller.post('/api/parameter-sets').send({ fitId: fit, rationale: 'Not yet reviewed draft.' })).body.id;
}, 120_000);
afterAll(() => t.close());

describe('route families', () => {
  it('401 without a session or token on every catalog and export route', async () => {
    const c = t.client();
    for (const path of [
      '/api/catalog',
      `/api/catalog/${v2}`,
      `/api/parameter-sets/${v2}/export?format=json`,
      `/api/mixtures?sets=${v2},${formulaSet}&rule=kong`,
      '/api/me/preferences',
      '/api/tokens',
    ]) {
      expect((await c.get(path)).status, path).toBe(401);
    }
    expect((await c.put('/api/me/preferences').send({ energyUnit: 'eV' })).status).toBe(401);
  });

  it('400 with one detail per field for bad queries', async () => {
    const fields = async (path: string) => {
      const res = await consumer.get(path);
      expect(res.status, path).toBe(400);
      expect(res.body.error.code).toBe('validation_failed');
      return res.body.error.details.map((d: { field: string }) => d.field);
    };
    expect(await fields('/api/catalog?scheme=cut-and-hope&tMinK=-3&kind=b2,enthalpy')).toEqual(
      expect.arrayContaining(['scheme', 'tMinK', 'kind.1']),
    );
    expect(await fields('/api/catalog?tMinK=400&tMaxK=300')).toEqual(['tMaxK']);
    expect(await fields('/api/catalog?colour=blue')).toEqual(['query']);
    expect(await fields(`/api/parameter-sets/${v2}/export`)).toEqual(['format']);
    expect(await fields(`/api/parameter-sets/${v2}/export?format=xlsx`)).toEqual(['format']);
    expect(await fields('/api/parameter-sets/abc/export?format=json')).toEqual(['id']);
    expect(await fields(`/api/mixtures?sets=${v2}&rule=kong`)).toEqual(['sets']);
    expect(await fields(`/api/mixtures?sets=${v2},${v2}&rule=kong`)).toEqual(['sets']);
    expect(await fields(`/api/mixtures?sets=${v2},x&rule=geometric`)).toEqual(expect.arrayContaining(['sets.1', 'rule']));
  });
});

describe('catalog', () => {
  const ids = async (query = '') => {
    const res = await consumer.get(`/api/catalog${query}`);
    expect(res.status).toBe(200);
    return (res.body.sets as Array<{ id: number }>).map((s) => s.id);
  };

  it('lists one row per current approved version, never drafts or superseded versions', async () => {
    const all = await ids();
    expect(all).toEqual(expect.arrayContaining([v2, formulaSet, shiftedSet]));
    expect(all).not.toContain(v1);
    expect(all).not.toContain(draftId);
    const row = (await consumer.get('/api/catalog?q=catalog')).body.sets[0];
    expect(row).toMatchObject({
      id: v2,
      version: 2,
      state: 'approved',
      scheme: 'full-potential',
      kinds: ['b2'],
      olderVersions: 1,
      approvedByName: expect.any(String),
      approvedAt: expect.any(String),
    });
  });

  it('filters by name, scheme, data kind and overlap with a temperature range', async () => {
    expect(await ids('?q=CATALOG')).toEqual([v2]);
    expect(await ids('?scheme=truncated-shifted')).toEqual([shiftedSet]);
    expect(await ids('?kind=b2')).toEqual(expect.arrayContaining([v2, formulaSet, shiftedSet]));
    expect(await ids('?kind=viscosity')).not.toEqual(expect.arrayContaining([v2]));
    expect(await ids('?kind=b2,density')).toEqual(expect.not.arrayContaining([v2, formulaSet, shiftedSet]));
    // Catalogium data span 180–620 K, the formula-named set 600–1050 K.
    expect(await ids('?tMinK=100&tMaxK=150')).toEqual(expect.not.arrayContaining([v2, formulaSet]));
    expect(await ids('?tMinK=610&tMaxK=615')).toEqual(expect.arrayContaining([v2, formulaSet]));
    expect(await ids('?tMinK=700')).toEqual(expect.arrayContaining([formulaSet]));
    expect(await ids('?tMinK=700')).not.toContain(v2);
    expect(await ids('?tMaxK=500')).not.toContain(formulaSet);
  });

  it('the card shows approval, sources, fit statistics and the versions with what changed', async () => {
    const card = (await consumer.get(`/api/catalog/${v1}`)).body;
    expect(card).toMatchObject({ id: v1, state: 'superseded', exportable: true, currentApprovedId: v2 });
    expect(card.measurementSets[0]).toMatchObject({
      kind: 'b2',
      doi: '10.1000/epsigma.catalog.1',
      source: expect.stringContaining('Fenwick'),
    });
    expect(card.fit.reducedChi2).toEqual(expect.any(Number));
    expect(card.versions.map((v: { id: number }) => v.id)).toEqual([v1, v2]);
    const [first, second] = card.versions;
    expect(first.change).toBeNull();
    expect(second.change.fromVersion).toBe(1);
    expect(second.change.epsilonK).toBeCloseTo(second.epsilonK - first.epsilonK, 12);
    expect(second.change.sigmaAngstrom).toBeCloseTo(second.sigmaAngstrom - first.sigmaAngstrom, 12);
    // Unpublished sets have no card, for anyone.
    expect((await modeller.get(`/api/catalog/${draftId}`)).status).toBe(404);
    expect((await consumer.get('/api/catalog/999999')).status).toBe(404);
  });
});

describe('export', () => {
  it('serves every format as an attachment with its content type', async () => {
    const expected: Record<string, RegExp> = {
      json: /^application\/json/,
      csv: /^text\/csv/,
      'lammps-real': /^text\/plain/,
      'lammps-metal': /^text\/plain/,
      'lammps-lj': /^text\/plain/,
      gromacs: /^text\/plain/,
    };
    for (const [format, type] of Object.entries(expected)) {
      const res = await consumer.get(`/api/parameter-sets/${v2}/export?format=${format}`).buffer(true);
      expect(res.status, format).toBe(200);
      expect(res.headers['content-type']).toMatch(type);
      expect(res.headers['content-disposition']).toMatch(new RegExp(`^attachment; filename="?epsigma-catalogium-ps${v2}-v2\\.`));
    }
  });

  it('the JSON export validates against its own published schema and converts ε and σ with CODATA 2018 constants', async () => {
    const schema = await consumer.get('/api/schemas/parameter-set-1.json');
    expect(schema.status).toBe(200);
    expect(schema.headers['content-type']).toMatch(/^application\/schema\+json/);
    const res = await consumer.get(`/api/parameter-sets/${v2}/export?format=json`);
    const doc = JSON.parse(res.text);
    expect(checkJsonSchema(JSON.parse(schema.text), doc)).toEqual([]);
    const card = (await consumer.get(`/api/catalog/${v2}`)).body;
    const eps = card.epsilonK;
    const sig = card.sigmaAngstrom;
    const p = doc.parameters;
    expect(p.epsilonK).toBe(eps);
    expect(p.epsilonKJPerMol).toBeCloseTo((eps * R_J_PER_MOL_K) / 1000, 9);
    expect(p.epsilonKcalPerMol).toBeCloseTo((eps * R_J_PER_MOL_K) / 1000 / CAL_J, 9);
    expect(p.epsilonEV / ((eps * KB_J_PER_K) / E_C)).toBeCloseTo(1, 10);
    expect(p.sigmaNm).toBeCloseTo(sig / 10, 12);
    // One known figure: 1 K × R = 8.314462618 J/mol (CODATA 2018 R, to the digits published).
    expect(R_J_PER_MOL_K).toBeCloseTo(8.314462618, 9);
    expect(doc.parameterSet).toMatchObject({ id: v2, version: 2, state: 'approved', approvedBy: card.approvedByName });
    expect(doc.provenance.datasets[0].doi).toBe('10.1000/epsigma.catalog.1'); // vocabulary: keep (export format v1)
  });

  it('CSV carries the chosen units and the engine fragments the engines’ own units', async () => {
    const card = (await consumer.get(`/api/catalog/${v2}`)).body;
    const csv = await consumer.get(`/api/parameter-sets/${v2}/export?format=csv&units=kcal/mol,nm`).buffer(true);
    const parsed = Papa.parse<Record<string, string>>(csv.text, { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const row = parsed.data[0];
    expect(Number(row.epsilon_kcal_per_mol)).toBeCloseTo((card.epsilonK * R_J_PER_MOL_K) / 1000 / CAL_J, 9);
    expect(Number(row.sigma_nm)).toBeCloseTo(card.sigmaAngstrom / 10, 9);
    // LAMMPS units real: ε in kcal/mol, σ in Å (https://docs.lammps.org/units.html).
    const real = (await consumer.get(`/api/parameter-sets/${v2}/export?format=lammps-real`).buffer(true)).text;
    const coeff = /^pair_coeff\s+1\s+1\s+(\S+)\s+(\S+)/m.exec(real);
    expect(coeff).not.toBeNull();
    expect(Number(coeff![1])).toBeCloseTo((card.epsilonK * R_J_PER_MOL_K) / 1000 / CAL_J, 6);
    expect(Number(coeff![2])).toBeCloseTo(card.sigmaAngstrom, 6);
    // LAMMPS units metal: ε in eV.
    const metal = (await consumer.get(`/api/parameter-sets/${v2}/export?format=lammps-metal`).buffer(true)).text;
    const mcoeff = /^pair_coeff\s+1\s+1\s+(\S+)\s+(\S+)/m.exec(metal);
    expect(Number(mcoeff![1]) / ((card.epsilonK * KB_J_PER_K) / E_C)).toBeCloseTo(1, 6);
  });

  it('escapes a substance name that starts with "=" in the CSV (OWASP CSV injection)', async () => {
    const res = await consumer.get(`/api/parameter-sets/${formulaSet}/export?format=csv`).buffer(true);
    expect(res.status).toBe(200);
    const row = Papa.parse<Record<string, string>>(res.text, { header: true, skipEmptyLines: true }).data[0];
    expect(row.substance).toBe(`'=HYPERLINK("http://x.invalid","Sulfane")`);
    expect(res.text).not.toMatch(/(^|,)=HYPERLINK/m);
  });

  it('refuses unknown units (400), unknown sets (404), drafts (404 to consumers, 409 to modellers)', async () => {
    const bad = await consumer.get(`/api/parameter-sets/${v2}/export?format=csv&units=furlongs`);
    expect(bad.status).toBe(400);
    expect(bad.body.error).toMatchObject({ code: 'unknown_unit', message: expect.stringContaining('furlongs') });
    expect((await consumer.get('/api/parameter-sets/999999/export?format=json')).status).toBe(404);
    expect((await consumer.get(`/api/parameter-sets/${draftId}/export?format=json`)).status).toBe(404);
    const refused = await modeller.get(`/api/parameter-sets/${draftId}/export?format=json`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('not_exportable');
    // Superseded versions stay exportable, for reproducing old work.
    expect((await consumer.get(`/api/parameter-sets/${v1}/export?format=json`)).status).toBe(200);
  });
});

describe('mixtures', () => {
  it('answers the pair table with Lorentz–Berthelot cross parameters flagged as estimates', async () => {
    const res = await consumer.get(`/api/mixtures?sets=${v2},${shiftedSet}&rule=lorentz-berthelot`);
    expect(res.status).toBe(200);
    const a = (await consumer.get(`/api/catalog/${v2}`)).body;
    const b = (await consumer.get(`/api/catalog/${shiftedSet}`)).body;
    expect(res.body.pairs).toHaveLength(3);
    const cross = res.body.pairs.find((p: { i: number; j: number }) => p.i === 0 && p.j === 1);
    // Lorentz (1881) arithmetic mean of σ, Berthelot (1898) geometric mean of ε.
    expect(cross).toMatchObject({ setIdI: v2, setIdJ: shiftedSet, kind: 'combining-rule-estimate' });
    expect(cross.epsilonK).toBeCloseTo(Math.sqrt(a.epsilonK * b.epsilonK), 10);
    expect(cross.sigmaAngstrom).toBeCloseTo((a.sigmaAngstrom + b.sigmaAngstrom) / 2, 10);
    expect(res.body.note).toMatch(/estimates/);
    // Different cutoff schemes: the answer says so.
    expect(res.body.cutoff.consistent).toBe(false);
  });

  it('Waldman–Hagler (1993) and Kong (1973) give their own cross parameters', async () => {
    const a = (await consumer.get(`/api/catalog/${v2}`)).body;
    const b = (await consumer.get(`/api/catalog/${formulaSet}`)).body;
    const wh = (await consumer.get(`/api/mixtures?sets=${v2},${formulaSet}&rule=waldman-hagler`)).body.pairs[1];
    // Waldman & Hagler, J. Comput. Chem. 14, 1077 (1993), eqs. for σ_ij (sixth-power mean) and ε_ij.
    const s6 = (a.sigmaAngstrom ** 6 + b.sigmaAngstrom ** 6) / 2;
    expect(wh.sigmaAngstrom).toBeCloseTo(s6 ** (1 / 6), 10);
    expect(wh.epsilonK).toBeCloseTo(
      (2 * Math.sqrt(a.epsilonK * b.epsilonK) * a.sigmaAngstrom ** 3 * b.sigmaAngstrom ** 3) /
        (a.sigmaAngstrom ** 6 + b.sigmaAngstrom ** 6),
      9,
    );
    const kong = (await consumer.get(`/api/mixtures?sets=${v2},${formulaSet}&rule=kong`)).body.pairs[1];
    // Kong, J. Chem. Phys. 59, 2464 (1973), Table I: εσ⁶ geometric; εσ¹² by the 1/13-power mean.
    const c6 = Math.sqrt(a.epsilonK * a.sigmaAngstrom ** 6 * b.epsilonK * b.sigmaAngstrom ** 6);
    const c12 = (((a.epsilonK * a.sigmaAngstrom ** 12) ** (1 / 13) + (b.epsilonK * b.sigmaAngstrom ** 12) ** (1 / 13)) / 2) ** 13;
    expect(kong.epsilonK * kong.sigmaAngstrom ** 6).toBeCloseTo(c6, 6);
    expect((kong.epsilonK * kong.sigmaAngstrom ** 12) / c12).toBeCloseTo(1, 10);
  });

  it('serves the mixture in every export format; the JSON validates against the mixture schema', async () => {
    for (const format of ['json', 'csv', 'lammps-real', 'lammps-metal', 'lammps-lj', 'gromacs']) {
      const res = await consumer.get(`/api/mixtures?sets=${v2},${formulaSet}&rule=kong&format=${format}`).buffer(true);
      expect(res.status, format).toBe(200);
      expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?epsigma-mixture-/);
    }
    const schema = JSON.parse((await t.client().get('/api/schemas/mixture-1.json')).text);
    const doc = JSON.parse((await consumer.get(`/api/mixtures?sets=${v2},${formulaSet}&rule=kong&format=json`)).text);
    expect(checkJsonSchema(schema, doc)).toEqual([]);
    expect((await consumer.get(`/api/mixtures?sets=${v2},${draftId}&rule=kong`)).status).toBe(404);
    expect((await modeller.get(`/api/mixtures?sets=${v2},${draftId}&rule=kong`)).status).toBe(409);
  });
});

describe('preferences', () => {
  it('defaults, partial updates, validation and forgetting the scheme', async () => {
    expect((await consumer.get('/api/me/preferences')).body).toEqual({ energyUnit: 'K', lengthUnit: 'Å' });
    expect((await consumer.put('/api/me/preferences').send({ energyUnit: 'kJ/mol', scheme: 'truncated-shifted' })).body).toEqual({
      energyUnit: 'kJ/mol',
      lengthUnit: 'Å',
      scheme: 'truncated-shifted',
    });
    expect((await consumer.put('/api/me/preferences').send({ lengthUnit: 'nm' })).body).toEqual({
      energyUnit: 'kJ/mol',
      lengthUnit: 'nm',
      scheme: 'truncated-shifted',
    });
    const bad = await consumer.put('/api/me/preferences').send({ energyUnit: 'Hartree', colour: 'red' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.map((d: { field: string }) => d.field)).toEqual(expect.arrayContaining(['energyUnit']));
    expect((await consumer.put('/api/me/preferences').send({ scheme: null })).body).toEqual({ energyUnit: 'kJ/mol', lengthUnit: 'nm' });
    // Stored per person: another person still has the defaults.
    expect((await modeller.get('/api/me/preferences')).body).toEqual({ energyUnit: 'K', lengthUnit: 'Å' });
  });
});

describe('published descriptions', () => {
  it('serves the schemas and the OpenAPI 3.1 document without credentials', async () => {
    const c = t.client();
    expect((await c.get('/api/schemas/parameter-set-1.json')).status).toBe(200);
    expect((await c.get('/api/schemas/nope.json')).status).toBe(404);
    const doc = JSON.parse((await c.get('/api/openapi.json')).text);
    expect(doc.openapi).toBe('3.1.0');
    expect(doc.components.securitySchemes.bearerToken).toMatchObject({ type: 'http', scheme: 'bearer' });
    expect(Object.keys(doc.paths)).toEqual(
      expect.arrayContaining(['/catalog', '/parameter-sets/{id}/export', '/mixtures', '/schemas/{name}', '/openapi.json']),
    );
    // Every route a token reaches is described, and nothing else.
    const described = Object.keys(doc.paths).map((p) => `GET /api${p.replace(/\{(\w+)\}/g, ':$1')}`);
    expect(described.sort()).toEqual(TOKEN_ROUTES.map((r) => r.route).sort());
    const tMin = doc.paths['/catalog'].get.parameters.find((p: { name: string }) => p.name === 'tMinK');
    expect(tMin.schema).toMatchObject({ type: 'number', exclusiveMinimum: 0 });
  });
});
