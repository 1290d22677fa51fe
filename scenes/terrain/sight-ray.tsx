import { useEffect, useMemo } from 'react';
import { BufferAttribute, BufferGeometry, Line, LineBasicMaterial } from 'three';

/** A straight sight line from the chosen post's eye to a tapped point (scene units). */
export function SightRay({ from, to, color }: { from: [number, number, number]; to: [number, number, number]; color: string }) {
  const line = useMemo(() => {
    const g = new BufferGeometry();
    g.setAttribute('position', new BufferAttribute(new Float32Array([...from, ...to]), 3));
    return new Line(g, new LineBasicMaterial({ color }));
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
