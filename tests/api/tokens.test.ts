import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { TOKEN_ROUTES } from '../../server/features/tokens/token-routes';
import { approvedSet, newSubstance } from './approved-set';
import { EMAIL, startTestApp, type TestApp } from './test-app';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

let t: TestApp;
let consumer: Agent;
let modeller: Agent;
let setId: number;
let otherSetId: number;
let token: string;
let tokenId: number;

const bearer = (secret: string) => ({ Authorization: `Bearer ${secret}` });
/** SHA-256 (FIPS 180-4) of the secret in base64url (RFC 4648 §5), computed here independently of the server. */
const sha256b64url = (s: string) => createHash('sha256').update(s).digest('base64url');

beforeAll(async () => {
  t = await startTestApp();
  consumer = await t.signIn(EMAIL.consumer);
  modeller = await t.signIn(EMAIL.modeller);
  const reviewer = await t.signIn(EMAIL.reviewer);
  const substanceId = await newSubstance(modeller, 'Tokenium', 20.18);
  setId = (
    await approvedSet(
      t,
      { modeller, reviewer },
      { substanceId, epsilonK: 40, sigmaAngstrom: 2.8, temperaturesK: Array.from({ length: 12 }, (_, i) => 60 + 30 * i) },
    )
  ).setId;
  const other = await newSubstance(modeller, 'Othertokenium', 28);
  otherSetId = (await approvedSet(t, { modeller, reviewer }, { substanceId: other, epsilonK: 95, sigmaAngstrom: 3.7 })).setId;
  const created = await consumer.post('/api/tokens').send({ name: 'Nightly simulation setup' });
  expect(created.status).toBe(201);
  token = created.body.token;
  tokenId = created.body.id;
}, 120_000);
afterAll(() => t.close());

describe('creating and listing tokens', () => {
  it('shows a 256-bit base64url secret once; lists never show it; the database keeps only its SHA-256', async () => {
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    const list = await consumer.get('/api/tokens');
    expect(list.status).toBe(200);
    expect(list.body.tokens[0]).toMatchObject({ id: tokenId, name: 'Nightly simulation setup', prefix: token.slice(0, 8), active: true });
    expect(JSON.stringify(list.body)).not.toContain(token);
    expect(Object.keys(list.body.tokens[0])).not.toEqual(expect.arrayContaining(['token']));
    expect(JSON.stringify(list.body)).not.toMatch(/hash/i);
    const row = await t.ctx.db.selectFrom('apiToken').selectAll().where('id', '=', tokenId).executeTakeFirstOrThrow();
    expect(row.tokenHash).toBe(sha256b64url(token));
    // The secret is nowhere in the database: not in the token row, not in the audit trail.
    const audit = await t.ctx.db.selectFrom('auditEvent').selectAll().where('targetType', '=', 'apiToken').execute();
    expect(audit.map((a) => a.action)).toContain('token.created');
    expect(JSON.stringify([row, audit])).not.toContain(token);
    // Each person sees only their own tokens.
    expect((await modeller.get('/api/tokens')).body.tokens).toEqual([]);
  });

  it('route family: 401 without a session, 400 per field', async () => {
    expect((await t.client().post('/api/tokens').send({ name: 'x' })).status).toBe(401);
    expect((await t.client().get('/api/tokens')).status).toBe(401);
    expect((await t.client().delete(`/api/tokens/${tokenId}`)).status).toBe(401);
    const bad = await consumer.post('/api/tokens').send({ name: '   ', scope: 'write' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.map((d: { field: string }) => d.field)).toEqual(expect.arrayContaining(['name']));
    expect((await consumer.delete('/api/tokens/abc')).status).toBe(400);
  });
});

describe('using a token', () => {
  it('reads the catalog, cards, exports, mixtures, schemas and the OpenAPI document, and records its use', async () => {
    const c = t.client();
    const catalog = await c.get('/api/catalog').set(bearer(token));
    expect(catalog.status).toBe(200);
    expect(catalog.body.sets.map((s: { id: number }) => s.id)).toEqual(expect.arrayContaining([setId, otherSetId]));
    expect((await c.get(`/api/catalog/${setId}`).set(bearer(token))).status).toBe(200);
    const file = await c.get(`/api/parameter-sets/${setId}/export?format=gromacs`).set(bearer(token));
    expect(file.status).toBe(200);
    expect(file.headers['content-disposition']).toMatch(/^attachment/);
    expect((await c.get(`/api/mixtures?sets=${setId},${otherSetId}&rule=lorentz-berthelot`).set(bearer(token))).status).toBe(200);
    expect((await c.get('/api/schemas/mixture-1.json').set(bearer(token))).status).toBe(200);
    expect((await c.get('/api/openapi.json').set(bearer(token))).status).toBe(200);
    const row = await t.ctx.db.selectFrom('apiToken').select('lastUsedAt').where('id', '=', tokenId).executeTakeFirstOrThrow();
    expect(row.lastUsedAt).not.toBeNull();
    expect((await consumer.get('/api/tokens')).body.tokens[0].lastUsedAt).toEqual(row.lastUsedAt);
  });

  it('is refused (403) on every other route and on every write, even with a matching Origin', async () => {
    const c = t.client(); // sends this site's Origin header
    const reads = [
      '/api/me',
      '/api/tokens',
      '/api/me/preferences',
      '/api/substances',
      `/api/parameter-sets/${setId}`,
      '/api/fits/1',
      '/api/audit',
      '/api/review-queue',
      '/api/health',
      '/api/no-such-route',
    ];
    for (const path of reads) {
      const res = await c.get(path).set(bearer(token));
      expect(res.status, path).toBe(403);
    }
    const writes: Array<[string, string, object?]> = [
      ['post', '/api/tokens', { name: 'escalate' }],
      ['delete', `/api/tokens/${tokenId}`],
      ['put', '/api/me/preferences', { energyUnit: 'eV' }],
      ['post', '/api/substances', { name: 'Injected', molarMassGPerMol: 10 }],
      ['post', `/api/parameter-sets/${setId}/retire`, { reason: 'by token' }],
      // Even a write to an allowed path.
      ['post', '/api/catalog', {}],
      ['post', '/api/auth/logout'],
    ];
    for (const [method, path, body] of writes) {
      const req = (c as unknown as Record<string, (p: string) => ReturnType<typeof c.get>>)[method](path).set(bearer(token));
      const res = await (body ? req.send(body) : req);
      expect(res.status, `${method} ${path}`).toBe(403);
    }
    // Nothing was changed by any of them.
    expect((await consumer.get('/api/tokens')).body.tokens).toHaveLength(1);
    expect((await consumer.get('/api/me/preferences')).body.energyUnit).toBe('K');
    expect((await consumer.get(`/api/catalog/${setId}`)).body.state).toBe('approved');
  });

  it('judges the path spellings Express also routes (any case, trailing slash) the same way', async () => {
    const c = t.client();
    for (const path of ['/api/CATALOG', '/api/catalog/', `/api/Parameter-Sets/${setId}/Export?format=csv`])
      expect((await c.get(path).set(bearer(token))).status, path).toBe(200);
    for (const path of ['/api/Tokens', '/api/tokens/', '/api/ME/preferences', `/api/parameter-sets/${setId}/`, '/api/catalog/1/comments'])
      expect((await c.get(path).set(bearer(token))).status, path).toBe(403);
    expect((await c.head('/api/catalog').set(bearer(token))).status).toBe(200);
  });

  it('the allow-list is only the read routes of the catalog, export, mixtures, schemas and OpenAPI', () => {
    expect(TOKEN_ROUTES.map((r) => r.route)).toEqual([
      'GET /api/catalog',
      'GET /api/catalog/:id',
      'GET /api/parameter-sets/:id/export',
      'GET /api/mixtures',
      'GET /api/parameter-sets/:id/predictions',
      'GET /api/schemas/:name',
      'GET /api/openapi.json',
    ]);
  });

  it('a token never borrows a session: with an admin cookie beside it, the request is the token owner’s', async () => {
    const admin = await t.signIn(EMAIL.admin);
    // /api/audit is the admin's page; with the token attached it is refused as a token request.
    expect((await admin.get('/api/audit')).status).toBe(200);
    expect((await admin.get('/api/audit').set(bearer(token))).status).toBe(403);
  });

  it('unknown or malformed tokens get 401 with a WWW-Authenticate challenge', async () => {
    const c = t.client();
    const unknown = await c.get('/api/catalog').set(bearer('A'.repeat(43)));
    expect(unknown.status).toBe(401);
    expect(unknown.headers['www-authenticate']).toMatch(/^Bearer/);
    expect((await c.get('/api/catalog').set({ Authorization: 'Bearer' })).status).toBe(401);
    expect((await c.get('/api/catalog').set({ Authorization: 'Bearer not a token!' })).status).toBe(401);
  });

  it('the secret never reaches the server log', () => {
    expect(t.logs.length).toBeGreaterThan(0);
    expect(t.logs.join('\n')).not.toContain(token);
  });
});

describe('revoking', () => {
  it('only the owner revokes (others get 404); a revoked token gets 401; the revocation is audited once', async () => {
    expect((await modeller.delete(`/api/tokens/${tokenId}`)).status).toBe(404);
    const res = await consumer.delete(`/api/tokens/${tokenId}`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: tokenId, active: false, revokedAt: expect.any(String) });
    expect((await t.client().get('/api/catalog').set(bearer(token))).status).toBe(401);
    expect((await consumer.delete(`/api/tokens/${tokenId}`)).status).toBe(200);
    const audit = await t.ctx.db
      .selectFrom('auditEvent')
      .select('action')
      .where('targetType', '=', 'apiToken')
      .where('targetId', '=', String(tokenId))
      .execute();
    expect(audit.map((a) => a.action).sort()).toEqual(['token.created', 'token.revoked']);
    // The database refuses to bring a revoked token back.
    await expect(t.ctx.db.updateTable('apiToken').set({ revokedAt: null }).where('id', '=', tokenId).execute()).rejects.toThrow(
      /stays revoked/,
    );
  });

  it('a token of a deactivated person stops working', async () => {
    const secret = (await modeller.post('/api/tokens').send({ name: 'modeller script' })).body.token;
    expect((await t.client().get('/api/catalog').set(bearer(secret))).status).toBe(200);
    const admin = await t.signIn(EMAIL.admin);
    const modellerId = (await t.ctx.db.selectFrom('user').select('id').where('email', '=', EMAIL.modeller).executeTakeFirstOrThrow()).id;
    expect((await admin.patch(`/api/people/${modellerId}`).send({ active: false })).status).toBe(200);
    expect((await t.client().get('/api/catalog').set(bearer(secret))).status).toBe(401);
  });
});
