import type { z } from 'zod';
import type { ErrorBody } from '#shared/schemas/common';
import { takeEarlyAnswer } from './early-requests';

/** Every failed API call becomes one of these, with a message fit to show a person. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly issues?: { path: string; message: string }[],
    options?: ErrorOptions,
  ) {
    super(message, options);
  }
}

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  /**
   * Sent as JSON; a Blob (a chosen file) goes as it is, streamed by the browser, and FormData
   * (a photo) as multipart with the browser's own Content-Type.
   */
  body?: unknown;
  signal?: AbortSignal;
  /** The ETag of the copy the caller holds: a 304 means it is still current. */
  ifNoneMatch?: string;
}

/**
 * A shared response schema (`shared/schemas`). Named by type only: zod loads with the screens
 * that need it, never with the first one (P2, P4), so the first screen's calls import theirs.
 */
export type ResponseSchema<T> = z.ZodType<T>;

/**
 * A schema, or a loader of one that runs only once an answer has come: with no signal the
 * request fails at once, and setting up zod's schemas first would hold the offline screen (P2).
 */
export type SchemaSource<T> = ResponseSchema<T> | (() => Promise<ResponseSchema<T>>);

const OFFLINE = 'No connection to Rackside right now. Check your signal and try again.';
/** The usual cause is an app older than its server (a phone that kept last week's copy). */
const UNREADABLE =
  'Rackside sent an answer this app could not read. Reload the page, then try again.';

/**
 * Our error body, read without zod: the first screen ships without the schema library, which
 * loads with the screens that need it (P2, P4).
 */
export function readErrorBody(data: unknown): ErrorBody['error'] | null {
  const error = (data as { error?: unknown } | null)?.error as
    Partial<ErrorBody['error']> | undefined;
  if (!error || typeof error.code !== 'string' || typeof error.message !== 'string') return null;
  return {
    code: error.code,
    message: error.message,
    issues: Array.isArray(error.issues) ? error.issues : undefined,
  };
}

/** The one place fetch is called: our CSRF header, and no answer at all as an `offline` error. */
async function send(
  path: string,
  { method = 'GET', body, signal, ifNoneMatch }: RequestOptions,
  accept: string,
): Promise<Response> {
  // The browser knows it has no network at all (navigator.onLine is trustworthy only when false):
  // say so at once rather than after a fetch that must fail, so an offline screen shows its
  // phone's copy as such in the same frame as the copy itself (P2).
  if (typeof navigator !== 'undefined' && navigator.onLine === false)
    throw new ApiError(0, 'offline', OFFLINE);
  const multipart = body instanceof FormData;
  // A plain GET the page already asked for while the app downloaded: that answer, if it came.
  const early =
    method === 'GET' && body === undefined && !ifNoneMatch && !signal?.aborted
      ? takeEarlyAnswer(path)
      : undefined;
  if (early) {
    const answer = await early.catch(() => undefined);
    if (answer) return answer;
  }
  try {
    return await fetch(`/api${path}`, {
      method,
      credentials: 'same-origin',
      headers: {
        Accept: accept,
        'X-Rackside-Client': '1',
        ...(ifNoneMatch ? { 'If-None-Match': ifNoneMatch } : {}),
        ...(body === undefined || multipart ? {} : { 'Content-Type': 'application/json' }),
      },
      body:
        body === undefined
          ? undefined
          : multipart || body instanceof Blob
            ? body
            : JSON.stringify(body),
      signal,
    });
  } catch (err) {
    // The caller's own abort or timeout is theirs to read; anything else is no answer.
    if (signal?.aborted) throw err;
    throw new ApiError(0, 'offline', OFFLINE);
  }
}

/** A failed answer in words: the server's own error body, or a sentence with the status. */
export async function failureOf(res: Response): Promise<ApiError> {
  const error = readErrorBody(await res.json().catch(() => null));
  if (error) return new ApiError(res.status, error.code, error.message, error.issues);
  return new ApiError(
    res.status,
    `http_${res.status}`,
    `Rackside answered with an error (${res.status}). Try again.`,
  );
}

/**
 * JSON mode: the answer checked against its shared schema (204 answers are checked as
 * `undefined`). A failure status throws the server's words; an answer that does not match the
 * schema throws `bad_response`, so a screen shows a sentence rather than breaking on bad data.
 */
export async function apiRequest<T>(
  path: string,
  options: RequestOptions & { schema: SchemaSource<T> },
): Promise<T> {
  const res = await send(path, options, 'application/json');
  if (!res.ok) throw await failureOf(res);
  const schema = typeof options.schema === 'function' ? await options.schema() : options.schema;
  let data: unknown;
  if (res.status !== 204) {
    try {
      data = await res.json();
    } catch (err) {
      throw new ApiError(res.status, 'bad_response', UNREADABLE, undefined, { cause: err });
    }
  }
  const checked = schema.safeParse(data);
  if (!checked.success)
    throw new ApiError(res.status, 'bad_response', UNREADABLE, undefined, { cause: checked.error });
  return checked.data;
}

/**
 * Raw mode: the Response whatever its status, for callers that read the status themselves
 * (the sync engine keeps a batch unless the server gave a verdict on each tap) or a body that
 * is not JSON (a PDF). Throws only when no answer came, or when the caller's signal aborted.
 */
export function apiRaw(
  path: string,
  options: RequestOptions & { accept?: string } = {},
): Promise<Response> {
  return send(path, options, options.accept ?? 'application/json');
}
