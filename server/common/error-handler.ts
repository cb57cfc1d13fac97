import type { ErrorRequestHandler, RequestHandler } from 'express';
import { AppError } from './errors';

/** Answers unknown /api routes with the same error shape as everything else. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError(404, 'not_found', `No API route ${req.method} ${req.path}.`));
};

/** An http-errors style error (body-parser's) with a 4xx status meant to be shown to the client. */
function isClientHttpError(err: unknown): err is { status: number; message: string } {
  const e = err as { status?: unknown; expose?: unknown } | null;
  return typeof e?.status === 'number' && e.status >= 400 && e.status < 500 && e.expose !== false;
}

/**
 * The single error handler: maps known failures to their status and never leaks a stack trace.
 * Unexpected errors are logged on the server (message and stack only; never request bodies).
 */
export function createErrorHandler(log: (msg: string) => void): ErrorRequestHandler {
  return (err, _req, res, _next) => {
    let error: AppError;
    if (err instanceof AppError) {
      error = err;
    } else if (err?.type === 'entity.parse.failed') {
      error = new AppError(400, 'invalid_json', 'The request body is not valid JSON.');
    } else if (err?.type === 'entity.too.large') {
      error = new AppError(413, 'payload_too_large', 'The request body is too large.');
    } else if (err?.type === 'encoding.unsupported') {
      error = new AppError(
        415,
        'unsupported_encoding',
        "The request body's Content-Encoding is not supported; send it uncompressed or as gzip, deflate or br.",
        [{ field: 'Content-Encoding', message: 'use identity, gzip, deflate or br' }],
      );
    } else if (err?.type === 'charset.unsupported') {
      error = new AppError(415, 'unsupported_charset', 'JSON bodies must be UTF-8 (Content-Type: application/json; charset=utf-8).', [
        { field: 'Content-Type', message: 'use charset=utf-8' },
      ]);
    } else if (isClientHttpError(err)) {
      // Other body-reading failures (a body that is not the gzip/deflate/br it claims, an aborted upload, a
      // wrong length): the client's fault, answered as such instead of a 500.
      error = new AppError(
        err.status,
        err.status === 415 ? 'unsupported_media_type' : 'unreadable_body',
        `The request body cannot be read (${err.message}).`,
      );
    } else if (err?.name === 'MulterError') {
      error =
        err.code === 'LIMIT_FILE_SIZE'
          ? new AppError(413, 'file_too_large', 'The file is over the upload size limit.', [
              { field: err.field ?? 'file', message: 'file over the size limit' },
            ])
          : new AppError(400, 'bad_upload', `Upload rejected: ${err.message}.`, [{ field: err.field ?? 'file', message: err.message }]);
    } else {
      log(`unexpected error: ${err instanceof Error ? `${err.message}\n${err.stack}` : String(err)}`);
      error = new AppError(500, 'internal_error', 'Something went wrong on the server. The error was logged.');
    }
    res.status(error.status).json({
      error: { code: error.code, message: error.message, ...(error.details ? { details: error.details } : {}) },
    });
  };
}
