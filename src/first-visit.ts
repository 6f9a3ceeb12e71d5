// Runs from the page's <head>, before the app's own script has downloaded (P3): asks the server
// for what the first screen will ask for (who is signed in, then their collection's round when
// the page is Today) and fetches the lazy chunks that screen will import, so neither waits for
// the app to start. The app takes these answers instead of asking again (src/lib/early-requests.ts).
// Built on its own (scripts/vite-first-visit.ts): it imports nothing and must stay small.
import type { EarlyRequests } from './lib/early-requests';

declare const __FIRST_VISIT_CHUNKS__: { signIn: string[]; signedIn: string[] };

/** Pages outside sign-in: they load their own data and never the round. */
const PUBLIC_PAGES =
  /^\/(sign-in|sign-up|forgot-password|reset-password|cover\/accept|join|dev)(\/|$)/;
/** The app's key for the collection this device works in (use-current-collection.ts). */
const COLLECTION_KEY = 'rackside.collectionId';

interface Membership {
  collectionId: string;
  role: string;
}

function preloadChunks(files: string[]) {
  for (const href of files) {
    const link = document.createElement('link');
    link.rel = 'modulepreload';
    link.href = href;
    document.head.appendChild(link);
  }
}

function start() {
  const path = location.pathname;
  const early: EarlyRequests = { startedAt: performance.now(), answers: {} };
  window.__racksideEarly = early;
  const get = (apiPath: string) => {
    const answer = fetch(`/api${apiPath}`, {
      credentials: 'same-origin',
      headers: { Accept: 'application/json', 'X-Rackside-Client': '1' },
    });
    answer.catch(() => undefined); // the app reads the failure, if it takes this answer
    early.answers[apiPath] = answer;
    return answer;
  };
  if (path === '/sign-in') return preloadChunks(__FIRST_VISIT_CHUNKS__.signIn);
  if (PUBLIC_PAGES.test(path)) return;
  // No network at all: nothing to ask, and no answers to read with the schemas (P2).
  if (navigator.onLine === false) return;
  const today = path === '/' || path === '/today';
  let saved: string | null = null;
  try {
    saved = localStorage.getItem(COLLECTION_KEY);
  } catch {
    // Storage blocked: the collection comes from the answer below.
  }
  const roundPath = (collectionId: string) => `/collections/${collectionId}/rounds/today`;
  if (today && saved) get(roundPath(saved));
  get('/auth/me')
    .then((res) => (res.ok ? res.clone().json() : null))
    .then((me: { memberships?: Membership[] } | null) => {
      if (!me) return;
      // The app's own choice (use-current-collection.ts): this device's, an owned one, any.
      const list = me.memberships ?? [];
      const chosen =
        list.find((m) => m.collectionId === saved) ??
        list.find((m) => m.role === 'owner') ??
        list[0];
      // The round first: a phone has six connections to the server, the chunks can queue.
      if (today && chosen && !early.answers[roundPath(chosen.collectionId)])
        get(roundPath(chosen.collectionId));
      preloadChunks(__FIRST_VISIT_CHUNKS__.signedIn);
    })
    .catch(() => undefined);
}

start();
