import type { Request } from 'express';
import { z } from 'zod';
import { fieldLabel } from '../../shared/schemas/field-labels';
import { withNewFieldNames } from '../../shared/schemas/old-names';
import { AppError } from './errors';

/** zod's own wording ("Invalid input: expected number, received string") made plain; our own messages pass through. */
function plainMessage(message: string): string {
  const expected = /^Invalid input: expected (\w+), received (\w+)$/.exec(message);
  if (expected)
    return expected[2] === 'undefined'
      ? 'this is required'
      : `give ${expected[1] === 'number' ? 'a number' : expected[1] === 'string' ? 'text' : expected[1] === 'array' ? 'a list' : expected[1] === 'boolean' ? 'yes or no' : `a value of type ${expected[1]}`}`;
  const unknownKeys = /^Unrecognized keys?: (.+)$/.exec(message);
  if (unknownKeys) return `this request does not take ${unknownKeys[1]}`;
  return message.replace(/\.$/, '');
}

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
  // The message names the field as the form labels it; `details` keep the API paths for the client to place them.
  const where = first.field === part ? (part === 'body' ? 'The request' : 'The address') : fieldLabel(first.field);
  const more = details.length > 1 ? ` (and ${details.length - 1} more problem${details.length > 2 ? 's' : ''})` : '';
  throw new AppError(
    400,
    'validation_failed',
    `${where}: ${plainMessage(first.message)}${more}.`,
    details.map((d) => ({ ...d, label: d.field === part ? null : fieldLabel(d.field) })),
  );
}

/** Old field names the schema declares (shared/schemas/old-names.ts) are read as their new names. */
export const validBody = <S extends z.ZodType>(schema: S, req: Request) => parsePart(schema, withNewFieldNames(schema, req.body), 'body');
export const validQuery = <S extends z.ZodType>(schema: S, req: Request) => parsePart(schema, req.query, 'query');
export const validParams = <S extends z.ZodType>(schema: S, req: Request) => parsePart(schema, req.params, 'params');

/** Route ids are positive integers. */
export const idParams = z.object({ id: z.coerce.number().int().positive() });
