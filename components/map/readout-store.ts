import { useSyncExternalStore } from 'react';
import type { LatLon } from '@/shared/geo/types';

/** What the read-out line says: where the pointer is (or was tapped) and the layer's class there. */
export interface Readout {
  readonly kind: 'pointer' | 'tap';
  /** The position (written in the person's chosen format when shown). */
  readonly point: LatLon;
  /** The coverage class at the point, for people (e.g. "2 posts"), or null. */
  readonly layerClass: string | null;
}

/**
 * A tiny store for the pointer read-out. Hover moves arrive at pointer rate:
 * they are coalesced to one update per animation frame and only the read-out
 * line re-renders — the map itself never does.
 */
export interface ReadoutStore {
  set(readout: Readout | null): void;
  get(): Readout | null;
  subscribe(listener: () => void): () => void;
}

export function createReadoutStore(): ReadoutStore {
  let value: Readout | null = null;
  let pending: Readout | null | undefined;
  let scheduled = false;
  const listeners = new Set<() => void>();
  const flush = () => {
    scheduled = false;
    if (pending === undefined) return;
    const next = pending;
    pending = undefined;
    if (
      next?.point.latDeg === value?.point.latDeg &&
      next?.point.lonDeg === value?.point.lonDeg &&
      next?.kind === value?.kind &&
      next?.layerClass === value?.layerClass
    )
      return;
    value = next;
    for (const l of listeners) l();
  };
  return {
    set(readout) {
      pending = readout;
      if (scheduled) return;
      scheduled = true;
      if (typeof requestAnimationFrame === 'function') requestAnimationFrame(flush);
      else setTimeout(flush, 16);
    },
    get: () => value,
    subscribe(listener) {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
  };
}

export function useReadout(store: ReadoutStore): Readout | null {
  return useSyncExternalStore(store.subscribe, store.get, store.get);
}
