import { lazy, useState } from 'react';
import { View } from 'react-native';
import type { SightlineSceneProps } from '@/scenes/sightline/sightline-scene';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { hasWebGL, Scene3dFrame } from '@/components/ui/scene-3d-frame';
import { Notice } from '@/components/ui/states';
import { space } from '@/components/ui/theme';

// Loaded on demand, so three.js is not part of the first bundle; through the one 3D module
// (see scenes/scenes-3d.ts), so three.js is in one async chunk.
const SightlineScene = lazy(() => import('@/scenes/scenes-3d').then((m) => ({ default: m.SightlineScene })));

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
        <Scene3dFrame fallback={NoWebGL}>
          <SightlineScene {...props} />
        </Scene3dFrame>
      </View>
      <AppText variant="small" tone="muted">
        Drag sideways to turn the view. Heights exaggerated; grey on the target is its hidden part.
      </AppText>
    </View>
  );
}
