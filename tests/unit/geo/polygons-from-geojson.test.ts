import { readFileSync } from 'node:fs';
import path from 'node:path';
import { GeoJsonImportError, polygonsFromGeoJson } from '@/shared/geo/polygons-from-geojson';

const fixture = (name: string) => readFileSync(path.join(__dirname, '..', '..', 'fixtures', 'geojson', name), 'utf8');

describe('polygonsFromGeoJson', () => {
  it('keeps a polygon’s outer ring and counts its hole', () => {
    // Source: tests/fixtures/geojson/README.md — GDAL 3.6.2 reads one valid Polygon with 1 interior ring.
    const [p, ...rest] = polygonsFromGeoJson(fixture('lake-district-with-hole.geojson'));
    expect(rest).toHaveLength(0);
    expect(p).toEqual({
      name: 'Stillwater district',
      ring: [
        [13.0, 60.5],
        [13.4, 60.5],
        [13.4, 60.7],
        [13.0, 60.7],
        [13.0, 60.5],
      ],
      holes: 1,
    });
  });

  it('gives one outline per part of a MultiPolygon', () => {
    // Source: tests/fixtures/geojson/README.md — GDAL 3.6.2 reads a valid MultiPolygon of 3 parts.
    const parts = polygonsFromGeoJson(fixture('island-parts.geojson'));
    expect(parts.map((p) => p.name)).toEqual(['Skerry group, part 1', 'Skerry group, part 2', 'Skerry group, part 3']);
    expect(parts[1]!.ring).toHaveLength(4);
    expect(parts.every((p) => p.holes === 0)).toBe(true);
  });

  it('refuses another geometry type, naming the feature and the type', () => {
    // Source: tests/fixtures/geojson/README.md — GDAL 3.6.2 reads a Line String.
    expect(() => polygonsFromGeoJson(fixture('patrol-track.geojson'))).toThrow(
      'Feature 1 (“Shore path”) is a LineString; only Polygon and MultiPolygon outlines can be imported.',
    );
  });

  it('refuses a self-crossing ring and says where it crosses', () => {
    // Source: tests/fixtures/geojson/README.md — SpatiaLite (through GDAL) reports Self-intersection[13.2 60.6].
    expect(() => polygonsFromGeoJson(fixture('crossed-outline.geojson'))).toThrow(/crosses itself near 60\.60000, 13\.20000/);
  });

  it('refuses text that is not JSON, JSON that is not GeoJSON, and projected coordinates', () => {
    expect(() => polygonsFromGeoJson('{not json')).toThrow(/^The file is not JSON/);
    expect(() => polygonsFromGeoJson('{"features": []}')).toThrow(/not GeoJSON/);
    const projected = JSON.stringify({
      type: 'Polygon',
      coordinates: [
        [
          [500000, 6700000],
          [501000, 6700000],
          [501000, 6701000],
          [500000, 6700000],
        ],
      ],
    });
    expect(() => polygonsFromGeoJson(projected)).toThrow(GeoJsonImportError);
    expect(() => polygonsFromGeoJson(projected)).toThrow(
      /position 1 \(500000, 6700000\), is not longitude and latitude in degrees/,
    );
  });

  it('closes an unclosed ring', () => {
    const open = JSON.stringify({
      type: 'Polygon',
      coordinates: [
        [
          [13, 60],
          [13.1, 60],
          [13.1, 60.1],
        ],
      ],
    });
    expect(polygonsFromGeoJson(open)[0]!.ring).toEqual([
      [13, 60],
      [13.1, 60],
      [13.1, 60.1],
      [13, 60],
    ]);
  });
});
