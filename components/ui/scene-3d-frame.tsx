import { Component, Suspense, type ReactNode } from 'react';
import { LoadingState } from './states';

/** Whether the browser can draw WebGL at all (checked before loading three.js). */
export function hasWebGL(): boolean {
  if (typeof document === 'undefined') return false;
  try {
    const canvas = document.createElement('canvas');
    return !!(canvas.getContext('webgl2') ?? canvas.getContext('webgl'));
  } catch {
    return false;
  }
}

class SceneBoundary extends Component<{ fallback: ReactNode; children: ReactNode }, { failed: boolean }> {
  override state = { failed: false };
  static getDerivedStateFromError() {
    return { failed: true };
  }
  override render() {
    return this.state.failed ? this.props.fallback : this.props.children;
  }
}

/**
 * Where a lazily loaded 3D scene goes: a loading state while its chunk
 * arrives, and `fallback` instead of the scene if it fails to start.
 */
export function Scene3dFrame({ fallback, children }: { fallback: ReactNode; children: ReactNode }) {
  return (
    <SceneBoundary fallback={fallback}>
      <Suspense fallback={<LoadingState label="Loading the 3D view…" />}>{children}</Suspense>
    </SceneBoundary>
  );
}
