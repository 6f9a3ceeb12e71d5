import { useCallback, useSyncExternalStore } from 'react';
import type { TemperatureUnit } from '#shared/domain/temperature';
import type { SizeUnit } from '#shared/domain/units';

/**
 * A person's display choice kept on this device (localStorage), like the theme: units change how
 * values are shown, never what is stored. The temperature unit is also the person's own setting
 * on the server (their e-mails use it): the device copy follows it (`followTemperatureUnit`)
 * and answers at once, offline too.
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
  const write = (next: T) => {
    if (current() === next) return;
    try {
      localStorage.setItem(key, next);
    } catch {
      // Private mode: the choice lasts for this page only.
    }
    listeners.forEach((l) => l());
  };
  function usePreference(): [T, (next: T) => void] {
    const value = useSyncExternalStore(subscribe, current, () => read(null));
    const set = useCallback((next: T) => write(next), []);
    return [value, set];
  }
  return Object.assign(usePreference, { write });
}

/** The person's unit for leg spans on this device (stored in mm whatever they choose). */
export const useSizeUnit = devicePreference<SizeUnit>('rackside.size-unit', (s) =>
  s === 'in' ? 'in' : 'mm',
);

/**
 * The person's unit for temperatures (stored in °C whatever they choose): their own setting on
 * the server, copied to the device by `followTemperatureUnit` when `me` arrives.
 */
export const useTemperatureUnit = devicePreference<TemperatureUnit>(
  'rackside.temperature-unit',
  (s) => (s === 'F' ? 'F' : 'C'),
);

/** The device takes the person's server-side unit (called with each `me` answer). */
export function followTemperatureUnit(unit: TemperatureUnit | undefined) {
  if (unit) useTemperatureUnit.write(unit);
}
