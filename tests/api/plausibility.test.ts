import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EMAIL, startTestApp, type TestApp } from './test-app';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
let t: TestApp;
let modeller: Agent;
let substanceId: number;

beforeAll(async () => {
  t = await startTestApp();
  modeller = await t.signIn(EMAIL.modeller);
  const res = await modeller.post('/api/substances').send({ name: 'quillgas QG-9', molarMassGPerMol: 44.1 });
  expect(res.status).toBe(201);
  substanceId = res.body.id;
});
afterAll(() => t.close());

const upload = (csv: string, kind = 'b2') =>
  modeller
    .post('/api/measurement-sets')
    .field('substanceId', substanceId)
    .field('kind', kind)
    .field('name', `Check ${Math.random()}`)
    .field('source', 'Fenwick Thermophysics Laboratory, invented run')
    .attach('file', Buffer.from(csv), { filename: 'check.csv', contentType: 'text/csv' });

describe('substances', () => {
  it('refuses a molar mass below a hydrogen atom (5e-324 g/mol), naming the field', async () => {
    for (const molarMass of [5e-324, 0.5]) {
      const res = await modeller.post('/api/substances').send({ name: `fenwick tiny ${molarMass}`, molarMassGPerMol: molarMass });
      expect(res.status).toBe(400);
      expect(res.body.error.details[0].field).toBe('molarMassGPerMol');
      expect(res.body.error.details[0].message).toContain('at least 1 g/mol');
    }
  });

  it('saves an unusual molar mass with a warning', async () => {
    const res = await modeller.post('/api/substances').send({ name: 'norrane wax NW-40', molarMassGPerMol: 1500 });
    expect(res.status).toBe(201);
    expect(res.body.warnings).toEqual([expect.stringContaining('1500 g/mol is unusual')]);
    const plain = await modeller.post('/api/substances').send({ name: 'norrane N-1', molarMassGPerMol: 72.15 });
    expect(plain.body.warnings).toEqual([]);
  });

  it('normalises names (NFKC, one space) before the uniqueness check', async () => {
    for (const name of ['quillgas\u00a0QG-9', ' quillgas  QG-9 ', 'ｑｕｉｌｌｇａｓ QG-9', 'QUILLGAS QG-9']) {
      const res = await modeller.post('/api/substances').send({ name, molarMassGPerMol: 44.1 });
      expect(res.status, JSON.stringify(name)).toBe(409);
      expect(res.body.error.details[0].field).toBe('name');
    }
    const other = await modeller.post('/api/substances').send({ name: 'fenwick bead\u00a0FB-9', molarMassGPerMol: 30 });
    expect(other.status).toBe(201);
    expect(other.body.name).toBe('fenwick bead FB-9');
    const rename = await modeller.patch(`/api/substances/${other.body.id}`).send({ name: 'quillgas\u2007QG-9' });
    expect(rename.status).toBe(409);
  });
});

describe('measurement uploads', () => {
  it('refuses a B2 of −1e308 cm³/mol, naming the row and column', async () => {
    const res = await upload('T (K),B2 (cm3/mol)\n300,-150\n350,-1e308\n');
    expect(res.status).toBe(422);
    const problem = res.body.error.details.find((d: { code: string }) => d.code === 'implausible-value');
    expect(problem).toMatchObject({ row: 3, column: 'B2 (cm3/mol)', field: 'b2Cm3PerMol' });
    expect(problem.message).toMatch(/impossible for a fluid/);
  });

  it('refuses a value that overflows once converted', async () => {
    const res = await upload('T (K),B2 (m3/mol)\n300,-1e305\n');
    expect(res.status).toBe(422);
    expect(res.body.error.details[0].code).toBe('implausible-value');
  });

  it('stores an "m3/mol" column holding cm³-sized numbers but warns that the unit makes B2 a million times too large', async () => {
    const res = await upload('T (K),B2 (m3/mol)\n250,-210\n300,-150\n350,-112\n');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.warnings).toEqual([expect.stringContaining('a million times too large')]);
    expect(res.body.warnings[0]).toContain('B2 (m3/mol)');
  });

  it('warns about one unusual value and says how many more', async () => {
    const res = await upload('T (K),B2 (cm3/mol)\n200,-30000\n250,-25000\n300,-150\n');
    expect(res.status).toBe(201);
    expect(res.body.warnings).toEqual([
      expect.stringMatching(
        /^Row 2, column "B2 \(cm3\/mol\)": second virial coefficient B2 -30000 cm³\/mol is unusual.*\(1 more row in this column\)$/,
      ),
    ]);
  });

  it('accepts ordinary values without warnings, and refuses an impossible density', async () => {
    const ok = await upload('T (K),B2 (cm3/mol)\n250,-210\n300,-150\n');
    expect(ok.status).toBe(201);
    expect(ok.body.warnings).toEqual([]);
    const dense = await upload('T (K),P (MPa),rho (kg/m3)\n300,5,2e7\n', 'density');
    expect(dense.status).toBe(422);
    expect(dense.body.error.details[0]).toMatchObject({ code: 'implausible-value', row: 2, field: 'densityKgPerM3' });
  });
});
