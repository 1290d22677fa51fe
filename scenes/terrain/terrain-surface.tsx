import { useLoader } from '@react-three/fiber';
import { useMemo } from 'react';
import { SRGBColorSpace, TextureLoader } from 'three';
import type { MeshGrid, SceneFrame } from './terrain-geometry';
import { useSurfaceGeometry } from './use-surface-geometry';

/** The terrain mesh with the hillshade (or, later, a coverage picture) draped over it. */
export function TerrainSurface({
  mesh,
  frame,
  textureUrl,
  textureBounds,
}: {
  mesh: MeshGrid;
  frame: SceneFrame;
  textureUrl: string;
  textureBounds: { west: number; south: number; east: number; north: number };
}) {
  const texture = useLoader(TextureLoader, textureUrl);
  const geometry = useSurfaceGeometry(mesh, frame, textureBounds);
  useMemo(() => {
    texture.colorSpace = SRGBColorSpace;
  }, [texture]);
  return (
    <mesh geometry={geometry}>
      <meshStandardMaterial map={texture} color="#F3EEDF" roughness={0.95} metalness={0} />
    </mesh>
  );
}
