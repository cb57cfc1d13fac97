/** The API's error shape, `{ error: { code, message, details? } }`, as a thrown value. */
export interface ApiErrorDetail {
  path?: string;
  row?: number;
  column?: string;
  field?: string;
  /** The field as the form labels it (the server's words for it). */
  label?: string;
  code?: string;
  message: string;
}

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: ApiErrorDetail[],
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

type RequestOptions = { method?: string; body?: unknown; formData?: FormData; signal?: AbortSignal };

/** One fetch wrapper for every call: same-origin cookies, JSON in and out, errors as ApiError. */
export async function api<T>(path: string, options: RequestOptions = {}): Promise<T> {
  const headers: Record<string, string> = { accept: 'application/json' };
  let body: BodyInit | undefined;
  if (options.formData) body = options.formData;
  else if (options.body !== undefined) {
    headers['content-type'] = 'application/json';
    body = JSON.stringify(options.body);
  }
  let response: Response;
  try {
    response = await fetch(`/api${path}`, {
      method: options.method ?? (body ? 'POST' : 'GET'),
      headers,
      body,
      credentials: 'same-origin',
      signal: options.signal,
    });
  } catch (err) {
    if ((err as Error).name === 'AbortError') throw err;
    throw new ApiError(0, 'network_error', 'The server cannot be reached. Check your connection and try again.');
  }
  if (response.status === 204) return undefined as T;
  const text = await response.text();
  const data = text ? safeJson(text) : undefined;
  if (!response.ok) {
    const e = (data as { error?: { code?: string; message?: string; details?: ApiErrorDetail[] } })?.error;
    throw new ApiError(
      response.status,
      e?.code ?? 'http_error',
      e?.message ?? `The server answered ${response.status}.`,
      Array.isArray(e?.details) ? e.details : undefined,
    );
  }
  return data as T;
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}

export const isApiError = (e: unknown, status?: number): e is ApiError =>
  e instanceof ApiError && (status === undefined || e.status === status);

/**
 * One detail of a refused request in plain words: the field as the form labels it (or the row), then the problem.
 * Internal paths such as "validity.temperatureMaxK" are never shown.
 */
export function detailText(d: ApiErrorDetail): string {
  const label = d.label ?? (d.row !== undefined ? `Row ${d.row}${d.column ? `, ${d.column}` : ''}` : undefined);
  return label && !d.message.startsWith(label) ? `${label}: ${d.message}` : d.message;
}

/** The details worth listing under an error's message (none that only repeat it). */
export const detailsOf = (error: unknown): ApiErrorDetail[] =>
  error instanceof ApiError ? (error.details ?? []).filter((d) => !error.message.includes(d.message)) : [];
