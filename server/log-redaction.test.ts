import { DrizzleQueryError } from 'drizzle-orm/errors';
import pg from 'pg';
import { describe, expect, it } from 'vitest';
import { redactError, redactHeaders } from './log-redaction';
import { HttpError } from './middleware/errors';

/** A node-postgres error as the server sends it: message, SQLSTATE, severity and detail. */
function pgError(message: string, code: string, detail?: string) {
  const err = new pg.DatabaseError(message, 0, 'error');
  Object.assign(err, { severity: 'ERROR', code, detail, table: 'animals' });
  return err;
}

describe('log redaction', () => {
  it('replaces credential headers and a Referer token, and keeps the rest', () => {
    expect(
      redactHeaders({
        Cookie: 'rackside.sid=abc',
        'set-cookie': ['rackside.sid=abc; Path=/'],
        authorization: 'Bearer x',
        'Stripe-Signature': 't=1,v1=abc',
        referer: 'https://r.example/reset-password?token=abc123',
        accept: 'application/json',
      }),
    ).toEqual({
      Cookie: '[redacted]',
      'set-cookie': '[redacted]',
      authorization: '[redacted]',
      'Stripe-Signature': '[redacted]',
      referer: 'https://r.example/reset-password?token=[redacted]',
      accept: 'application/json',
    });
  });

  // Message forms PostgreSQL uses (from memory; the 22P02 one is also met for real in tests/api/logging.test.ts).
  it.each([
    [
      'invalid input syntax for type uuid: "keeper@example.test"',
      'invalid input syntax for type uuid: "[redacted]"',
    ],
    [
      'invalid input value for enum event_kind: "fed-by-Ann"',
      'invalid input value for enum event_kind: "[redacted]"',
    ],
    [
      'value "99999999999" is out of range for type integer',
      'value "[redacted]" is out of range for type integer',
    ],
    [
      'null value in column "name" of relation "animals" violates not-null constraint',
      'null value in column "name" of relation "animals" violates not-null constraint',
    ],
    [
      'duplicate key value violates unique constraint "users_email_unique"',
      'duplicate key value violates unique constraint "users_email_unique"',
    ],
  ])('keeps the names in "%s" and drops the values', (message, logged) => {
    const out = redactError(
      pgError(message, '22P02', 'Key (email)=(keeper@example.test) already exists.'),
    ) as Record<string, unknown>;
    expect(out.message).toBe(logged);
    expect(JSON.stringify(out)).not.toContain('keeper@example.test');
    expect(out).toMatchObject({ code: '22P02', table: 'animals' });
    expect(out).not.toHaveProperty('detail');
  });

  it('keeps the SQL of a failed query but not its parameters, nor its cause’s values', () => {
    const cause = pgError('invalid input syntax for type uuid: "secret-note-text"', '22P02');
    const err = new DrizzleQueryError(
      'insert into "events" ("payload") values ($1)',
      ['secret-note-text\nparams: more'],
      cause,
    );
    const out = redactError(err) as Record<string, unknown>;
    expect(out.message).toBe('Failed query: insert into "events" ("payload") values ($1)');
    expect(String(out.stack)).toMatch(
      /^Error: Failed query: insert into "events" \("payload"\) values \(\$1\)\n\s+at /,
    );
    expect(JSON.stringify(out)).not.toContain('secret-note-text');
    expect((out.cause as Record<string, unknown>).code).toBe('22P02');
  });

  it('keeps our own errors as they are, without objects that may hold a request', () => {
    const out = redactError(
      new HttpError(409, 'taken', 'That place already exists.', [
        { path: 'email', message: 'a@b.test' },
      ]),
    ) as Record<string, unknown>;
    expect(out).toMatchObject({
      type: 'HttpError',
      message: 'That place already exists.',
      status: 409,
      code: 'taken',
    });
    expect(out).not.toHaveProperty('issues');
  });
});
