import { useCallback, useSyncExternalStore } from 'react';
import type { TemperatureUnit } from '#shared/domain/temperature';
import type { SizeUnit } from '#shared/domain/units';

/**
 * A person's display choice kept on this device (localStorage), like the theme: units change how
 * values are shown, never what is stored, so they need no round trip to the server.
 */
function devicePreference<T extends string>(key: string, read: (stored: string | null) => T) {
  const listeners = new Set<() => void>();
  const current = (): T => {
    try {
      return read(localStorage.getItem(key));
    } catch {
      return read(null);
    }
  };
  const subscribe = (notify: () => void) => {
    listeners.add(notify);
    return () => listeners.delete(notify);
  };
  return function usePreference(): [T, (next: T) => void] {
    const value = useSyncExternalStore(subscribe, current, () => read(null));
    const set = useCallback((next: T) => {
      try {
        localStorage.setItem(key, next);
      } catch {
        // Private mode: the choice lasts for this page only.
      }
      listeners.forEach((l) => l());
    }, []);
    return [value, set];
  };
}

/** The person's unit for leg spans on this device (stored in mm whatever they choose). */
export const useSizeUnit = devicePreference<SizeUnit>('rackside.size-unit', (s) =>
  s === 'in' ? 'in' : 'mm',
);

/** The person's unit for temperatures on this device (stored in °C whatever they choose). */
export const useTemperatureUnit = devicePreference<TemperatureUnit>(
  'rackside.temperature-unit',
  (s) => (s === 'F' ? 'F' : 'C'),
);
