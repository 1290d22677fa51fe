import { Component, lazy, Suspense, useMemo, type ReactNode } from 'react';
import { View } from 'react-native';
import type { SceneDrape } from '@/scenes/terrain/coverage-drape';
import type { ScenePost, SceneTarget } from '@/scenes/terrain/terrain-scene';
import { defaultExaggeration } from '@/scenes/terrain/terrain-geometry';
import { useTerrainMesh } from '@/components/data/terrain';
import { AppText } from '@/components/ui/app-text';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { colors, radius, space } from '@/components/ui/theme';
import type { ShownLayer } from './map-viewport';
import type { SiteMapFrame } from './site-map-frame';

// Loaded on demand: three.js and the scene stay out of the first bundle and never block first paint.
// Through the one 3D module (see scenes/scenes-3d.ts), so three.js is in one async chunk.
const TerrainScene = lazy(() => import('@/scenes/scenes-3d').then((m) => ({ default: m.TerrainScene })));

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

function Fallback({ reason }: { reason: string }) {
  return (
    <View style={{ padding: space.lg }}>
      <Notice tone="info" title="3D view not available">
        <AppText>{reason} The 2D map and the profile hold the same answers.</AppText>
      </Notice>
    </View>
  );
}

/** The 3D terrain view of the map: mesh with the hillshade, posts, and sight lines to the tapped points. */
export function Terrain3d({
  siteId,
  frame,
  posts,
  chosenPostId,
  targets,
  drape = null,
}: {
  siteId: string;
  frame: SiteMapFrame;
  posts: readonly ScenePost[];
  chosenPostId: string | null;
  targets: readonly SceneTarget[];
  /** The coverage layer chosen on the map, laid over the ground (null: the hillshade alone). */
  drape?: ShownLayer | null;
}) {
  const webgl = useMemo(hasWebGL, []);
  const drapeRaster = drape?.layer.raster ?? null;
  const drapeValues = drape?.values ?? null;
  const drapePalette = drape?.layer.palette ?? null;
  const sceneDrape = useMemo<SceneDrape | null>(
    () => (drapeRaster && drapeValues && drapePalette ? { grid: drapeRaster, values: drapeValues, palette: drapePalette } : null),
    [drapeRaster, drapeValues, drapePalette],
  );
  const mesh = useTerrainMesh(siteId);
  if (!frame.base) return <Fallback reason="This site has no terrain yet, so there is nothing to show in 3D." />;
  if (!webgl) return <Fallback reason="This browser cannot draw 3D (WebGL is off or missing)." />;
  if (mesh.isPending) return <LoadingState label="Loading the terrain mesh…" />;
  if (mesh.isError) return <ErrorState error={mesh.error} onRetry={() => void mesh.refetch()} />;
  const exaggeration = defaultExaggeration(mesh.data);
  return (
    <View style={{ flex: 1 }}>
      <View style={{ flex: 1 }} aria-label="3D terrain view" role="img">
        <SceneBoundary fallback={<Fallback reason="The 3D view failed to start on this device." />}>
          <Suspense fallback={<LoadingState label="Loading the 3D view…" />}>
            <TerrainScene
              mesh={mesh.data}
              texture={{ url: frame.base.url, bounds: frame.base.rect }}
              exaggeration={exaggeration}
              posts={posts}
              chosenPostId={chosenPostId}
              targets={targets}
              drape={sceneDrape}
            />
          </Suspense>
        </SceneBoundary>
      </View>
      <View
        style={{
          position: 'absolute',
          left: space.sm,
          right: space.sm,
          bottom: space.sm,
          backgroundColor: 'rgba(255,255,255,0.93)',
          borderRadius: radius.md,
          borderWidth: 1,
          borderColor: colors.line,
          padding: space.sm,
        }}
        pointerEvents="none"
      >
        <AppText variant="small">
          Heights ×{exaggeration}; terrain averaged to {Math.round(mesh.data.cellSizeM)} m cells. Drag to turn, scroll to come
          closer. Cones: existing posts; open diamonds: proposed. Lines from the chosen post: blue seen, orange not seen, grey not
          yet worked out (first condition; the profile has the detail). Lines run straight from the eye; the earth’s curve and
          refraction are in the profile.
          {drape ? ` Coloured ground: ${drape.layer.title} (the legend names the colours).` : ''}
        </AppText>
      </View>
    </View>
  );
}
