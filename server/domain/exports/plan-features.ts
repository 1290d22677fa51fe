import type { Feature, FeatureCollection, Geometry } from 'geojson';
import type { PlanSnapshot } from '@/shared/schemas/plan';
import { geodesicCircle, geodesicSector, rfc7946Ring, roundCoordinate, type Position } from './geojson-rings';
import { measureLine, positionAt, stretchPositions } from './shore-lines';

/** One listed blind area of one case, outlined from the stored class raster. */
export interface BlindAreaOutline {
  caseKey: string;
  /** 1 = the case's largest listed blind area. */
  rank: number;
  areaM2: number;
  /** The point the coverage reports as surely inside the area (WGS84), when the run recorded one. */
  interior: { latDeg: number; lonDeg: number } | null;
  /** RFC 7946 MultiPolygon coordinates. */
  coordinates: Position[][][];
}

/** What the collection is of (properties of the collection's own `kenning` member). */
export interface FeatureCollectionMeta {
  planId: string;
  planTitle: string;
  planVersion: number;
  revision: number;
  contentHash: string;
  siteName: string;
  cautions: string[];
}

/** A post as the snapshot froze it. */
interface FrozenPost {
  id: string;
  name: string;
  kind: string;
  status: string;
  location: { latDeg: number; lonDeg: number };
  groundElevationM: number;
  structureHeightM: number;
  eyeHeightM: number;
  sector: { fromDeg: number; toDeg: number } | null;
  /** A patrol's waypoints (vessels and aircraft), absent or null otherwise. */
  route?: { latDeg: number; lonDeg: number }[] | null;
  speedMps?: number | null;
  cycleMinutes?: number | null;
}

type Ring = [number, number][];

const round = (v: number, digits: number) => Math.round(v * 10 ** digits) / 10 ** digits;

function polygonFeature(ring: readonly (readonly [number, number])[] | null, properties: Record<string, unknown>) {
  const outer = ring && rfc7946Ring(ring as Position[], true);
  return outer ? feature({ type: 'Polygon', coordinates: [outer] }, properties) : null;
}

const feature = (geometry: Geometry, properties: Record<string, unknown>): Feature => ({
  type: 'Feature',
  geometry,
  properties,
});

/**
 * The frozen revision of a plan as an RFC 7946 FeatureCollection in WGS84
 * longitude/latitude: the site's boundary, priority zones and sea area;
 * every post (a Point, heights in its properties: ground, structure, eye and
 * the eye's elevation, metres above the datum the site uses); each post's
 * viewing sector (a geodesic wedge out to its farthest detection range);
 * a range ring per post × target × condition (the geodesic circle of the
 * detection range, with what limits it); and the listed blind areas of each
 * terrain-coverage case (MultiPolygons traced from the stored layer).
 * On a coast: each patrol's route (a LineString through its waypoints), the
 * shoreline (a LineString with its length and bands), and per coverage case
 * the shore strips (per band × post, a MultiLineString of the stretches the
 * post watches) and the gaps (a LineString along the shore between their
 * chainages, or a Point for a seam of no length).
 * Every feature says what it is in `properties.kind`.
 *
 * Source: RFC 7946 §3 (geometry objects; §3.1.1 positions are longitude,
 * latitude; §3.1.6 closed, counter-clockwise exterior rings); §4 (WGS84).
 *
 * @param snapshot a verified revision's snapshot (not modified)
 * @param meta the plan and revision, for the collection's header
 * @param blindAreas outlines of the cases' blind areas
 */
export function planFeatureCollection(
  snapshot: PlanSnapshot,
  meta: FeatureCollectionMeta,
  blindAreas: readonly BlindAreaOutline[],
): FeatureCollection & { kenning: FeatureCollectionMeta } {
  const features: Feature[] = [];
  const site = snapshot.inputs.site as {
    name?: string;
    boundary?: Ring | null;
    priorityZones?: { name: string; weight: number; ring: Ring }[];
    seaArea?: Ring | null;
    shoreline?: Ring | null;
    bands?: { name: string; fromM: number; toM: number }[];
  };
  const push = (f: Feature | null) => {
    if (f) features.push(f);
  };
  push(polygonFeature(site.boundary ?? null, { kind: 'boundary', name: site.name ?? meta.siteName }));
  for (const zone of site.priorityZones ?? []) {
    push(polygonFeature(zone.ring, { kind: 'priority-zone', name: zone.name, weight: zone.weight }));
  }
  push(polygonFeature(site.seaArea ?? null, { kind: 'sea-area', name: 'Sea' }));

  const posts = snapshot.inputs.posts as unknown as FrozenPost[];
  for (const post of posts) {
    const { latDeg, lonDeg } = post.location;
    features.push(
      feature(
        { type: 'Point', coordinates: [roundCoordinate(lonDeg), roundCoordinate(latDeg)] },
        {
          kind: 'post',
          postId: post.id,
          name: post.name,
          postKind: post.kind,
          status: post.status,
          groundElevationM: post.groundElevationM,
          structureHeightM: post.structureHeightM,
          eyeHeightM: post.eyeHeightM,
          eyeElevationM: round(post.groundElevationM + post.structureHeightM + post.eyeHeightM, 3),
          sectorFromDeg: post.sector?.fromDeg ?? null,
          sectorToDeg: post.sector?.toDeg ?? null,
        },
      ),
    );
    if (post.route && post.route.length >= 2) {
      features.push(
        feature(
          { type: 'LineString', coordinates: post.route.map((w) => [roundCoordinate(w.lonDeg), roundCoordinate(w.latDeg)]) },
          {
            kind: 'patrol-route',
            postId: post.id,
            postName: post.name,
            postKind: post.kind,
            waypoints: post.route.length,
            routeLengthM: round(measureLine(post.route.map((w) => [w.lonDeg, w.latDeg] as Position))!.lengthM, 1),
            speedMps: post.speedMps ?? null,
            cycleMinutes: post.cycleMinutes ?? null,
          },
        ),
      );
    }
    const rows = snapshot.results.filter((r) => r.postId === post.id);
    if (post.sector) {
      const ranges = rows.map((r) => r.result.detectionRangeM ?? r.result.geographicRangeM ?? 0);
      const radiusM = Math.max(0, ...ranges);
      const ring = radiusM > 0 ? geodesicSector(post.location, post.sector.fromDeg, post.sector.toDeg, radiusM) : null;
      if (ring) {
        features.push(
          feature(
            { type: 'Polygon', coordinates: [ring] },
            {
              kind: 'sector',
              postId: post.id,
              postName: post.name,
              fromDeg: post.sector.fromDeg,
              toDeg: post.sector.toDeg,
              radiusM: round(radiusM, 1),
            },
          ),
        );
      }
    }
    for (const row of rows) {
      const rangeM = row.result.detectionRangeM;
      const ring = rangeM !== null && rangeM > 0 ? geodesicCircle(post.location, rangeM) : null;
      if (!ring) continue;
      features.push(
        feature(
          { type: 'Polygon', coordinates: [ring] },
          {
            kind: 'range-ring',
            postId: post.id,
            postName: post.name,
            targetId: row.targetId,
            targetName: row.targetName,
            conditionSetId: row.conditionSetId,
            conditionSetName: row.conditionSetName,
            conditionIndex: row.conditionIndex,
            refractionK: row.result.k,
            detectionRangeM: round(rangeM!, 1),
            limitedBy: row.result.limitedBy,
            horizonRangeM: row.result.horizonDistanceM === null ? null : round(row.result.horizonDistanceM, 1),
            geographicRangeM: row.result.geographicRangeM === null ? null : round(row.result.geographicRangeM, 1),
          },
        ),
      );
    }
  }

  const cases = new Map((snapshot.coverage?.cases ?? []).map((c) => [c.key, c]));
  for (const area of blindAreas) {
    const c = cases.get(area.caseKey);
    if (area.coordinates.length === 0) continue;
    features.push(
      feature(
        { type: 'MultiPolygon', coordinates: area.coordinates },
        {
          kind: 'blind-area',
          caseKey: area.caseKey,
          targetName: c?.targetName ?? null,
          conditionSetName: c?.conditionSetName ?? null,
          conditionLabel: c?.conditionLabel ?? null,
          rank: area.rank,
          areaM2: area.areaM2,
          interiorLatDeg: area.interior ? roundCoordinate(area.interior.latDeg) : null,
          interiorLonDeg: area.interior ? roundCoordinate(area.interior.lonDeg) : null,
        },
      ),
    );
  }
  shoreFeatures(site.shoreline ?? null, site.bands ?? [], snapshot.coverage?.cases ?? [], features);
  return { type: 'FeatureCollection', kenning: meta, features };
}

type FrozenCase = NonNullable<PlanSnapshot['coverage']>['cases'][number];

/** The shoreline, and each case's shore strips and gaps along it (chainage in metres from its first corner). */
function shoreFeatures(
  shoreline: Ring | null,
  bands: readonly { name: string; fromM: number; toM: number }[],
  cases: readonly FrozenCase[],
  features: Feature[],
) {
  const line = shoreline ? measureLine(shoreline) : null;
  if (!line) return;
  features.push(
    feature(
      { type: 'LineString', coordinates: line.corners.map(([lon, lat]) => [roundCoordinate(lon), roundCoordinate(lat)]) },
      { kind: 'shoreline', lengthM: round(line.lengthM, 1), bands: bands.map((b) => ({ ...b })) },
    ),
  );
  for (const c of cases) {
    const about = {
      caseKey: c.key,
      targetName: c.targetName,
      conditionSetName: c.conditionSetName,
      conditionLabel: c.conditionLabel,
    };
    for (const band of c.bands ?? []) {
      for (const post of band.posts) {
        const parts = post.watched.map(([from, to]) => stretchPositions(line, from, to)).filter((p) => p !== null);
        if (parts.length === 0) continue;
        features.push(
          feature(
            { type: 'MultiLineString', coordinates: parts },
            {
              kind: 'shore-strip',
              ...about,
              band: band.name,
              bandFromM: band.fromM,
              bandToM: band.toM,
              postId: post.postId,
              postName: post.postName,
              lengthM: round(post.lengthM, 1),
              watched: post.watched.map(([from, to]) => [round(from, 1), round(to, 1)]),
            },
          ),
        );
      }
    }
    for (const gap of c.gaps ?? []) {
      const stretch = stretchPositions(line, gap.fromM, gap.toM);
      features.push(
        feature(
          stretch ? { type: 'LineString', coordinates: stretch } : { type: 'Point', coordinates: positionAt(line, gap.fromM) },
          {
            kind: 'shore-gap',
            ...about,
            band: gap.band,
            gapKind: gap.kind,
            fromM: round(gap.fromM, 1),
            toM: round(gap.toM, 1),
            lengthM: round(gap.lengthM, 1),
            closerPostId: gap.closer?.postId ?? null,
            closerPostName: gap.closer?.postName ?? null,
            closerRaiseByM: gap.closer?.raiseByM ?? null,
            closerBlockedBy: gap.closer?.blockedBy ?? null,
          },
        ),
      );
    }
  }
}
