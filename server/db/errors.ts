/** PostgreSQL's SQLSTATE for a unique constraint (Appendix A, "Class 23"). */
const UNIQUE_VIOLATION = '23505';

/** True for a unique-constraint clash, whether pg's error arrives bare or wrapped by Drizzle. */
export function isUniqueViolation(err: unknown): boolean {
  const e = err as { code?: string; cause?: { code?: string } } | null;
  return e?.code === UNIQUE_VIOLATION || e?.cause?.code === UNIQUE_VIOLATION;
}
