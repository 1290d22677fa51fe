import type { RefObject } from 'react';
import type { View } from 'react-native';

/** Mouse-only map input (wheel zoom, hover); phones and tablets zoom by pinching, so native has none. */
export interface MapPointerHandlers {
  onWheel(factor: number, x: number, y: number): void;
  onHover(x: number, y: number): void;
  onLeave(): void;
}

/** Native: nothing to attach (see map-pointer.web.ts). */
export function useMapPointer(_target: RefObject<View | null>, _handlers: RefObject<MapPointerHandlers>): void {}
