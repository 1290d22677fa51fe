import proj4 from 'proj4';

import { formatCoordinate } from '@/shared/geo/format-coordinate';
import { parseCoordinate } from '@/shared/geo/parse-coordinate';

import { deepFreeze, expectCoordinateError, expectWithin } from './expect-close';

// Invented example position (from the brief); DDM/DMS values by definition of minutes and seconds
// (0.2345° = 14.07′ = 14′04.2″, 0.8765° = 52.59′ = 52′35.4″; common practice, no source).
const POST = { latDeg: 61.2345, lonDeg: -149.8765 };

describe('formatCoordinate', () => {
  it('writes each format at its default precision', () => {
    // Source: as above for DD/DDM/DMS; UTM zone 6 (150°W–144°W, central meridian 147°W) and band V (56°N–64°N),
    // easting and northing checked against proj4's EPSG:32606 forward below.
    expect(formatCoordinate(POST, 'dd')).toBe('61.23450, -149.87650');
    expect(formatCoordinate(POST, 'ddm')).toBe("61°14.070'N 149°52.590'W");
    expect(formatCoordinate(POST, 'dms')).toBe(`61°14'04.2"N 149°52'35.4"W`);
    expect(formatCoordinate(POST, 'utm')).toMatch(/^6V \d{6} \d{7}$/);
  });

  it('writes UTM in whole metres that agree with proj4 to half a metre', () => {
    // Source: proj4 (npm) with its EPSG:32606 definition, as a general-purpose reference.
    const [e = Number.NaN, n = Number.NaN] = proj4('EPSG:4326', 'EPSG:32606', [POST.lonDeg, POST.latDeg]);
    const [, easting, northing] = formatCoordinate(POST, 'utm').split(' ');
    expectWithin(Number(easting), e, 0.5);
    expectWithin(Number(northing), n, 0.5);
  });

  it('writes the published GeographicLib example in band S and in hemisphere form', () => {
    // Source: GeographicLib GeoConvert usage text: 33.3 44.4 = 38N 444140.54 3684706.36 (MGRS 38SMB…).
    expect(formatCoordinate({ latDeg: 33.3, lonDeg: 44.4 }, 'utm')).toBe('38S 444141 3684706');
    expect(formatCoordinate({ latDeg: 33.3, lonDeg: 44.4 }, 'utm', { utmLetter: 'hemisphere' })).toBe('38N 444141 3684706');
    expect(formatCoordinate({ latDeg: 33.3, lonDeg: 44.4 }, 'utm', { decimals: 2 })).toBe('38S 444140.54 3684706.36');
  });

  it('writes a southern position as band letter, S, or "south" where S would read as band S', () => {
    // Source: geodesy (npm) test suite: 33.857°S 151.215°E = 56 S 334873.199 6252266.092, MGRS band H.
    const southern = { latDeg: -33.857, lonDeg: 151.215 };
    expect(formatCoordinate(southern, 'utm')).toBe('56H 334873 6252266');
    expect(formatCoordinate(southern, 'utm', { utmLetter: 'hemisphere' })).toBe('56S 334873 6252266');
    // Source: Kenning's band-S rule — 54°S has a northing that would read as band S (32°N–40°N).
    expect(formatCoordinate({ latDeg: -54, lonDeg: 15 }, 'utm', { utmLetter: 'hemisphere' })).toMatch(/^33 south 500000 \d{7}$/);
    expect(formatCoordinate({ latDeg: -54, lonDeg: 15 }, 'utm')).toMatch(/^33F 500000 /); // band F = 56°S–48°S
  });

  it('rounds with carries and never writes 60 minutes or seconds', () => {
    // Source: sexagesimal arithmetic (common practice, no source).
    expect(formatCoordinate({ latDeg: 10.99999999, lonDeg: 20.5 }, 'dms')).toBe(`11°00'00.0"N 20°30'00.0"E`);
    expect(formatCoordinate({ latDeg: 10.99999999, lonDeg: 20.5 }, 'ddm')).toBe("11°00.000'N 20°30.000'E");
    // 45.999986° = 45°59′59.95″ less 0.0004″; 45.999987° = 45°59′59.953″, which rounds up into the minutes and degrees.
    expect(formatCoordinate({ latDeg: 45.999986, lonDeg: 0 }, 'dms')).toBe(`45°59'59.9"N 0°00'00.0"E`);
    expect(formatCoordinate({ latDeg: 45.999987, lonDeg: 0 }, 'dms')).toBe(`46°00'00.0"N 0°00'00.0"E`);
    expect(formatCoordinate({ latDeg: 0.0000049, lonDeg: 0.0000051 }, 'dd')).toBe('0.00000, 0.00001');
  });

  it('writes values that round to zero without a minus sign and as N or E', () => {
    // Source: none — display rule of this module.
    expect(formatCoordinate({ latDeg: -0.000001, lonDeg: -0 }, 'dd')).toBe('0.00000, 0.00000');
    expect(formatCoordinate({ latDeg: -0.000001, lonDeg: -0.000001 }, 'dms')).toBe(`0°00'00.0"N 0°00'00.0"E`);
    expect(formatCoordinate({ latDeg: -0.0001, lonDeg: 0 }, 'dms')).toBe(`0°00'00.4"S 0°00'00.0"E`);
  });

  it('writes poles and the antimeridian', () => {
    // Source: none — range ends of latitude and longitude (common practice, no source).
    expect(formatCoordinate({ latDeg: 90, lonDeg: 180 }, 'dms')).toBe(`90°00'00.0"N 180°00'00.0"E`);
    expect(formatCoordinate({ latDeg: -90, lonDeg: -180 }, 'ddm')).toBe("90°00.000'S 180°00.000'W");
    expect(formatCoordinate({ latDeg: -90, lonDeg: -180 }, 'dd', { style: 'letters' })).toBe('90.00000°S 180.00000°W');
    expectCoordinateError(() => formatCoordinate({ latDeg: 90, lonDeg: 0 }, 'utm'), 'outside-utm-area', 'latitude');
  });

  it('honours decimals and style options', () => {
    // Source: as for the default precision.
    expect(formatCoordinate(POST, 'dd', { decimals: 2 })).toBe('61.23, -149.88');
    expect(formatCoordinate(POST, 'dd', { style: 'letters' })).toBe('61.23450°N 149.87650°W');
    expect(formatCoordinate(POST, 'ddm', { style: 'signed', decimals: 1 })).toBe("61°14.1', -149°52.6'");
    expect(formatCoordinate(POST, 'dms', { decimals: 0 })).toBe(`61°14'04"N 149°52'35"W`);
    expect(formatCoordinate(POST, 'utm', { zone: 5 })).toMatch(/^5V \d{6} \d{7}$/);
  });

  it('refuses bad positions and options with a readable message', () => {
    // Source: none — error contract.
    expect(
      expectCoordinateError(() => formatCoordinate({ latDeg: 95, lonDeg: 0 }, 'dd'), 'latitude-out-of-range', 'latitude').message,
    ).toMatch(/Latitude 95° is beyond 90°/);
    expectCoordinateError(() => formatCoordinate({ latDeg: 0, lonDeg: 200 }, 'dd'), 'longitude-out-of-range', 'longitude');
    expectCoordinateError(() => formatCoordinate({ latDeg: Number.NaN, lonDeg: 0 }, 'dms'), 'not-finite', 'latitude');
    expectCoordinateError(() => formatCoordinate(POST, 'georef' as never), 'unknown-format', 'options');
    expectCoordinateError(() => formatCoordinate(POST, 'dd', { decimals: 1.5 }), 'invalid-option', 'options');
    expectCoordinateError(() => formatCoordinate(POST, 'dd', { decimals: 12 }), 'invalid-option', 'options');
    expectCoordinateError(() => formatCoordinate(POST, 'dd', { style: 'roman' as never }), 'invalid-option', 'options');
    expectCoordinateError(() => formatCoordinate(POST, 'utm', { utmLetter: 'x' as never }), 'invalid-option', 'options');
  });

  it('does not mutate its input or options', () => {
    // Source: house style, no source needed.
    const point = deepFreeze({ ...POST });
    const options = deepFreeze({ decimals: 3, style: 'letters' as const });
    expect(() => formatCoordinate(point, 'dd', options)).not.toThrow();
    expect(point).toEqual(POST);
    expect(options).toEqual({ decimals: 3, style: 'letters' });
  });

  it('writes text that parseCoordinate reads back as the same format', () => {
    // Source: none — formatter and parser consistency.
    for (const format of ['dd', 'ddm', 'dms', 'utm'] as const) {
      expect(parseCoordinate(formatCoordinate(POST, format)).format).toBe(format);
    }
  });
});
