import { lazy, useMemo } from 'react';
import { View } from 'react-native';
import type { SceneDrape } from '@/scenes/terrain/coverage-drape';
import type { ScenePost, SceneTarget } from '@/scenes/terrain/terrain-scene';
import { defaultExaggeration } from '@/scenes/terrain/terrain-geometry';
import { useTerrainMesh } from '@/components/data/terrain';
import { AppText } from '@/components/ui/app-text';
import { hasWebGL, Scene3dFrame } from '@/components/ui/scene-3d-frame';
import { ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { colors, radius, space } from '@/components/ui/theme';
import type { ShownLayer } from './map-viewport';
import type { SiteMapFrame } from './site-map-frame';

// Loaded on demand: three.js and the scene stay out of the first bundle and never block first paint.
// Through the one 3D module (see scenes/scenes-3d.ts), so three.js is in one async chunk.
const TerrainScene = lazy(() => import('@/scenes/scenes-3d').then((m) => ({ default: m.TerrainScene })));

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
        <Scene3dFrame fallback={<Fallback reason="The 3D view failed to start on this device." />}>
          <TerrainScene
            mesh={mesh.data}
            texture={{ url: frame.base.url, bounds: frame.base.rect }}
            exaggeration={exaggeration}
            posts={posts}
            chosenPostId={chosenPostId}
            targets={targets}
            drape={sceneDrape}
          />
        </Scene3dFrame>
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
