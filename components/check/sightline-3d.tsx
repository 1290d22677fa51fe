import { Component, lazy, Suspense, useState, type ReactNode } from 'react';
import { View } from 'react-native';
import type { SightlineSceneProps } from '@/scenes/sightline/sightline-scene';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { LoadingState, Notice } from '@/components/ui/states';
import { space } from '@/components/ui/theme';

// Loaded on demand, so three.js is not part of the first bundle; through the one 3D module
// (see scenes/scenes-3d.ts), so three.js is in one async chunk.
const SightlineScene = lazy(() => import('@/scenes/scenes-3d').then((m) => ({ default: m.SightlineScene })));

function hasWebGL(): boolean {
  if (typeof document === 'undefined') return false;
  try {
    const c = document.createElement('canvas');
    return !!(c.getContext('webgl2') ?? c.getContext('webgl'));
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

const NoWebGL = (
  <Notice tone="info" title="3D view not available">
    <AppText>
      This browser cannot draw 3D (WebGL is off or missing). The side view and the table above hold the same answer.
    </AppText>
  </Notice>
);

/** The 3D sightline view, opened on request. */
export function Sightline3d(props: SightlineSceneProps) {
  const [open, setOpen] = useState(false);
  if (!open)
    return <Button kind="secondary" label="Show in 3D" onPress={() => setOpen(true)} style={{ alignSelf: 'flex-start' }} />;
  if (!hasWebGL()) return NoWebGL;
  return (
    <View style={{ gap: space.sm }}>
      <View style={{ height: 340, borderRadius: 14, overflow: 'hidden' }} aria-label="3D sightline view">
        <SceneBoundary fallback={NoWebGL}>
          <Suspense fallback={<LoadingState label="Loading the 3D view…" />}>
            <SightlineScene {...props} />
          </Suspense>
        </SceneBoundary>
      </View>
      <AppText variant="small" tone="muted">
        Drag sideways to turn the view. Heights exaggerated; grey on the target is its hidden part.
      </AppText>
    </View>
  );
}
