/**
 * Answers the page asked for before the app started (src/first-visit.ts): the first screen's
 * GETs take them instead of asking the server again (P3). Each is taken once, and only in the
 * first seconds of the page, so nothing later is served an old answer.
 */
export interface EarlyRequests {
  /** performance.now() when the page's script ran. */
  startedAt: number;
  /** API path (without /api) → the fetch under way. */
  answers: Record<string, Promise<Response>>;
}

declare global {
  interface Window {
    __racksideEarly?: EarlyRequests;
  }
}

/** An early answer is the first screen's; after this it is left to expire. */
const FRESH_FOR_MS = 20_000;

/** The early answer for `path`, if there is one still fresh; it is then gone for everyone else. */
export function takeEarlyAnswer(path: string): Promise<Response> | undefined {
  const early = typeof window === 'undefined' ? undefined : window.__racksideEarly;
  const answer = early?.answers[path];
  if (!early || !answer) return undefined;
  delete early.answers[path];
  if (performance.now() - early.startedAt > FRESH_FOR_MS) return undefined;
  return answer;
}

/** Whether the page asked early for a path that passes `test` (and it is still there to take). */
export function hasEarlyAnswer(test: (path: string) => boolean): boolean {
  const early = typeof window === 'undefined' ? undefined : window.__racksideEarly;
  return !!early && Object.keys(early.answers).some(test);
}

/**
 * Drops every early answer not yet taken: once this page's taps have reached the server, an
 * answer asked for before them is out of date (a round without those taps).
 */
export function forgetEarlyAnswers() {
  const early = typeof window === 'undefined' ? undefined : window.__racksideEarly;
  if (early) early.answers = {};
}
