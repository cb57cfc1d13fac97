/**
 * Migration 20261202_0014 (the vocabulary rename) on a database that holds data: the demo, an approved parameter
 * set with its fit, a pair set on a B12 measurement set and a withdrawn measurement set, all made through the API.
 * The database is taken back to the previous version (the rename's down step), a fit is added there the way the
 * old code stored it (old keys in its JSON), and the rename is applied again as a server start applies it:
 * rows, immutability triggers, foreign keys and indexes must hold, and the old fit must read like a new one.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import type { Server } from 'node:http';
import { tmpdir } from 'node:os';
import path from 'node:path';
import SQLite from 'better-sqlite3';
import { CamelCasePlugin, Kysely, Migrator, SqliteDialect } from 'kysely';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MIGRATIONS } from '../../migrations/index';
import { createApp } from '../../server/app';
import { createContext } from '../../server/bootstrap';
import { loadEnv } from '../../server/config/env';
import { crossB2 } from '../../shared/mixing/cross-virial';
import { approvedSet, newSubstance, syntheticB2Csv } from './approved-set';
import { EMAIL, TEST_PASSWORD, startTestApp } from './test-app';

const PREVIOUS = '20261202_0013_mie_parameter_sets';
const RENAMED_TABLES = [
  'measurement_set',
  'measurement_set_version',
  'measurement_row',
  'measurement_set_withdrawal',
  'fit',
  'parameter_set',
  'pair_set',
];
const OLD_TABLES = ['dataset', 'dataset_version', 'measurement_row', 'dataset_withdrawal', 'fit', 'parameter_set', 'pair_set'];

const dir = mkdtempSync(path.join(tmpdir(), 'epsigma-rename-'));
const file = path.join(dir, 'data.sqlite');
let countsBefore: number[];
let fitId: number;
let oldStyleFitId: number;
let measurementSetId: number;
let after: Awaited<ReturnType<typeof createContext>>;
let server: Server;
let baseUrl: string;

const count = (sqlite: SQLite.Database, table: string) => (sqlite.prepare(`SELECT count(*) AS n FROM ${table}`).get() as { n: number }).n;

/** Keys of JSON written by the code before the rename: measurementSetId → datasetId, perMeasurementSet → perDataset. */
const oldKeys = (json: string) => json.replace(/"measurementSet/g, '"dataset').replace(/MeasurementSet/g, 'Dataset');

beforeAll(async () => {
  // 1. Data through the API at the latest version.
  const t = await startTestApp();
  const modeller = await t.signIn(EMAIL.modeller);
  const reviewer = await t.signIn(EMAIL.reviewer);
  const a = await newSubstance(modeller, 'Renamium A', 40);
  const b = await newSubstance(modeller, 'Renamium B', 58);
  const setA = await approvedSet(t, { modeller, reviewer }, { substanceId: a, epsilonK: 140, sigmaAngstrom: 3.5 });
  const setB = await approvedSet(t, { modeller, reviewer }, { substanceId: b, epsilonK: 220, sigmaAngstrom: 4.2 });
  fitId = setA.fitId;
  measurementSetId = setA.measurementSetId;
  const lines = [
    'T (K),B12 (cm3/mol),u(B12) (cm3/mol)',
    ...[180, 220, 260, 320, 400, 500].map(
      (T) => `${T},${crossB2(T, { epsilonK: 140, sigmaAngstrom: 3.5 }, { epsilonK: 220, sigmaAngstrom: 4.2 }, 0.04).toFixed(4)},1`,
    ),
  ];
  const b12 = await modeller
    .post('/api/measurement-sets')
    .field('substanceId', a)
    .field('kind', 'b12')
    .field('name', 'Invented B12')
    .attach('file', Buffer.from(lines.join('\n')), { filename: 'b12.csv', contentType: 'text/csv' });
  expect(b12.status).toBe(201);
  expect(
    (await modeller.post('/api/pair-sets').send({ parameterSetIds: [setA.setId, setB.setId], measurementSetId: b12.body.id })).status,
  ).toBe(201);
  const spare = await modeller
    .post('/api/measurement-sets')
    .field('substanceId', b)
    .field('kind', 'b2')
    .field('name', 'Spare B2')
    .attach('file', syntheticB2Csv(220, 4.2), { filename: 'b2.csv', contentType: 'text/csv' });
  expect((await modeller.post(`/api/measurement-sets/${spare.body.id}/withdraw`).send({ reason: 'a spare run' })).status).toBe(200);
  await t.ctx.sqlite.backup(file);
  await t.close();

  // 2. Back to the previous version: the rename's down step.
  const sqlite = new SQLite(file);
  sqlite.pragma('foreign_keys = ON');
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- the migrations run on an untyped database
  const db = new Kysely<any>({ dialect: new SqliteDialect({ database: sqlite }), plugins: [new CamelCasePlugin()] });
  const down = await new Migrator({ db, provider: { getMigrations: async () => MIGRATIONS } }).migrateTo(PREVIOUS);
  expect(down.error).toBeUndefined();
  countsBefore = OLD_TABLES.map((table) => count(sqlite, table));
  expect(countsBefore.every((n) => n > 0)).toBe(true);

  // 3. A fit stored the way the old code stored it: a copy of the approved set's fit and its job, with old keys.
  const job = sqlite.prepare('SELECT job.* FROM job JOIN fit ON fit.job_id = job.id WHERE fit.id = ?').get(fitId) as Record<
    string,
    unknown
  >;
  expect(String(job.input_json)).toContain('"measurementSets"');
  const jobCols = Object.keys(job).filter((c) => c !== 'id');
  const jobCopy = { ...job, input_json: oldKeys(String(job.input_json)), result_json: oldKeys(String(job.result_json)), cache_key: null };
  const newJobId = sqlite
    .prepare(`INSERT INTO job (${jobCols.join(', ')}) VALUES (${jobCols.map((c) => `@${c}`).join(', ')})`)
    .run(jobCopy).lastInsertRowid;
  const fit = sqlite.prepare('SELECT * FROM fit WHERE id = ?').get(fitId) as Record<string, unknown>;
  expect(fit.datasets_json).toBeDefined();
  const fitCols = Object.keys(fit).filter((c) => c !== 'id');
  const fitCopy = { ...fit, number: Number(fit.number) + 100, job_id: newJobId, datasets_json: oldKeys(String(fit.datasets_json)) };
  oldStyleFitId = Number(
    sqlite.prepare(`INSERT INTO fit (${fitCols.join(', ')}) VALUES (${fitCols.map((c) => `@${c}`).join(', ')})`).run(fitCopy)
      .lastInsertRowid,
  );
  expect(String(fitCopy.datasets_json)).toContain('"datasetId"');
  await db.destroy();

  // 4. A server start applies the rename again.
  const env = loadEnv({ NODE_ENV: 'test', DATABASE_PATH: file, DEMO_PASSWORD: TEST_PASSWORD, SIGN_IN_LIMIT: '1000', WORKERS: '1' });
  after = await createContext(env, () => {});
  server = await new Promise((resolve) => {
    const s = createApp(after).listen(0, '127.0.0.1', () => resolve(s));
  });
  const address = server.address();
  baseUrl = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}`;
}, 240_000);

afterAll(async () => {
  await new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve()));
  await after?.close();
  rmSync(dir, { recursive: true, force: true });
});

const signIn = async (email: string) => {
  const agent = request.agent(baseUrl);
  agent.set('Origin', baseUrl);
  expect((await agent.post('/api/auth/login').send({ email, password: TEST_PASSWORD })).status).toBe(200);
  return agent;
};

describe('migration 0014 (measurement set vocabulary) on a database with data', () => {
  it('keeps every row of the renamed tables', () => {
    expect(RENAMED_TABLES.map((table) => count(after.sqlite, table))).toEqual(
      countsBefore.map((n, i) => (OLD_TABLES[i] === 'fit' ? n + 1 : n)),
    );
    const names = (after.sqlite.prepare("SELECT name FROM sqlite_master WHERE type = 'table'").all() as Array<{ name: string }>).map(
      (r) => r.name,
    );
    expect(names).toEqual(expect.arrayContaining(['measurement_set', 'measurement_set_version', 'measurement_set_withdrawal']));
    expect(names).not.toEqual(expect.arrayContaining(['dataset']));
  });

  it('leaves no old name in the schema but one constraint name: tables, columns, indexes and triggers say measurement_set', () => {
    const schema = after.sqlite.prepare('SELECT name, sql FROM sqlite_master WHERE sql IS NOT NULL').all() as Array<{
      name: string;
      sql: string;
    }>;
    // SQLite cannot rename a table constraint without rebuilding the table; the name is never referenced.
    const withoutConstraintName = (sql: string) => sql.replace('constraint "dataset_version_unique"', '');
    expect(schema.filter((r) => /dataset/i.test(withoutConstraintName(r.sql)) || /dataset/i.test(r.name)).map((r) => r.name)).toEqual([]);
    const columns = (table: string) =>
      (after.sqlite.prepare(`PRAGMA table_info(${table})`).all() as Array<{ name: string }>).map((c) => c.name);
    expect(columns('measurement_set')).toContain('kind');
    expect(columns('measurement_set_version')).toContain('measurement_set_id');
    expect(columns('measurement_row')).toContain('measurement_set_version_id');
    expect(columns('fit')).toContain('measurement_sets_json');
    expect(columns('parameter_set')).toContain('measurement_sets_json');
    expect(columns('pair_set')).toContain('measurement_set_version_id');
  });

  it('still refuses to change or delete versions, rows and withdrawals, and fits (triggers)', () => {
    for (const sql of [
      'UPDATE measurement_set_version SET notes = notes',
      'DELETE FROM measurement_set_version',
      'UPDATE measurement_row SET value = 0',
      'DELETE FROM measurement_row',
      'UPDATE measurement_set_withdrawal SET reason = reason',
      'DELETE FROM measurement_set_withdrawal',
    ]) {
      expect(() => after.sqlite.prepare(sql).run(), sql).toThrow(/immutable/);
    }
    expect(() => after.sqlite.prepare('UPDATE fit SET measurement_sets_json = measurement_sets_json').run()).toThrow(/immutable/);
    expect(() => after.sqlite.prepare("UPDATE parameter_set SET measurement_sets_json = '[]'").run()).toThrow(/frozen/);
  });

  it('keeps the foreign keys: every reference resolves and a dangling one is refused', () => {
    expect(after.sqlite.prepare('PRAGMA foreign_key_check').all()).toEqual([]);
    const fk = (table: string) =>
      (after.sqlite.prepare(`PRAGMA foreign_key_list(${table})`).all() as Array<{ table: string; from: string }>).map(
        (r) => `${r.from}→${r.table}`,
      );
    expect(fk('measurement_set_version')).toContain('measurement_set_id→measurement_set');
    expect(fk('measurement_row')).toContain('measurement_set_version_id→measurement_set_version');
    expect(fk('measurement_set_withdrawal')).toContain('measurement_set_id→measurement_set');
    expect(fk('pair_set')).toContain('measurement_set_version_id→measurement_set_version');
    expect(() =>
      after.sqlite
        .prepare(
          "INSERT INTO measurement_set_withdrawal (measurement_set_id, withdrawn_by, withdrawn_at, reason) SELECT 999999, id, '', 'x' FROM user LIMIT 1",
        )
        .run(),
    ).toThrow(/FOREIGN KEY/);
  });

  it('keeps the indexes on the renamed columns', () => {
    const indexColumns = (index: string) =>
      (after.sqlite.prepare(`PRAGMA index_info(${index})`).all() as Array<{ name: string }>).map((c) => c.name);
    expect(indexColumns('measurement_set_substance_idx')).toEqual(['substance_id']);
    expect(indexColumns('measurement_row_version_idx')).toEqual(['measurement_set_version_id', 'position']);
    const plan = after.sqlite.prepare('EXPLAIN QUERY PLAN SELECT * FROM measurement_set WHERE substance_id = 1').all() as Array<{
      detail: string;
    }>;
    expect(plan.map((p) => p.detail).join(' ')).toMatch(/measurement_set_substance_idx/);
  });

  it('reads a fit stored with the old keys exactly like the same fit stored with the new ones', async () => {
    const modeller = await signIn(EMAIL.modeller);
    const fresh = await modeller.get(`/api/fits/${fitId}`);
    const old = await modeller.get(`/api/fits/${oldStyleFitId}`);
    expect(fresh.status).toBe(200);
    expect(old.status).toBe(200);
    expect(old.body.measurementSets[0].measurementSetId).toBe(measurementSetId);
    expect(JSON.stringify(old.body)).not.toMatch(/dataset/i);
    const comparable = (b: Record<string, unknown>) => {
      const { id: _id, number: _number, jobId: _jobId, ...rest } = b;
      return rest;
    };
    expect(comparable(old.body)).toEqual(comparable(fresh.body));
  });

  it('serves the measurement sets and their kinds under the new names', async () => {
    const modeller = await signIn(EMAIL.modeller);
    const detail = await modeller.get(`/api/measurement-sets/${measurementSetId}`);
    expect(detail.status).toBe(200);
    expect(detail.body).toMatchObject({ id: measurementSetId, kind: 'b2', kindLabel: expect.any(String) });
    expect(detail.body.rows.length).toBeGreaterThan(0);
  });
});
