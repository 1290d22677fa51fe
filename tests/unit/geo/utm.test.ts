import proj4 from 'proj4';

import { fromUtm, LATITUDE_BANDS, latitudeBand, toUtm, utmCentralMeridian, utmZoneFor, type Hemisphere } from '@/shared/geo/utm';

import { deepFreeze, expectCoordinateError, expectWithin } from './expect-close';

/*
 * Reference positions. Each row: latitude, longitude (degrees), zone,
 * hemisphere, easting, northing (metres), and the tolerance the published
 * digits allow (half the last digit, plus 0.1 mm).
 */
interface Reference {
  what: string;
  latDeg: number;
  lonDeg: number;
  zone: number;
  hemisphere: Hemisphere;
  easting: number;
  northing: number;
  toleranceM: number;
  source: string;
}

const GEODESY = 'geodesy (npm) test suite, test/utm-mgrs-tests.js, "latitude/longitude -> UTM"';
const IBM =
  'IBM developerWorks "j-coordconvert" listing 7, as quoted in test/utm-mgrs-tests.js of geodesy (npm); rounded to the metre';
const REFERENCES: readonly Reference[] = [
  // Source: GeographicLib GeoConvert usage text: "33.3 44.4" ≡ "38N 444140.54 3684706.36".
  {
    what: '33.3°N 44.4°E',
    latDeg: 33.3,
    lonDeg: 44.4,
    zone: 38,
    hemisphere: 'N',
    easting: 444140.54,
    northing: 3684706.36,
    toleranceM: 0.0051,
    source: 'GeographicLib GeoConvert usage',
  },
  // Source: geodesy (npm) test suite, see GEODESY.
  {
    what: 'equator at 0°',
    latDeg: 0,
    lonDeg: 0,
    zone: 31,
    hemisphere: 'N',
    easting: 166021.443081,
    northing: 0,
    toleranceM: 0.0001,
    source: GEODESY,
  },
  {
    what: '1°N 1°E',
    latDeg: 1,
    lonDeg: 1,
    zone: 31,
    hemisphere: 'N',
    easting: 277438.26352,
    northing: 110597.97252,
    toleranceM: 0.0001,
    source: GEODESY,
  },
  {
    what: '1°S 1°W',
    latDeg: -1,
    lonDeg: -1,
    zone: 30,
    hemisphere: 'S',
    easting: 722561.73648,
    northing: 9889402.02748,
    toleranceM: 0.0001,
    source: GEODESY,
  },
  {
    what: '48.8583°N 2.2945°E',
    latDeg: 48.8583,
    lonDeg: 2.2945,
    zone: 31,
    hemisphere: 'N',
    easting: 448251.898,
    northing: 5411943.794,
    toleranceM: 0.0006,
    source: GEODESY,
  },
  {
    what: '33.857°S 151.215°E',
    latDeg: -33.857,
    lonDeg: 151.215,
    zone: 56,
    hemisphere: 'S',
    easting: 334873.199,
    northing: 6252266.092,
    toleranceM: 0.0006,
    source: GEODESY,
  },
  {
    what: '38.8977°N 77.0365°W',
    latDeg: 38.8977,
    lonDeg: -77.0365,
    zone: 18,
    hemisphere: 'N',
    easting: 323394.296,
    northing: 4307395.634,
    toleranceM: 0.0006,
    source: GEODESY,
  },
  {
    what: '22.9519°S 43.2106°W',
    latDeg: -22.9519,
    lonDeg: -43.2106,
    zone: 23,
    hemisphere: 'S',
    easting: 683466.254,
    northing: 7460687.433,
    toleranceM: 0.0006,
    source: GEODESY,
  },
  // Source: geodesy (npm) test suite — 5.3249°E at 60.39°N lies in widened zone 32, not 31.
  {
    what: '60.39135°N 5.3249°E (zone 32 widened)',
    latDeg: 60.39135,
    lonDeg: 5.3249,
    zone: 32,
    hemisphere: 'N',
    easting: 297508.41,
    northing: 6700645.3,
    toleranceM: 0.0051,
    source: GEODESY,
  },
  // Source: IBM coordconvert values, see IBM (rounded: tolerance 0.5 m plus the other implementation's own error, 1 m in all).
  {
    what: '0.13°N 0.2324°W',
    latDeg: 0.13,
    lonDeg: -0.2324,
    zone: 30,
    hemisphere: 'N',
    easting: 808084,
    northing: 14386,
    toleranceM: 1,
    source: IBM,
  },
  {
    what: '45.6456°S 23.3545°E',
    latDeg: -45.6456,
    lonDeg: 23.3545,
    zone: 34,
    hemisphere: 'S',
    easting: 683474,
    northing: 4942631,
    toleranceM: 1,
    source: IBM,
  },
  {
    what: '12.765°S 33.8765°W',
    latDeg: -12.765,
    lonDeg: -33.8765,
    zone: 25,
    hemisphere: 'S',
    easting: 404859,
    northing: 8588691,
    toleranceM: 1,
    source: IBM,
  },
  {
    what: '23.4578°N 135.4545°W',
    latDeg: 23.4578,
    lonDeg: -135.4545,
    zone: 8,
    hemisphere: 'N',
    easting: 453580,
    northing: 2594273,
    toleranceM: 1,
    source: IBM,
  },
  {
    what: '77.345°N 156.9876°E',
    latDeg: 77.345,
    lonDeg: 156.9876,
    zone: 57,
    hemisphere: 'N',
    easting: 450794,
    northing: 8586116,
    toleranceM: 1,
    source: IBM,
  },
];

describe('toUtm against published conversions', () => {
  it.each(REFERENCES)('$what → zone $zone$hemisphere ($source)', (ref) => {
    const utm = toUtm({ latDeg: ref.latDeg, lonDeg: ref.lonDeg });
    expect(utm.zone).toBe(ref.zone);
    expect(utm.hemisphere).toBe(ref.hemisphere);
    expectWithin(utm.easting, ref.easting, ref.toleranceM);
    expectWithin(utm.northing, ref.northing, ref.toleranceM);
  });
});

describe('fromUtm against published conversions', () => {
  // Latitude tolerance: the published metres' own rounding (toleranceM) over 1 m ≈ 9e-6° (111 km per degree),
  // and for longitude the same divided by cos(latitude); 1e-9° covers the arithmetic.
  it.each(REFERENCES)('zone $zone$hemisphere → $what ($source)', (ref) => {
    const back = fromUtm({ zone: ref.zone, hemisphere: ref.hemisphere, easting: ref.easting, northing: ref.northing });
    const perDegreeM = 111_000;
    expectWithin(back.latDeg, ref.latDeg, ref.toleranceM / perDegreeM + 1e-9);
    expectWithin(back.lonDeg, ref.lonDeg, ref.toleranceM / (perDegreeM * Math.cos((ref.latDeg * Math.PI) / 180)) + 1e-9);
  });

  it('reproduces GeographicLib to 1e-9° on its 38N example', () => {
    // Source: GeoConvert -p 9 of "38n 444140.54 3684706.36" gives 33.30000003988349 44.39999994689769,
    // as recorded in a public Swift UTM test suite (second-hand quote of GeographicLib output).
    const back = fromUtm({ zone: 38, hemisphere: 'N', easting: 444140.54, northing: 3684706.36 });
    expectWithin(back.latDeg, 33.30000003988349, 1e-9);
    expectWithin(back.lonDeg, 44.39999994689769, 1e-9);
  });
});

describe('the transverse Mercator engine toUtm builds on', () => {
  it('reproduces the USGS Professional Paper 1395 numerical example (Clarke 1866)', () => {
    // Source: USGS Professional Paper 1395 "Map Projections — A Working Manual", p. 269: Clarke 1866
    // (a = 6 378 206.4 m), central meridian 75°W, k0 = 0.9996, 40°30'N 73°30'W → x = 127 106.5 m, y = 4 484 124.4 m
    // (published to 0.1 m; tolerance 0.1 m).
    const clarke = '+ellps=clrk66 +towgs84=0,0,0 +no_defs';
    const tm = proj4(`+proj=longlat ${clarke}`, `+proj=utm +zone=18 +units=m ${clarke}`);
    const [x = Number.NaN, y = Number.NaN] = tm.forward([-73.5, 40.5]);
    expectWithin(x - 500_000, 127_106.5, 0.1);
    expectWithin(y, 4_484_124.4, 0.1);
  });
});

describe('utmZoneFor', () => {
  it.each([
    // Source: geodesy (npm) test suite, "Norway/Svalbard adjustment".
    [60, 4, 32],
    [75, 8, 31],
    [75, 10, 33],
    [75, 20, 33],
    [75, 22, 35],
    [75, 32, 35],
    [75, 34, 37],
  ])('%p°N %p°E is in zone %p (Norway/Svalbard exception)', (lat, lon, zone) => {
    expect(utmZoneFor(lat, lon)).toBe(zone);
  });

  it.each([
    // Source: DMA TM 8358.1 ch. 3 (from memory) and Apache SIS issue SIS-353: zone 32 covers 3°E–12°E for 56°N–64°N;
    // 31X 0–9°E, 33X 9–21°E, 35X 21–33°E, 37X 33–42°E for 72°N–84°N. Edges: the western edge belongs to the zone.
    ['just below 56°N stays in 31', 55.9999, 4, 31],
    ['56°N exactly is widened', 56, 3, 32],
    ['west of 3°E at 60°N is still 31', 60, 2.9999, 31],
    ['12°E at 60°N is 33', 60, 12, 33],
    ['64°N is no longer widened', 64, 4, 31],
    ['72°N exactly: 9°E starts 33X', 72, 9, 33],
    ['just below 72°N at 9°E is 32', 71.9999, 9, 32],
    ['84°N is still band X: 20°E is 33', 84, 20, 33],
    ['42°E at 75°N is back to 38', 75, 42, 38],
    ['western Svalbard edge 0°E is 31', 75, 0, 31],
    ['just west of 0° at 75°N is 30', 75, -0.0001, 30],
  ])('%s', (_what, lat, lon, zone) => {
    expect(utmZoneFor(lat, lon)).toBe(zone);
  });

  it.each([
    // Source: 6° zones numbered eastward from 180°W, zone 1 = 180°W–174°W, zone 60 = 174°E–180°E (common practice, no source).
    [0, -180, 1],
    [0, 180, 1],
    [0, 179.9999, 60],
    [0, -174.0001, 1],
    [0, -174, 2],
    [0, -0.0001, 30],
    [0, 0, 31],
    [-45, 174, 60],
    [80.5, 0.5, 31],
    [-80, -177, 1],
    [84, 179, 60],
  ])('%p, %p is in zone %p', (lat, lon, zone) => {
    expect(utmZoneFor(lat, lon)).toBe(zone);
  });

  it('refuses positions outside UTM and impossible ones', () => {
    // Source: UTM limits 80°S and 84°N (Lantmäteriet UTM page; DMA TM 8358.2 from memory).
    expectCoordinateError(() => utmZoneFor(84.0001, 10), 'outside-utm-area', 'latitude');
    expectCoordinateError(() => utmZoneFor(-80.0001, 10), 'outside-utm-area', 'latitude');
    expectCoordinateError(() => utmZoneFor(90, 0), 'outside-utm-area', 'latitude');
    expectCoordinateError(() => utmZoneFor(0, 181), 'longitude-out-of-range', 'longitude');
    expectCoordinateError(() => utmZoneFor(Number.NaN, 0), 'not-finite', 'latitude');
  });
});

describe('latitudeBand', () => {
  it.each(
    // Source: band table C 80°S–72°S … M 8°S–0°, N 0°–8°N … X 72°N–84°N, no I or O (PCI Geomatics help "UTM GRID ZONES";
    // DMA TM 8358.1 ch. 3). Each band checked just inside its southern and northern edges.
    [...LATITUDE_BANDS].map((letter, i) => [letter, -80 + 8 * i, letter === 'X' ? 84 : -80 + 8 * (i + 1)] as const),
  )('band %s spans %p° to %p°', (letter, south, north) => {
    expect(latitudeBand(south)).toBe(letter);
    expect(latitudeBand(north - 1e-9)).toBe(letter);
  });

  it('has 20 letters without I and O, and 84°N is X', () => {
    // Source: as above.
    expect(LATITUDE_BANDS).toHaveLength(20);
    expect(LATITUDE_BANDS).not.toMatch(/[IO]/);
    expect(latitudeBand(84)).toBe('X');
    expect(latitudeBand(0)).toBe('N');
    expect(latitudeBand(-1e-12)).toBe('M');
    expectCoordinateError(() => latitudeBand(-81), 'outside-utm-area');
  });
});

describe('toUtm details', () => {
  it('names the EPSG code of the grid, the same grid as proj4 defines for that code', () => {
    // Source: proj4's built-in EPSG:326zz / 327zz definitions ("WGS 84 / UTM zone zzN|S" in the EPSG registry).
    for (const point of [
      { latDeg: 61.2345, lonDeg: -149.8765 },
      { latDeg: -33.857, lonDeg: 151.215 },
      { latDeg: 0, lonDeg: 0 },
      { latDeg: 78, lonDeg: 15 },
    ]) {
      const utm = toUtm(point);
      expect(utm.epsg).toBe((utm.hemisphere === 'N' ? 32600 : 32700) + utm.zone);
      const [e = Number.NaN, n = Number.NaN] = proj4('EPSG:4326', `EPSG:${utm.epsg}`, [point.lonDeg, point.latDeg]);
      expectWithin(utm.easting, e, 1e-6);
      expectWithin(utm.northing, n, 1e-6);
    }
  });

  it('puts the equator in the north and just south of it in the south', () => {
    // Source: false northing 0 m north, 10 000 000 m south (common practice, no source).
    expect(toUtm({ latDeg: 0, lonDeg: 15 }).hemisphere).toBe('N');
    expectWithin(toUtm({ latDeg: 0, lonDeg: 15 }).northing, 0, 1e-6);
    const south = toUtm({ latDeg: -1e-7, lonDeg: 15 });
    expect(south.hemisphere).toBe('S');
    expect(south.band).toBe('M');
    expectWithin(south.northing, 10_000_000 - 0.011, 0.001); // 1e-7° of latitude ≈ 0.0111 m (111 km per degree × 0.9996)
  });

  it('writes the antimeridian in zone 1, or in zone 60 when asked, symmetric about each central meridian', () => {
    // Source: derived from the published equator value 166 021.443081 m at 3° west of a central meridian
    // (geodesy (npm) test suite, "0,0"), by the east–west symmetry of the transverse Mercator.
    const west = toUtm({ latDeg: 0, lonDeg: 180 });
    expect(west.zone).toBe(1);
    expectWithin(west.easting, 166_021.443081, 0.0001);
    const east = toUtm({ latDeg: 0, lonDeg: 180 }, 60);
    expect(east.zone).toBe(60);
    expectWithin(east.easting, 1_000_000 - 166_021.443081, 0.0001);
    expectWithin(toUtm({ latDeg: 0, lonDeg: -180 }).easting, 166_021.443081, 0.0001);
  });

  it('puts the central meridian at 500 000 m in every zone', () => {
    // Source: false easting 500 000 m, central meridian 6·zone − 183 (Lantmäteriet UTM page).
    for (let zone = 1; zone <= 60; zone += 1) {
      const utm = toUtm({ latDeg: 45, lonDeg: utmCentralMeridian(zone) }, zone);
      expectWithin(utm.easting, 500_000, 1e-6);
    }
    expect(utmCentralMeridian(1)).toBe(-177);
    expect(utmCentralMeridian(31)).toBe(3);
    expect(utmCentralMeridian(60)).toBe(177);
  });

  it('accepts a neighbouring zone but not a far one', () => {
    // Source: Kenning's rule (9° of longitude from the central meridian, eastings of six digits).
    const near = toUtm({ latDeg: 61, lonDeg: 17.9 }, 34); // 3.1° west of 21°E
    expect(near.zone).toBe(34);
    expectWithin(fromUtm(near).lonDeg, 17.9, 1e-9);
    expectCoordinateError(() => toUtm({ latDeg: 61, lonDeg: 5 }, 34), 'outside-zone', 'zone');
    expectCoordinateError(() => toUtm({ latDeg: 0, lonDeg: 9 }, 33), 'outside-zone', 'easting'); // 6° off at the equator: easting > 1 000 000 m
    expectCoordinateError(() => toUtm({ latDeg: 0, lonDeg: 0 }, 61), 'unknown-zone', 'zone');
    expectCoordinateError(() => toUtm({ latDeg: 0, lonDeg: 0 }, 2.5), 'unknown-zone', 'zone');
  });

  it('refuses the poles and other places outside UTM with a readable message', () => {
    // Source: UTM limits 80°S and 84°N (Lantmäteriet UTM page; DMA TM 8358.2 from memory).
    const north = expectCoordinateError(() => toUtm({ latDeg: 90, lonDeg: 0 }), 'outside-utm-area', 'latitude');
    expect(north.message).toMatch(/90\.00°N is outside UTM, which covers 80°S to 84°N/);
    const south = expectCoordinateError(() => toUtm({ latDeg: -90, lonDeg: 0 }), 'outside-utm-area');
    expect(south.message).toMatch(/90\.00°S/);
    expect(toUtm({ latDeg: 84, lonDeg: 0 }).band).toBe('X');
    expect(toUtm({ latDeg: -80, lonDeg: 0 }).band).toBe('C');
  });

  it('does not mutate its input', () => {
    // Source: house style, no source needed.
    const point = deepFreeze({ latDeg: 61.2345, lonDeg: -149.8765 });
    const utm = toUtm(point);
    expect(point).toEqual({ latDeg: 61.2345, lonDeg: -149.8765 });
    const grid = deepFreeze({ zone: utm.zone, hemisphere: utm.hemisphere, easting: utm.easting, northing: utm.northing });
    fromUtm(grid);
    expect(grid.easting).toBe(utm.easting);
  });
});

describe('fromUtm checks', () => {
  it.each([
    // Source: none — Kenning's validation contract.
    ['zone 0', { zone: 0, hemisphere: 'N', easting: 500000, northing: 0 }, 'unknown-zone', 'zone'],
    ['zone 61', { zone: 61, hemisphere: 'N', easting: 500000, northing: 0 }, 'unknown-zone', 'zone'],
    ['hemisphere E', { zone: 33, hemisphere: 'E', easting: 500000, northing: 0 }, 'unknown-zone-letter', 'zone'],
    ['easting 0', { zone: 33, hemisphere: 'N', easting: 0, northing: 10 }, 'easting-out-of-range', 'easting'],
    ['easting 1 000 000', { zone: 33, hemisphere: 'N', easting: 1_000_000, northing: 10 }, 'easting-out-of-range', 'easting'],
    ['easting NaN', { zone: 33, hemisphere: 'N', easting: Number.NaN, northing: 10 }, 'not-finite', 'easting'],
    ['negative northing', { zone: 33, hemisphere: 'N', easting: 500000, northing: -1 }, 'northing-out-of-range', 'northing'],
    [
      'northing past 10 000 km',
      { zone: 33, hemisphere: 'S', easting: 500000, northing: 10_000_001 },
      'northing-out-of-range',
      'northing',
    ],
    ['north of 84°N', { zone: 33, hemisphere: 'N', easting: 500000, northing: 9_400_000 }, 'outside-utm-area', 'latitude'],
    ['south of 80°S', { zone: 33, hemisphere: 'S', easting: 500000, northing: 1_000_000 }, 'outside-utm-area', 'latitude'],
    ['far from the meridian at 83°N', { zone: 33, hemisphere: 'N', easting: 1000, northing: 9_200_000 }, 'outside-zone', 'zone'],
  ] as const)('%s', (_what, utm, code, part) => {
    expectCoordinateError(() => fromUtm(utm as never), code, part);
  });

  it('reads positions in the 30′ polar overlap but writes only inside 80°S–84°N', () => {
    // Source: UTM overlaps UPS to 84.5°N and 80.5°S (apsalin.com UTM converter notes; DMA TM 8358.2 from memory).
    const [, north = Number.NaN] = proj4('EPSG:4326', 'EPSG:32633', [15, 84.3]);
    expectWithin(fromUtm({ zone: 33, hemisphere: 'N', easting: 500_000, northing: north }).latDeg, 84.3, 1e-9);
    const [, south = Number.NaN] = proj4('EPSG:4326', 'EPSG:32733', [15, -80.3]);
    expectWithin(fromUtm({ zone: 33, hemisphere: 'S', easting: 500_000, northing: south }).latDeg, -80.3, 1e-9);
    expectCoordinateError(() => toUtm({ latDeg: 84.3, lonDeg: 15 }), 'outside-utm-area', 'latitude');
  });

  it('returns longitudes in [−180, 180)', () => {
    // Source: longitude convention of this module (common practice, no source).
    const west = fromUtm({ zone: 1, hemisphere: 'N', easting: 166_021.443081, northing: 0 });
    expectWithin(west.lonDeg, -180, 1e-9);
    const east = fromUtm({ zone: 60, hemisphere: 'N', easting: 800_000, northing: 1_000_000 });
    expect(east.lonDeg).toBeLessThan(180);
    expect(east.lonDeg).toBeGreaterThan(179);
    const wrapped = fromUtm({ zone: 60, hemisphere: 'N', easting: 1_000_000 - 166_000, northing: 0 });
    expectWithin(wrapped.lonDeg, -180 + 0.000193, 0.0001); // 21.4 m east of 180° at the equator wraps to the western side
  });
});
