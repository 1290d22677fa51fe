import { ringSelfIntersection } from '@/shared/geo/ring-self-intersection';

/** A GeoJSON file that cannot be imported as outlines, with the reason in words. */
export class GeoJsonImportError extends Error {
  override name = 'GeoJsonImportError';
}

/** One polygon found in a GeoJSON file. */
export interface ImportedPolygon {
  /** `properties.name` of its feature, else a name from its place in the file ("Polygon 2", "Polygon 2, part 3"). */
  readonly name: string;
  /** The outer ring, closed, `[longitude, latitude]` degrees. */
  readonly ring: [number, number][];
  /** How many holes (inner rings) the polygon had; an outline here is one ring, so they are left out. */
  readonly holes: number;
}

/** Longest import read, characters (about 20 MB of text): an outline file is far smaller. */
export const MAX_GEOJSON_CHARS = 20_000_000;

type Json = Record<string, unknown>;
const isObject = (v: unknown): v is Json => typeof v === 'object' && v !== null && !Array.isArray(v);

function ringOf(raw: unknown, where: string): [number, number][] {
  if (!Array.isArray(raw) || raw.length === 0) throw new GeoJsonImportError(`${where} has no coordinates.`);
  const ring = raw.map((p, i): [number, number] => {
    if (
      !Array.isArray(p) ||
      p.length < 2 ||
      typeof p[0] !== 'number' ||
      typeof p[1] !== 'number' ||
      !Number.isFinite(p[0]) ||
      !Number.isFinite(p[1])
    ) {
      throw new GeoJsonImportError(`${where}, position ${i + 1}, is not a [longitude, latitude] pair of numbers.`);
    }
    if (Math.abs(p[0]) > 180 || Math.abs(p[1]) > 90) {
      throw new GeoJsonImportError(
        `${where}, position ${i + 1} (${p[0]}, ${p[1]}), is not longitude and latitude in degrees: GeoJSON (RFC 7946) is WGS 84 degrees, longitude first. Export the file in EPSG:4326.`,
      );
    }
    return [p[0], p[1]];
  });
  const first = ring[0]!;
  const last = ring[ring.length - 1]!;
  if (first[0] !== last[0] || first[1] !== last[1]) ring.push([first[0], first[1]]);
  if (new Set(ring.slice(0, -1).map((p) => p.join(','))).size < 3) {
    throw new GeoJsonImportError(`${where} has fewer than three distinct corners.`);
  }
  const crossing = ringSelfIntersection(ring);
  if (crossing) {
    throw new GeoJsonImportError(
      `${where} crosses itself near ${crossing[1].toFixed(5)}, ${crossing[0].toFixed(5)} (latitude, longitude); fix the outline in the program it came from.`,
    );
  }
  return ring;
}

function polygonOf(coordinates: unknown, label: string, name: string): ImportedPolygon {
  if (!Array.isArray(coordinates) || coordinates.length === 0) throw new GeoJsonImportError(`${label} has no rings.`);
  return { name, ring: ringOf(coordinates[0], `The outer ring of ${label}`), holes: coordinates.length - 1 };
}

/** `label` names the geometry in errors ("Feature 2 (“Bay”)"); `name` names what it yields. */
function fromGeometry(geometry: unknown, label: string, name: string, out: ImportedPolygon[]): void {
  if (!isObject(geometry)) throw new GeoJsonImportError(`${label} has no geometry.`);
  switch (geometry.type) {
    case 'Polygon':
      out.push(polygonOf(geometry.coordinates, label, name));
      return;
    case 'MultiPolygon': {
      const parts = geometry.coordinates;
      if (!Array.isArray(parts) || parts.length === 0) throw new GeoJsonImportError(`${label} (a MultiPolygon) has no parts.`);
      parts.forEach((p, i) =>
        out.push(
          parts.length === 1 ? polygonOf(p, label, name) : polygonOf(p, `${label}, part ${i + 1}`, `${name}, part ${i + 1}`),
        ),
      );
      return;
    }
    default:
      throw new GeoJsonImportError(
        `${label} is a ${typeof geometry.type === 'string' ? geometry.type : 'geometry of no known type'}; only Polygon and MultiPolygon outlines can be imported.`,
      );
  }
}

/**
 * Reads the polygons of a GeoJSON text (RFC 7946: a FeatureCollection, a
 * Feature, or a bare Polygon or MultiPolygon geometry; WGS 84 longitude and
 * latitude in degrees). A MultiPolygon gives one polygon per part. Each
 * polygon keeps its outer ring and counts its holes.
 *
 * @param text - the file's text
 * @returns the polygons in file order (at least one)
 * @throws {GeoJsonImportError} naming the problem: not JSON, no polygons, a
 *   feature of another geometry type (LineString, Point…), coordinates that are
 *   not degrees, or a ring that crosses itself (with where)
 *
 * @example
 * polygonsFromGeoJson('{"type":"Polygon","coordinates":[[[14,61],[14.2,61],[14.2,61.1],[14,61]]]}');
 * // [{ name: 'Polygon 1', ring: [[14,61],[14.2,61],[14.2,61.1],[14,61]], holes: 0 }]
 */
export function polygonsFromGeoJson(text: string): ImportedPolygon[] {
  if (text.length > MAX_GEOJSON_CHARS) throw new GeoJsonImportError('The file is too large for an outline (over 20 MB of text).');
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    throw new GeoJsonImportError(`The file is not JSON: ${e instanceof Error ? e.message : 'it cannot be read'}.`);
  }
  if (!isObject(json) || typeof json.type !== 'string') {
    throw new GeoJsonImportError('The file is JSON but not GeoJSON: it has no "type".');
  }
  const out: ImportedPolygon[] = [];
  const nameOf = (f: Json) =>
    isObject(f.properties) && typeof f.properties.name === 'string' && f.properties.name.trim() ? f.properties.name.trim() : null;
  const feature = (f: Json, i: number) => {
    const n = nameOf(f);
    fromGeometry(f.geometry, n ? `Feature ${i + 1} (“${n}”)` : `Feature ${i + 1}`, n ?? `Polygon ${i + 1}`, out);
  };
  if (json.type === 'FeatureCollection') {
    if (!Array.isArray(json.features) || json.features.length === 0)
      throw new GeoJsonImportError('The FeatureCollection has no features.');
    json.features.forEach((f, i) => {
      if (!isObject(f)) throw new GeoJsonImportError(`Feature ${i + 1} is not a GeoJSON feature.`);
      feature(f, i);
    });
  } else if (json.type === 'Feature') {
    feature(json, 0);
  } else {
    fromGeometry(json, 'The geometry', 'Polygon 1', out);
  }
  return out;
}
