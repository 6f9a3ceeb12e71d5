import { redactUrl } from './redact-url';

/** What a secret is replaced with in a log line. */
export const REDACTED = '[redacted]';

/** Headers that carry a credential: the session cookie (both ways) and any authorisation. */
const SECRET_HEADERS = new Set([
  'cookie',
  'set-cookie',
  'authorization',
  'proxy-authorization',
  // Sales — payments: a webhook's signature, good for a new delivery for 300 s.
  'stripe-signature',
]);
/** Query parameters that carry a credential (single-use tokens in invite and reset links). */
const SECRET_QUERY = /token|password|secret/i;

/** Headers as logged: credentials replaced, a Referer's one-time token too. */
export function redactHeaders(headers: unknown): unknown {
  if (!headers || typeof headers !== 'object') return headers;
  const out: Record<string, unknown> = {};
  for (const [name, value] of Object.entries(headers)) {
    const key = name.toLowerCase();
    if (SECRET_HEADERS.has(key)) out[name] = REDACTED;
    else if ((key === 'referer' || key === 'location') && typeof value === 'string')
      out[name] = redactUrl(value);
    else out[name] = value;
  }
  return out;
}

function redactQuery(query: unknown): unknown {
  if (!query || typeof query !== 'object') return query;
  return Object.fromEntries(
    Object.entries(query).map(([k, v]) => [k, SECRET_QUERY.test(k) ? REDACTED : v]),
  );
}

interface SerializedReq {
  url?: string;
  query?: unknown;
  headers?: unknown;
  [key: string]: unknown;
}

/** pino-http's request record (already reduced by its standard serializer) without secrets. */
export function redactRequest(req: SerializedReq): SerializedReq {
  return {
    ...req,
    url: typeof req.url === 'string' ? redactUrl(req.url) : req.url,
    query: redactQuery(req.query),
    headers: redactHeaders(req.headers),
  };
}

/** pino-http's response record without Set-Cookie. */
export function redactResponse(res: { headers?: unknown; [key: string]: unknown }) {
  return { ...res, headers: redactHeaders(res.headers) };
}

type ErrorLike = Error & Record<string, unknown>;

const isError = (e: unknown): e is ErrorLike =>
  e instanceof Error ||
  (!!e &&
    typeof e === 'object' &&
    typeof (e as Error).message === 'string' &&
    typeof (e as Error).stack === 'string');

/** Drizzle's wrapper: its message and `params` hold every parameter value of the query. */
const isDrizzleQueryError = (e: ErrorLike) => typeof e.query === 'string' && 'params' in e;
/** node-postgres's DatabaseError: a SQLSTATE, and values in its message, detail and context. */
const isPgError = (e: ErrorLike) =>
  typeof e.severity === 'string' && typeof e.code === 'string' && /^[0-9A-Z]{5}$/.test(e.code);

/**
 * PostgreSQL quotes both names and values in its messages (`relation "events"`, but `for type
 * uuid: "the value"`); a quoted word after one of these nouns is a name and stays.
 */
const NAME_BEFORE_QUOTE =
  /(?:relation|constraint|column|table|index|schema|type|function|sequence|database|role|encoding|operator|trigger|view|extension)\s$/i;

function redactQuotedValues(message: string): string {
  return message.replace(/"(?:[^"]|"")*"/g, (quoted, offset: number) =>
    NAME_BEFORE_QUOTE.test(message.slice(Math.max(0, offset - 20), offset))
      ? quoted
      : `"${REDACTED}"`,
  );
}

/** Fields of a PostgreSQL error that name things and never hold a row's values. */
const PG_NAME_FIELDS = [
  'code',
  'severity',
  'constraint',
  'table',
  'column',
  'schema',
  'dataType',
  'routine',
  'hint',
  'position',
] as const;

/** The stack's frames, without its first line(s): those repeat the message. */
function frames(err: ErrorLike): string | undefined {
  if (typeof err.stack !== 'string') return undefined;
  const head = `${err.name}: ${err.message}`;
  if (err.stack.startsWith(head)) return err.stack.slice(head.length);
  const at = err.stack.search(/\n\s+at /);
  return at < 0 ? '' : err.stack.slice(at);
}

function describe(err: ErrorLike, depth: number): Record<string, unknown> {
  const type = err.constructor?.name ?? err.name;
  let out: Record<string, unknown>;
  if (isDrizzleQueryError(err)) {
    // The SQL has placeholders ($1, $2…); the values are in `params` and the message: left out.
    const message = `Failed query: ${err.query as string}`;
    out = { type, message, stack: `${err.name}: ${message}${frames(err) ?? ''}`, query: err.query };
  } else if (isPgError(err)) {
    const message = redactQuotedValues(err.message);
    out = { type, message, stack: `${err.name}: ${message}${frames(err) ?? ''}` };
    for (const field of PG_NAME_FIELDS) if (err[field] !== undefined) out[field] = err[field];
  } else {
    out = { type, message: err.message, stack: err.stack };
    // Our own errors' status and code; objects are left out, they may hold a request's data.
    for (const [key, value] of Object.entries(err)) {
      if (
        key !== 'cause' &&
        (value === null || ['string', 'number', 'boolean'].includes(typeof value))
      )
        out[key] = value;
    }
  }
  if (depth < 5 && isError(err.cause)) out.cause = describe(err.cause, depth + 1);
  return out;
}

/**
 * The `err` of a log line. Database errors keep their SQL, SQLSTATE and the names involved but
 * never a parameter's value (a note, an e-mail address, a token). Accepts the raw error or
 * pino's serialized one (pino-http wraps serializers around its standard one).
 */
export function redactError(input: unknown): unknown {
  const raw = (input as { raw?: unknown } | null)?.raw ?? input;
  return isError(raw) ? describe(raw, 0) : raw;
}
