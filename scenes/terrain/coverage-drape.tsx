import { useEffect, useMemo } from 'react';
import { DataTexture, LinearFilter, NearestFilter, RGBAFormat, SRGBColorSpace } from 'three';
import type { ClassPalette } from '@/components/map/class-palettes';
import { classRasterBounds, type ClassRasterGrid } from '@/components/map/class-raster-pixels';
import { drapePixels } from './coverage-drape-pixels';
import type { MeshGrid, SceneFrame } from './terrain-geometry';
import { useSurfaceGeometry } from './use-surface-geometry';

/** A decoded coverage layer to lay over the terrain. */
export interface SceneDrape {
  readonly grid: ClassRasterGrid;
  /** Codes, row-major, row 0 = north. */
  readonly values: Uint8Array;
  readonly palette: ClassPalette;
}

/**
 * A coverage layer draped over the terrain: the surface's vertices again,
 * with texture coordinates over the layer's own grid rectangle, and the
 * classes as a nearest-sampled data texture (cell edges stay sharp on the
 * decimated mesh). Drawn after the ground, without writing depth, pulled
 * slightly towards the camera so it never fights the ground for a pixel.
 */
export function CoverageDrape({ mesh, frame, drape }: { mesh: MeshGrid; frame: SceneFrame; drape: SceneDrape }) {
  const bounds = useMemo(() => classRasterBounds(drape.grid), [drape.grid]);
  const geometry = useSurfaceGeometry(mesh, frame, bounds);
  const texture = useMemo(() => {
    const { width, height, rgba } = drapePixels(drape.values, drape.grid, drape.palette);
    const t = new DataTexture(rgba, width, height, RGBAFormat);
    t.colorSpace = SRGBColorSpace;
    t.magFilter = NearestFilter;
    t.minFilter = LinearFilter;
    t.generateMipmaps = false;
    t.needsUpdate = true;
    return t;
  }, [drape]);
  useEffect(() => () => texture.dispose(), [texture]);
  return (
    <mesh geometry={geometry} renderOrder={1}>
      <meshStandardMaterial
        map={texture}
        transparent
        depthWrite={false}
        polygonOffset
        polygonOffsetFactor={-2}
        polygonOffsetUnits={-2}
        roughness={0.95}
        metalness={0}
      />
    </mesh>
  );
}
