import { useSyncExternalStore } from 'react';
import type { CoordinateFormat } from '@/shared/geo/types';

/** The read-out formats in switch order, with their short labels. */
export const COORDINATE_FORMATS: readonly { id: CoordinateFormat; label: string; name: string }[] = [
  { id: 'dd', label: 'DD', name: 'Decimal degrees' },
  { id: 'ddm', label: 'DDM', name: 'Degrees and decimal minutes' },
  { id: 'dms', label: 'DMS', name: 'Degrees, minutes and seconds' },
  { id: 'utm', label: 'UTM', name: 'UTM zone, easting and northing' },
  { id: 'mgrs', label: 'MGRS', name: 'MGRS (USNG) grid reference' },
];

/** The datum every coordinate in Kenning is written on. */
export const DATUM_LABEL = 'WGS 84';

const KEY = 'kenning.map.coordinateFormat';
const listeners = new Set<() => void>();

function readStored(): CoordinateFormat {
  try {
    const stored = typeof sessionStorage === 'undefined' ? null : sessionStorage.getItem(KEY);
    return COORDINATE_FORMATS.some((f) => f.id === stored) ? (stored as CoordinateFormat) : 'ddm';
  } catch {
    return 'ddm';
  }
}

let current: CoordinateFormat | null = null;

function get(): CoordinateFormat {
  current ??= readStored();
  return current;
}

function set(format: CoordinateFormat) {
  current = format;
  try {
    if (typeof sessionStorage !== 'undefined') sessionStorage.setItem(KEY, format);
  } catch {
    // Storage refused (private mode): remembered in memory for this page only.
  }
  for (const l of listeners) l();
}

const subscribe = (listener: () => void) => {
  listeners.add(listener);
  return () => listeners.delete(listener);
};

/** The coordinate format the person chose for map read-outs, remembered for the browser session (DDM until chosen). */
export function useCoordinateFormat(): [CoordinateFormat, (format: CoordinateFormat) => void] {
  return [useSyncExternalStore(subscribe, get, get), set];
}
