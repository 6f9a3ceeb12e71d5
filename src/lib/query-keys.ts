import type { RoundDay } from './db';

/**
 * Every TanStack Query key the app uses, in one place: a key that is read in one file and
 * invalidated in another must be spelt the same, and the prefixes below are what invalidation
 * matches on (`rounds.all(c)` also refreshes that collection's rules, history and schedules).
 */
export const queryKeys = {
  auth: {
    me: () => ['auth', 'me'] as const,
    demo: () => ['auth', 'demo'] as const,
    firstRun: () => ['auth', 'first-run'] as const,
    signUpLink: (token: string) => ['auth', 'sign-up-link', token] as const,
  },
  animals: {
    /** Every collection's lists: a sync can change animals anywhere. */
    everywhere: () => ['animals'] as const,
    all: (collectionId: string) => ['animals', collectionId] as const,
    list: (collectionId: string) => ['animals', collectionId, 'list'] as const,
  },
  locations: {
    list: (collectionId: string) => ['locations', collectionId] as const,
  },
  rounds: {
    /** Every collection's rounds: saved taps refresh them all. */
    everywhere: () => ['rounds'] as const,
    all: (collectionId: string) => ['rounds', collectionId] as const,
    /** The phone's copy (IndexedDB), what the screen shows. */
    local: (collectionId: string, day: RoundDay, userId: string) =>
      ['rounds', collectionId, 'local', day, userId] as const,
    /** Fetching the server's copy into IndexedDB. */
    server: (collectionId: string, day: RoundDay) =>
      ['rounds', collectionId, 'server', day] as const,
    rules: (collectionId: string) => ['rounds', collectionId, 'rules'] as const,
    history: (collectionId: string, animalId: string) =>
      ['rounds', collectionId, 'history', animalId] as const,
    schedule: (collectionId: string, animalId: string) =>
      ['rounds', collectionId, 'schedule', animalId] as const,
  },
  colonies: {
    /** Every collection's colonies: a sync can change stock anywhere. */
    everywhere: () => ['colonies'] as const,
    list: (collectionId: string) => ['colonies', collectionId, 'list'] as const,
    history: (collectionId: string, colonyId: string) =>
      ['colonies', collectionId, 'history', colonyId] as const,
  },
  chores: {
    /** Every collection's chores on this phone: a sync settles them anywhere. */
    everywhere: () => ['chores'] as const,
    /** This phone's chores of a day (IndexedDB), colonies' and rooms' alike. */
    on: (collectionId: string, localDate: string) => ['chores', collectionId, localDate] as const,
  },
  breeding: {
    sacs: (collectionId: string) => ['breeding', collectionId, 'sacs'] as const,
  },
  cover: {
    covers: (collectionId: string) => ['cover', collectionId, 'covers'] as const,
    handover: (collectionId: string) => ['cover', collectionId, 'handover'] as const,
    reports: (collectionId: string) => ['cover', collectionId, 'reports'] as const,
    helperReports: (collectionId: string) => ['cover', collectionId, 'helper-reports'] as const,
    mine: (collectionId: string, userId: string) =>
      ['cover', collectionId, 'mine', userId] as const,
    invite: (token: string) => ['cover-invite', token] as const,
  },
  climate: {
    /** Every collection's climate: synced room readings change what is due and out of range. */
    everywhere: () => ['climate'] as const,
    all: (collectionId: string) => ['climate', collectionId] as const,
    today: (collectionId: string) => ['climate', collectionId, 'today'] as const,
    rooms: (collectionId: string) => ['climate', collectionId, 'rooms'] as const,
    history: (collectionId: string, room: string, days: number) =>
      ['climate', collectionId, 'history', room, days] as const,
    animal: (collectionId: string, animalId: string) =>
      ['climate', collectionId, 'animal', animalId] as const,
  },
  members: {
    list: (collectionId: string) => ['members', collectionId] as const,
  },
  // Sales — listings, availability (L)
  listings: {
    list: (collectionId: string) => ['listings', collectionId] as const,
  },
  availability: {
    settings: (collectionId: string) => ['availability', collectionId] as const,
    /** The public list, read with no session. */
    published: (token: string) => ['available', token] as const,
  },
  // Sales — payments.
  payments: {
    invoice: (collectionId: string, invoiceId: string) =>
      ['payments', collectionId, invoiceId] as const,
  },
  // Sales — S: settings, buyers, sales; `all` refreshes every one of them after a change.
  sales: {
    all: (collectionId: string) => ['sales', collectionId] as const,
    settings: (collectionId: string) => ['sales', collectionId, 'settings'] as const,
    buyers: (collectionId: string) => ['sales', collectionId, 'buyers'] as const,
    list: (collectionId: string) => ['sales', collectionId, 'list'] as const,
    available: (collectionId: string) => ['sales', collectionId, 'available'] as const,
    sale: (collectionId: string, saleId: string) =>
      ['sales', collectionId, 'sale', saleId] as const,
    animal: (collectionId: string, animalId: string) =>
      ['sales', collectionId, 'animal', animalId] as const,
  },
  devMail: () => ['dev', 'mail'] as const,
  lan: () => ['lan'] as const,
  sync: {
    attention: (userId: string) => ['sync', 'attention', userId] as const,
  },
  storage: {
    persisted: () => ['storage', 'persisted'] as const,
  },
};
