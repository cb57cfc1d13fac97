import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EMAIL, startTestApp, TEST_PASSWORD, type TestApp } from './test-app';

/** Every refusal is the one error shape, never a 500, and nothing unexpected reached the server log. */
function expectClientError(res: { status: number; body: { error?: { code?: unknown; message?: unknown } } }, statuses: number[]) {
  expect(statuses, JSON.stringify(res.body)).toContain(res.status);
  expect(typeof res.body.error?.code).toBe('string');
  expect(typeof res.body.error?.message).toBe('string');
}

describe('Origin check and forwarding headers without TRUST_PROXY', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());
  const host = () => new URL(t.baseUrl).host;

  it('ignores X-Forwarded-Host: a foreign Origin naming the forwarded host is refused', async () => {
    const res = await t
      .client()
      .post('/api/auth/login')
      .set('Origin', 'https://evil.example')
      .set('X-Forwarded-Host', 'evil.example')
      .set('X-Forwarded-Proto', 'https')
      .send({ email: EMAIL.admin, password: TEST_PASSWORD });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('origin_rejected');
  });

  it('refuses https://host on an http server, and another port of the same host', async () => {
    for (const origin of [`https://${host()}`, `http://127.0.0.1:1`, 'null']) {
      const res = await t.client().post('/api/auth/login').set('Origin', origin).send({ email: EMAIL.admin, password: TEST_PASSWORD });
      expect(res.status, origin).toBe(403);
    }
    expect((await t.client().post('/api/auth/login').send({ email: EMAIL.admin, password: TEST_PASSWORD })).status).toBe(200);
  });

  it('marks every API answer Cache-Control: no-store (reads, errors, exports)', async () => {
    const consumer = await t.signIn(EMAIL.consumer);
    for (const p of ['/api/health', '/api/me', '/api/catalog', '/api/no-such-route']) {
      expect((await consumer.get(p)).headers['cache-control'], p).toBe('no-store');
    }
    expect((await t.client().get('/api/me')).headers['cache-control']).toBe('no-store');
  });
});

describe('Origin check behind a trusted proxy (TRUST_PROXY=loopback)', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp({ TRUST_PROXY: 'loopback' });
  });
  afterAll(() => t.close());

  it('uses X-Forwarded-Host and X-Forwarded-Proto from the trusted proxy, scheme included', async () => {
    const viaProxy = (origin: string) =>
      t
        .client()
        .post('/api/auth/login')
        .set('Origin', origin)
        .set('X-Forwarded-Host', 'epsigma.quillmoor.example')
        .set('X-Forwarded-Proto', 'https')
        .send({ email: EMAIL.admin, password: TEST_PASSWORD });
    expect((await viaProxy('https://epsigma.quillmoor.example')).status).toBe(200);
    expect((await viaProxy('http://epsigma.quillmoor.example')).status).toBe(403);
    expect((await viaProxy(t.baseUrl)).status).toBe(403);
  });
});

describe('malformed requests answer 400/415 in the error shape, never 500', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());
  const noUnexpected = () => expect(t.logs.filter((l) => l.includes('unexpected error'))).toEqual([]);

  it.each(['gzip', 'deflate', 'br', 'bogus', 'gzip, identity'])('JSON with Content-Encoding: %s but a plain body', async (encoding) => {
    const res = await t
      .client()
      .post('/api/auth/login')
      .set('Content-Type', 'application/json')
      .set('Content-Encoding', encoding)
      .send(JSON.stringify({ email: EMAIL.admin, password: 'x' }));
    expectClientError(res, [400, 415]);
    noUnexpected();
  });

  it.each(['latin1', 'iso-8859-1', 'bogus'])('JSON with charset=%s', async (charset) => {
    const res = await t
      .client()
      .post('/api/auth/login')
      .set('Content-Type', `application/json; charset=${charset}`)
      .send(JSON.stringify({ email: EMAIL.admin, password: 'x' }));
    expectClientError(res, [415]);
    expect(res.body.error.code).toBe('unsupported_charset');
    noUnexpected();
  });

  describe('multipart uploads', () => {
    let modeller: Awaited<ReturnType<TestApp['signIn']>>;
    beforeAll(async () => {
      modeller = await t.signIn(EMAIL.modeller);
    });
    const part = (boundary: string) =>
      `--${boundary}\r\nContent-Disposition: form-data; name="substanceId"\r\n\r\n1\r\n--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="b2.csv"\r\nContent-Type: text/csv\r\n\r\nT (K),B2 (cm3/mol)\r\n300,-20\r\n`;
    const cases: Array<[string, string, string]> = [
      ['no boundary', 'multipart/form-data', part('x') + '--x--\r\n'],
      ['an empty boundary', 'multipart/form-data; boundary=', '--\r\n'],
      ['a truncated body', 'multipart/form-data; boundary=quill', part('quill').slice(0, 150)],
      ['a body cut after a part', 'multipart/form-data; boundary=quill', part('quill')],
      [
        'malformed part headers',
        'multipart/form-data; boundary=quill',
        '--quill\r\nContent-Disposition form-data name=file\r\n\u0000\u0001garbage\r\n\r\nabc\r\n--quill--\r\n',
      ],
      [
        'a part without Content-Disposition',
        'multipart/form-data; boundary=quill',
        '--quill\r\nContent-Type: text/csv\r\n\r\nT (K)\r\n--quill--\r\n',
      ],
    ];
    it.each(cases)('POST /api/measurement-sets with %s', async (_label, contentType, body) => {
      const res = await modeller.post('/api/measurement-sets').set('Content-Type', contentType).send(body);
      expectClientError(res, [400, 413, 415, 422]);
      noUnexpected();
    });
    it.each(cases)('POST /api/measurement-sets/:id/versions with %s', async (_label, contentType, body) => {
      const res = await modeller.post('/api/measurement-sets/1/versions').set('Content-Type', contentType).send(body);
      expectClientError(res, [400, 404, 413, 415, 422]);
      noUnexpected();
    });
  });
});
