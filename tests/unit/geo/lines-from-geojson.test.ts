import { GeoJsonLineError, linesFromGeoJson } from '@/shared/geo/lines-from-geojson';

describe('lines from GeoJSON', () => {
  it('reads a LineString, a Feature with a name and a MultiLineString in a collection', () => {
    // Source: RFC 7946 §3.1.4 (LineString), §3.1.5 (MultiLineString), §3.2–3.3 (Feature, FeatureCollection).
    expect(linesFromGeoJson('{"type":"LineString","coordinates":[[14.1,61.0,3],[14.2,61.05]]}')).toEqual([
      {
        name: 'Line 1',
        line: [
          [14.1, 61],
          [14.2, 61.05],
        ],
      },
    ]);
    const collection = {
      type: 'FeatureCollection',
      features: [
        {
          type: 'Feature',
          properties: { name: 'North shore' },
          geometry: {
            type: 'LineString',
            coordinates: [
              [1, 2],
              [3, 4],
            ],
          },
        },
        {
          type: 'Feature',
          properties: {},
          geometry: {
            type: 'Polygon',
            coordinates: [
              [
                [0, 0],
                [1, 0],
                [1, 1],
                [0, 0],
              ],
            ],
          },
        },
        {
          type: 'Feature',
          properties: null,
          geometry: {
            type: 'MultiLineString',
            coordinates: [
              [
                [5, 6],
                [7, 8],
              ],
              [
                [9, 10],
                [11, 12],
              ],
            ],
          },
        },
      ],
    };
    expect(linesFromGeoJson(JSON.stringify(collection)).map((l) => l.name)).toEqual(['North shore', 'Line 2', 'Line 3']);
  });

  it('refuses what is not a line, with the reason', () => {
    expect(() => linesFromGeoJson('not json')).toThrow(GeoJsonLineError);
    expect(() => linesFromGeoJson('{"type":"Polygon","coordinates":[[[0,0],[1,0],[1,1],[0,0]]]}')).toThrow(/not an outline/);
    expect(() => linesFromGeoJson('{"type":"LineString","coordinates":[[61.0,200],[14.2,61.05]]}')).toThrow(/outside WGS 84/);
  });
});
