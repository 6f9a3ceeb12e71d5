import type { z } from 'zod';
import type { ErrorBody } from '#shared/schemas/common';

/** Every failed API call becomes one of these, with a message fit to show a person. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly issues?: { path: string; message: string }[],
  ) {
    super(message);
  }
}

interface RequestOptions<T> {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  /** Sent as JSON; a Blob (a chosen file) is sent as it is, streamed by the browser. */
  body?: unknown;
  schema?: z.ZodType<T>;
  signal?: AbortSignal;
}

/**
 * Our error body, read without zod: the first screen ships without the schema library, which
 * loads with the screens that need it (P2, P4).
 */
export function readErrorBody(data: unknown): ErrorBody['error'] | null {
  const error = (data as { error?: unknown } | null)?.error as Partial<ErrorBody['error']> | undefined;
  if (!error || typeof error.code !== 'string' || typeof error.message !== 'string') return null;
  return { code: error.code, message: error.message, issues: Array.isArray(error.issues) ? error.issues : undefined };
}

/** The one place fetch is called: our CSRF header, typed errors for failures. */
async function send(path: string, { method = 'GET', body, signal }: RequestOptions<unknown>, accept: string): Promise<Response> {
  let res: Response;
  try {
    res = await fetch(`/api${path}`, {
      method,
      credentials: 'same-origin',
      headers: {
        Accept: accept,
        'X-Rackside-Client': '1',
        ...(body === undefined ? {} : { 'Content-Type': 'application/json' }),
      },
      body: body === undefined ? undefined : body instanceof Blob ? body : JSON.stringify(body),
      signal,
    });
  } catch (err) {
    if (signal?.aborted) throw err;
    throw new ApiError(
      0,
      'offline',
      'No connection to Rackside right now. Check your signal and try again.',
    );
  }
  if (!res.ok) {
    const error = readErrorBody(await res.json().catch(() => null));
    if (error) throw new ApiError(res.status, error.code, error.message, error.issues);
    throw new ApiError(
      res.status,
      `http_${res.status}`,
      `Rackside answered with an error (${res.status}). Try again.`,
    );
  }
  return res;
}

/** JSON in and out, checked against a schema when one is given. */
export async function apiRequest<T = void>(
  path: string,
  options: RequestOptions<T> = {},
): Promise<T> {
  const res = await send(path, options as RequestOptions<unknown>, 'application/json');
  if (res.status === 204) return undefined as T;
  const data: unknown = await res.json().catch(() => null);
  return options.schema ? options.schema.parse(data) : (data as T);
}

/** A file the server makes (a PDF), as a Blob. */
export async function apiDownload(path: string, options: Omit<RequestOptions<unknown>, 'schema'>, accept: string): Promise<Blob> {
  return (await send(path, options, accept)).blob();
}
