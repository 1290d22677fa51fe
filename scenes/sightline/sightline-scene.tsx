import { Canvas, useThree } from '@react-three/fiber';
import { useEffect, useMemo, useRef } from 'react';
import type { Group } from 'three';
import type { SightlineResult } from '@/shared/schemas/sightline';
import { MEAN_EARTH_RADIUS_M } from '@/shared/physics/constants';
import { EarthPatch } from './earth-patch';
import { PostMarker } from './post-marker';
import { surfaceY, type SceneScale } from './scene-geometry';
import { SightRay } from './sight-ray';

export interface SightlineSceneProps {
  observerHeightM: number;
  targetHeightM?: number;
  distanceM?: number;
  earthRadiusM?: number;
  results: SightlineResult[];
  colors: string[];
}

/** Drag rotates the scene about the vertical; rotation lives in a ref and asks for one frame, never React state. */
function DragRotate({ target }: { target: React.RefObject<Group | null> }) {
  const { gl, invalidate } = useThree();
  useEffect(() => {
    const el = gl.domElement;
    let lastX: number | null = null;
    const down = (e: PointerEvent) => {
      lastX = e.clientX;
      el.setPointerCapture(e.pointerId);
    };
    const move = (e: PointerEvent) => {
      if (lastX === null || !target.current) return;
      target.current.rotation.y += (e.clientX - lastX) * 0.01;
      lastX = e.clientX;
      invalidate();
    };
    const up = () => {
      lastX = null;
    };
    el.addEventListener('pointerdown', down);
    el.addEventListener('pointermove', move);
    el.addEventListener('pointerup', up);
    return () => {
      el.removeEventListener('pointerdown', down);
      el.removeEventListener('pointermove', move);
      el.removeEventListener('pointerup', up);
    };
  }, [gl, invalidate, target]);
  return null;
}

/** Curved earth segment, the eye, the target with its hidden part, and one sightline per condition. */
export default function SightlineScene({
  observerHeightM,
  targetHeightM,
  distanceM,
  earthRadiusM = MEAN_EARTH_RADIUS_M,
  results,
  colors,
}: SightlineSceneProps) {
  const group = useRef<Group>(null);
  const scale = useMemo<SceneScale>(() => {
    const horizons = results.map((r) => r.horizonDistanceM ?? 0);
    const xMaxM = Math.max(distanceM ?? 0, ...horizons.map((d) => d * 1.25), 1000) * 1.05;
    const tall = Math.max(observerHeightM, targetHeightM ?? 0, 1);
    // Make the tallest pole about a tenth of the horizontal extent.
    return { xMaxM, exaggeration: (xMaxM * 0.1) / tall, earthRadiusM };
  }, [results, distanceM, observerHeightM, targetHeightM, earthRadiusM]);
  const km = scale.xMaxM / 1000;
  const lift = (m: number) => (m * scale.exaggeration) / 1000;
  const first = results[0];

  return (
    <Canvas
      frameloop="demand"
      camera={{ position: [km * 0.5, km * 0.35, km * 0.9], fov: 45, near: 0.01, far: km * 20 }}
      style={{ touchAction: 'none' }}
    >
      <color attach="background" args={['#EEF2F3']} />
      <ambientLight intensity={0.7} />
      <directionalLight position={[km, km, km * 0.5]} intensity={1.1} />
      <group ref={group} position={[-km / 2, 0, 0]}>
        <EarthPatch scale={scale} />
        <PostMarker x={0} baseY={0} heightY={lift(observerHeightM)} color="#B8461B" radius={km * 0.006} />
        {distanceM !== undefined && targetHeightM !== undefined ? (
          <PostMarker
            x={distanceM / 1000}
            baseY={surfaceY(distanceM, 0, scale)}
            heightY={lift(targetHeightM)}
            hiddenY={first?.hiddenHeightM != null ? lift(first.hiddenHeightM) : 0}
            color="#17252B"
            radius={km * 0.006}
          />
        ) : null}
        {results.map((r, i) => (
          <SightRay
            key={i}
            horizonM={r.horizonDistanceM}
            effectiveRadiusM={r.effectiveRadiusM}
            color={colors[i] ?? '#17252B'}
            scale={scale}
          />
        ))}
      </group>
      <DragRotate target={group} />
    </Canvas>
  );
}
