import { useCallback, useSyncExternalStore } from 'react';
import type { SizeUnit } from '#shared/domain/units';

const KEY = 'rackside.size-unit';
const listeners = new Set<() => void>();

function read(): SizeUnit {
  try {
    return localStorage.getItem(KEY) === 'in' ? 'in' : 'mm';
  } catch {
    return 'mm';
  }
}

/** The person's unit for leg spans on this device (stored in mm whatever they choose). */
export function useSizeUnit(): [SizeUnit, (unit: SizeUnit) => void] {
  const unit = useSyncExternalStore(
    (notify) => {
      listeners.add(notify);
      return () => listeners.delete(notify);
    },
    read,
    () => 'mm' as const,
  );
  const set = useCallback((next: SizeUnit) => {
    try {
      localStorage.setItem(KEY, next);
    } catch {
      // Private mode: the choice lasts for this page only.
    }
    listeners.forEach((l) => l());
  }, []);
  return [unit, set];
}
