/**
 * The one error type of the API. Every failure reaches the client as
 * `{ "error": { "code", "message", "details"? } }` with the status carried here.
 */
export type ErrorDetail = { path?: string; row?: number; column?: string; field?: string; code?: string; message: string };

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: ErrorDetail[] | Record<string, unknown>,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const badRequest = (message: string, details?: AppError['details']) => new AppError(400, 'bad_request', message, details);
export const unauthorized = (message = 'Sign in to continue.') => new AppError(401, 'unauthorized', message);
export const forbidden = (message = 'Your roles do not allow this.') => new AppError(403, 'forbidden', message);
export const notFound = (what: string) => new AppError(404, 'not_found', `${what} was not found.`);
export const conflict = (message: string, details?: AppError['details']) => new AppError(409, 'conflict', message, details);
export const unprocessable = (message: string, details?: AppError['details']) => new AppError(422, 'unprocessable', message, details);
