import { useEffect, useMemo } from 'react';
import { BufferAttribute, BufferGeometry, Line, LineBasicMaterial } from 'three';

/**
 * A straight sight line from the chosen post's eye to a tapped point (scene
 * units), drawn over the terrain (no depth test) so a line that runs into a
 * hill still shows where it goes; its colour says whether the point is seen.
 */
export function SightRay({ from, to, color }: { from: [number, number, number]; to: [number, number, number]; color: string }) {
  const line = useMemo(() => {
    const g = new BufferGeometry();
    g.setAttribute('position', new BufferAttribute(new Float32Array([...from, ...to]), 3));
    const line = new Line(g, new LineBasicMaterial({ color, depthTest: false, transparent: true, opacity: 0.9 }));
    line.renderOrder = 10;
    return line;
  }, [from, to, color]);
  useEffect(
    () => () => {
      line.geometry.dispose();
      (line.material as LineBasicMaterial).dispose();
    },
    [line],
  );
  return <primitive object={line} />;
}
