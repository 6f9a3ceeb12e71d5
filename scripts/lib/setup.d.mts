// Types for the parts of setup.mjs that TypeScript code (tests) uses.
export declare const repoRoot: string;
/** The folder holding pg_ctl and initdb, or null when PostgreSQL is not installed. */
export declare function findPostgresBin(): string | null;
/** Runs a PostgreSQL tool, as the `postgres` user when we are root. */
export declare function asPostgres(cmd: string, args: string[]): { ok: boolean; out: string };
