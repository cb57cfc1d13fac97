import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EMAIL, startTestApp, TEST_PASSWORD, type TestApp } from './test-app';

/**
 * Malformed bodies, encodings and content types sent to every write route the app serves (found by walking its
 * router, so new routes are covered without editing this file), as a person holding every role so the request
 * gets past the role checks to the body. Nothing may answer 5xx, every refusal is the one error shape, and the
 * server log shows no unexpected error.
 */
const ALL_ROLES = 'fuzz.all-roles@quillmoor.example';

interface Case {
  name: string;
  contentType?: string;
  headers?: Record<string, string>;
  body: string | Buffer;
}

const deep = '['.repeat(5000) + ']'.repeat(5000);
const CASES: Case[] = [
  { name: 'broken JSON', contentType: 'application/json', body: '{"name":' },
  { name: 'JSON claiming gzip', contentType: 'application/json', headers: { 'Content-Encoding': 'gzip' }, body: '{"name":"x"}' },
  { name: 'JSON claiming deflate', contentType: 'application/json', headers: { 'Content-Encoding': 'deflate' }, body: '{"name":"x"}' },
  { name: 'JSON claiming br', contentType: 'application/json', headers: { 'Content-Encoding': 'br' }, body: '{"name":"x"}' },
  {
    name: 'JSON with an unknown encoding',
    contentType: 'application/json',
    headers: { 'Content-Encoding': 'bogus' },
    body: '{"name":"x"}',
  },
  { name: 'JSON in latin1', contentType: 'application/json; charset=latin1', body: '{"name":"caf\u00e9"}' },
  { name: 'a JSON array', contentType: 'application/json', body: '[1,2,3]' },
  { name: 'JSON null', contentType: 'application/json', body: 'null' },
  { name: 'prototype keys', contentType: 'application/json', body: '{"__proto__":{"admin":true},"constructor":{"prototype":{}}}' },
  {
    name: 'every field the wrong type',
    contentType: 'application/json',
    body: '{"id":"x","name":{},"email":[],"password":1,"reason":null,"roles":"admin","measurementSets":{"0":1},"fitId":"1","sets":true,"substanceId":-1,"molarMass":"1e999"}',
  },
  {
    name: 'huge numbers and strings',
    contentType: 'application/json',
    body: JSON.stringify({ name: 'x'.repeat(100_000), molarMass: 1e308, epsilonK: -1e308, fitId: 2 ** 60 }),
  },
  { name: 'deeply nested JSON', contentType: 'application/json', body: deep },
  {
    name: 'invalid UTF-8',
    contentType: 'application/json',
    body: Buffer.from([0x7b, 0x22, 0x6e, 0x22, 0x3a, 0x22, 0xff, 0xfe, 0x22, 0x7d]),
  },
  { name: 'plain text', contentType: 'text/plain', body: 'hello' },
  { name: 'a form', contentType: 'application/x-www-form-urlencoded', body: 'name=x&molarMass=1' },
  { name: 'XML', contentType: 'application/xml', body: '<a>1</a>' },
  {
    name: 'multipart without a boundary',
    contentType: 'multipart/form-data',
    body: '--x\r\nContent-Disposition: form-data; name="a"\r\n\r\n1\r\n--x--\r\n',
  },
  {
    name: 'truncated multipart',
    contentType: 'multipart/form-data; boundary=q',
    body: '--q\r\nContent-Disposition: form-data; name="file"; filename="a.csv"\r\nContent-Type: text/csv\r\n\r\nT (K),B2',
  },
  {
    name: 'multipart with broken part headers',
    contentType: 'multipart/form-data; boundary=q',
    body: '--q\r\n\u0000garbage\r\n\r\nabc\r\n--q--\r\n',
  },
  { name: 'no content type', body: '{"name":"x"}' },
];

let t: TestApp;
let agent: Awaited<ReturnType<TestApp['signIn']>>;
let writeRoutes: Array<{ method: string; path: string }> = [];

beforeAll(async () => {
  t = await startTestApp();
  const admin = await t.signIn(EMAIL.admin);
  const made = await admin
    .post('/api/people')
    .send({ email: ALL_ROLES, name: 'Fuzz All-Roles', roles: ['admin', 'modeller', 'reviewer', 'consumer'], password: TEST_PASSWORD });
  expect(made.status).toBe(201);
  agent = await t.signIn(ALL_ROLES);
  const found: Array<{ method: string; path: string }> = [];
  const walk = (stack: Array<{ route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: unknown[] } }>) => {
    for (const layer of stack) {
      if (layer.route) for (const method of Object.keys(layer.route.methods)) found.push({ method, path: `/api${layer.route.path}` });
      else if (layer.handle?.stack) walk(layer.handle.stack as typeof stack);
    }
  };
  walk((t.app as unknown as { router: { stack: Parameters<typeof walk>[0] } }).router.stack);
  // Sign-out last: it ends the session the other requests use.
  writeRoutes = found
    .filter((r) => ['post', 'put', 'patch', 'delete'].includes(r.method))
    .map((r) => ({
      method: r.method,
      path: r.path
        .replace(/:version/g, '1')
        .replace(/:name/g, 'x')
        .replace(/:\w+/g, '1'),
    }))
    .sort((a, b) => Number(a.path === '/api/auth/logout') - Number(b.path === '/api/auth/logout'));
});
afterAll(() => t.close());

describe('malformed requests to every write route', () => {
  it('finds the write routes', () => {
    expect(writeRoutes.length).toBeGreaterThan(25);
    expect(writeRoutes).toContainEqual({ method: 'post', path: '/api/measurement-sets' });
  });

  it.each(CASES.map((c) => [c.name, c] as const))('%s: never 5xx, always the error shape', async (_name, c) => {
    const failures: string[] = [];
    for (const { method, path } of writeRoutes) {
      if (path === '/api/auth/logout') continue;
      let req = agent[method as 'post'](path);
      if (c.contentType) req = req.set('Content-Type', c.contentType);
      for (const [k, v] of Object.entries(c.headers ?? {})) req = req.set(k, v);
      const res = await req.send(c.body as string);
      if (res.status >= 500) failures.push(`${method.toUpperCase()} ${path}: ${res.status} ${JSON.stringify(res.body)}`);
      else if (res.status >= 400 && (typeof res.body?.error?.code !== 'string' || typeof res.body?.error?.message !== 'string'))
        failures.push(`${method.toUpperCase()} ${path}: ${res.status} without the error shape`);
    }
    expect(failures).toEqual([]);
    expect(t.logs.filter((l) => l.includes('unexpected error'))).toEqual([]);
    // Still signed in: none of it ended or broke the session.
    expect((await agent.get('/api/me')).status).toBe(200);
  });

  it('sign-out with a malformed body still answers in the error shape or signs out', async () => {
    const res = await agent
      .post('/api/auth/logout')
      .set('Content-Type', 'application/json')
      .set('Content-Encoding', 'gzip')
      .send('{"x":1}');
    expect(res.status).toBeLessThan(500);
  });
});
