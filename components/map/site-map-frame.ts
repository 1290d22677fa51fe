import { utmZoneFor } from '@/shared/geo/utm-zone-for';
import type { LatLon } from '@/shared/geo/types';
import type { Post, Site } from '@/shared/schemas/site';
import type { SiteTerrain } from '@/shared/schemas/terrain';
import { boundsOfPoints } from '@/shared/terrain/bounds-of-points';
import { gridConvergence } from '@/shared/terrain/grid-convergence';
import { gridProjection, type GridProjection } from '@/shared/terrain/grid-projection';
import type { GridRect, ZoomLimits } from './map-camera';

/** A post placed in the map's grid. */
export interface FramedPost {
  readonly post: Post;
  /** Grid position, metres. */
  readonly x: number;
  readonly y: number;
  /** Grid convergence at the post, radians (grid bearing = true bearing − γ). */
  readonly convergence: number;
}

/** A polygon in grid metres. */
export interface FramedRing {
  readonly name: string;
  readonly points: readonly { x: number; y: number }[];
}

/** Everything the map draws, in one projected frame of grid metres. */
export interface SiteMapFrame {
  readonly projection: GridProjection;
  /** The hillshade and where it lies; null without terrain. */
  readonly base: { readonly url: string; readonly rect: GridRect; readonly terrainId: string } | null;
  /** Why the terrain is not drawn although the site has one (a CRS the browser cannot convert), or null. */
  readonly baseProblem: string | null;
  readonly boundary: FramedRing | null;
  readonly zones: readonly FramedRing[];
  readonly posts: readonly FramedPost[];
  /** What to show first: the site (boundary, zones, posts) with a margin, else the terrain. */
  readonly initial: GridRect;
  /** Zoom limits, pixels per metre. */
  readonly zoom: ZoomLimits;
  /** Grid convergence at the middle of the initial view, radians (for the north arrow). */
  readonly convergence: number;
}

const ringOf = (projection: GridProjection, ring: readonly (readonly [number, number])[], name: string): FramedRing => ({
  name,
  points: ring.map(([lonDeg, latDeg]) => projection.toGrid({ latDeg, lonDeg })),
});

/** A rectangle grown by `share` of its larger side on every side (at least `minM` metres). */
export function padRect(rect: GridRect, share: number, minM = 250): GridRect {
  const pad = Math.max(Math.max(rect.east - rect.west, rect.north - rect.south) * share, minM);
  return { west: rect.west - pad, south: rect.south - pad, east: rect.east + pad, north: rect.north + pad };
}

/** Mean of the site's corners and posts, or null when it has none. */
function siteCentre(site: Site, posts: readonly Post[]): LatLon | null {
  const pts: LatLon[] = [
    ...(site.boundary ?? []).map(([lonDeg, latDeg]) => ({ latDeg, lonDeg })),
    ...site.priorityZones.flatMap((z) => z.ring.map(([lonDeg, latDeg]) => ({ latDeg, lonDeg }))),
    ...posts.map((p) => p.location),
  ];
  if (pts.length === 0) return null;
  return {
    latDeg: pts.reduce((s, p) => s + p.latDeg, 0) / pts.length,
    lonDeg: pts.reduce((s, p) => s + p.lonDeg, 0) / pts.length,
  };
}

/**
 * Puts a site on one map frame (first view: the boundary and zones, else the posts). With a terrain the frame is the terrain's
 * grid CRS and the hillshade lies over its `gridBounds`; without one (or when
 * the browser cannot convert the terrain's CRS) it is the WGS 84 / UTM zone of
 * the site's middle, over a plain background. Returns null for a site with no
 * boundary, zones or posts and no terrain: nothing to place.
 */
export function siteMapFrame(site: Site, posts: readonly Post[], terrain: SiteTerrain | null): SiteMapFrame | null {
  let projection: GridProjection | null = null;
  let baseProblem: string | null = null;
  if (terrain) {
    try {
      projection = gridProjection(terrain.crs);
    } catch (error) {
      baseProblem =
        `The terrain’s coordinate system (${terrain.crs.label}) cannot be converted here, so the map is drawn without it. ${error instanceof Error ? error.message : ''}`.trim();
    }
  }
  const centre = siteCentre(site, posts);
  if (!projection) {
    if (!centre) return null;
    const zone = utmZoneFor(centre.latDeg, centre.lonDeg);
    projection = gridProjection({ epsg: (centre.latDeg >= 0 ? 32600 : 32700) + zone, wkt: null });
  }
  const grid = projection;
  const base =
    terrain && !baseProblem ? { url: terrain.baseLayer.url, rect: terrain.baseLayer.gridBounds, terrainId: terrain.id } : null;
  const boundary = site.boundary ? ringOf(grid, site.boundary, site.name) : null;
  const zones = site.priorityZones.map((z) => ringOf(grid, z.ring, z.name));
  const framedPosts = posts.map((post) => {
    const { x, y } = grid.toGrid(post.location);
    return { post, x, y, convergence: gridConvergence(grid, post.location) };
  });
  // The first view is the site itself: its boundary and zones when drawn (a post far outside, e.g.
  // one typed with a wrong zone, is still drawn and reached by panning), else the posts.
  const drawn = [...(boundary?.points ?? []), ...zones.flatMap((z) => z.points)];
  const siteRect = boundsOfPoints(drawn.length > 0 ? drawn : framedPosts);
  const initial = siteRect ? padRect(siteRect, 0.08) : (base?.rect ?? { west: -5000, south: -5000, east: 5000, north: 5000 });
  const everything = [...cornersOf(initial), ...(base ? cornersOf(base.rect) : []), ...framedPosts];
  const all = boundsOfPoints(everything)!;
  const span = Math.max(all.east - all.west, all.north - all.south, 1000);
  // Out until everything there is fits in 150 px (but at least to a view of the site in 50 px); in to
  // 2 px a metre (a 25 m cell 50 px wide).
  const siteSpan = Math.max(initial.east - initial.west, initial.north - initial.south, 1000);
  const zoom: ZoomLimits = { minPxPerM: Math.min(150 / span, 50 / siteSpan), maxPxPerM: 2 };
  const middle = grid.toLatLon((initial.west + initial.east) / 2, (initial.south + initial.north) / 2);
  return {
    projection: grid,
    base,
    baseProblem,
    boundary,
    zones,
    posts: framedPosts,
    initial,
    zoom,
    convergence: gridConvergence(grid, middle),
  };
}

const cornersOf = (r: GridRect) => [
  { x: r.west, y: r.south },
  { x: r.east, y: r.north },
];
