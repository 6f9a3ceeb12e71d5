import type { Logger } from './logger';

/** Work a request starts but does not wait for (e-mail, mostly). */
export interface Background {
  /** Runs `work` after the current request's handler returns; a failure is logged, not thrown. */
  run(task: string, work: () => Promise<void>): void;
  /** Waits for everything started so far (shutdown, tests). */
  drain(): Promise<void>;
}

/**
 * Anything that depends on whether an e-mail address has an account (looking it up, writing a
 * token, talking to the SMTP server) runs here, after the answer has gone: the answer and its
 * timing are then the same for known and unknown addresses (docs/decisions/012-same-answer-for-every-email.md).
 * In-process rather than a pg-boss job: these are single, short and safe to lose with the
 * process — the person asks again — and shutdown waits for them.
 */
export function createBackground(logger: Logger): Background {
  const running = new Set<Promise<void>>();
  return {
    run(task, work) {
      const done: Promise<void> = new Promise<void>((resolve) => setImmediate(resolve))
        .then(work)
        .catch((err: unknown) => {
          // Name and code only: a database error's message carries the query's parameters
          // (e-mail addresses, token hashes).
          const e = err as { name?: unknown; code?: unknown } | null;
          logger.error(
            {
              task,
              err: {
                name: String(e?.name ?? 'Error'),
                code: e?.code === undefined ? undefined : String(e.code),
              },
            },
            `background task failed: ${task}`,
          );
        })
        .finally(() => running.delete(done));
      running.add(done);
    },
    async drain() {
      while (running.size) await Promise.all([...running]);
    },
  };
}
