import { useMemo } from 'react';
import { BufferAttribute, BufferGeometry, Line, LineBasicMaterial } from 'three';
import { rayPoints, type SceneScale } from './scene-geometry';

/** One condition's horizon-grazing sightline. */
export function SightRay({
  horizonM,
  effectiveRadiusM,
  color,
  scale,
}: {
  horizonM: number | null;
  effectiveRadiusM: number | null;
  color: string;
  scale: SceneScale;
}) {
  const line = useMemo(() => {
    const pts = rayPoints(horizonM, effectiveRadiusM, scale);
    if (!pts) return null;
    const g = new BufferGeometry();
    g.setAttribute('position', new BufferAttribute(pts, 3));
    return new Line(g, new LineBasicMaterial({ color }));
  }, [horizonM, effectiveRadiusM, color, scale]);
  return line ? <primitive object={line} /> : null;
}
