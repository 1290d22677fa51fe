import { useEffect, type RefObject } from 'react';
import type { View } from 'react-native';
import type { MapPointerHandlers } from './map-pointer';

export type { MapPointerHandlers } from './map-pointer';

/** Pixels a wheel "line" scrolls, for browsers that report lines (Firefox). */
const LINE_PX = 16;

/**
 * Web: the mouse wheel zooms about the pointer (a notch of 100 px is ×1.25),
 * and hovering reports the pointer's position for the coordinate read-out.
 * Listeners go straight onto the DOM node (react-native-web's View ref), so
 * nothing re-renders per event; `preventDefault` keeps the page from
 * scrolling under the map.
 */
export function useMapPointer(target: RefObject<View | null>, handlers: RefObject<MapPointerHandlers>): void {
  useEffect(() => {
    const el = target.current as unknown as HTMLElement | null;
    if (!el || typeof el.addEventListener !== 'function') return;
    const local = (e: MouseEvent) => {
      const box = el.getBoundingClientRect();
      return { x: e.clientX - box.left, y: e.clientY - box.top };
    };
    const wheel = (e: WheelEvent) => {
      e.preventDefault();
      const dy = e.deltaMode === 1 ? e.deltaY * LINE_PX : e.deltaMode === 2 ? e.deltaY * el.clientHeight : e.deltaY;
      const { x, y } = local(e);
      handlers.current.onWheel(Math.pow(1.25, -dy / 100), x, y);
    };
    const move = (e: PointerEvent) => {
      if (e.pointerType !== 'mouse') return;
      const { x, y } = local(e);
      handlers.current.onHover(x, y);
    };
    const leave = () => handlers.current.onLeave();
    el.addEventListener('wheel', wheel, { passive: false });
    el.addEventListener('pointermove', move);
    el.addEventListener('pointerleave', leave);
    return () => {
      el.removeEventListener('wheel', wheel);
      el.removeEventListener('pointermove', move);
      el.removeEventListener('pointerleave', leave);
    };
  }, [target, handlers]);
}
