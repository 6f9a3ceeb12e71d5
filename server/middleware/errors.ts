import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import type { ErrorBody } from '#shared/schemas/common';
import { isDatabaseUnavailable } from '../db/errors';

/** An error a service throws on purpose: its status and message reach the client. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly issues?: { path: string; message: string }[],
  ) {
    super(message);
  }
}

export function zodIssues(error: ZodError): { path: string; message: string }[] {
  return error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
}

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, 'not_found', `There is no API route ${req.method} ${req.path}.`));
};

interface BodyParserError {
  type?: string;
  status?: number;
}

export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let status = 500;
  let body: ErrorBody = {
    error: {
      code: 'internal',
      message: 'Something went wrong on our side. Nothing you sent was lost; try again.',
    },
  };
  const parserError = err as BodyParserError;
  if (err instanceof HttpError) {
    status = err.status;
    body = { error: { code: err.code, message: err.message, issues: err.issues } };
  } else if (err instanceof ZodError) {
    status = 422;
    body = {
      error: { code: 'invalid', message: 'Some fields need attention.', issues: zodIssues(err) },
    };
  } else if (parserError.type === 'entity.parse.failed') {
    status = 400;
    body = { error: { code: 'bad_json', message: 'The request body is not valid JSON.' } };
  } else if (parserError.type === 'entity.too.large') {
    status = 413;
    body = { error: { code: 'too_large', message: 'The request is too large.' } };
  } else if (
    typeof parserError.status === 'number' &&
    parserError.status >= 400 &&
    parserError.status < 500
  ) {
    status = parserError.status;
    body = { error: { code: 'bad_request', message: 'The request could not be read.' } };
  } else if (isDatabaseUnavailable(err)) {
    // PostgreSQL is restarting or out of reach: say so, so phones keep their taps and retry.
    status = 503;
    res.setHeader('Retry-After', '5');
    body = {
      error: {
        code: 'unavailable',
        message:
          'Rackside cannot reach its database just now. Nothing is lost: try again in a moment.',
      },
    };
    req.log?.warn({ err }, 'database unavailable');
  } else {
    req.log?.error({ err }, 'unhandled error');
  }
  res.status(status).json(body);
};
