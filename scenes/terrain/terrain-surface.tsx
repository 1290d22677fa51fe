import { useLoader } from '@react-three/fiber';
import { useEffect, useMemo } from 'react';
import { BufferAttribute, BufferGeometry, SRGBColorSpace, TextureLoader } from 'three';
import { terrainSurface, type MeshGrid, type SceneFrame } from './terrain-geometry';

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
  const geometry = useMemo(() => {
    const surface = terrainSurface(mesh, frame, textureBounds);
    const g = new BufferGeometry();
    g.setAttribute('position', new BufferAttribute(surface.positions, 3));
    g.setAttribute('uv', new BufferAttribute(surface.uvs, 2));
    g.setIndex(new BufferAttribute(surface.indices, 1));
    g.computeVertexNormals();
    return g;
  }, [mesh, frame, textureBounds]);
  useEffect(() => () => geometry.dispose(), [geometry]);
  useMemo(() => {
    texture.colorSpace = SRGBColorSpace;
  }, [texture]);
  return (
    <mesh geometry={geometry}>
      <meshStandardMaterial map={texture} color="#F3EEDF" roughness={0.95} metalness={0} />
    </mesh>
  );
}
