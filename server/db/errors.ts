/** PostgreSQL's SQLSTATE for a unique constraint (Appendix A, "Class 23"). */
const UNIQUE_VIOLATION = '23505';

/** True for a unique-constraint clash, whether pg's error arrives bare or wrapped by Drizzle. */
export function isUniqueViolation(err: unknown): boolean {
  const e = err as { code?: string; cause?: { code?: string } } | null;
  return e?.code === UNIQUE_VIOLATION || e?.cause?.code === UNIQUE_VIOLATION;
}

/** PostgreSQL's SQLSTATE for a foreign key that still has rows pointing at it (Class 23). */
const FOREIGN_KEY_VIOLATION = '23503';

/** True for a row another table still points at, bare or wrapped by Drizzle. */
export function isForeignKeyViolation(err: unknown): boolean {
  const e = err as { code?: string; cause?: { code?: string } } | null;
  return e?.code === FOREIGN_KEY_VIOLATION || e?.cause?.code === FOREIGN_KEY_VIOLATION;
}

/**
 * True when PostgreSQL cannot be reached or is going away: SQLSTATE class 08 (connection
 * exception) and 57P01–57P03 (shutdown, cannot connect now), per PostgreSQL's Appendix A,
 * plus the socket errors and messages node-postgres raises when the server is gone.
 */
export function isDatabaseUnavailable(err: unknown): boolean {
  for (
    let e = err as { code?: string; message?: string; cause?: unknown } | null | undefined,
      depth = 0;
    e && depth < 4;
    e = e.cause as typeof e, depth++
  ) {
    const code = e.code ?? '';
    if (
      code.startsWith('08') ||
      ['57P01', '57P02', '57P03', 'ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE'].includes(code)
    )
      return true;
    if (
      /Connection terminated|timeout exceeded when trying to connect|Client has encountered a connection error/.test(
        e.message ?? '',
      )
    )
      return true;
  }
  return false;
}

/**
 * True when PostgreSQL aborted a transaction to break a deadlock (40P01) or a serialisation
 * conflict (40001), per Appendix A, "Class 40": the whole transaction may simply run again.
 */
export function isRetryableConflict(err: unknown): boolean {
  const e = err as { code?: string; cause?: { code?: string } } | null;
  const code = e?.code ?? e?.cause?.code;
  return code === '40P01' || code === '40001';
}
