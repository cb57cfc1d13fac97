import express from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { sendView } from './respond';

const widgetView = z.strictObject({ id: z.number().int(), nameText: z.string(), sizes: z.array(z.strictObject({ lengthM: z.number() })) });

/** A bare app with one route answering `body` through sendView; no database needed. */
function appAnswering(body: unknown, checkResponses: boolean) {
  const app = express();
  app.locals.checkResponses = checkResponses;
  app.get('/widget', (_req, res) => sendView(res, widgetView, body as z.input<typeof widgetView>, 201));
  return app;
}

describe('sendView', () => {
  it('sends a body that keeps its contract with the given status', async () => {
    const body = { id: 1, nameText: 'Quillmoor gauge', sizes: [{ lengthM: 0.5 }] };
    const res = await request(appAnswering(body, true)).get('/widget');
    expect(res.status).toBe(201);
    expect(res.body).toEqual(body);
  });

  it('answers 500 response_contract for an extra field, naming it', async () => {
    const res = await request(appAnswering({ id: 1, nameText: 'x', sizes: [], name_text: 'x' }, true)).get('/widget?secret=1');
    expect(res.status).toBe(500);
    expect(res.body.error.code).toBe('response_contract');
    expect(res.body.error.message).toContain('GET /widget does not match');
    expect(res.body.error.message).not.toContain('secret');
    expect(res.body.error.details).toEqual([
      expect.objectContaining({ path: '(body)', code: 'unrecognized_keys', message: expect.stringContaining('name_text') }),
    ]);
  });

  it('answers 500 for a missing or mistyped nested field, with its path', async () => {
    const res = await request(appAnswering({ id: 1, sizes: [{ lengthM: '0.5' }] }, true)).get('/widget');
    expect(res.status).toBe(500);
    expect(res.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual(['nameText', 'sizes.0.lengthM']);
  });

  it('sends the body unchecked when response checking is off (production default)', async () => {
    const drifted = { id: 1, extra: true };
    const res = await request(appAnswering(drifted, false)).get('/widget');
    expect(res.status).toBe(201);
    expect(res.body).toEqual(drifted);
  });
});
