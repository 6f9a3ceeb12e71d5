import { randomUUID } from 'node:crypto';
import { pinoHttp } from 'pino-http';
import { redactError, redactRequest, redactResponse } from './log-redaction';
import type { Logger } from './logger';

/** One log line per API request, with an id the answer carries too (X-Request-Id). */
export function requestLog(logger: Logger) {
  return pinoHttp({
    logger,
    genReqId: (_req, res) => {
      const id = randomUUID();
      res.setHeader('X-Request-Id', id);
      return id;
    },
    autoLogging: { ignore: (req) => !req.url?.startsWith('/api') },
    // No credential in a log line: the session cookie (sent and set), authorisation headers,
    // the single-use tokens of invite and reset links, a database error's parameter values.
    serializers: { req: redactRequest, res: redactResponse, err: redactError },
  });
}
