import { useCallback, useSyncExternalStore } from 'react';
import type { MembershipSummary } from '#shared/schemas/auth';

const KEY = 'rackside.collectionId';
const listeners = new Set<() => void>();

function subscribe(listener: () => void) {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** Makes a collection this device's current one (e.g. right after accepting a cover). */
export function chooseCollectionOnDevice(collectionId: string) {
  localStorage.setItem(KEY, collectionId);
  for (const l of listeners) l();
}

/**
 * The collection this device is working in. Remembered per device; falls back to the first
 * collection the person owns, then to any they belong to.
 */
export function useCurrentCollection(memberships: MembershipSummary[]) {
  const saved = useSyncExternalStore(subscribe, () => localStorage.getItem(KEY));
  const current =
    memberships.find((m) => m.collectionId === saved) ??
    memberships.find((m) => m.role === 'owner') ??
    memberships[0] ??
    null;
  const choose = useCallback((collectionId: string) => chooseCollectionOnDevice(collectionId), []);
  return { current, choose };
}
