import { useEffect, useMemo } from 'react';
import { BufferAttribute, BufferGeometry } from 'three';
import { terrainSurface, type MeshGrid, type SceneFrame } from './terrain-geometry';

/**
 * The terrain surface as a three.js geometry, with texture coordinates over
 * `bounds` (grid metres), made once per input and disposed when it changes.
 * Shared by the hillshaded ground and the coverage drape so the two line up
 * vertex for vertex.
 */
export function useSurfaceGeometry(
  mesh: MeshGrid,
  frame: SceneFrame,
  bounds: { west: number; south: number; east: number; north: number },
): BufferGeometry {
  const geometry = useMemo(() => {
    const surface = terrainSurface(mesh, frame, bounds);
    const g = new BufferGeometry();
    g.setAttribute('position', new BufferAttribute(surface.positions, 3));
    g.setAttribute('uv', new BufferAttribute(surface.uvs, 2));
    g.setIndex(new BufferAttribute(surface.indices, 1));
    g.computeVertexNormals();
    return g;
  }, [mesh, frame, bounds]);
  useEffect(() => () => geometry.dispose(), [geometry]);
  return geometry;
}
