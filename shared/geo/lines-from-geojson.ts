/** A line found in a GeoJSON text: its name (a feature's `name` property, else "Line N") and [lon, lat] corners. */
export interface ImportedLine {
  readonly name: string;
  readonly line: [number, number][];
}

/** Why a GeoJSON text gave no line. */
export class GeoJsonLineError extends Error {}

const isPair = (p: unknown): p is [number, number] =>
  Array.isArray(p) &&
  p.length >= 2 &&
  typeof p[0] === 'number' &&
  typeof p[1] === 'number' &&
  Number.isFinite(p[0]) &&
  Number.isFinite(p[1]);

/**
 * The LineStrings of a GeoJSON text (RFC 7946: a geometry, a Feature or a
 * FeatureCollection; MultiLineString parts each a line), WGS 84 degrees.
 * Heights (a third number) are dropped; other geometry types are skipped.
 *
 * @throws GeoJsonLineError when the text is not JSON, holds no line, or a
 *   position is outside −180…180 / −90…90
 * @example
 * linesFromGeoJson('{"type":"LineString","coordinates":[[14.1,61.0],[14.2,61.05]]}');
 * // [{ name: 'Line 1', line: [[14.1, 61], [14.2, 61.05]] }]
 */
export function linesFromGeoJson(text: string): ImportedLine[] {
  let doc: unknown;
  try {
    doc = JSON.parse(text);
  } catch {
    throw new GeoJsonLineError('This is not GeoJSON (not valid JSON).');
  }
  const lines: ImportedLine[] = [];
  const add = (coords: unknown, name: string | null) => {
    if (!Array.isArray(coords) || !coords.every(isPair))
      throw new GeoJsonLineError('A line’s positions must be [longitude, latitude] pairs.');
    const line = coords.map((p) => [p[0], p[1]] as [number, number]);
    for (const [lon, lat] of line) {
      if (lon < -180 || lon > 180 || lat < -90 || lat > 90)
        throw new GeoJsonLineError(`A position is outside WGS 84 degrees: ${lon}, ${lat} (longitude first).`);
    }
    lines.push({ name: name ?? `Line ${lines.length + 1}`, line });
  };
  const geometry = (g: unknown, name: string | null) => {
    if (!g || typeof g !== 'object') return;
    const { type, coordinates } = g as { type?: unknown; coordinates?: unknown };
    if (type === 'LineString') add(coordinates, name);
    if (type === 'MultiLineString' && Array.isArray(coordinates)) coordinates.forEach((c) => add(c, name));
    if (type === 'GeometryCollection') ((g as { geometries?: unknown[] }).geometries ?? []).forEach((x) => geometry(x, name));
  };
  const feature = (f: unknown) => {
    const props = (f as { properties?: { name?: unknown } }).properties;
    geometry((f as { geometry?: unknown }).geometry, typeof props?.name === 'string' ? props.name : null);
  };
  const root = doc as { type?: unknown; features?: unknown[] };
  if (root?.type === 'FeatureCollection') (root.features ?? []).forEach(feature);
  else if (root?.type === 'Feature') feature(root);
  else geometry(root, null);
  if (lines.length === 0) throw new GeoJsonLineError('No LineString in this GeoJSON: a shoreline is a line, not an outline.');
  return lines;
}
