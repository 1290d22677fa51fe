import { Canvas } from '@react-three/fiber';
import { Suspense, useMemo, useRef } from 'react';
import type { Group } from 'three';
import { CoverageDrape, type SceneDrape } from './coverage-drape';
import { OrbitDrag } from './orbit-drag';
import { PostPin } from './post-pin';
import { SightRay } from './sight-ray';
import { meshElevationAt, sceneFrame, toScene, type MeshGrid } from './terrain-geometry';
import { TerrainSurface } from './terrain-surface';

/** A post for the scene: grid position (metres), ground elevation and eye height above it. */
export interface ScenePost {
  readonly id: string;
  readonly x: number;
  readonly y: number;
  readonly groundElevationM: number;
  /** Structure and eye together, metres above the ground. */
  readonly eyeHeightM: number;
  readonly proposed: boolean;
}

/** A tapped point and what the chosen post makes of it (true seen, false not seen, null not known yet). */
export interface SceneTarget {
  readonly id: number;
  readonly x: number;
  readonly y: number;
  readonly seen: boolean | null;
}

export interface TerrainSceneProps {
  mesh: MeshGrid;
  /** The picture draped over the terrain and the grid rectangle it spans. */
  texture: { url: string; bounds: { west: number; south: number; east: number; north: number } };
  exaggeration: number;
  posts: readonly ScenePost[];
  chosenPostId: string | null;
  targets: readonly SceneTarget[];
  /** A coverage layer laid over the ground, or null. */
  drape?: SceneDrape | null;
}

/** Colours of the sight lines: seen, not seen, not known (the caption says which is which). */
export const RAY_COLOURS = { seen: '#1E5A9E', hidden: '#C2410C', unknown: '#54646B' } as const;

/** The site's terrain in 3D: the draped mesh, the posts, and sight lines from the chosen post to the tapped points. */
export default function TerrainScene({
  mesh,
  texture,
  exaggeration,
  posts,
  chosenPostId,
  targets,
  drape = null,
}: TerrainSceneProps) {
  const group = useRef<Group>(null);
  const frame = useMemo(() => sceneFrame(mesh, exaggeration), [mesh, exaggeration]);
  const span = Math.max(frame.halfWidth, frame.halfDepth) * 2;
  const chosen = posts.find((p) => p.id === chosenPostId) ?? null;
  const eye = chosen ? toScene(frame, chosen.x, chosen.y, chosen.groundElevationM + chosen.eyeHeightM) : null;
  const pins = useMemo(
    () =>
      posts.map((p) => {
        const foot = toScene(frame, p.x, p.y, p.groundElevationM);
        return { p, foot, heightY: Math.max((p.eyeHeightM * exaggeration) / 1000, span * 0.01) };
      }),
    [posts, frame, exaggeration, span],
  );
  const rays = useMemo(
    () =>
      targets.map((t) => {
        const ground = meshElevationAt(mesh, t.x, t.y) ?? frame.baseElevationM;
        return { t, to: toScene(frame, t.x, t.y, ground) };
      }),
    [targets, mesh, frame],
  );
  const distance = span * 1.1;
  return (
    <Canvas
      frameloop="demand"
      camera={{ position: [0, distance * 0.75, distance * 0.85], fov: 45, near: span * 0.005, far: span * 20 }}
      style={{ touchAction: 'none' }}
    >
      <color attach="background" args={['#EEF2F3']} />
      <ambientLight intensity={0.85} />
      <directionalLight position={[-span, span, -span * 0.5]} intensity={1.4} />
      <group ref={group}>
        <Suspense fallback={null}>
          <TerrainSurface mesh={mesh} frame={frame} textureUrl={texture.url} textureBounds={texture.bounds} />
        </Suspense>
        {drape ? <CoverageDrape mesh={mesh} frame={frame} drape={drape} /> : null}
        {pins.map(({ p, foot, heightY }) => (
          <PostPin
            key={p.id}
            position={foot}
            heightY={heightY}
            proposed={p.proposed}
            chosen={p.id === chosenPostId}
            size={span * 0.03}
          />
        ))}
        {eye
          ? rays.map(({ t, to }) => (
              <SightRay
                key={t.id}
                from={eye}
                to={to}
                color={t.seen === null ? RAY_COLOURS.unknown : t.seen ? RAY_COLOURS.seen : RAY_COLOURS.hidden}
              />
            ))
          : null}
      </group>
      <OrbitDrag target={group} distance={distance} />
    </Canvas>
  );
}
