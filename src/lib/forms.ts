import { useEffect } from 'react';
import type { FieldPath, FieldValues, UseFormSetError } from 'react-hook-form';
import { ApiError, type ApiErrorDetail } from './api-client';

/**
 * A refused request (400/422) puts each `details[].field` the form has beside that field, with setError;
 * returns the details it could not place, for the message under the form.
 * `placeOf` maps an API field path to the form's path (null: not a field of this form).
 */
export function useServerFieldErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  placeOf: (field: string) => FieldPath<T> | null,
): ApiErrorDetail[] {
  const refused = error instanceof ApiError && (error.status === 400 || error.status === 422);
  const details = refused ? (error.details ?? []) : [];
  const placed = details.map((d) => (d.field ? placeOf(d.field) : null));
  useEffect(() => {
    details.forEach((d, k) => {
      const path = placed[k];
      if (path) setError(path, { type: 'server', message: d.message });
    });
    // Only a new refusal places messages; the arrays are derived from it.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [error, setError]);
  // What is left for the message under the form (not what only repeats that message).
  return details.filter((d, k) => !placed[k] && !(error as ApiError).message.includes(d.message));
}

/** `placeOf` for a flat form whose fields carry the API's names. */
export const sameNames =
  <N extends string>(names: readonly N[]) =>
  (field: string): N | null =>
    (names as readonly string[]).includes(field) ? (field as N) : null;

/** aria attributes tying a control to its message (the Field component gives the message the id `${id}-error`). */
export const invalidProps = (id: string, message: string | undefined) => ({
  'aria-invalid': message ? true : undefined,
  'aria-describedby': message ? `${id}-error` : undefined,
});

/** A number as typed ('2,5' is 2.5); undefined for empty text, NaN for text that is no number (the request schema refuses it). */
export const decimalOf = (s: string): number | undefined => (s.trim() === '' ? undefined : Number(s.trim().replace(',', '.')));

/** A schema message ("a review needs a comment") written as a sentence ("A review needs a comment."), where a form shows it so. */
export const asSentence = (message: string | undefined) =>
  message ? `${message[0].toUpperCase()}${message.slice(1)}${/[.!?]$/.test(message) ? '' : '.'}` : undefined;

/** The first message in a field's error, also where a schema complained about one item of it (`rows.2`). */
export function firstMessage(error: unknown): string | undefined {
  if (!error || typeof error !== 'object') return undefined;
  const e = error as { message?: unknown };
  if (typeof e.message === 'string') return e.message;
  for (const v of Object.values(error)) {
    const m = v && typeof v === 'object' && !('nodeType' in v) ? firstMessage(v) : undefined;
    if (m) return m;
  }
  return undefined;
}
