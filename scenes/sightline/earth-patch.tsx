import { useMemo } from 'react';
import { BufferAttribute, BufferGeometry } from 'three';
import { patchIndices, surfacePatch, type SceneScale } from './scene-geometry';

/** The curved earth under the sightline, exaggerated vertically. */
export function EarthPatch({ scale }: { scale: SceneScale }) {
  const geometry = useMemo(() => {
    const g = new BufferGeometry();
    g.setAttribute('position', new BufferAttribute(surfacePatch(scale), 3));
    g.setIndex(new BufferAttribute(patchIndices(), 1));
    g.computeVertexNormals();
    return g;
  }, [scale]);
  return (
    <mesh geometry={geometry}>
      <meshStandardMaterial color="#C9C2AE" roughness={0.95} flatShading />
    </mesh>
  );
}
