import type { Response } from 'express';
import type { z } from 'zod';

/**
 * Answers `body` as JSON with `status`. When response checking is on (`CHECK_RESPONSES=1`, set for the API and browser
 * tests, off in production by default) the body is first parsed with its contract from shared/contracts: a body that
 * drifted from it (a field missing, extra or of another type) answers 500 `response_contract` with one detail per
 * problem, so every test that calls a route also checks its answer. The body is sent as it is, not the parsed copy.
 */
export function sendView<S extends z.ZodType>(res: Response, schema: S, body: z.input<S>, status = 200): void {
  if (res.app.locals.checkResponses === true) {
    const parsed = schema.safeParse(body);
    if (!parsed.success) {
      const details = parsed.error.issues.map((issue) => ({
        path: issue.path.map(String).join('.') || '(body)',
        code: issue.code,
        message: 'keys' in issue && Array.isArray(issue.keys) ? `${issue.message}: ${issue.keys.join(', ')}` : issue.message,
      }));
      res.status(500).json({
        // The path without its query string: queries may carry secrets.
        error: {
          code: 'response_contract',
          message: `The answer of ${res.req.method} ${res.req.originalUrl.split('?')[0]} does not match its contract (${details.length} problem${details.length === 1 ? '' : 's'}).`,
          details,
        },
      });
      return;
    }
  }
  res.status(status).json(body);
}
