import type { Request } from 'express';
import { z } from 'zod';
import { AppError } from './errors';

/** Parses one part of a request with its zod schema; a mismatch answers 400 with one detail per field. */
function parsePart<S extends z.ZodType>(schema: S, value: unknown, part: 'body' | 'query' | 'params'): z.infer<S> {
  const result = schema.safeParse(value ?? {});
  if (result.success) return result.data;
  const details = result.error.issues.map((issue) => ({
    path: [part, ...issue.path.map(String)].join('.'),
    field: issue.path.map(String).join('.') || part,
    code: issue.code,
    message: issue.message,
  }));
  const first = details[0];
  throw new AppError(400, 'validation_failed', `Invalid ${part}: ${first.field} — ${first.message}`, details);
}

export const validBody = <S extends z.ZodType>(schema: S, req: Request) => parsePart(schema, req.body, 'body');
export const validQuery = <S extends z.ZodType>(schema: S, req: Request) => parsePart(schema, req.query, 'query');
export const validParams = <S extends z.ZodType>(schema: S, req: Request) => parsePart(schema, req.params, 'params');

/** Route ids are positive integers. */
export const idParams = z.object({ id: z.coerce.number().int().positive() });
