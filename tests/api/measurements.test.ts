import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EMAIL, startTestApp, type TestApp } from './test-app';

const fixture = (name: string) => readFileSync(new URL(`../fixtures/csv/${name}`, import.meta.url));

let t: TestApp;
let modeller: Awaited<ReturnType<TestApp['signIn']>>;
let substanceId: number;

beforeAll(async () => {
  t = await startTestApp();
  modeller = await t.signIn(EMAIL.modeller);
  // An invented substance for the tests (molar mass of argon, IUPAC 2021 standard atomic weight 39.948).
  const res = await modeller.post('/api/substances').send({ name: 'Testium', molarMassGPerMol: 39.948, formula: 'Tm' });
  expect(res.status).toBe(201);
  substanceId = res.body.id;
});
afterAll(() => t.close());

async function counts() {
  const n = async (table: 'measurementSet' | 'measurementSetVersion' | 'measurementRow') =>
    Number(
      (
        await t.ctx.db
          .selectFrom(table)
          .select((eb) => eb.fn.countAll<number>().as('n'))
          .executeTakeFirstOrThrow()
      ).n,
    );
  return {
    measurementSet: await n('measurementSet'),
    measurementSetVersion: await n('measurementSetVersion'),
    measurementRow: await n('measurementRow'),
  };
}

function upload(agent: typeof modeller, file: Buffer, fields: Record<string, string | number>, filename = 'table.csv') {
  let req = agent.post('/api/measurement-sets');
  for (const [k, v] of Object.entries(fields)) req = req.field(k, String(v));
  return req.attach('file', file, { filename, contentType: 'text/csv' });
}

describe('substances', () => {
  it('route family: 401 without session, 403 for consumers writing, 400 per field', async () => {
    expect((await t.client().get('/api/substances')).status).toBe(401);
    const consumer = await t.signIn(EMAIL.consumer);
    expect((await consumer.post('/api/substances').send({ name: 'X', molarMassGPerMol: 1 })).status).toBe(403);
    expect((await consumer.get('/api/substances')).status).toBe(200);
    const bad = await modeller.post('/api/substances').send({ name: '', molarMassGPerMol: -3 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.map((d: { field: string }) => d.field)).toEqual(expect.arrayContaining(['name', 'molarMassGPerMol']));
  });

  it('refuses a duplicate name (case-insensitive) with 409', async () => {
    expect((await modeller.post('/api/substances').send({ name: 'testium', molarMassGPerMol: 40 })).status).toBe(409);
  });

  it('edits descriptive fields with an audit row holding before and after', async () => {
    const res = await modeller.patch(`/api/substances/${substanceId}`).send({ description: 'An invented test gas' });
    expect(res.status).toBe(200);
    expect(res.body.description).toBe('An invented test gas');
    const audit = await t.ctx.db.selectFrom('auditEvent').selectAll().where('action', '=', 'substance.updated').executeTakeFirstOrThrow();
    expect(JSON.parse(audit.beforeJson!).description).toBeNull();
    expect(JSON.parse(audit.afterJson!).description).toBe('An invented test gas');
  });
});

describe('measurement set upload', () => {
  it('stores a °C + bar density table in canonical units (K, MPa, kg/m³)', async () => {
    const res = await upload(modeller, fixture('good-density-celsius-bar.csv'), {
      substanceId,
      kind: 'density',
      name: 'Density test',
      source: 'Invented for tests',
      doi: '10.1000/test.1',
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ id: expect.any(Number), version: 1, rowCount: 4 });
    const got = await modeller.get(`/api/measurement-sets/${res.body.id}`);
    expect(got.status).toBe(200);
    expect(got.body).toMatchObject({
      kind: 'density',
      version: 1,
      sha256: createHash('sha256').update(fixture('good-density-celsius-bar.csv')).digest('hex'),
    });
    // 25 °C = 298.15 K (ITS-90 / SI Brochure 9th ed. §2.3.1: t/°C = T/K − 273.15); 10 bar = 1 MPa (NIST SP 811, App. B.8).
    expect(got.body.rows[0].temperatureK).toBeCloseTo(298.15, 10);
    expect(got.body.rows[0].pressureMPa).toBeCloseTo(1.0, 12);
    expect(got.body.rows[0].densityKgPerM3).toBe(16);
    expect(got.body.rows[0].uDensityKgPerM3).toBe(0.02);
    expect(got.body.rows[0].uncertaintySource).toBe('measured');
  });

  it('converts molar densities with the substance molar mass', async () => {
    const res = await upload(modeller, fixture('good-density-molar.csv'), { substanceId, kind: 'density', name: 'Molar density test' });
    expect(res.status).toBe(201);
    const got = await modeller.get(`/api/measurement-sets/${res.body.id}`);
    // 0.4 mol/L × 39.948 g/mol = 15.9792 kg/m³
    expect(got.body.rows[0].densityKgPerM3).toBeCloseTo(15.9792, 9);
    // No uncertainty column: the default relative uncertainty (1 %) is applied and marked.
    expect(got.body.rows[0].uDensityKgPerM3).toBeCloseTo(0.159792, 9);
    expect(got.body.rows[0].uncertaintySource).toBe('default-relative');
  });

  it('takes a semicolon, decimal-comma viscosity table', async () => {
    const res = await upload(modeller, fixture('good-viscosity-semicolon-decimal-comma.csv'), {
      substanceId,
      kind: 'viscosity',
      name: 'Viscosity test',
    });
    expect(res.status).toBe(201);
    const got = await modeller.get(`/api/measurement-sets/${res.body.id}`);
    expect(got.body.rows.map((r: { viscosityMicroPaS: number }) => r.viscosityMicroPaS)).toEqual([18.5, 22.5, 26, 29.5]);
    expect(got.body.delimiter).toBe(';');
    expect(got.body.decimal).toBe(',');
  });

  it('accepts an explicit column mapping for unrecognised headers', async () => {
    const mapping = {
      0: { quantity: 'temperature', unit: 'degC' },
      1: { quantity: 'b2', unit: 'cm3/mol' },
      2: { quantity: 'uB2', unit: 'cm3/mol' },
    };
    const res = await upload(modeller, fixture('good-needs-mapping.csv'), {
      substanceId,
      kind: 'b2',
      name: 'Mapped B2',
      mapping: JSON.stringify(mapping),
    });
    expect(res.status).toBe(201);
    const without = await upload(modeller, fixture('good-needs-mapping.csv'), { substanceId, kind: 'b2', name: 'Unmapped B2' });
    expect(without.status).toBe(422);
  });

  // Each broken file: status, the problem code, the row (spreadsheet numbering, header = row 1) and column named.
  const BROKEN: Array<{ file: string; kind: string; code: string; row?: number; column?: string }> = [
    { file: 'non-numeric-cell.csv', kind: 'b2', code: 'non-numeric' },
    { file: 'missing-required-column.csv', kind: 'density', code: 'missing-required-column' },
    { file: 'unknown-unit.csv', kind: 'viscosity', code: 'unknown-unit' },
    { file: 'wrong-dimension.csv', kind: 'density', code: 'wrong-dimension' },
    { file: 'nonpositive-temperature.csv', kind: 'b2', code: 'nonpositive-temperature' },
    { file: 'nonpositive-pressure.csv', kind: 'density', code: 'nonpositive-pressure' },
    { file: 'nonpositive-density.csv', kind: 'density', code: 'nonpositive-density' },
    { file: 'nonpositive-viscosity.csv', kind: 'viscosity', code: 'nonpositive-viscosity' },
    { file: 'nonpositive-uncertainty.csv', kind: 'b2', code: 'nonpositive-uncertainty' },
    { file: 'duplicate-state-point.csv', kind: 'density', code: 'duplicate-state-point' },
    { file: 'empty.csv', kind: 'b2', code: 'empty-file' },
    { file: 'header-only.csv', kind: 'b2', code: 'no-data-rows' },
  ];

  for (const c of BROKEN) {
    it(`rejects ${c.file} with 422 (${c.code}) and stores nothing`, async () => {
      const before = await counts();
      const res = await upload(modeller, fixture(c.file), { substanceId, kind: c.kind, name: `broken ${c.file}` }, c.file);
      expect(res.status).toBe(422);
      const problem = res.body.error.details.find((d: { code: string }) => d.code === c.code);
      expect(problem, JSON.stringify(res.body.error.details)).toBeTruthy();
      expect(problem.message.length).toBeGreaterThan(10);
      if (!['missing-required-column', 'empty-file', 'no-data-rows', 'unknown-unit', 'wrong-dimension'].includes(c.code)) {
        expect(problem.row).toBeGreaterThanOrEqual(2);
        expect(problem.column).toBeTruthy();
      }
      expect(await counts()).toEqual(before);
    });
  }

  it('names the row and column of a non-numeric cell', async () => {
    const res = await upload(modeller, fixture('non-numeric-cell.csv'), { substanceId, kind: 'b2', name: 'x' });
    const p = res.body.error.details.find((d: { code: string }) => d.code === 'non-numeric');
    const lines = fixture('non-numeric-cell.csv').toString('utf8').split(/\r?\n/);
    expect(lines[p.row - 1]).toContain(lines[p.row - 1].split(',').find((cell) => cell.trim() !== '' && Number.isNaN(Number(cell)))!);
  });

  it('rejects more rows than the limit with 422', async () => {
    const lines = ['T (K),B2 (cm3/mol)'];
    for (let i = 0; i < 5001; i++) lines.push(`${100 + i * 0.1},${-100 + i * 0.01}`);
    const before = await counts();
    const res = await upload(modeller, Buffer.from(lines.join('\n')), { substanceId, kind: 'b2', name: 'too many' });
    expect(res.status).toBe(422);
    expect(res.body.error.details[0].code).toBe('too-many-rows');
    expect(await counts()).toEqual(before);
  });

  it('rejects a file over the size limit with 413', async () => {
    const before = await counts();
    const big = Buffer.alloc(2 * 1024 * 1024 + 10, 'a');
    const res = await upload(modeller, big, { substanceId, kind: 'b2', name: 'big' });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('file_too_large');
    expect(await counts()).toEqual(before);
  });

  it('rejects a file that is not a CSV with 400', async () => {
    const res = await modeller
      .post('/api/measurement-sets')
      .field('substanceId', substanceId)
      .field('kind', 'b2')
      .field('name', 'png')
      .attach('file', Buffer.from([0x89, 0x50, 0x4e, 0x47]), { filename: 'plot.png', contentType: 'image/png' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('not_csv');
  });

  it('answers 400 per field for bad multipart fields and a missing file', async () => {
    const res = await upload(modeller, fixture('good-b2-parentheses.csv'), {
      substanceId: 'abc',
      kind: 'enthalpy',
      name: '',
      defaultRelativeUncertainty: 2,
      doi: 'not-a-doi',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.details.map((d: { field: string }) => d.field)).toEqual(
      expect.arrayContaining(['substanceId', 'kind', 'name', 'defaultRelativeUncertainty', 'doi']),
    );
    const noFile = await modeller.post('/api/measurement-sets').field('substanceId', substanceId).field('kind', 'b2').field('name', 'n');
    expect(noFile.status).toBe(400);
    expect(noFile.body.error.details[0].field).toBe('file');
  });

  it('route family: 401 without session, 403 for roles that may not upload', async () => {
    expect((await upload(t.client(), fixture('good-b2-parentheses.csv'), { substanceId, kind: 'b2', name: 'x' })).status).toBe(401);
    for (const email of [EMAIL.consumer, EMAIL.reviewer, EMAIL.admin]) {
      const agent = await t.signIn(email);
      expect((await upload(agent, fixture('good-b2-parentheses.csv'), { substanceId, kind: 'b2', name: 'x' })).status).toBe(403);
    }
    expect((await t.client().get('/api/measurement-sets')).status).toBe(401);
  });
});

describe('measurement set versions', () => {
  it('a second version leaves version 1 byte-identical with its SHA-256 unchanged', async () => {
    const v1Bytes = fixture('good-b2-parentheses.csv');
    const first = await upload(modeller, v1Bytes, { substanceId, kind: 'b2', name: 'Versioned B2', source: 'Invented' });
    expect(first.status).toBe(201);
    const id = first.body.id;
    const v1Before = await modeller.get(`/api/measurement-sets/${id}?version=1`);
    const original1 = await modeller
      .get(`/api/measurement-sets/${id}/versions/1/original`)
      .buffer(true)
      .parse((res, cb) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => cb(null, Buffer.concat(chunks)));
      });

    const second = await modeller
      .post(`/api/measurement-sets/${id}/versions`)
      .field('source', 'Invented, corrected')
      .attach('file', fixture('good-b2-brackets.csv'), { filename: 'corrected.csv', contentType: 'text/csv' });
    expect(second.status).toBe(201);
    expect(second.body).toMatchObject({ id, version: 2 });

    const v1After = await modeller.get(`/api/measurement-sets/${id}?version=1`);
    expect(v1After.body.sha256).toBe(v1Before.body.sha256);
    expect(v1After.body.sha256).toBe(createHash('sha256').update(v1Bytes).digest('hex'));
    expect(v1After.body.rows).toEqual(v1Before.body.rows);
    const original1After = await modeller
      .get(`/api/measurement-sets/${id}/versions/1/original`)
      .buffer(true)
      .parse((res, cb) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(Buffer.compare(original1.body as Buffer, v1Bytes)).toBe(0);
    expect(Buffer.compare(original1After.body as Buffer, v1Bytes)).toBe(0);

    const latest = await modeller.get(`/api/measurement-sets/${id}`);
    expect(latest.body.version).toBe(2);
    expect(latest.body.versions.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    const list = await modeller.get(`/api/measurement-sets?substanceId=${substanceId}`);
    const entry = list.body.measurementSets.find((d: { id: number }) => d.id === id);
    expect(entry.version).toBe(2);
  });

  it('a rejected corrected version changes nothing', async () => {
    const list = await modeller.get(`/api/measurement-sets?substanceId=${substanceId}`);
    const id = list.body.measurementSets.find((d: { name: string }) => d.name === 'Versioned B2').id;
    const before = await counts();
    const res = await modeller
      .post(`/api/measurement-sets/${id}/versions`)
      .attach('file', fixture('non-numeric-cell.csv'), { filename: 'bad.csv', contentType: 'text/csv' });
    expect(res.status).toBe(422);
    expect(await counts()).toEqual(before);
  });

  it('the database refuses to edit or delete stored versions and rows', () => {
    expect(() => t.ctx.sqlite.prepare('UPDATE measurement_row SET value = 0').run()).toThrow(/immutable/);
    expect(() => t.ctx.sqlite.prepare('DELETE FROM measurement_set_version').run()).toThrow(/immutable/);
  });

  it('withdraws a measurement set: kept readable, refused for new versions, audited', async () => {
    const list = await modeller.get(`/api/measurement-sets?substanceId=${substanceId}`);
    const id = list.body.measurementSets.find((d: { name: string }) => d.name === 'Mapped B2').id;
    expect((await modeller.post(`/api/measurement-sets/${id}/withdraw`).send({ reason: '' })).status).toBe(400);
    expect((await modeller.post(`/api/measurement-sets/${id}/withdraw`).send({ reason: 'Calibration error found' })).status).toBe(200);
    const got = await modeller.get(`/api/measurement-sets/${id}`);
    expect(got.body.withdrawn.reason).toBe('Calibration error found');
    expect((await modeller.post(`/api/measurement-sets/${id}/withdraw`).send({ reason: 'again' })).status).toBe(409);
    const again = await modeller
      .post(`/api/measurement-sets/${id}/versions`)
      .attach('file', fixture('good-b2-brackets.csv'), { filename: 'x.csv', contentType: 'text/csv' });
    expect(again.status).toBe(409);
  });

  it('answers 404 for unknown measurement sets and versions', async () => {
    expect((await modeller.get('/api/measurement-sets/99999')).status).toBe(404);
    const list = await modeller.get(`/api/measurement-sets?substanceId=${substanceId}`);
    expect((await modeller.get(`/api/measurement-sets/${list.body.measurementSets[0].id}?version=42`)).status).toBe(404);
  });
});
